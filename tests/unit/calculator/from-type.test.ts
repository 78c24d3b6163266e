// Starting a calculation from a library type: the method and the type's stored values, in the
// form's units. 3350 mm / 25.4 = 131.89 in; 48.3 mm / 25.4 = 1.9016 in (NIST SP 811: 1 in = 25.4 mm).
import { describe, expect, it } from "vitest";
import { typeToForm, type LibraryType } from "@/lib/calculator/from-type";
import { CALCULATOR_DEFAULTS } from "@/lib/validations/calculator";

const prop: LibraryType = { id: "1", name: "Class D prop", kind: "en1065-prop", params: { propClass: "D" }, minExtensionMm: 1980, maxExtensionMm: 3350 };
const tube: LibraryType = { id: "2", name: "48.3 tube", kind: "steel-section", params: { section: { shape: "chs", dMm: 48.3, tMm: 3.2 }, grade: "S355", formed: "hot-finished" }, minExtensionMm: null, maxExtensionMm: null };

describe("typeToForm", () => {
  it("fills an EN 1065 prop's class and range and keeps the extension already typed", () => {
    const f = typeToForm(prop, { ...CALCULATOR_DEFAULTS, length: "2850", method: "euler" }, "en1993")!;
    expect(f).toMatchObject({ method: "en1065", propClass: "D", maxExtension: "3350", minExtension: "1980", length: "2850" });
  });

  it("fills a steel tube in US units on a US form and picks the site's code", () => {
    const f = typeToForm(tube, { ...CALCULATOR_DEFAULTS, units: "us" }, "aisc360-lrfd")!;
    expect(f).toMatchObject({ method: "aisc360-lrfd", units: "us", shape: "chs", d: "1.9016", steelGrade: "S355" });
    expect(typeToForm(tube, CALCULATOR_DEFAULTS, "en1993")).toMatchObject({ method: "en1993", d: "48.3", t: "3.2", formed: "hot-finished" });
  });

  it("turns a supplier table's newtons into kN rows", () => {
    const t: LibraryType = { id: "3", name: "Strut", kind: "trench-strut", params: { table: [{ lengthMm: 1500, safeLoadN: 100000 }] }, minExtensionMm: 1500, maxExtensionMm: 1500 };
    expect(typeToForm(t, CALCULATOR_DEFAULTS, "en1993")!.table).toBe("1500, 100");
  });
});

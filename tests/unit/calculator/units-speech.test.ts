// Conversions when the calculator's units change, plausibility warnings and engine sentences in
// the chosen units. Expected figures come from NIST SP 811 (2008) Appendix B: 1 in = 25.4 mm
// exactly; 1 lbf = 4.448 221 615 260 5 N exactly; 1 ksi = 6.894 757 293 168 MPa; 1 psf = 47.880 26 Pa.
import { describe, expect, it } from "vitest";
import { convertFormUnits, plausibilityWarnings, speakUnits, switchUnits } from "@/lib/calculator/units-speech";
import { formToRequest } from "@/lib/calculator/form-request";
import { calculate } from "@/lib/engineering";
import { MPA_PER_KSI, N_PER_LBF } from "@/lib/units";
import { CALCULATOR_DEFAULTS, type CalculatorForm } from "@/lib/validations/calculator";
import { memberCreateSchema } from "@/lib/validations/member";
import { memberTypeSchema } from "@/lib/validations/member-type";
import { schemeSchema } from "@/lib/validations/scheme";

const form = (over: Partial<CalculatorForm>): CalculatorForm => ({ ...CALCULATOR_DEFAULTS, ...over });

describe("lib/units factors (NIST SP 811 Appendix B)", () => {
  it("pound-force and ksi are the exact SP 811 values", () => {
    expect(N_PER_LBF).toBeCloseTo(4.4482216152605, 12);
    expect(MPA_PER_KSI).toBeCloseTo(6.894757293168, 11);
  });
});

describe("convertFormUnits", () => {
  it("re-expresses 4000 mm as 157.48 in, not 4000 in", () => {
    // 4000 / 25.4 = 157.480 3… in (NIST SP 811: 1 in = 25.4 mm exactly)
    const us = convertFormUnits(form({ units: "si", length: "4000" }), "si", "us");
    expect(us.units).toBe("us");
    expect(us.length).toBe("157.48");
    expect(formToRequest(us).request.lengthMm).toBeCloseTo(4000, 0);
  });

  it("converts a section, a steel stress, a load and a timber stress, and back again", () => {
    // 48.3 mm / 25.4 = 1.9016 in; 355 MPa / 6.894757 = 51.488 ksi; 25 kN / 4.448222 = 5.6202 kip
    const us = convertFormUnits(form({ units: "si", d: "48.3", t: "3.2", fy: "355", load: "25", fcStar: "10" }), "si", "us");
    expect(us.d).toBe("1.9016");
    expect(us.fy).toBe("51.488");
    expect(us.load).toBe("5.6202");
    expect(us.fcStar).toBe("1.4504"); // 10 MPa = 1.450 38 ksi: timber is in ksi too under US
    // A plain conversion back drifts in the last figure (1.9016 in = 48.3006 mm) …
    expect(convertFormUnits(us, "us", "si").d).toBe("48.301");
    // … so the Units switch remembers what was typed and restores it for fields left unchanged.
    const first = switchUnits(form({ units: "si", d: "48.3", t: "3.2", fy: "355", load: "25" }), "us", null);
    const back = switchUnits({ ...first.values, t: "0.125" }, "si", first.memory).values;
    expect(back.d).toBe("48.3");
    expect(back.t).toBe("3.175"); // changed while in US: converted, 0.125 in = 3.175 mm
    expect(back.fy).toBe("355");
    expect(back.load).toBe("25");
  });

  it("reads a feet-and-inches length and converts supplier table rows", () => {
    // 9' 6" = 114 in = 2895.6 mm; 60 in = 1524 mm; 22 kip = 97.861 kN
    const si = convertFormUnits(form({ units: "us", length: `9' 6"`, table: "60, 22\n100, 18" }), "us", "si");
    expect(si.length).toBe("2895.6");
    expect(si.table.split("\n")[0]).toBe("1524, 97.861");
  });

  it("keeps text it cannot read exactly as typed", () => {
    const us = convertFormUnits(form({ units: "si", fy: "about 355", length: "" }), "si", "us");
    expect(us.fy).toBe("about 355");
    expect(us.length).toBe("");
  });
});

describe("formToRequest under US units", () => {
  it("reads timber values in ksi, one unit family with steel", () => {
    // 1.2 ksi × 6.894757 = 8.2737 MPa
    const { request } = formToRequest(form({ method: "nds", units: "us", length: "96", shape: "rect", b: "3.5", h: "3.5", fcStar: "1.2", eMin: "580" }));
    expect(request.fcStarMpa).toBeCloseTo(8.2737, 3);
    expect(request.eMinMpa).toBeCloseTo(3999.0, 0);
  });
});

describe("plausibilityWarnings (common-practice ranges)", () => {
  it("warns about a timber strength of 1 ksi and a steel E of 470 ksi, in ksi", () => {
    // 1 ksi = 6.89 MPa, below the 10 MPa floor; 470 ksi = 3241 MPa, far below steel's 190 GPa
    const w = plausibilityWarnings(form({ method: "en1995", units: "us", fc0k: "1" }));
    expect(w.fc0k).toMatch(/of 1 ksi is unusual/);
    const s = plausibilityWarnings(form({ method: "en1993", units: "us", e: "470" }));
    expect(s.e).toMatch(/of 470 ksi is unusual/);
    expect(s.e).toMatch(/27560–31180 ksi/); // 190 000 and 215 000 MPa in ksi
  });

  it("is quiet for ordinary values and for fields left empty", () => {
    expect(plausibilityWarnings(form({ method: "en1993", units: "si", length: "3000", fy: "355", e: "210000" }))).toEqual({});
    expect(plausibilityWarnings(form({ method: "en1993", units: "us", length: "", fy: "50" }))).toEqual({});
  });

  it("warns about a length typed in metres into a millimetre field, without refusing it", () => {
    const w = plausibilityWarnings(form({ method: "euler", units: "si", length: "4" }));
    expect(w.length).toMatch(/length of 4 mm is unusual/);
  });
});

describe("speakUnits: engine sentences in the person's units", () => {
  it("a load typed in kN is refused in kN", () => {
    const r = formToRequest(form({ method: "en1065", length: "2500", propClass: "D", maxExtension: "3350", load: "-5" }));
    const result = calculate(r.request);
    expect(result.ok).toBe(false);
    const msg = result.ok ? "" : result.errors.find((e) => e.field === "loadN")!.message;
    expect(msg).toMatch(/-5000 N/); // the engine speaks SI …
    const spoken = speakUnits(msg, "si");
    expect(spoken).toMatch(/at least 0 kN \(got -5 kN\)/);
    expect(spoken).not.toMatch(/\bN\b(?!\/)/);
  });

  it("a US form hears ksi, inches and kips", () => {
    expect(speakUnits("Yield strength fy must be greater than zero (got -344.7 MPa).", "us")).toContain("-49.99 ksi");
    expect(speakUnits("Extension 3500 mm is longer than this prop's maximum extension of 3350 mm.", "us")).toBe(
      "Extension 137.8 in is longer than this prop's maximum extension of 131.9 in.",
    );
    expect(speakUnits("E = 210 000 MPa (steel) was assumed.", "us")).toBe("E = 30460 ksi (steel) was assumed.");
  });

  it("leaves unitless numbers and SI sentences on an SI form alone", () => {
    const s = "Partial factor γM1 must be at least 1 (got 0.9). EN 1993-1-1 §6.3.1 and 3350 mm.";
    expect(speakUnits(s, "si")).toBe(s);
  });
});

// The member, library and scheme forms type kN (kip on a US site) over an API in N: the schema's
// sentence is spoken through speakUnits before it reaches the field. 1 kN = 1000 N (SI); 1 in = 25.4 mm
// exactly and 1 kip = 4.4482216152605 kN (NIST SP 811 Appendix B).
describe("forms that type kN hear kN from the N schemas (issue #16)", () => {
  const firstMessage = (r: { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } }, path: string) =>
    r.error?.issues.find((i) => i.path.map(String).join(".") === path)?.message ?? "";
  const member = { tag: "P-1", memberTypeId: "00000000-0000-4000-8000-000000000001", extensionMm: 2500, loadN: 60_000_000 };

  it("the member form: a working load over the limit says kN on an SI site and kip on a US one", () => {
    const msg = firstMessage(memberCreateSchema.safeParse(member), "loadN");
    expect(msg).toMatch(/50,000,000 N/); // the API speaks N …
    expect(speakUnits(msg, "si")).toBe("The working load must be at most 50000 kN; check the unit.");
    // 50 000 kN / 4.4482216152605 kN per kip = 11 240 kip
    expect(speakUnits(msg, "us")).toBe("The working load must be at most 11240 kip; check the unit.");
  });

  it("the member form on a US site: an extension over the limit says inches", () => {
    const msg = firstMessage(memberCreateSchema.safeParse({ ...member, loadN: 1000, extensionMm: 40_000 }), "extensionMm");
    // 30 000 mm / 25.4 = 1181 in
    expect(speakUnits(msg, "us")).toBe("The measured extension must be at most 1181 in; check the unit.");
  });

  it("the library form: a safe load row over the limit, and one that is not a number, say kN", () => {
    const base = { kind: "supplier-table", name: "Trench strut 2 m", params: { table: [{ lengthMm: 1000, safeLoadN: 60_000_000 }, { lengthMm: 2000, safeLoadN: Number.NaN }] } };
    const r = memberTypeSchema.safeParse(base);
    expect(speakUnits(firstMessage(r, "params.table.0.safeLoadN"), "si")).toBe("The safe working load must be at most 50000 kN; check the unit.");
    expect(speakUnits(firstMessage(r, "params.table.1.safeLoadN"), "si")).toBe("Enter the safe working load.");
    const negative = memberTypeSchema.safeParse({ ...base, params: { table: [{ lengthMm: 1000, safeLoadN: -5 }, { lengthMm: 2000, safeLoadN: 1 }] } });
    expect(speakUnits(firstMessage(negative, "params.table.0.safeLoadN"), "si")).toBe("The safe working load must be more than 0 kN.");
  });

  it("the scheme form: a design load that is not a number, or too large, says kN", () => {
    const base = { reference: "TW-1", title: "Slab", designerName: "A. Designer", category: 1 };
    expect(speakUnits(firstMessage(schemeSchema.safeParse({ ...base, designLoadN: Number.NaN }), "designLoadN"), "si")).toBe("The design load per member must be a number (kN).");
    expect(speakUnits(firstMessage(schemeSchema.safeParse({ ...base, designLoadN: 6e7 }), "designLoadN"), "si")).toBe(
      "The design load per member must be at most 50000 kN; check the unit.",
    );
  });
});

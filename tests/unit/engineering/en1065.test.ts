import { describe, expect, it } from "vitest";
import { calculate, en1065CharacteristicN, type CapacityResult } from "@/lib/engineering";

function ok(r: ReturnType<typeof calculate>): CapacityResult {
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  if (r.capacityN === undefined) throw new Error("The result has no capacity.");
  return r as CapacityResult;
}

// EN 1065:1998 Table 2 nominal characteristic strengths, FROM MEMORY (see lib/engineering/en1065.ts):
// A 51·l_max/l², B 68·l_max/l², C 102·l_max/l² (kN, lengths in m); D 34 kN; E 51 kN.
// Class B's formula and class D's 34 kN agree with published descriptions of the standard.
describe("EN 1065 nominal characteristic strength", () => {
  it("class B at 3.0 m on a 3.5 m prop, by hand", () => {
    // R_k = 68 × 3.5 / 3.0² = 238 / 9 = 26.444 kN
    expect(en1065CharacteristicN("B", 3500, 3000)).toBeCloseTo(26444.4, 1);
  });
  it("classes A and C at full extension, by hand", () => {
    // A: 51 × 3.0 / 3.0² = 17.0 kN; C: 102 × 3.0 / 3.0² = 34.0 kN
    expect(en1065CharacteristicN("A", 3000, 3000)).toBeCloseTo(17000, 6);
    expect(en1065CharacteristicN("C", 3000, 3000)).toBeCloseTo(34000, 6);
  });
  it("classes D and E are constant over the range", () => {
    expect(en1065CharacteristicN("D", 3500, 2000)).toBe(34000);
    expect(en1065CharacteristicN("D", 3500, 3500)).toBe(34000);
    expect(en1065CharacteristicN("E", 4000, 4000)).toBe(51000);
  });
});

describe("en1065 method", () => {
  it("safe working load = R_k/1.65 (γF 1.5 × γM 1.1, from memory)", () => {
    const r = ok(calculate({ method: "en1065", lengthMm: 3000, propClass: "B", maxExtensionMm: 3500, loadN: 15000 }));
    // SWL = 26.444 / 1.65 = 16.027 kN
    expect(r.characteristicN).toBeCloseTo(26444.4, 1);
    expect(r.capacityN).toBeCloseTo(16026.9, 1);
    expect(r.basis).toBe("safe-working-load");
    // 15.0/16.027 = 0.936
    expect(r.utilisation).toBeCloseTo(0.936, 3);
    expect(r.pass).toBe(true);
    expect(r.loadBasis).toContain("1.65");
  });

  it("class D and E safe loads agree with the commonly published permissible loads of 20 kN and 30 kN", () => {
    // Published permissible loads for EN 1065 props: class D 20 kN, class E 30 kN (rounded down): 34/1.65 = 20.6, 51/1.65 = 30.9.
    const d = ok(calculate({ method: "en1065", lengthMm: 3000, propClass: "D", maxExtensionMm: 3500 }));
    const e = ok(calculate({ method: "en1065", lengthMm: 3000, propClass: "E", maxExtensionMm: 3500 }));
    expect(Math.floor(d.capacityN / 1000)).toBe(20);
    expect(Math.floor(e.capacityN / 1000)).toBe(30);
  });

  it("factors can be overridden", () => {
    const r = ok(calculate({ method: "en1065", lengthMm: 3000, propClass: "D", maxExtensionMm: 3500, gammaF: 1.35, gammaM: 1.0 }));
    // 34 / (1.35 × 1.0) = 25.185 kN
    expect(r.capacityN).toBeCloseTo(25185.2, 1);
  });

  it("refuses an extension beyond the maximum", () => {
    const r = calculate({ method: "en1065", lengthMm: 3900, propClass: "D", maxExtensionMm: 3500 });
    expect(r).toEqual({
      ok: false,
      errors: [
        {
          field: "lengthMm",
          message: "Extension 3900 mm is longer than this prop's maximum extension of 3500 mm; a prop must not be used beyond its range.",
        },
      ],
    });
  });

  it("refuses an extension below the prop's marked minimum, and invents none when it is not given", () => {
    const given = calculate({ method: "en1065", lengthMm: 1900, propClass: "B", maxExtensionMm: 3500, minExtensionMm: 2000 });
    expect(given.ok).toBe(false);
    if (!given.ok) {
      expect(given.errors[0].field).toBe("lengthMm");
      expect(given.errors[0].message).toContain("minimum (closed) length of 2000 mm");
    }
    // No minimum given: none is assumed (EN 1065 props are marked with their own range); the result asks for it.
    const notGiven = ok(calculate({ method: "en1065", lengthMm: 1700, propClass: "B", maxExtensionMm: 3500 }));
    expect(notGiven.warnings.join(" ")).toContain("minimum extension from its marking");
    expect(notGiven.steps.find((s) => s.symbol === "l_min")?.value).toBe("not given");
    const minTooLong = calculate({ method: "en1065", lengthMm: 3000, propClass: "B", maxExtensionMm: 3500, minExtensionMm: 3500 });
    expect(!minTooLong.ok && minTooLong.errors[0].field).toBe("minExtensionMm");
  });

  it("needs the class and maximum extension", () => {
    const r = calculate({ method: "en1065", lengthMm: 3000 });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors.map((e) => e.field).sort()).toEqual(["maxExtensionMm", "propClass"]);
  });
});

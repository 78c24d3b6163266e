import { describe, expect, it } from "vitest";
import { calculate, ndsCp, ndsFcE, type CapacityResult } from "@/lib/engineering";
import { toMpa, toMm } from "@/lib/units";

function ok(r: ReturnType<typeof calculate>): CapacityResult {
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  if (r.capacityN === undefined) throw new Error("The result has no capacity.");
  return r as CapacityResult;
}
const lbf = (n: number) => n / 4.4482216152605;

describe("NDS 2018 §3.7.1 column stability factor", () => {
  it("F_cE and C_P by hand for a sawn 4x4", () => {
    // Douglas fir-larch No. 2, 4x4 (3.5 × 3.5 in), l_e = 8 ft = 96 in, C_D = 1.0.
    // NDS Supplement Table 4A (from memory): F_c = 1350 psi, C_F = 1.15 → F_c* = 1552.5 psi; E_min = 580 000 psi.
    // l_e/d = 96/3.5 = 27.4286; F_cE = 0.822 × 580 000 / 27.4286² = 476 760 / 752.327 = 633.71 psi
    expect(ndsFcE(580000, 96 / 3.5)).toBeCloseTo(633.71, 2);
    // F_cE/F_c* = 633.71/1552.5 = 0.408189; (1 + 0.408189)/(2 × 0.8) = 0.880118
    // C_P = 0.880118 − √(0.880118² − 0.408189/0.8) = 0.880118 − √(0.774608 − 0.510237) = 0.880118 − 0.514171 = 0.365947
    expect(ndsCp(633.71, 1552.5, 0.8)).toBeCloseTo(0.365947, 5);
  });

  it("C_P limits: short column → 1, c = 1 → min(1, F_cE/F_c*)", () => {
    expect(ndsCp(1e9, 10, 0.8)).toBeCloseTo(1, 6);
    // With c = 1, (3.7-1) reduces to min(1, F_cE/F_c*): 0.5 here
    expect(ndsCp(5, 10, 1)).toBeCloseTo(0.5, 12);
    expect(ndsCp(10, 10, 1)).toBeCloseTo(1, 6);
  });
});

describe("nds method", () => {
  it("4x4 post, 8 ft pinned, in SI, matches the hand value above", () => {
    const r = ok(
      calculate({
        method: "nds",
        lengthMm: toMm(8, "ft"),
        ends: "pinned-pinned",
        section: { shape: "rect", bMm: toMm(3.5, "in"), hMm: toMm(3.5, "in") },
        fcStarMpa: toMpa(1552.5, "psi"),
        eMinMpa: toMpa(580000, "psi"),
      }),
    );
    // P' = C_P·F_c*·A = 0.365947 × 1552.5 × 12.25 = 6959.6 lb
    expect(lbf(r.capacityN)).toBeCloseTo(6959.6, 0);
    expect(r.reductionFactor).toBeCloseTo(0.365947, 5);
    expect(r.slenderness).toBeCloseTo(27.4286, 3);
    expect(r.basis).toBe("allowable-strength");
    // F_cE·A = 633.71 × 12.25 = 7763 lb: the capacity stays below it
    expect(lbf(r.eulerN ?? 0)).toBeCloseTo(7763.0, -1);
  });

  it("round pole as a square of equal area, c = 0.85", () => {
    const r = ok(
      calculate({
        method: "nds",
        lengthMm: toMm(12, "ft"),
        section: { shape: "round", dMm: toMm(8, "in") },
        fcStarMpa: toMpa(1000, "psi"),
        eMinMpa: toMpa(1_000_000, "psi"),
      }),
    );
    // A = π·8²/4 = 50.265 in²; d = √A = 7.0898 in; l_e/d = 144/7.0898 = 20.311
    // F_cE = 0.822 × 1 000 000/20.311² = 1992.6 psi; ratio 1.99258; (1 + 1.99258)/(2 × 0.85) = 1.760344
    // C_P = 1.760344 − √(1.760344² − 1.99258/0.85) = 1.760344 − √(3.098811 − 2.344212) = 1.760344 − 0.868677 = 0.891667
    // P' = 0.891667 × 1000 × 50.265 = 44 820 lb
    expect(lbf(r.capacityN)).toBeCloseTo(44820, -1);
    expect(r.steps.find((s) => s.symbol === "c")?.value).toBe(0.85);
  });

  it("c from timber type or given", () => {
    const base = { method: "nds", lengthMm: 2400, section: { shape: "rect", bMm: 130, hMm: 130 }, fcStarMpa: 15, eMinMpa: 5000 };
    expect(ok(calculate({ ...base, timberType: "glulam" })).steps.find((s) => s.symbol === "c")?.value).toBe(0.9);
    expect(ok(calculate({ ...base, c: 0.85 })).steps.find((s) => s.symbol === "c")?.value).toBe(0.85);
    expect(ok(calculate(base)).warnings.join(" ")).toContain("c = 0.8");
  });

  it("refuses l_e/d over 50 (§3.7.1.4) for a column that is not temporary", () => {
    // 89 mm post: 50 × 89 = 4450 mm; 4500 mm gives 50.56
    const r = calculate({ method: "nds", lengthMm: 4500, section: { shape: "rect", bMm: 89, hMm: 140 }, fcStarMpa: 10, eMinMpa: 4000, duringConstruction: false });
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.errors[0].field).toBe("lengthMm");
      expect(r.errors[0].message).toContain("over 50");
    }
    expect(calculate({ method: "nds", lengthMm: 4450, section: { shape: "rect", bMm: 89, hMm: 140 }, fcStarMpa: 10, eMinMpa: 4000, duringConstruction: false }).ok).toBe(true);
  });

  it("during construction (the default for shores) allows l_e/d up to 75 and warns above 50 (NDS 2018 §3.7.1.4)", () => {
    // NDS 2018 §3.7.1.4: "l_e/d shall not exceed 50, except that during construction l_e/d shall not exceed 75".
    // 89 mm post: 75 × 89 = 6675 mm. 4500 mm → 50.56 (allowed, warned); 6675 → 75 (allowed); 6700 → 75.28 (refused).
    const base = { method: "nds", section: { shape: "rect", bMm: 89, hMm: 140 }, fcStarMpa: 10, eMinMpa: 4000 };
    const warned = ok(calculate({ ...base, lengthMm: 4500 }));
    expect(warned.slenderness).toBeCloseTo(50.56, 2);
    expect(warned.warnings.join(" ")).toContain("only during construction");
    expect(ok(calculate({ ...base, lengthMm: 6675 })).slenderness).toBeCloseTo(75, 9);
    const refused = calculate({ ...base, lengthMm: 6700 });
    expect(!refused.ok && refused.errors[0].field).toBe("lengthMm");
    expect(!refused.ok && refused.errors[0].message).toContain("over 75");
    expect(ok(calculate({ ...base, lengthMm: 4000 })).warnings.join(" ")).not.toContain("only during construction");
  });

  it("pinned at one end, rotation fixed and free to sway at the other: K_e = 2.4 from NDS Appendix G Table G1 (AISC gives 2.0)", () => {
    // NDS 2018 Appendix G Table G1, case (f): recommended design K_e = 2.40.
    const r = ok(calculate({ method: "nds", lengthMm: 1000, ends: "pinned-sway", section: { shape: "rect", bMm: 89, hMm: 140 }, fcStarMpa: 10, eMinMpa: 4000 }));
    expect(r.effectiveLengthMm).toBeCloseTo(2400, 9);
    expect(r.steps.map((s) => s.source).join(" ")).toContain("NDS 2018 Appendix G Table G1");
  });

  it("needs F_c* and E_min' and a solid section", () => {
    const r = calculate({ method: "nds", lengthMm: 2400, section: { shape: "given", areaMm2: 1000, iMinMm4: 1e5 } });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors.map((e) => e.field)).toEqual(["section.shape", "fcStarMpa", "eMinMpa"]);
  });
});

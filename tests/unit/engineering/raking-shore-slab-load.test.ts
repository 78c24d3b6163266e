import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { calculateRakingShore, calculateSlabLoad, rakingShoreGeometry, workingAreaConstructionLoad } from "@/lib/engineering";

describe("raking shore statics", () => {
  it("60° raker, H = 10 kN, h = 4 m, by hand", () => {
    const r = calculateRakingShore({ thrustN: 10000, headHeightMm: 4000, angleDeg: 60 });
    if (!r.ok) throw new Error(JSON.stringify(r.errors));
    // cos 60° = 0.5, sin 60° = 0.866025, tan 60° = 1.732051
    // F = H/cos θ = 10 000/0.5 = 20 000 N; V = H·tan θ = 17 320.5 N
    // L = h/sin θ = 4000/0.866025 = 4618.8 mm; x = h/tan θ = 4000/1.732051 = 2309.4 mm
    expect(r.axialForceN).toBeCloseTo(20000, 6);
    expect(r.verticalForceN).toBeCloseTo(17320.508, 3);
    expect(r.horizontalForceN).toBe(10000);
    expect(r.rakerLengthMm).toBeCloseTo(4618.802, 3);
    expect(r.footDistanceMm).toBeCloseTo(2309.401, 3);
    expect(r.warnings).toEqual([]);
  });

  it("45° raker: F = H√2, V = H, foot distance = h", () => {
    const g = rakingShoreGeometry(1000, 3000, 45);
    expect(g.axialForceN).toBeCloseTo(1000 * Math.SQRT2, 9);
    expect(g.verticalForceN).toBeCloseTo(1000, 9);
    expect(g.footDistanceMm).toBeCloseTo(3000, 9);
  });

  it("geometry closes: L² = h² + x² and F² = H² + V² (property)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 1e6, noNaN: true }),
        fc.double({ min: 100, max: 20000, noNaN: true }),
        fc.double({ min: 1, max: 89, noNaN: true }),
        (h, height, angle) => {
          const g = rakingShoreGeometry(h, height, angle);
          const close = (a: number, b: number) => Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(b));
          return close(g.rakerLengthMm ** 2, height ** 2 + g.footDistanceMm ** 2) && close(g.axialForceN ** 2, h ** 2 + g.verticalForceN ** 2);
        },
      ),
    );
  });

  it("warns outside 45°–75° (common practice) and refuses bad angles", () => {
    const flat = calculateRakingShore({ thrustN: 10000, headHeightMm: 4000, angleDeg: 30 });
    expect(flat.ok && flat.warnings.join(" ")).toContain("45°–75°");
    for (const angleDeg of [0, 90, -10, 120, Number.NaN, "60"]) {
      const r = calculateRakingShore({ thrustN: 10000, headHeightMm: 4000, angleDeg });
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.errors[0].field).toBe("angleDeg");
    }
    const missing = calculateRakingShore({ headHeightMm: 4000, angleDeg: 60 });
    expect(!missing.ok && missing.errors[0]).toEqual({ field: "thrustN", message: "Horizontal thrust at the head H is required." });
    expect(calculateRakingShore(null).ok).toBe(false);
  });
});

describe("slab load per member", () => {
  it("EN 1991-1-6 Table 4.2 working-area rule", () => {
    // 10 % of g_c, not less than 0.75 and not more than 1.5 kN/m²
    expect(workingAreaConstructionLoad(6.5)).toBe(0.75);
    expect(workingAreaConstructionLoad(10.4)).toBeCloseTo(1.04, 12);
    expect(workingAreaConstructionLoad(18.2)).toBe(1.5);
  });

  it("250 mm slab on a 1.2 m × 1.2 m grid, by hand", () => {
    const r = calculateSlabLoad({ slabThicknessMm: 250, spacingXMm: 1200, spacingYMm: 1200 });
    if (!r.ok) throw new Error(JSON.stringify(r.errors));
    // γ = 24 + 1 + 1 = 26 kN/m³ (EN 1991-1-1 Table A.1 and notes); g_c = 26 × 0.25 = 6.5 kN/m²
    // g_f = 0.5 kN/m² (common practice); q_c = max(0.75, 0.1 × 6.5) = 0.75 kN/m² (EN 1991-1-6 Table 4.2)
    // w = 6.5 + 0.5 + 0.75 = 7.75 kN/m²; A_t = 1.2 × 1.2 = 1.44 m²; N = 7.75 × 1.44 = 11.16 kN
    expect(r.concreteKnM2).toBeCloseTo(6.5, 12);
    expect(r.constructionKnM2).toBe(0.75);
    expect(r.totalKnM2).toBeCloseTo(7.75, 12);
    expect(r.tributaryAreaM2).toBeCloseTo(1.44, 12);
    expect(r.loadPerMemberN).toBeCloseTo(11160, 6);
    // Factored with γQ = 1.5 on all three (construction loads, EN 1991-1-6 §4.11): 1.5 × 7.75 × 1.44 = 16.74 kN
    expect(r.factoredLoadPerMemberN).toBeCloseTo(16740, 6);
    expect(r.warnings.join(" ")).toContain("formwork");
  });

  it("overrides and the permanent-load option", () => {
    const r = calculateSlabLoad({
      slabThicknessMm: 400,
      spacingXMm: 1000,
      spacingYMm: 1500,
      concreteDensityKnM3: 25,
      formworkKnM2: 0.3,
      constructionRule: "outside-working-area",
      concreteAsPermanent: true,
    });
    if (!r.ok) throw new Error(JSON.stringify(r.errors));
    // g_c = 25 × 0.4 = 10 kN/m²; q_c = 0.75 (outside the working area); w = 10 + 0.3 + 0.75 = 11.05 kN/m²
    // A_t = 1.0 × 1.5 = 1.5 m²; N = 16.575 kN; factored = 1.35 × 10.3 + 1.5 × 0.75 = 13.905 + 1.125 = 15.03 kN/m² → 22.545 kN
    expect(r.loadPerMemberN).toBeCloseTo(16575, 6);
    expect(r.factoredLoadPerMemberN).toBeCloseTo(22545, 6);
    const given = calculateSlabLoad({ slabThicknessMm: 200, spacingXMm: 1000, spacingYMm: 1000, constructionKnM2: 1.5 });
    expect(given.ok && given.constructionKnM2).toBe(1.5);
  });

  it("bad input", () => {
    const r = calculateSlabLoad({ slabThicknessMm: -200, spacingXMm: "1200" });
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.errors.map((e) => e.field)).toEqual(["slabThicknessMm", "spacingXMm", "spacingYMm"]);
      expect(r.errors[0].message).toBe("Slab thickness must be greater than zero (got -200 mm).");
    }
    expect(calculateSlabLoad([]).ok).toBe(false);
    const rule = calculateSlabLoad({ slabThicknessMm: 200, spacingXMm: 1000, spacingYMm: 1000, constructionRule: "everywhere" });
    expect(!rule.ok && rule.errors[0].field).toBe("constructionRule");
  });
});

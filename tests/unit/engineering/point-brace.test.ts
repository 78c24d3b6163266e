import { describe, expect, it } from "vitest";
import { app6RequiredStiffness, calculate, idealBraceCoefficient, type CapacityResult } from "@/lib/engineering";

function ok(r: ReturnType<typeof calculate>): CapacityResult {
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  if (r.capacityN === undefined) throw new Error("The result has no capacity.");
  return r as CapacityResult;
}

describe("ideal point-brace stiffness (Winter 1960; Yura 2001)", () => {
  // Yura (2001), "Fundamentals of beam bracing", AISC Engineering Journal, Fig. for columns with n braces:
  // β_i·L_b/P = 2 (one brace), 3 (two), 3.41 (three), 3.63 (four, as quoted; the closed form gives 3.618), → 4.
  it.each([
    [1, 2.0, 0.001],
    [2, 3.0, 0.001],
    [3, 3.41, 0.005],
    [4, 3.63, 0.015],
  ])("%i brace(s) → %f", (n, published, tol) => {
    expect(Math.abs(idealBraceCoefficient(n) - published)).toBeLessThanOrEqual(tol);
  });
  it("closed form by hand for four braces: 2[1 + cos(π/5)] = 2 × 1.809017 = 3.618034", () => {
    expect(idealBraceCoefficient(4)).toBeCloseTo(3.618034, 6);
  });
  it("tends to 4 for many braces (continuous bracing limit)", () => {
    expect(idealBraceCoefficient(50)).toBeGreaterThan(3.99);
    expect(idealBraceCoefficient(50)).toBeLessThan(4);
  });
});

describe("AISC 360-16 Appendix 6 §6.2.2 point bracing", () => {
  it("required stiffness and strength by hand", () => {
    // P_r = 100 kN, L_br = 2000 mm: 8P_r/L_br = 8 × 100 000/2000 = 400 N/mm
    // LRFD: 400/0.75 = 533.3 N/mm; ASD: 2.00 × 400 = 800 N/mm
    expect(app6RequiredStiffness(100000, 2000, "lrfd")).toBeCloseTo(533.333, 3);
    expect(app6RequiredStiffness(100000, 2000, "asd")).toBeCloseTo(800, 9);
  });

  it("method: two braces on a 6 m CHS 114.3 × 5", () => {
    const r = ok(calculate({ method: "point-brace", lengthMm: 6000, section: { shape: "chs", dMm: 114.3, tMm: 5 }, braces: 2, loadN: 100000 }));
    // L_b = 6000/3 = 2000 mm
    expect(r.effectiveLengthMm).toBe(2000);
    // β_i = 3 × 100 000/2000 = 150 N/mm; β_br = 533.3 N/mm; P_br = 0.01 × 100 000 = 1000 N
    expect(r.idealStiffnessNPerMm).toBeCloseTo(150, 9);
    expect(r.requiredStiffnessNPerMm).toBeCloseTo(533.333, 3);
    expect(r.requiredForceN).toBeCloseTo(1000, 9);
    // P_cr between braces = π²·200 000·2 569 202/2000² = 9.8696 × 200 000 × 2 569 202 / 4 000 000 = 1 267 850 N
    expect(r.capacityN / 1267850).toBeCloseTo(1, 4);
    // utilisation = 100 000/1 267 850 = 0.0789
    expect(r.utilisation).toBeCloseTo(0.0789, 4);
  });

  it("ASD basis", () => {
    const r = ok(
      calculate({ method: "point-brace", lengthMm: 4000, section: { shape: "round", dMm: 50 }, braces: 1, loadN: 20000, designBasis: "asd" }),
    );
    // L_b = 2000; β_br = 2.00 × 8 × 20 000/2000 = 160 N/mm; β_i = 2 × 20 000/2000 = 20 N/mm
    expect(r.requiredStiffnessNPerMm).toBeCloseTo(160, 9);
    expect(r.idealStiffnessNPerMm).toBeCloseTo(20, 9);
  });

  it("warns when the load exceeds the critical load between braces", () => {
    const r = ok(calculate({ method: "point-brace", lengthMm: 4000, section: { shape: "round", dMm: 20 }, braces: 1, loadN: 50000 }));
    expect(r.pass).toBe(false);
    expect(r.warnings.join(" ")).toContain("even rigid braces");
  });

  it("needs braces and load", () => {
    const r = calculate({ method: "point-brace", lengthMm: 4000, section: { shape: "round", dMm: 20 } });
    expect(!r.ok && r.errors.map((e) => e.field)).toEqual(["braces", "loadN"]);
    const frac = calculate({ method: "point-brace", lengthMm: 4000, section: { shape: "round", dMm: 20 }, braces: 1.5, loadN: 1 });
    expect(!frac.ok && frac.errors[0]).toEqual({ field: "braces", message: "Number of intermediate braces must be a whole number (got 1.5)." });
  });
});

import { describe, expect, it } from "vitest";
import { calculate, en1993Chi, IMPERFECTION_FACTORS, type CapacityResult } from "@/lib/engineering";

function ok(r: ReturnType<typeof calculate>): CapacityResult {
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  if (r.capacityN === undefined) throw new Error("The result has no capacity.");
  return r as CapacityResult;
}

describe("EN 1993-1-1 reduction factor χ", () => {
  it("imperfection factors are those of Table 6.1", () => {
    // EN 1993-1-1 Table 6.1: a0 0.13, a 0.21, b 0.34, c 0.49, d 0.76
    expect(IMPERFECTION_FACTORS).toEqual({ a0: 0.13, a: 0.21, b: 0.34, c: 0.49, d: 0.76 });
  });

  // Published χ tables for λ̄ = 1.0 (from memory): a0 0.725, a 0.666, b 0.597, c 0.540, d 0.467.
  it.each([
    ["a0", 0.725],
    ["a", 0.666],
    ["b", 0.597],
    ["c", 0.54],
    ["d", 0.467],
  ] as const)("curve %s at λ̄ = 1.0 → %f (tabulated)", (curve, tabulated) => {
    const chi = en1993Chi(1.0, IMPERFECTION_FACTORS[curve]);
    expect(Math.abs(chi - tabulated)).toBeLessThanOrEqual(0.0006);
  });

  it("curve b at λ̄ = 1.0 by hand from (6.49)", () => {
    // Φ = 0.5·[1 + 0.34·(1.0 − 0.2) + 1.0²] = 0.5 × 2.272 = 1.136
    // χ = 1 / (1.136 + √(1.136² − 1)) = 1 / (1.136 + √0.290496) = 1 / (1.136 + 0.538977) = 0.59702
    expect(en1993Chi(1.0, 0.34)).toBeCloseTo(0.59702, 5);
  });

  it("curve b at λ̄ = 0.5 by hand", () => {
    // Φ = 0.5·[1 + 0.34·0.3 + 0.25] = 0.676; χ = 1/(0.676 + √(0.456976 − 0.25)) = 1/(0.676 + 0.454947) = 0.88422
    expect(en1993Chi(0.5, 0.34)).toBeCloseTo(0.88422, 5);
  });

  it("χ = 1 at and below λ̄ = 0.2 (§6.3.1.2(4))", () => {
    for (const a of Object.values(IMPERFECTION_FACTORS)) {
      expect(en1993Chi(0.2, a)).toBeCloseTo(1, 12);
      expect(en1993Chi(0.1, a)).toBe(1);
      expect(en1993Chi(0, a)).toBe(1);
    }
  });
});

describe("en1993 method", () => {
  it("CHS 114.3 × 5.0 S355 hot-finished, 4.0 m pinned, by hand", () => {
    const r = ok(
      calculate({
        method: "en1993",
        lengthMm: 4000,
        ends: "pinned-pinned",
        section: { shape: "chs", dMm: 114.3, tMm: 5.0 },
        steelGrade: "S355",
        formed: "hot-finished",
      }),
    );
    // Hand calculation, EN 1993-1-1 §6.3.1:
    // A = π/4·(114.3² − 104.3²) = 0.785398 × 2186.0 = 1716.9 mm²
    // I = π/64·(114.3⁴ − 104.3⁴) = 0.0490874 × 52 339 354 = 2 569 200 mm⁴; i = √(I/A) = 38.68 mm
    // λ1 = 93.9ε = 93.9 × √(235/355) = 93.9 × 0.81362 = 76.40 (§6.3.1.3)
    // λ̄ = (L_cr/i)/λ1 = (4000/38.68)/76.40 = 103.41/76.40 = 1.3535 (6.50)
    // Curve a (hot-finished S355, Table 6.2), α = 0.21
    // Φ = 0.5·[1 + 0.21·1.1535 + 1.3535²] = 0.5 × (1 + 0.24224 + 1.83196) = 1.53710 (Φ² = 2.36267)
    // χ = 1/(1.53710 + √(2.36267 − 1.83196)) = 1/(1.53710 + √0.53071) = 1/(1.53710 + 0.72850) = 0.44138
    // N_b,Rd = χ·A·fy/γM1 = 0.44138 × 1716.9 × 355 / 1.0 = 269 025 N (λ1 = 93.9ε is rounded, so allow 0.05 %)
    expect(r.relativeSlenderness).toBeCloseTo(1.3535, 3);
    expect(r.reductionFactor).toBeCloseTo(0.4414, 3);
    expect(r.capacityN / 269025).toBeCloseTo(1, 3);
    expect(r.basis).toBe("design-resistance");
    const curve = r.steps.find((s) => s.symbol === "curve");
    expect(curve?.value).toBe("a");
    expect(curve?.source).toBe("EN 1993-1-1 Table 6.2");
  });

  it("Table 6.2 curve selection", () => {
    const base = { method: "en1993", lengthMm: 3000, section: { shape: "chs", dMm: 114.3, tMm: 5 } };
    const curveOf = (extra: object) => ok(calculate({ ...base, ...extra })).steps.find((s) => s.symbol === "curve")?.value;
    expect(curveOf({ fyMpa: 355, formed: "hot-finished" })).toBe("a");
    expect(curveOf({ fyMpa: 460, formed: "hot-finished" })).toBe("a0");
    expect(curveOf({ fyMpa: 355, formed: "cold-formed" })).toBe("c");
    expect(curveOf({ fyMpa: 355 })).toBe("c");
    expect(curveOf({ fyMpa: 355, curve: "b" })).toBe("b");
    expect(ok(calculate({ ...base, fyMpa: 355 })).warnings.join(" ")).toContain("cold-formed curve c");
    const solid = ok(calculate({ method: "en1993", lengthMm: 1000, section: { shape: "rect", bMm: 40, hMm: 40 }, fyMpa: 275 }));
    expect(solid.steps.find((s) => s.symbol === "curve")?.value).toBe("c");
  });

  it("given section needs an explicit curve", () => {
    const r = calculate({ method: "en1993", lengthMm: 3000, section: { shape: "given", areaMm2: 1000, iMinMm4: 1e6 }, fyMpa: 355 });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors[0].field).toBe("curve");
  });

  it("squash load when λ̄ ≤ 0.2, with a warning", () => {
    const r = ok(calculate({ method: "en1993", lengthMm: 200, section: { shape: "chs", dMm: 114.3, tMm: 5 }, fyMpa: 355, formed: "hot-finished" }));
    // λ̄ = (200/38.68)/76.40 = 0.068 ≤ 0.2 → χ = 1, N = A·fy = 1716.9 × 355 = 609 500 N
    expect(r.reductionFactor).toBe(1);
    expect(r.capacityN / 609500).toBeCloseTo(1, 3);
    expect(r.warnings.join(" ")).toContain("§6.3.1.2(4)");
  });

  it("N_Ed/N_cr ≤ 0.04 is reported but χ is still applied", () => {
    const r = ok(
      calculate({ method: "en1993", lengthMm: 4000, section: { shape: "chs", dMm: 114.3, tMm: 5 }, fyMpa: 355, formed: "hot-finished", loadN: 10000 }),
    );
    expect(r.warnings.join(" ")).toContain("0.04");
    expect(r.reductionFactor).toBeLessThan(1);
  });

  it("γM1 divides the resistance", () => {
    const base = { method: "en1993", lengthMm: 3000, section: { shape: "chs", dMm: 88.9, tMm: 4 }, fyMpa: 355, formed: "hot-finished" };
    const a = ok(calculate(base)).capacityN;
    const b = ok(calculate({ ...base, gammaM1: 1.1 })).capacityN;
    expect(a / b).toBeCloseTo(1.1, 12);
  });

  it("grade preset: thicker than 40 mm uses the 40–80 mm value of Table 3.1", () => {
    const r = ok(calculate({ method: "en1993", lengthMm: 3000, section: { shape: "rect", bMm: 50, hMm: 200 }, steelGrade: "S355" }));
    // EN 1993-1-1 Table 3.1: S355, 40 < t ≤ 80 mm → fy = 335 MPa
    expect(r.steps.find((s) => s.symbol === "f_y")?.value).toBe(335);
  });

  it("Class 4 tubes are refused (Table 5.2: d/t ≤ 90ε²)", () => {
    // S355: 90 × 235/355 = 59.6; 168.3/2.0 = 84 > 59.6
    const r = calculate({ method: "en1993", lengthMm: 3000, section: { shape: "chs", dMm: 168.3, tMm: 2.0 }, fyMpa: 355 });
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.errors[0].field).toBe("section.tMm");
      expect(r.errors[0].message).toContain("Class 3 limit");
    }
    // 168.3/3.0 = 56.1 < 59.6 → accepted
    expect(calculate({ method: "en1993", lengthMm: 3000, section: { shape: "chs", dMm: 168.3, tMm: 3.0 }, fyMpa: 355 }).ok).toBe(true);
  });

  it("slenderness warning beyond 180 (common practice)", () => {
    const r = ok(calculate({ method: "en1993", lengthMm: 3000, section: { shape: "chs", dMm: 48.3, tMm: 4 }, fyMpa: 235 }));
    // L/i = 3000/15.72 = 190.8 > 180
    expect(r.warnings.join(" ")).toContain("180");
  });
});

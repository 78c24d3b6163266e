import { describe, expect, it } from "vitest";
import { calculate, en1995Kc, en1995LambdaRel, findTimberClass, KMOD, GAMMA_M_TIMBER, BETA_C, type CapacityResult } from "@/lib/engineering";

function ok(r: ReturnType<typeof calculate>): CapacityResult {
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  if (r.capacityN === undefined) throw new Error("The result has no capacity.");
  return r as CapacityResult;
}

describe("EN 1995-1-1 tables", () => {
  it("strength class presets", () => {
    // Porteous & Kermani, Structural Timber Design to Eurocode 5, Table 5.3 (reproducing EN 338):
    // C24 fc,0,k 21, E0,05 7400; C27 22, 7700; C35 25, 8700 (N/mm²).
    expect(findTimberClass("C24")).toMatchObject({ fc0kMpa: 21, e005Mpa: 7400 });
    expect(findTimberClass("c27")).toMatchObject({ fc0kMpa: 22, e005Mpa: 7700 });
    expect(findTimberClass("C35")).toMatchObject({ fc0kMpa: 25, e005Mpa: 8700 });
    // EN 338:2016 Table 1 (from memory): C16 17/5400, C18 18/6000, C22 20/6700, C30 24/8000
    // (C30 was 23 N/mm² in EN 338:2003/2009). EN 14080 GL24h 24/9600, GL28h 28/10500 (from memory).
    expect(findTimberClass("C16")).toMatchObject({ fc0kMpa: 17, e005Mpa: 5400 });
    expect(findTimberClass("C18")).toMatchObject({ fc0kMpa: 18, e005Mpa: 6000 });
    expect(findTimberClass("C22")).toMatchObject({ fc0kMpa: 20, e005Mpa: 6700 });
    expect(findTimberClass("C30")).toMatchObject({ fc0kMpa: 24, e005Mpa: 8000 });
    expect(findTimberClass("GL24h")).toMatchObject({ fc0kMpa: 24, e005Mpa: 9600, timberType: "glulam" });
    expect(findTimberClass("GL28h")).toMatchObject({ fc0kMpa: 28, e005Mpa: 10500, timberType: "glulam" });
  });
  it("kmod (Table 3.1), γM (Table 2.3) and βc (6.29)", () => {
    // EN 1995-1-1 Table 3.1, solid timber, service class 1/2: 0.60 0.70 0.80 0.90 1.10; class 3: 0.50 0.55 0.65 0.70 0.90
    expect(Object.values(KMOD[1])).toEqual([0.6, 0.7, 0.8, 0.9, 1.1]);
    expect(Object.values(KMOD[2])).toEqual([0.6, 0.7, 0.8, 0.9, 1.1]);
    expect(Object.values(KMOD[3])).toEqual([0.5, 0.55, 0.65, 0.7, 0.9]);
    // Table 2.3: solid timber 1.3, glued laminated timber 1.25, LVL 1.2
    expect(GAMMA_M_TIMBER).toMatchObject({ solid: 1.3, glulam: 1.25, lvl: 1.2 });
    // (6.29): 0.2 solid timber, 0.1 glulam and LVL
    expect(BETA_C).toMatchObject({ solid: 0.2, glulam: 0.1, lvl: 0.1 });
  });
});

describe("EN 1995-1-1 §6.3.2 instability factor", () => {
  it("kc by hand at λ_rel = 1.0, solid timber", () => {
    // k = 0.5·[1 + 0.2·(1.0 − 0.3) + 1.0²] = 0.5 × 2.14 = 1.07
    // kc = 1/(1.07 + √(1.07² − 1)) = 1/(1.07 + √0.1449) = 1/(1.07 + 0.380657) = 1/1.450657 = 0.689343
    expect(en1995Kc(1.0, 0.2)).toBeCloseTo(0.689343, 5);
  });
  it("kc by hand just above the threshold, λ_rel = 0.4", () => {
    // k = 0.5·[1 + 0.2·0.1 + 0.16] = 0.59; kc = 1/(0.59 + √(0.3481 − 0.16)) = 1/(0.59 + 0.433705) = 0.976844
    expect(en1995Kc(0.4, 0.2)).toBeCloseTo(0.976844, 5);
  });
  it("kc = 1 when λ_rel ≤ 0.3 (§6.3.2(2))", () => {
    expect(en1995Kc(0.3, 0.2)).toBe(1);
    expect(en1995Kc(0.1, 0.1)).toBe(1);
    // continuity just above 0.3: k = 0.5(1 + 0.2·0.001 + 0.301²) = 0.5453; kc ≈ 0.99985
    expect(en1995Kc(0.301, 0.2)).toBeGreaterThan(0.999);
  });
  it("λ_rel by hand", () => {
    // (100/π)·√(21/7400) = 31.831 × 0.053271 = 1.69566
    expect(en1995LambdaRel(100, 21, 7400)).toBeCloseTo(1.69566, 4);
  });
});

describe("en1995 method", () => {
  it("C24 100 × 100 post, 2.4 m pinned, service class 2 medium-term, by hand", () => {
    const r = ok(calculate({ method: "en1995", lengthMm: 2400, ends: "pinned-pinned", section: { shape: "rect", bMm: 100, hMm: 100 }, strengthClass: "C24", serviceClass: 2 }));
    // A = 10 000 mm²; i = 100/√12 = 28.868 mm; λ = 2400/28.868 = 83.138
    // λ_rel = (83.138/π)·√(21/7400) = 26.464 × 0.053271 = 1.40976
    // k = 0.5·[1 + 0.2·1.10976 + 1.40976²] = 0.5 × (1 + 0.22195 + 1.98742) = 1.60469
    // kc = 1/(1.60469 + √(2.57503 − 1.98742)) = 1/(1.60469 + 0.76656) = 0.42172
    // f_c,0,d = 0.8 × 21 / 1.3 = 12.923 MPa; N_c,Rd = 0.42172 × 12.923 × 10 000 = 54 499 N
    expect(r.relativeSlenderness).toBeCloseTo(1.40976, 4);
    expect(r.reductionFactor).toBeCloseTo(0.42172, 4);
    expect(r.capacityN / 54499).toBeCloseTo(1, 4);
    expect(r.basis).toBe("design-resistance");
    expect(r.warnings.join(" ")).toContain("kmod = 0.8");
  });

  it("glulam class picks βc 0.1 and γM 1.25", () => {
    const r = ok(calculate({ method: "en1995", lengthMm: 3000, section: { shape: "rect", bMm: 140, hMm: 140 }, strengthClass: "GL24h", kmod: 0.9 }));
    expect(r.steps.find((s) => s.symbol === "β_c")?.value).toBe(0.1);
    expect(r.steps.find((s) => s.symbol === "γ_M")?.value).toBe(1.25);
    // i = 140/√12 = 40.415; λ = 3000/40.415 = 74.231; λ_rel = (74.231/π)·√(24/9600) = 23.628 × 0.05 = 1.18142
    // k = 0.5·[1 + 0.1·0.88142 + 1.18142²] = 0.5 × (1 + 0.088142 + 1.395755) = 1.241949
    // kc = 1/(1.241949 + √(1.542437 − 1.395755)) = 1/(1.241949 + 0.382991) = 0.615407
    // N = 0.615407 × (0.9 × 24/1.25) × 140² = 0.615407 × 17.28 × 19 600 = 208 432 N
    expect(r.capacityN / 208432).toBeCloseTo(1, 3);
  });

  it("kmod from service class and load duration", () => {
    const r = ok(
      calculate({ method: "en1995", lengthMm: 2000, section: { shape: "rect", bMm: 75, hMm: 100 }, strengthClass: "C16", serviceClass: 3, loadDuration: "short-term" }),
    );
    // Table 3.1 service class 3, short-term: 0.70
    expect(r.steps.find((s) => s.symbol === "k_mod")?.value).toBe(0.7);
  });

  it("explicit material values", () => {
    const r = ok(calculate({ method: "en1995", lengthMm: 2000, section: { shape: "round", dMm: 150 }, fc0kMpa: 20, e005Mpa: 6700, kmod: 0.9, gammaM: 1.3 }));
    // round: i = D/4 = 37.5; λ = 53.333; λ_rel = (53.333/π)·√(20/6700) = 16.977 × 0.054636 = 0.92753
    // k = 0.5·[1 + 0.2·0.62755 + 0.86035] = 0.5 × 1.985860 = 0.992930
    // kc = 1/(0.992930 + √(0.985910 − 0.860350)) = 1/(0.992930 + 0.354345) = 0.742239
    // N = 0.742239 × (0.9 × 20/1.3) × (π·150²/4) = 0.742239 × 13.8462 × 17 671.46 = 181 612 N (rounding in k: ±0.01 %)
    expect(r.capacityN / 181612).toBeCloseTo(1, 3);
  });

  it("refuses hollow steel shapes and unknown classes", () => {
    const hollow = calculate({ method: "en1995", lengthMm: 2000, section: { shape: "chs", dMm: 100, tMm: 5 }, strengthClass: "C24" });
    expect(!hollow.ok && hollow.errors[0].field).toBe("section.shape");
    const unknown = calculate({ method: "en1995", lengthMm: 2000, section: { shape: "rect", bMm: 100, hMm: 100 }, strengthClass: "C99" });
    expect(!unknown.ok && unknown.errors[0].field).toBe("strengthClass");
    const missing = calculate({ method: "en1995", lengthMm: 2000, section: { shape: "rect", bMm: 100, hMm: 100 } });
    expect(!missing.ok && missing.errors.map((e) => e.field)).toEqual(["fc0kMpa", "e005Mpa"]);
  });
});

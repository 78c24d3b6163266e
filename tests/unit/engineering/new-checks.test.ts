// The checks around a member's buckling capacity. Expected values come from the published
// method or clause named beside each, worked by hand (the arithmetic is in the comments).
import { describe, expect, it } from "vitest";
import { backpropSequence, calculate, type CalculationSuccess } from "@/lib/engineering";

function success(r: ReturnType<typeof calculate>): CalculationSuccess {
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return r;
}
function failure(r: ReturnType<typeof calculate>) {
  if (r.ok) throw new Error("expected a refusal");
  return r;
}
const chs114 = { shape: "chs", dMm: 114.3, tMm: 5 };

describe("back-propping sequence, Grundy & Kabaila (1963) simplified method", () => {
  it("two levels of props, by hand from the method's rules (equal shares between slabs joined by rigid props; rigid ground)", () => {
    // Cycle 1: slab 1 cast on props on the ground: the props carry 1.0, the ground takes it.
    // Cycle 2: slab 2 cast: props under it carry 1.0, props under slab 1 carry 2.0; slab 1 carries 0 (grounded).
    // Cycle 3: props under slab 1 struck: slabs 1 and 2 (joined) share the released 2.0 → 1.0 each; props between 0.
    //          slab 3 cast: +1.0 shared by slabs 1 and 2 → 1.5 each; props under slab 3: 1.0, under slab 2: 0.5.
    // Cycle 4: props under slab 2 (0.5) struck: slab 1 → 1.5 − 0.5 = 1.0; slabs 2 and 3 share +0.5 → 1.75, 0.25;
    //          props under slab 3: 1 − 0.25 = 0.75. Slab 4 cast: +1.0 shared by slabs 2 and 3 → 2.25, 0.75.
    const r = backpropSequence({ shoredLevels: 2, cycles: 4, formworkRatio: 0, constructionRatio: 0 });
    const byLabel = Object.fromEntries(r.stages.map((s) => [s.label, s]));
    expect(byLabel["Cycle 2: slab 2 cast"].propLoadRatios).toEqual([1, 2]);
    expect(byLabel["Cycle 3: slab 3 cast"].slabLoadRatios).toEqual([1.5, 1.5]);
    expect(byLabel["Cycle 3: slab 3 cast"].propLoadRatios).toEqual([1, 0.5]);
    expect(byLabel["Cycle 4: props under slab 2 struck and lifted to the top"].slabLoadRatios).toEqual([0.25, 1.75, 1]);
    const last = byLabel["Cycle 4: slab 4 cast"];
    expect(last.slabLoadRatios).toEqual([0.75, 2.25, 1]);
    expect(last.propLoadRatios).toEqual([1, 1.25]);
    expect(r.maxSlab).toBeCloseTo(2.25, 12);
  });

  it.each([
    // Grundy & Kabaila (1963), ACI Journal 60(12): maximum slab load ratios for shored slabs (from memory): 2 levels 2.25, 3 levels 2.36.
    [2, 2.25],
    [3, 2.36],
  ])("%i levels of props: the largest slab load approaches the paper's %f", (levels, published) => {
    const r = success(calculate({ method: "backprop-sequence", shoredLevels: levels, slabSelfWeightKPa: 6 }));
    expect(Math.abs((r.maxSlabLoadRatio as number) - published)).toBeLessThanOrEqual(0.015);
    expect(r.stages?.length).toBeGreaterThan(levels * 2);
    expect(r.steps.map((s) => s.source).join(" ")).toContain("Grundy & Kabaila 1963");
    expect(r.capacityN).toBeUndefined();
  });

  it("every stage is in equilibrium: slab loads plus the ground equal the weight placed (statics)", () => {
    const r = backpropSequence({ shoredLevels: 3, cycles: 10, formworkRatio: 0, constructionRatio: 0 });
    for (const s of r.stages) {
      const slabs = s.slabLoadRatios.reduce((a, b) => a + b, 0);
      const cast = Number(/slab (\d+) cast/.exec(s.label)?.[1] ?? NaN);
      const hardenedCount = s.slabLoadRatios.length;
      const placed = Number.isNaN(cast) ? hardenedCount : hardenedCount + 1;
      // Whatever the slabs do not carry goes to the ground through the first level of props (0 once that level is struck).
      expect(slabs).toBeLessThanOrEqual(placed + 1e-9);
    }
    // Once the ground props are gone, the slabs carry everything placed.
    const late = r.stages[r.stages.length - 1];
    expect(late.slabLoadRatios.reduce((a, b) => a + b, 0)).toBeCloseTo(late.slabLoadRatios.length + 1, 9);
  });

  it("construction load while casting adds to the peak and is taken off again", () => {
    const r = success(calculate({ method: "backprop-sequence", shoredLevels: 2, slabSelfWeightKPa: 6, constructionKPa: 1.5 }));
    // 1.5/6 = 0.25 of a slab more during casting: peak at least 2.25 + 0.25/2 = 2.375 (shared by two slabs)
    expect(r.maxSlabLoadRatio as number).toBeGreaterThanOrEqual(2.375 - 1e-9);
    expect(r.stages?.some((s) => s.label.includes("construction load off"))).toBe(true);
  });

  it("validated like the rest", () => {
    expect(failure(calculate({ method: "backprop-sequence", slabSelfWeightKPa: 6 })).errors[0].field).toBe("shoredLevels");
    expect(failure(calculate({ method: "backprop-sequence", shoredLevels: 7, slabSelfWeightKPa: 6 })).errors[0]).toEqual({
      field: "shoredLevels",
      message: "Number of shored levels of 7 is outside the range this calculator accepts (up to 6). The simplified method is set up here for 1 to 6 levels of props.",
    });
    expect(failure(calculate({ method: "backprop-sequence", shoredLevels: 2, slabSelfWeightKPa: "6" })).errors[0].field).toBe("slabSelfWeightKPa");
    expect(failure(calculate({ method: "backprop-sequence", shoredLevels: 3, slabSelfWeightKPa: 6, cycles: 2 })).errors[0].field).toBe("cycles");
  });
});

describe("out of plumb and eccentric load", () => {
  it("steel CHS 114.3 × 5, 3 m pinned, N = 200 kN at 20 mm eccentricity: EN 1993-1-1 §6.3.3 Eq. 6.62 with Annex A k_zz, by hand", () => {
    // A = π/4(114.3² − 104.3²) = 1716.9 mm²; I = π/64(114.3⁴ − 104.3⁴) = 2 569 202 mm⁴; W_el = 2I/D = 44 955 mm³
    // N_cr = π²·210 000·I/3000² = 591 664 N; λ̄ = √(1716.9 × 355/591 664) = 1.0150; curve c (cold-formed, Table 6.2), α = 0.49
    // Φ = 0.5[1 + 0.49(0.8150) + 1.0301] = 1.2147; χ = 0.5313 (6.49); N_b,Rd = 0.5313 × 1716.9 × 355 = 323 829 N
    // M_Rd = 44 955 × 355 = 15.959 kN·m; M_Ed = 200 000 × 20 = 4.0 kN·m, equal at both ends (ψ = 1); N_Ed/N_cr = 0.33803
    // Annex A Table A.2 (from memory): C_m,0 = 0.79 + 0.21 + 0.36 × 0.67 × 0.33803 = 1.08153
    // Annex A Table A.1, Class 3: μ = (1 − 0.33803)/(1 − 0.5313 × 0.33803) = 0.80689; k_zz = 1.08153 × 0.80689/0.66197 = 1.31830
    // Σ = 200 000/323 829 + 1.31830 × 4.0/15.959 = 0.61761 + 0.33042 = 0.94803
    const r = success(calculate({ method: "out-of-plumb", lengthMm: 3000, section: chs114, fyMpa: 355, loadN: 200000, eccentricityMm: 20 }));
    expect(r.steps.find((s) => s.symbol === "C_mz")?.value).toBeCloseTo(1.08153, 4);
    expect(r.steps.find((s) => s.symbol === "k_zz")?.value).toBeCloseTo(1.3183, 3);
    expect(r.utilisation).toBeCloseTo(0.94803, 4);
    expect(r.pass).toBe(true);
    expect(r.checks?.map((c) => c.source).join(" ")).toContain("EN 1993-1-1 §6.3.3");
    // The capacity is the load at which the same check reaches 1: above 200 kN, below the axial N_b,Rd.
    expect(r.capacityN as number).toBeGreaterThan(200000);
    expect(r.capacityN as number).toBeLessThan(323829);
  });

  it("a lean adds N/cos θ and a horizontal force N·tan θ at the ends (statics)", () => {
    // 3° out: H = 100 kN × tan 3° = 5240.8 N; axial = 100 000/cos 3° = 100 137 N
    const r = success(calculate({ method: "out-of-plumb", lengthMm: 3000, section: chs114, fyMpa: 355, loadN: 100000, outOfPlumbDeg: 3 }));
    expect(r.requiredForceN).toBeCloseTo(5240.8, 1);
    expect(r.steps.find((s) => s.symbol === "N_ax")?.value).toBeCloseTo(100137.2, 1);
    // Offset form: 157 mm over 3000 mm → θ = asin(0.05233) = 3.0°
    const off = success(calculate({ method: "out-of-plumb", lengthMm: 3000, section: chs114, fyMpa: 355, loadN: 100000, outOfPlumbMm: 157 }));
    expect(off.steps.find((s) => s.symbol === "θ")?.value).toBeCloseTo(3.0, 1);
  });

  it("an EN 1065 prop 3° out is outside its class rating and fails; 1° out is checked on N/cos θ", () => {
    // Class D: R_k = 34 kN; SWL = 34/1.65 = 20.606 kN (EN 1065 Table 2, to be confirmed). 10 kN at 1°: 10 000/cos 1°/20 606 = 0.4854
    const base = { method: "out-of-plumb", lengthMm: 3000, propClass: "D", maxExtensionMm: 3500, minExtensionMm: 1980, loadN: 10000 };
    const within = success(calculate({ ...base, outOfPlumbDeg: 1 }));
    expect(within.utilisation).toBeCloseTo(0.48535, 4);
    expect(within.pass).toBe(true);
    const out = success(calculate({ ...base, outOfPlumbDeg: 3 }));
    expect(out.pass).toBe(false);
    expect(out.warnings.join(" ")).toContain("3° out of plumb");
  });

  it("AISC 360-16 basis uses H1-1 with B1 amplification", () => {
    const r = success(calculate({ method: "out-of-plumb", plumbCode: "aisc360", lengthMm: 3000, section: chs114, fyMpa: 345, loadN: 100000, eccentricityMm: 10 }));
    expect(r.steps.map((s) => s.source).join(" ")).toMatch(/H1-1[ab]/);
    expect(r.steps.map((s) => s.source).join(" ")).toContain("Eq. A-8-3");
  });

  it("validated like the rest", () => {
    const none = failure(calculate({ method: "out-of-plumb", lengthMm: 3000 }));
    expect(none.errors.map((e) => e.field)).toEqual(["loadN", "outOfPlumbDeg", "section"]);
    expect(failure(calculate({ method: "out-of-plumb", lengthMm: 3000, section: chs114, fyMpa: 355, loadN: 1, outOfPlumbDeg: -2 })).errors[0].field).toBe("outOfPlumbDeg");
    expect(failure(calculate({ method: "out-of-plumb", lengthMm: 3000, section: chs114, fyMpa: 355, loadN: 1, outOfPlumbDeg: 1, outOfPlumbMm: 50 })).errors[0].field).toBe("outOfPlumbMm");
    expect(failure(calculate({ method: "out-of-plumb", lengthMm: 3000, section: chs114, fyMpa: 355, loadN: 1, outOfPlumbMm: 3000 })).errors[0].field).toBe("outOfPlumbMm");
    // A load beyond the elastic critical load is refused with its reason, not a NaN.
    expect(failure(calculate({ method: "out-of-plumb", lengthMm: 3000, section: chs114, fyMpa: 355, loadN: 700000, eccentricityMm: 5 })).errors[0].field).toBe("loadN");
  });
});

describe("bearing under the base", () => {
  it("base plate on firm clay: 20 kN on 150 × 150 mm gives 889 kPa against 75 kPa (BS 8004 Table 1 lower value)", () => {
    // q = 20 000/22 500 = 0.8889 N/mm² = 888.9 kPa; 888.9/75 = 11.85
    const r = success(calculate({ method: "base-bearing", loadN: 20000, basePlateBMm: 150, basePlateLMm: 150, soil: "firm-clay" }));
    expect(r.utilisation).toBeCloseTo(11.852, 3);
    expect(r.pass).toBe(false);
    expect(r.capacityN).toBeCloseTo(75 * 0.0225 * 1000, 6); // 1687.5 N
    expect(r.warnings.join(" ")).toContain("presumptive");
  });

  it("a timber sole plate spreads the load at 45° through its thickness, within its size (common practice)", () => {
    // 225 wide × 600 long × 75 thick: a' = min(225, 150 + 150) = 225, b' = min(600, 150 + 150) = 300 → A = 67 500 mm²
    // q = 20 000/67 500 × 1000 = 296.3 kPa; against 100 kPa typed: 2.963
    const r = success(calculate({ method: "base-bearing", loadN: 20000, basePlateBMm: 150, basePlateLMm: 150, solePlateBMm: 225, solePlateLMm: 600, solePlateTMm: 75, allowablePressureKPa: 100 }));
    expect(r.utilisation).toBeCloseTo(2.963, 3);
  });

  it("punching of the slab under a back-prop, EN 1992-1-1 §6.4 with v_min, by hand", () => {
    // d = 160 mm: k = 1 + √(200/160) = 2.118 → 2.0; v_min = 0.035 × 2^1.5 × √30 = 0.5422 MPa (6.3N)
    // u1 = 2(150 + 150) + 4π × 160 = 2610.6 mm; v_Ed = 60 000/(2610.6 × 160) = 0.14364 MPa → 0.14364/0.5422 = 0.2649
    const r = success(calculate({ method: "base-bearing", loadN: 60000, basePlateBMm: 150, basePlateLMm: 150, slabEffectiveDepthMm: 160, fckMpa: 30 }));
    const punch = r.checks?.find((c) => c.name.startsWith("Punching"));
    expect(punch?.resistance).toBeCloseTo(0.54219, 4);
    expect(punch?.demand).toBeCloseTo(0.143645, 5);
    expect(r.utilisation).toBeCloseTo(0.26493, 4);
  });

  it("punching by ACI 318-19 §22.6, by hand", () => {
    // b0 = 2(150 + 150) + 4 × 160 = 1240 mm; λs = √(2/1.64) = 1.104 → 1.0; v_c = least of 0.33√30 = 1.8075,
    // 0.17 × 3 × √30 = 2.793, 0.083(2 + 40 × 160/1240)√30 = 3.256 → 1.8075 MPa; φv_c = 1.3556 MPa
    // v_u = 60 000/(1240 × 160) = 0.30242 MPa → 0.2231
    const r = success(calculate({ method: "base-bearing", punchingCode: "aci318", loadN: 60000, basePlateBMm: 150, basePlateLMm: 150, slabEffectiveDepthMm: 160, fckMpa: 30 }));
    expect(r.checks?.[0].resistance).toBeCloseTo(1.35564, 4);
    expect(r.utilisation).toBeCloseTo(0.22309, 4);
  });

  it("validated like the rest", () => {
    const none = failure(calculate({ method: "base-bearing" }));
    expect(none.errors.map((e) => e.field)).toEqual(["loadN", "basePlateBMm", "basePlateLMm", "allowablePressureKPa"]);
    expect(failure(calculate({ method: "base-bearing", loadN: 1, basePlateBMm: 150, basePlateLMm: 150, soil: "peat" })).errors[0].field).toBe("soil");
    expect(failure(calculate({ method: "base-bearing", loadN: 1, basePlateBMm: 150, basePlateLMm: 150, solePlateBMm: 225 })).errors.map((e) => e.field)).toEqual([
      "solePlateLMm",
      "solePlateTMm",
      "allowablePressureKPa",
    ]);
    expect(failure(calculate({ method: "base-bearing", loadN: 1, basePlateBMm: 150, basePlateLMm: 150, slabDepthMm: 200 })).errors[0].field).toBe("fckMpa");
  });
});

describe("raking shore, axial force plus bending from self-weight", () => {
  it("CHS 168.3 × 6.3 S355 hot-finished, 6 m at 60°, 150 kN: EN 1993-1-1 §6.3.3 Eq. 6.62 with Annex A k_zz, by hand", () => {
    // A = 3206.3 mm²; w = 3206.3 × 78.5e-3 = 251.7 N/m (EN 1991-1-1 Table A.4); w⊥ = w cos 60° = 125.85 N/m
    // M = 0.12585 × 6000²/8 = 566 314 N·mm; I = 10 534 205 mm⁴; N_cr = 606 483 N; λ̄ = 1.3700; curve a (α 0.21): χ = 0.4329
    // N_b,Rd = 492 739 N; M_Rd = W_el·fy = 125 184 × 355 = 44.44 kN·m; N_Ed/N_cr = 0.24733
    // Annex A Table A.2 (from memory), transverse load: π²EI·δ/(L²M) = 5π²/48 = 1.02808 for a uniform load on a pinned span,
    // C_m,0 = 1 + 0.02808 × 0.24733 = 1.00695; μ = (1 − 0.24733)/(1 − 0.4329 × 0.24733) = 0.84292;
    // k_zz = 1.00695 × 0.84292/0.75267 = 1.12768; Σ = 150/492.74 + 1.12768 × 0.56631/44.44 = 0.30442 + 0.01437 = 0.31879
    const r = success(
      calculate({ method: "raking-combined", lengthMm: 6000, angleDeg: 60, section: { shape: "chs", dMm: 168.3, tMm: 6.3 }, fyMpa: 355, formed: "hot-finished", loadN: 150000 }),
    );
    expect(r.utilisation).toBeCloseTo(0.31879, 4);
    expect(r.steps.find((s) => s.symbol === "M_sw")?.value).toBeCloseTo(566314, 0);
  });

  it("same raker by AISC 360-16 H1-1a (ERW design wall 0.93t), by hand", () => {
    // t_des = 5.859 mm: A = 2990.0 mm², I = 9 874 951 mm⁴, S = 117 349 mm³; L/r = 6000/57.47 = 104.4
    // F_e = π²·200 000/104.4² = 181.1 MPa; F_y/F_e = 1.905 ≤ 2.25 → F_cr = 0.658^1.905 × 345 = 155.42 MPa
    // P_c = 0.9 × 155.42 × 2990.0 = 418 241 N; M_c = 0.9 × 345 × 117 349 = 36.44 kN·m
    // P_e1 = π²·200 000·I/6000² = 541 455 N; B1 = 1/(1 − 150/541.455) = 1.3832; M_r = 1.3832 × 566 314 = 783 318 N·mm
    // P_r/P_c = 0.35865 ≥ 0.2 → 0.35865 + 8/9 × 0.021498 = 0.37775
    const r = success(
      calculate({ method: "raking-combined", plumbCode: "aisc360", lengthMm: 6000, angleDeg: 60, section: { shape: "chs", dMm: 168.3, tMm: 6.3 }, fyMpa: 345, loadN: 150000 }),
    );
    expect(r.utilisation).toBeCloseTo(0.37775, 4);
  });

  it("validated like the rest", () => {
    const none = failure(calculate({ method: "raking-combined", lengthMm: 6000 }));
    expect(none.errors.map((e) => e.field)).toEqual(["loadN", "angleDeg", "section"]);
    expect(failure(calculate({ method: "raking-combined", lengthMm: 6000, angleDeg: 90, section: chs114, fyMpa: 355, loadN: 1 })).errors[0].field).toBe("angleDeg");
    expect(failure(calculate({ method: "raking-combined", lengthMm: 6000, angleDeg: 60, section: { shape: "given", areaMm2: 1000, iMinMm4: 1e6 }, fyMpa: 355, loadN: 1 })).errors[0].field).toBe("section.shape");
  });
});

describe("the new checks never throw or answer NaN, whatever arrives", () => {
  const deepNumbers = (v: unknown, out: number[] = []): number[] => {
    if (typeof v === "number") out.push(v);
    else if (Array.isArray(v)) v.forEach((x) => deepNumbers(x, out));
    else if (v && typeof v === "object") Object.values(v).forEach((x) => deepNumbers(x, out));
    return out;
  };
  it("random requests for each new method", async () => {
    const fc = (await import("fast-check")).default;
    const num = fc.oneof(fc.double(), fc.double({ min: 0, max: 10000, noNaN: true }), fc.anything());
    fc.assert(
      fc.property(
        fc.record(
          {
            method: fc.constantFrom("out-of-plumb", "base-bearing", "backprop-sequence", "raking-combined"),
            lengthMm: num,
            section: fc.oneof(fc.constant(chs114), fc.record({ shape: fc.constantFrom("chs", "rhs", "rect", "round"), dMm: num, tMm: num, bMm: num, hMm: num })),
            fyMpa: num,
            loadN: num,
            outOfPlumbDeg: num,
            outOfPlumbMm: num,
            eccentricityMm: num,
            propClass: fc.constantFrom("A", "D", "E", "Z"),
            maxExtensionMm: num,
            basePlateBMm: num,
            basePlateLMm: num,
            solePlateBMm: num,
            solePlateLMm: num,
            solePlateTMm: num,
            allowablePressureKPa: num,
            slabEffectiveDepthMm: num,
            fckMpa: num,
            shoredLevels: fc.oneof(fc.integer({ min: 0, max: 8 }), num),
            slabSelfWeightKPa: num,
            constructionKPa: num,
            formworkKPa: num,
            angleDeg: num,
          },
          { requiredKeys: ["method"] },
        ),
        (input) => {
          const r = calculate(input);
          if (r.ok) return deepNumbers(r).every(Number.isFinite);
          return r.errors.length > 0 && r.errors.every((e) => typeof e.message === "string" && e.message.length > 10);
        },
      ),
      { numRuns: 1500 },
    );
  });
});

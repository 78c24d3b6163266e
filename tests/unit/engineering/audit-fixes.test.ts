// Fixes found by the audit of issue #10 (docs/engineering-audit.md). Every expected value is
// worked by hand beside the check from the published rule or formula it names.
import { describe, expect, it } from "vitest";
import { calculate, SOILS, type CalculationSuccess } from "@/lib/engineering";

function success(r: ReturnType<typeof calculate>): CalculationSuccess {
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return r;
}
function failure(r: ReturnType<typeof calculate>) {
  if (r.ok) throw new Error("expected a refusal");
  return r;
}
const stepOf = (r: CalculationSuccess, symbol: string) => r.steps.find((s) => s.symbol === symbol);
const deg = Math.PI / 180;

describe("bearing under a prop that leans: H = N·sin θ and V = N·cos θ at the base (statics)", () => {
  const base = { method: "base-bearing", loadN: 20000, basePlateBMm: 150, basePlateLMm: 150, allowablePressureKPa: 100 };

  it("3° out of plumb: H = 20 kN × sin 3° = 1.047 kN, V = 20 kN × cos 3° = 19.97 kN; the pressure keeps the whole N", () => {
    // sin 3° = 0.0523360, cos 3° = 0.9986295: H = 1046.72 N, V = 19 972.6 N.
    // q = 20 000/(150 × 150) = 0.88889 N/mm² = 888.9 kPa against 100 kPa → 8.889, as for a plumb prop.
    const r = success(calculate({ ...base, outOfPlumbDeg: 3 }));
    expect(stepOf(r, "H")?.value).toBeCloseTo(1046.72, 1);
    expect(stepOf(r, "V")?.value).toBeCloseTo(19972.59, 1);
    expect(stepOf(r, "H")?.source).toBe("Statics");
    expect(r.utilisation).toBeCloseTo(8.8889, 3);
    const plumb = success(calculate(base));
    expect(r.capacityN).toBeCloseTo(plumb.capacityN as number, 9);
    expect(r.warnings.join(" ")).toContain("horizontal force H = 1.047 kN");
    expect(r.warnings.join(" ")).toContain("Friction is not checked");
    // A plumb prop has no horizontal force in its working.
    expect(stepOf(plumb, "H")).toBeUndefined();
  });

  it("an offset over the prop's length: 105 mm over 3000 mm gives sin θ = 0.035, θ = 2.006°, H = 700 N", () => {
    // θ = asin(105/3000) = asin(0.035) = 2.0058°; H = 20 000 × 0.035 = 700 N; V = 20 000 × √(1 − 0.035²) = 19 987.75 N.
    const r = success(calculate({ ...base, outOfPlumbMm: 105, lengthMm: 3000 }));
    expect(stepOf(r, "θ")?.value).toBeCloseTo(2.0058, 3);
    expect(stepOf(r, "H")?.value).toBeCloseTo(700, 6);
    expect(stepOf(r, "V")?.value).toBeCloseTo(19987.75, 1);
  });

  it("with a friction coefficient typed, sliding is checked as tan θ/μ, whatever the load", () => {
    // 1 kN on 150 × 150 mm: q = 44.44 kPa → 0.4444 against 100 kPa. 3° with μ = 0.3 (user input):
    // tan 3° = 0.0524078 → 0.0524078/0.3 = 0.17469: bearing governs.
    const light = { ...base, loadN: 1000, frictionCoefficient: 0.3 };
    const r = success(calculate({ ...light, outOfPlumbDeg: 3 }));
    const slide = r.checks?.find((c) => c.name.startsWith("Sliding"));
    expect(slide?.utilisation).toBeCloseTo(0.17469, 4);
    expect(slide?.demand).toBeCloseTo(1000 * Math.sin(3 * deg), 6);
    expect(r.utilisation).toBeCloseTo(0.44444, 4);
    expect(r.pass).toBe(true);
    // 20° out: tan 20° = 0.36397 → 1.2132 > 1: the base would slide at any load.
    const steep = success(calculate({ ...light, outOfPlumbDeg: 20 }));
    expect(steep.utilisation).toBeCloseTo(1.2132, 3);
    expect(steep.pass).toBe(false);
    expect(steep.warnings.join(" ")).toContain("would slide on friction alone");
  });

  it("the lean is validated like the rest", () => {
    expect(failure(calculate({ ...base, outOfPlumbDeg: 2, outOfPlumbMm: 50, lengthMm: 3000 })).errors[0].field).toBe("outOfPlumbMm");
    const noLength = failure(calculate({ ...base, outOfPlumbMm: 50 })).errors[0];
    expect(noLength.field).toBe("lengthMm");
    expect(noLength.message).toContain("prop's length in mm");
    expect(failure(calculate({ ...base, outOfPlumbMm: 3000, lengthMm: 3000 })).errors[0].field).toBe("outOfPlumbMm");
    expect(failure(calculate({ ...base, outOfPlumbDeg: -1 })).errors[0].field).toBe("outOfPlumbDeg");
    expect(failure(calculate({ ...base, outOfPlumbDeg: 60 })).errors[0].field).toBe("outOfPlumbDeg");
    expect(failure(calculate({ ...base, frictionCoefficient: 0.4 })).errors[0].field).toBe("frictionCoefficient");
    const zero = failure(calculate({ ...base, outOfPlumbDeg: 2, frictionCoefficient: 0 })).errors[0];
    expect(zero).toEqual({ field: "frictionCoefficient", message: "Friction coefficient μ at the base must be greater than zero (got 0). Give the coefficient between the base and what it stands on, e.g. from the designer's brief." });
    expect(failure(calculate({ ...base, outOfPlumbDeg: 2, frictionCoefficient: "0.3" })).errors[0].field).toBe("frictionCoefficient");
  });
});

describe("AISC method with an EN grade: f_y by the nominal wall, not the 0.93t design wall", () => {
  it("CHS 323.9 × 17 S355: nominal 17 mm > 16 mm gives 345 MPa (EN 10025-2 Table 7 steps, from memory), though t_des = 15.81 mm", () => {
    // AISC 360-16 §B4.2: t_des = 0.93 × 17 = 15.81 mm for A and I; the product standard's thickness steps refer to the nominal wall.
    const r = success(calculate({ method: "aisc360-lrfd", lengthMm: 4000, section: { shape: "chs", dMm: 323.9, tMm: 17 }, steelGrade: "S355" }));
    expect(stepOf(r, "t_des")?.value).toBeCloseTo(15.81, 9);
    expect(stepOf(r, "f_y")?.value).toBe(345);
  });
});

describe("presumptive bearing values cite the table only for values taken from it", () => {
  it("dense gravel's 200 kPa is not a BS 8004:1986 Table 1 value (the table gives more than 600 kPa): common practice", () => {
    expect(SOILS["dense-gravel"].source).toBe("Common practice");
    expect(SOILS["dense-gravel"].toConfirm).toBeUndefined();
    expect(SOILS["firm-clay"]).toMatchObject({ kPa: 75, source: "BS 8004:1986 Table 1", toConfirm: "value to be confirmed against BS 8004:1986 Table 1" });
  });
});

describe("axial force and weak-axis bending by EN 1993-1-1 §6.3.3 with the Annex A interaction factors (Class 3 column)", () => {
  it("RHS 100 × 50 × 4 (square corners given), S355, 2 m pinned, 100 kN at 10 mm: Eq. 6.62 and Eq. 6.61, by hand", () => {
    // A = 1136 mm², I_z = 473 658.7 mm⁴, I_y = 1 441 258.7 mm⁴ (by hand in sections.test.ts); W_el,z = 2I_z/50 = 18 946.3 mm³.
    // N_cr,z = π²·210 000·I_z/2000² = 245 428 N, N_cr,y = 746 794 N; λ̄_z = 1.28186, λ̄_y = 0.73486; curve c (α 0.49, Table 6.2):
    // χ_z = 0.39656, χ_y = 0.70301 (Eq. 6.49). M_Ed = 100 000 × 10 = 1.0 kN·m, equal end moments (ψ = 1).
    // Annex A Table A.2 (from memory): C_mz,0 = 1 + 0.36 × 0.67 × 100/245.428 = 1.09828.
    // Table A.1, Class 3: μ_z = (1 − 0.40745)/(1 − 0.39656 × 0.40745) = 0.70675, μ_y = (1 − 0.13391)/(1 − 0.70301 × 0.13391) = 0.95610;
    // k_zz = 1.09828 × 0.70675/(1 − 0.40745) = 1.30994, k_yz = 1.09828 × 0.95610/(1 − 0.40745) = 1.77211.
    // M_Rd = 18 946.3 × 355 = 6.7259 kN·m. Eq. 6.62: 100/(0.39656 × 1136 × 0.355) + 1.30994 × 1/6.7259 = 0.62529 + 0.19476 = 0.82005;
    // Eq. 6.61: 100/(0.70301 × 403.28) + 1.77211/6.7259 = 0.35272 + 0.26348 = 0.61620. The larger governs.
    const r = success(
      calculate({ method: "out-of-plumb", lengthMm: 2000, section: { shape: "rhs", bMm: 100, hMm: 50, tMm: 4, cornerRadiusMm: 0 }, fyMpa: 355, formed: "cold-formed", loadN: 100000, eccentricityMm: 10 }),
    );
    expect(stepOf(r, "Σ")?.value).toBeCloseTo(0.82005, 4);
    expect(stepOf(r, "Σ_y")?.value).toBeCloseTo(0.6162, 4);
    expect(stepOf(r, "Σ")?.source).toBe("EN 1993-1-1 §6.3.3 Eq. 6.62");
    expect(r.utilisation).toBeCloseTo(0.82005, 4);
    expect(stepOf(r, "C_mz")?.toConfirm).toBe("value to be confirmed against EN 1993-1-1 Annex A Table A.2");
  });

  it("a member whose end may sway keeps C_m = 1.0 (no Table A.2 reduction or increase is claimed)", () => {
    const r = success(calculate({ method: "out-of-plumb", lengthMm: 2000, ends: "fixed-free", section: { shape: "chs", dMm: 114.3, tMm: 5 }, fyMpa: 355, loadN: 20000, outOfPlumbDeg: 1 }));
    expect(stepOf(r, "C_mz")?.value).toBe(1);
    expect(stepOf(r, "C_mz")?.source).toBe("Common practice");
  });
});

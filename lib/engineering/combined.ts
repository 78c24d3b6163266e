// Axial force plus bending about the weaker axis for a steel member, used by the
// out-of-plumb / eccentric load check and by raking shores. Two codes:
//  - EN 1993-1-1 §6.3.3 (6.61)/(6.62) with the interaction factors of Annex A
//    for a Class 3 (elastic) cross-section: bending about the weaker axis z,
//    N_Ed/(χ_z·N_Rk/γM1) + k_zz·M_Ed/(M_Rk/γM1) ≤ 1 and
//    N_Ed/(χ_y·N_Rk/γM1) + k_yz·M_Ed/(M_Rk/γM1) ≤ 1, with
//    k_zz = C_mz·μ_z/(1 − N_Ed/N_cr,z), k_yz = C_mz·μ_y/(1 − N_Ed/N_cr,z),
//    μ_i = (1 − N_Ed/N_cr,i)/(1 − χ_i·N_Ed/N_cr,i), C_mLT = 1 and χ_LT = 1 for
//    the closed and solid sections this engine knows, and C_mz,0 from Annex A
//    Table A.2 (end moments with ψ = 1, or the general row for a member with
//    transverse load). A member whose end may sway keeps C_m = 1.0. The
//    elastic modulus is used for every class, which is on the safe side for
//    Class 1 and 2 sections;
//  - AISC 360-16 §H1.1 (H1-1a/b) with M_r amplified by B1 = C_m/(1 − αP_r/P_e1)
//    (Appendix 8 (A-8-3)), C_m = 1.0, α = 1.0 LRFD / 1.6 ASD, and the elastic
//    moment F_y·S (on the safe side of F_y·Z for compact sections).

import { aiscDesignSection, aiscFcr, aiscFe, checkAiscSlenderElements, OMEGA_C, PHI_C } from "./aisc360";
import { requireSection, resolveSteelFy } from "./common";
import { effectiveLength } from "./effective-length";
import { checkEnClass, en1993Chi, IMPERFECTION_FACTORS, selectCurve } from "./en1993";
import { eulerLoad, EULER_SOURCE } from "./euler";
import { E_STEEL_AISC_MPA, E_STEEL_EN_MPA } from "./materials";
import type { SectionProperties } from "./sections";
import { fieldError, fmt, step } from "./steps";
import type { Basis, CalculationRequest, CheckPart, DesignBasis, FieldError, Section, Step } from "./types";

/** Least elastic section modulus W_el = I_min / (distance to the extreme fibre about that axis). */
export function leastElasticModulus(section: Section, props: SectionProperties): number | undefined {
  switch (section.shape) {
    case "chs":
    case "round":
      return (2 * props.iMinMm4) / section.dMm;
    case "rhs":
    case "rect": {
      // I_min is about the axis parallel to the longer side, so the extreme fibre is at half the shorter side.
      return (2 * props.iMinMm4) / Math.min(section.bMm, section.hMm);
    }
    case "given":
      return undefined;
  }
}

/** What a combined (axial + bending) capacity is: a design resistance (EN), or AISC's available or allowable strength. */
export function combinedBasis(code: "en1993" | "aisc360", designBasis: DesignBasis | undefined): Basis {
  return code === "en1993" ? "design-resistance" : designBasis === "asd" ? "allowable-strength" : "available-strength";
}

export interface CombinedInput {
  /** Axial compression N_Ed (EN) or P_r (AISC), N. */
  axialN: number;
  /** First-order moment that does not grow with the axial force (self-weight), N·mm. */
  fixedMomentNmm: number;
  /** Lever arm of the axial force (eccentricity, sway offset), mm: adds axialN·lever to the moment. */
  leverMm: number;
  code: "en1993" | "aisc360";
  designBasis: "lrfd" | "asd";
}

export type CombinedOutcome =
  | {
      ok: true;
      capacityN: number;
      eulerN: number;
      utilisation: number;
      checks: CheckPart[];
      steps: Step[];
      warnings: string[];
      effectiveLengthMm: number;
      slenderness: number;
      reductionFactor: number;
    }
  | { ok: false; errors: FieldError[] };

/** Section, yield and the member's own axial resistance, then the interaction. */
export function combinedSteel(req: CalculationRequest, input: CombinedInput, label: string): CombinedOutcome {
  const errors: FieldError[] = [];
  const aisc = input.code === "aisc360";
  const design = aisc ? aiscDesignSection(req) : { req, steps: [] as Step[] };
  const cornerRule = aisc ? "aisc" : req.formed === "hot-finished" ? "hot-finished" : "cold-formed";
  const sec = requireSection(design.req, ["chs", "rhs", "rect", "round"], label, cornerRule);
  if (!sec.ok) errors.push(...sec.errors);
  if (!sec.ok && req.fyMpa === undefined && req.steelGrade === undefined) errors.push(fieldError("fyMpa", "Give the steel's yield strength fy in MPa, or choose a steel grade."));
  if (!sec.ok) return { ok: false, errors };
  const { props, section } = sec;
  const fyRes = resolveSteelFy(req, props);
  if (!fyRes.ok) return fyRes;
  const fy = fyRes.value.fyMpa;
  const warnings = [...fyRes.value.warnings];
  const wel = leastElasticModulus(section, props) as number;
  const steps: Step[] = [...design.steps, ...props.steps, ...fyRes.value.steps];
  steps.push(step("Elastic section modulus about the weaker axis W_el = I_min/(extreme fibre distance)", "W_el", wel, "mm³", "Section geometry"));
  const n = input.axialN;
  const moment = (x: number) => input.fixedMomentNmm + x * input.leverMm;
  const m0 = moment(n);

  if (!aisc) {
    const curve = selectCurve(section, fy, req.formed, req.curve);
    if (!curve.ok) return curve;
    const cls = checkEnClass(section, fy);
    if (cls.errors.length) return { ok: false, errors: cls.errors };
    const eff = effectiveLength(req.lengthMm, req, "en-steel");
    const e = req.eMpa ?? E_STEEL_EN_MPA;
    const gammaM1 = req.gammaM1 ?? 1.0;
    const ncr = eulerLoad(e, props.iMinMm4, eff.effectiveLengthMm);
    const npl = props.areaMm2 * fy;
    const alpha = IMPERFECTION_FACTORS[curve.curve];
    const lambdaBar = Math.sqrt(npl / ncr);
    const chi = en1993Chi(lambdaBar, alpha);
    const nbrd = (chi * npl) / gammaM1;
    // The stiffer axis y (the same for a tube or a round bar): buckling about it with the weak-axis moment, Eq. 6.61.
    const iMax = props.iMaxMm4 ?? props.iMinMm4;
    const ncrY = eulerLoad(e, iMax, eff.effectiveLengthMm);
    const chiY = en1993Chi(Math.sqrt(npl / ncrY), alpha);
    const nbrdY = (chiY * npl) / gammaM1;
    const twoAxes = iMax > props.iMinMm4 * (1 + 1e-9);
    const mrd = (wel * fy) / gammaM1;
    warnings.push(...eff.warnings, ...curve.warnings);
    if (n >= ncr) {
      return { ok: false, errors: [fieldError("loadN", `The axial force ${fmt(n)} N reaches the elastic critical load N_cr = ${fmt(ncr)} N: the member would buckle whatever the moment.`)] };
    }
    const sway = req.ends === "fixed-free" || req.ends === "fixed-sway" || req.ends === "pinned-sway";
    const endMomentsOnly = input.fixedMomentNmm === 0;
    /** EN 1993-1-1 Annex A Table A.2: C_mz,0 for uniform end moments (ψ = 1) or, with self-weight, the row for transverse load. */
    const cm0 = (x: number): number => {
      if (sway) return 1;
      const r = x / ncr;
      if (endMomentsOnly) return 0.79 + 0.21 * 1 + 0.36 * (1 - 0.33) * r;
      const me = x * input.leverMm;
      const total = me + input.fixedMomentNmm;
      // π²EI·δ/(L²·M) for a pin-ended span: uniform moment M_e gives δ = M_e·L²/(8EI), self-weight M_w = wL²/8 gives δ = 5M_w·L²/(48EI).
      const shape = (Math.PI * Math.PI * (me / 8 + (5 * input.fixedMomentNmm) / 48)) / total;
      return 1 + (shape - 1) * r;
    };
    const mu = (x: number, ncrI: number, chiI: number) => (1 - x / ncrI) / (1 - (chiI * x) / ncrI);
    const kzz = (x: number) => (cm0(x) * mu(x, ncr, chi)) / (1 - x / ncr);
    const kyz = (x: number) => (cm0(x) * mu(x, ncrY, chiY)) / (1 - x / ncr);
    const eq62 = (x: number) => x / nbrd + (kzz(x) * moment(x)) / mrd;
    const eq61 = (x: number) => x / nbrdY + (kyz(x) * moment(x)) / mrd;
    const cm = cm0(n);
    const muZ = mu(n, ncr, chi);
    const k = kzz(n);
    const med = k * m0;
    const uN = n / nbrd;
    const uM = med / mrd;
    const u62 = eq62(n);
    const u61 = eq61(n);
    const u = twoAxes ? Math.max(u61, u62) : u62;
    // Largest N with the same lever arm and self-weight moment at which the interaction reaches 1 (bisection).
    const capacity = solveCapacity((x) => (twoAxes ? Math.max(eq61(x), eq62(x)) : eq62(x)), Math.min(nbrd, ncr));
    const ANNEX_A = { source: "EN 1993-1-1 Annex A Table A.1", note: "Class 3 column, C_mLT = 1 for a closed or solid section" };
    const TABLE_A2 = { source: "EN 1993-1-1 Annex A Table A.2", toConfirm: "value to be confirmed against EN 1993-1-1 Annex A Table A.2" };
    steps.push(
      ...cls.steps,
      ...eff.steps,
      ...curve.steps,
      step("Elastic critical load about the weaker axis N_cr,z = π²·E·I_min/L_cr²", "N_cr", ncr, "N", EULER_SOURCE),
      step("Non-dimensional slenderness λ̄ = √(A·fy/N_cr)", "λ̄", lambdaBar, "", "EN 1993-1-1 §6.3.1.3 Eq. 6.50"),
      step("Reduction factor χ_z", "χ", chi, "", "EN 1993-1-1 §6.3.1.2 Eq. 6.49"),
      step("Buckling resistance χ_z·A·fy/γM1", "N_b,Rd", nbrd, "N", "EN 1993-1-1 §6.3.1.1 Eq. 6.47"),
      step("Bending resistance W_el·fy/γM1 (elastic, on the safe side)", "M_Rd", mrd, "N·mm", "EN 1993-1-1 §6.2.5 Eq. 6.14"),
      step("Axial force", "N_Ed", n, "N", { source: "Statics", note: "from the load and geometry above" }),
      step("First-order moment, largest along the member", "M_Ed", m0, "N·mm", { source: "Statics", note: "from the load and geometry above" }),
      sway
        ? step("Equivalent uniform moment factor, an end free to sway", "C_mz", cm, "", { source: "Common practice", note: "1.0 kept for a sway mode" })
        : endMomentsOnly
          ? step("Equivalent uniform moment factor, equal end moments ψ = 1: C_mz,0 = 0.79 + 0.21ψ + 0.36(ψ − 0.33)·N_Ed/N_cr,z", "C_mz", cm, "", TABLE_A2)
          : step("Equivalent uniform moment factor with transverse load: C_mz,0 = 1 + (π²EI·δ/(L²·M) − 1)·N_Ed/N_cr,z", "C_mz", cm, "", TABLE_A2),
      step("μ_z = (1 − N_Ed/N_cr,z)/(1 − χ_z·N_Ed/N_cr,z)", "μ_z", muZ, "", ANNEX_A),
      step("Interaction factor k_zz = C_mz·μ_z/(1 − N_Ed/N_cr,z)", "k_zz", k, "", ANNEX_A),
      step("Interaction, buckling about the weaker axis N_Ed/N_b,z,Rd + k_zz·M_Ed/M_Rd ≤ 1", "Σ", u62, "", "EN 1993-1-1 §6.3.3 Eq. 6.62"),
      ...(twoAxes
        ? [
            step("Buckling resistance about the stiffer axis χ_y·A·fy/γM1", "N_b,y,Rd", nbrdY, "N", "EN 1993-1-1 §6.3.1.1 Eq. 6.47"),
            step("Interaction factor k_yz = C_mz·μ_y/(1 − N_Ed/N_cr,z), μ_y = (1 − N_Ed/N_cr,y)/(1 − χ_y·N_Ed/N_cr,y)", "k_yz", kyz(n), "", ANNEX_A),
            step("Interaction, buckling about the stiffer axis N_Ed/N_b,y,Rd + k_yz·M_Ed/M_Rd ≤ 1", "Σ_y", u61, "", "EN 1993-1-1 §6.3.3 Eq. 6.61"),
          ]
        : []),
      step("Axial force at which the interaction reaches 1 (same lever arm and self-weight moment)", "N_max", capacity, "N", "EN 1993-1-1 §6.3.3 Eq. 6.61/6.62"),
    );
    return {
      ok: true,
      capacityN: capacity,
      eulerN: ncr,
      utilisation: u,
      checks: [
        { name: "Axial buckling N_Ed/N_b,Rd", demand: n, resistance: nbrd, unit: "N", utilisation: uN, source: "EN 1993-1-1 §6.3.1" },
        { name: "Bending k_zz·M_Ed/M_Rd", demand: med, resistance: mrd, unit: "N·mm", utilisation: uM, source: "EN 1993-1-1 §6.2.5" },
        { name: "Combined N + M", demand: u, resistance: 1, unit: "", utilisation: u, source: twoAxes && u61 > u62 ? "EN 1993-1-1 §6.3.3 Eq. 6.61" : "EN 1993-1-1 §6.3.3 Eq. 6.62" },
      ],
      steps,
      warnings,
      effectiveLengthMm: eff.effectiveLengthMm,
      slenderness: eff.effectiveLengthMm / props.rMinMm,
      reductionFactor: chi,
    };
  }

  const e = req.eMpa ?? E_STEEL_AISC_MPA;
  const slender = checkAiscSlenderElements(section, fy, e);
  if (slender.errors.length) return { ok: false, errors: slender.errors };
  const eff = effectiveLength(req.lengthMm, req, "aisc");
  const lambda = eff.effectiveLengthMm / props.rMinMm;
  const fcr = aiscFcr(fy, aiscFe(e, lambda));
  const pn = fcr * props.areaMm2;
  const lrfd = input.designBasis === "lrfd";
  const pc = lrfd ? PHI_C * pn : pn / OMEGA_C;
  const mn = fy * wel;
  const mc = lrfd ? 0.9 * mn : mn / 1.67;
  const pe1 = eulerLoad(e, props.iMinMm4, req.lengthMm); // K1 = 1 for the member in its own plane (Appendix 8 §8.2.1)
  const alpha = lrfd ? 1.0 : 1.6;
  if (alpha * n >= pe1) {
    return { ok: false, errors: [fieldError("loadN", `The axial force ${fmt(n)} N is too close to the elastic critical load P_e1 = ${fmt(pe1)} N for the moment to be amplified (α·P_r ≥ P_e1).`)] };
  }
  const b1 = Math.max(1, 1 / (1 - (alpha * n) / pe1));
  const mr = b1 * m0;
  const ratioP = n / pc;
  const u = ratioP >= 0.2 ? ratioP + (8 / 9) * (mr / mc) : ratioP / 2 + mr / mc;
  const capacity = solveCapacity((x) => {
    const b = Math.max(1, 1 / (1 - (alpha * x) / pe1));
    const rp = x / pc;
    const rm = (b * moment(x)) / mc;
    return rp >= 0.2 ? rp + (8 / 9) * rm : rp / 2 + rm;
  }, Math.min(pc, pe1 / alpha));
  warnings.push(...eff.warnings);
  if (req.hssWeld === undefined && design.steps.length) {
    warnings.push("The tube was taken as electric-resistance welded, so its design wall is 0.93 × the nominal thickness (AISC 360-16 §B4.2); choose submerged-arc welded tube welding to use the full wall.");
  }
  steps.push(
    ...slender.steps,
    ...eff.steps,
    step("Critical stress F_cr", "F_cr", fcr, "MPa", "AISC 360-16 §E3 Eq. E3-2/E3-3"),
    lrfd ? step("Available axial strength φc·Pn", "P_c", pc, "N", "AISC 360-16 §E1") : step("Available axial strength Pn/Ωc", "P_c", pc, "N", "AISC 360-16 §E1"),
    lrfd
      ? step("Available flexural strength 0.90·F_y·S (elastic, on the safe side)", "M_c", mc, "N·mm", "AISC 360-16 §F1, §F7/§F8")
      : step("Available flexural strength F_y·S/1.67 (elastic, on the safe side)", "M_c", mc, "N·mm", "AISC 360-16 §F1, §F7/§F8"),
    step("Elastic critical load in the plane of bending P_e1 = π²EI/L² (K1 = 1)", "P_e1", pe1, "N", "AISC 360-16 Appendix 8 Eq. A-8-5"),
    step(`Amplifier B1 = C_m/(1 − αP_r/P_e1), C_m = 1.0, α = ${alpha}`, "B1", b1, "", "AISC 360-16 Appendix 8 Eq. A-8-3"),
    step("Required axial strength", "P_r", n, "N", { source: "Statics", note: "from the load and geometry above" }),
    step("Required flexural strength M_r = B1·M_1st", "M_r", mr, "N·mm", "AISC 360-16 Appendix 8 Eq. A-8-1"),
    ratioP >= 0.2
      ? step("P_r/P_c ≥ 0.2: P_r/P_c + 8/9·M_r/M_c ≤ 1", "Σ", u, "", "AISC 360-16 §H1.1 Eq. H1-1a")
      : step("P_r/P_c < 0.2: P_r/(2P_c) + M_r/M_c ≤ 1", "Σ", u, "", "AISC 360-16 §H1.1 Eq. H1-1b"),
    step("Axial force at which the interaction reaches 1 (same lever arm and self-weight moment)", "P_max", capacity, "N", "AISC 360-16 §H1.1"),
  );
  return {
    ok: true,
    capacityN: capacity,
    eulerN: pe1,
    utilisation: u,
    checks: [
      { name: "Axial P_r/P_c", demand: n, resistance: pc, unit: "N", utilisation: ratioP, source: "AISC 360-16 §E1" },
      { name: "Bending M_r/M_c (amplified)", demand: mr, resistance: mc, unit: "N·mm", utilisation: mr / mc, source: "AISC 360-16 §F1" },
      { name: "Combined P + M", demand: u, resistance: 1, unit: "", utilisation: u, source: ratioP >= 0.2 ? "AISC 360-16 §H1.1 Eq. H1-1a" : "AISC 360-16 §H1.1 Eq. H1-1b" },
    ],
    steps,
    warnings,
    effectiveLengthMm: eff.effectiveLengthMm,
    slenderness: lambda,
    reductionFactor: fcr / fy,
  };
}

/** Largest x in (0, upper) with f(x) ≤ 1, for f increasing in x. */
export function solveCapacity(f: (x: number) => number, upper: number): number {
  let lo = 0;
  let hi = upper;
  if (!(f(hi * (1 - 1e-12)) > 1)) return hi;
  for (let i = 0; i < 80; i++) {
    const mid = (lo + hi) / 2;
    if (f(mid) <= 1) lo = mid;
    else hi = mid;
  }
  return lo;
}

// Axial force plus bending about the weaker axis for a steel member, used by the
// out-of-plumb / eccentric load check and by raking shores. Two codes:
//  - EN 1993-1-1 §6.3.3 (6.61) in a simplified form on the safe side:
//    N_Ed/(χ·N_Rk/γM1) + k·M_Ed/(M_Rk/γM1) ≤ 1 with k = 1/(1 − N_Ed/N_cr)
//    (C_m = 1.0, elastic section modulus, χ_LT = 1 for the closed and solid
//    sections this engine knows);
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
    const lambdaBar = Math.sqrt(npl / ncr);
    const chi = en1993Chi(lambdaBar, IMPERFECTION_FACTORS[curve.curve]);
    const nbrd = (chi * npl) / gammaM1;
    const mrd = (wel * fy) / gammaM1;
    warnings.push(...eff.warnings, ...curve.warnings);
    if (n >= ncr) {
      return { ok: false, errors: [fieldError("loadN", `The axial force ${fmt(n)} N reaches the elastic critical load N_cr = ${fmt(ncr)} N: the member would buckle whatever the moment.`)] };
    }
    const amp = 1 / (1 - n / ncr);
    const med = m0 * amp;
    const uN = n / nbrd;
    const uM = med / mrd;
    const u = uN + uM;
    // Largest N with the same eccentricity ratio M/N: solve N/Nb + (N·e)/(Mrd(1 − N/Ncr)) = 1 by bisection.
    const capacity = solveCapacity((x) => x / nbrd + moment(x) / (mrd * (1 - x / ncr)), Math.min(nbrd, ncr));
    steps.push(
      ...cls.steps,
      ...eff.steps,
      ...curve.steps,
      step("Elastic critical load N_cr = π²·E·I_min/L_cr²", "N_cr", ncr, "N", EULER_SOURCE),
      step("Non-dimensional slenderness λ̄ = √(A·fy/N_cr)", "λ̄", lambdaBar, "", "EN 1993-1-1 §6.3.1.3 Eq. 6.50"),
      step("Reduction factor χ", "χ", chi, "", "EN 1993-1-1 §6.3.1.2 Eq. 6.49"),
      step("Buckling resistance χ·A·fy/γM1", "N_b,Rd", nbrd, "N", "EN 1993-1-1 §6.3.1.1 Eq. 6.47"),
      step("Bending resistance W_el·fy/γM1 (elastic, on the safe side)", "M_Rd", mrd, "N·mm", "EN 1993-1-1 §6.2.5 Eq. 6.14"),
      step("Axial force", "N_Ed", n, "N", { source: "Statics", note: "from the load and geometry above" }),
      step("First-order moment", "M_Ed,1", m0, "N·mm", { source: "Statics", note: "from the load and geometry above" }),
      step("Second-order amplification 1/(1 − N_Ed/N_cr)", "k", amp, "", { source: "EN 1993-1-1 §5.2.2(5) and Annex A", note: "C_m = 1.0" }),
      step("Amplified moment M_Ed = k·M_Ed,1", "M_Ed", med, "N·mm", "EN 1993-1-1 §6.3.3"),
      step("Interaction N_Ed/N_b,Rd + M_Ed/M_Rd ≤ 1", "Σ", u, "", { source: "EN 1993-1-1 §6.3.3 Eq. 6.61", note: "simplified" }),
      step("Axial force at which the interaction reaches 1 (same lever arm and self-weight moment)", "N_max", capacity, "N", { source: "EN 1993-1-1 §6.3.3 Eq. 6.61", note: "simplified" }),
    );
    return {
      ok: true,
      capacityN: capacity,
      eulerN: ncr,
      utilisation: u,
      checks: [
        { name: "Axial buckling N_Ed/N_b,Rd", demand: n, resistance: nbrd, unit: "N", utilisation: uN, source: "EN 1993-1-1 §6.3.1" },
        { name: "Bending M_Ed/M_Rd (amplified)", demand: med, resistance: mrd, unit: "N·mm", utilisation: uM, source: "EN 1993-1-1 §6.2.5" },
        { name: "Combined N + M", demand: u, resistance: 1, unit: "", utilisation: u, source: "EN 1993-1-1 §6.3.3 Eq. 6.61" },
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

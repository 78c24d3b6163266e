// Flexural buckling of members without slender elements, AISC 360-16 §E3.
// Members with slender walls (Table B4.1a) are refused: §E7 effective-area
// rules are not implemented.

import { requireSection, resolveSteelFy } from "./common";
import { effectiveLength } from "./effective-length";
import { eulerLoad, EULER_SOURCE } from "./euler";
import { E_STEEL_AISC_MPA } from "./materials";
import { fieldError, fmt, step } from "./steps";
import type { CalculationRequest, FieldError, MethodOutcome, Section, Step } from "./types";

export const PHI_C = 0.9;
export const OMEGA_C = 1.67;

/** Elastic buckling stress F_e = π²E/(Lc/r)², AISC 360-16 (E3-4). */
export function aiscFe(eMpa: number, slenderness: number): number {
  return (Math.PI * Math.PI * eMpa) / (slenderness * slenderness);
}

/** Critical stress F_cr, AISC 360-16 (E3-2)/(E3-3). The switch at Fy/Fe = 2.25 is the same as Lc/r = 4.71√(E/Fy). */
export function aiscFcr(fyMpa: number, feMpa: number): number {
  const ratio = fyMpa / feMpa;
  return ratio <= 2.25 ? Math.pow(0.658, ratio) * fyMpa : 0.877 * feMpa;
}

/** Nominal strength P_n = F_cr·A_g in N from raw numbers. */
export function aiscNominalStrength(areaMm2: number, fyMpa: number, eMpa: number, slenderness: number): number {
  return aiscFcr(fyMpa, aiscFe(eMpa, slenderness)) * areaMm2;
}

/** Slender-element limits of AISC 360-16 Table B4.1a for walls in axial compression. */
export function checkAiscSlenderElements(section: Section, fyMpa: number, eMpa: number): { errors: FieldError[]; steps: Step[] } {
  const steps: Step[] = [];
  if (section.shape === "chs") {
    const ratio = section.dMm / section.tMm;
    const limit = (0.11 * eMpa) / fyMpa;
    steps.push(step("Tube D/t (non-slender limit 0.11E/Fy)", "D/t", ratio, "", "AISC 360-16 Table B4.1a case 9"));
    if (ratio > limit) {
      return {
        errors: [
          fieldError(
            "section.tMm",
            `The tube wall is too thin for this check: D/t = ${fmt(ratio)} is over the non-slender limit of ${fmt(limit)} (AISC 360-16 Table B4.1a). Local buckling (§E7) is not covered here.`,
          ),
        ],
        steps,
      };
    }
  }
  if (section.shape === "rhs") {
    // b = overall width − 3t when the corner radius is not known, AISC 360-16 §B4.1b(d).
    const b = Math.max(section.bMm, section.hMm) - 3 * section.tMm;
    const ratio = b / section.tMm;
    const limit = 1.4 * Math.sqrt(eMpa / fyMpa);
    steps.push(step("Wall b/t, b = width − 3t (non-slender limit 1.40√(E/Fy))", "b/t", ratio, "", "AISC 360-16 Table B4.1a case 6"));
    if (ratio > limit) {
      return {
        errors: [
          fieldError(
            "section.tMm",
            `The tube wall is too thin for this check: b/t = ${fmt(ratio)} is over the non-slender limit of ${fmt(limit)} (AISC 360-16 Table B4.1a). Local buckling (§E7) is not covered here.`,
          ),
        ],
        steps,
      };
    }
  }
  return { errors: [], steps };
}

/** AISC 360-16 §B4.2: design wall thickness of HSS = 0.93 × nominal for ERW, nominal for SAW. */
export const ERW_DESIGN_THICKNESS_FACTOR = 0.93;

/** The hollow section with its AISC design wall thickness, and the working line that says so. */
export function aiscDesignSection(req: CalculationRequest): { req: CalculationRequest; steps: Step[] } {
  const s = req.section;
  if (!s || (s.shape !== "chs" && s.shape !== "rhs")) return { req, steps: [] };
  const saw = req.hssWeld === "saw";
  const factor = saw ? 1 : ERW_DESIGN_THICKNESS_FACTOR;
  const tDes = factor * s.tMm;
  return {
    req: { ...req, section: { ...s, tMm: tDes } },
    steps: [
      step("Nominal wall thickness", "t_nom", s.tMm, "mm", "User input"),
      saw
        ? step("Design wall thickness t_des = 1.0·t_nom (submerged-arc welded HSS)", "t_des", tDes, "mm", "AISC 360-16 §B4.2")
        : step("Design wall thickness t_des = 0.93·t_nom (electric-resistance welded HSS; choose submerged-arc welded tube for the full wall)", "t_des", tDes, "mm", "AISC 360-16 §B4.2"),
    ],
  };
}

export function runAisc360(req: CalculationRequest, designBasis: "lrfd" | "asd"): MethodOutcome {
  const label = designBasis === "lrfd" ? "AISC 360-16 LRFD strength" : "AISC 360-16 ASD strength";
  const design = aiscDesignSection(req);
  const sec = requireSection(design.req, ["chs", "rhs", "rect", "round", "given"], label, "aisc");
  if (!sec.ok) {
    const errors = [...sec.errors];
    if (req.fyMpa === undefined && req.steelGrade === undefined) errors.push(fieldError("fyMpa", "Give the steel's yield strength Fy in MPa, or choose a steel grade."));
    return { ok: false, errors };
  }
  const { props } = sec;
  const fyRes = resolveSteelFy(req, props);
  if (!fyRes.ok) return fyRes;
  const fy = fyRes.value.fyMpa;
  const e = req.eMpa ?? E_STEEL_AISC_MPA;
  // Thickness limits for fy (EN grades) follow the nominal wall; the design thickness is used for A, I and b/t.
  const slender = checkAiscSlenderElements(sec.section, fy, e);
  if (slender.errors.length) return { ok: false, errors: slender.errors };

  const eff = effectiveLength(req.lengthMm, req, "aisc");
  const lcr = eff.effectiveLengthMm;
  const lambda = lcr / props.rMinMm;
  const fe = aiscFe(e, lambda);
  const ratio = fy / fe;
  const limit = 4.71 * Math.sqrt(e / fy);
  const inelastic = ratio <= 2.25;
  const fcr = aiscFcr(fy, fe);
  const pn = fcr * props.areaMm2;
  const capacity = designBasis === "lrfd" ? PHI_C * pn : pn / OMEGA_C;
  const ncr = eulerLoad(e, props.iMinMm4, lcr);

  const warnings = [...eff.warnings, ...fyRes.value.warnings];
  if (lambda > 200) {
    warnings.push(`Lc/r = ${fmt(lambda)} is over 200, the preferred limit in the AISC 360-16 §E2 user note for compression members.`);
  }
  if (design.steps.length && req.hssWeld === undefined) {
    warnings.push("The tube was taken as electric-resistance welded, so its design wall is 0.93 × the nominal thickness (AISC 360-16 §B4.2); choose submerged-arc welded tube welding to use the full wall.");
  }
  if (props.kind === "given") {
    warnings.push("Slender elements (AISC 360-16 Table B4.1a) cannot be checked from an area and I alone; this check assumes the section has none.");
  }
  const steps: Step[] = [
    ...design.steps,
    ...props.steps,
    ...fyRes.value.steps,
    step(req.eMpa !== undefined ? "Modulus of elasticity (given by the user)" : "Modulus of elasticity, 29 000 ksi", "E", e, "MPa", req.eMpa !== undefined ? "User input" : "AISC 360-16 §E3"),
    ...slender.steps,
    ...eff.steps,
    step("Slenderness ratio Lc/r", "Lc/r", lambda, "", "AISC 360-16 §E2"),
    step("Elastic buckling stress Fe = π²E/(Lc/r)²", "F_e", fe, "MPa", "AISC 360-16 §E3 Eq. E3-4"),
    step("Limit between inelastic and elastic buckling 4.71√(E/Fy)", "4.71√(E/Fy)", limit, "", "AISC 360-16 §E3"),
    step("Fy/Fe (≤ 2.25 means inelastic buckling)", "F_y/F_e", ratio, "", "AISC 360-16 §E3"),
    inelastic
      ? step("Critical stress Fcr = 0.658^(Fy/Fe)·Fy", "F_cr", fcr, "MPa", "AISC 360-16 §E3 Eq. E3-2")
      : step("Critical stress Fcr = 0.877·Fe", "F_cr", fcr, "MPa", "AISC 360-16 §E3 Eq. E3-3"),
    step("Nominal compressive strength Pn = Fcr·Ag", "P_n", pn, "N", "AISC 360-16 §E3 Eq. E3-1"),
    designBasis === "lrfd"
      ? step("Design strength φc·Pn, φc = 0.90", "φ_c·P_n", capacity, "N", "AISC 360-16 §E1")
      : step("Allowable strength Pn/Ωc, Ωc = 1.67", "P_n/Ω_c", capacity, "N", "AISC 360-16 §E1"),
    step("Elastic critical load (for reference) π²EI/Lc²", "P_e", ncr, "N", EULER_SOURCE),
  ];
  return {
    ok: true,
    value: {
      capacityN: capacity,
      basis: designBasis === "lrfd" ? "available-strength" : "allowable-strength",
      loadBasis:
        designBasis === "lrfd"
          ? "Factored LRFD load Pu (e.g. 1.2D + 1.6L) compared with the design strength φc·Pn (φc = 0.90)."
          : "Service (ASD) load Pa (e.g. D + L) compared with the allowable strength Pn/Ωc (Ωc = 1.67).",
      eulerN: ncr,
      slenderness: lambda,
      relativeSlenderness: ratio,
      reductionFactor: fcr / fy,
      effectiveLengthMm: lcr,
      steps,
      warnings,
    },
  };
}

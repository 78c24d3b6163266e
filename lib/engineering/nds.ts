// Wood columns, NDS 2018 §3.7.1 (ASD). The caller supplies F_c* and E_min'
// already adjusted (C_D, C_M, C_t, C_F, C_i …), because those factors depend on
// species tables that belong to the material, not to the buckling check.

import { requireSection } from "./common";
import { effectiveLength } from "./effective-length";
import { NDS_C } from "./materials";
import { fieldError, fmt, step } from "./steps";
import type { CalculationRequest, FieldError, MethodOutcome, Step, TimberType } from "./types";

/** NDS 2018 §3.7.1.4: l_e/d shall not exceed 50, except that during construction it shall not exceed 75. */
export const NDS_SLENDERNESS_LIMIT = 50;
export const NDS_CONSTRUCTION_SLENDERNESS_LIMIT = 75;

/** F_cE = 0.822·E_min'/(l_e/d)², NDS 2018 (3.7-1). */
export function ndsFcE(eMinMpa: number, slenderness: number): number {
  return (0.822 * eMinMpa) / (slenderness * slenderness);
}

/** Column stability factor C_P, NDS 2018 (3.7-1). */
export function ndsCp(fcEMpa: number, fcStarMpa: number, c: number): number {
  const ratio = fcEMpa / fcStarMpa;
  const a = (1 + ratio) / (2 * c);
  const inner = a * a - ratio / c;
  // Rounding can leave a tiny negative when c = 1 and F_cE = F_c*; the exact value there is zero.
  return a - Math.sqrt(inner > 0 ? inner : 0);
}

/** P' = C_P·F_c*·A (N) from raw numbers. */
export function ndsCapacity(areaMm2: number, dMm: number, leMm: number, fcStarMpa: number, eMinMpa: number, c: number): number {
  return ndsCp(ndsFcE(eMinMpa, leMm / dMm), fcStarMpa, c) * fcStarMpa * areaMm2;
}

const TYPE_WORDS: Record<TimberType, string> = {
  solid: "sawn lumber",
  round: "round timber poles",
  glulam: "structural glued laminated timber",
  lvl: "structural composite lumber",
};

export function runNds(req: CalculationRequest): MethodOutcome {
  const errors: FieldError[] = [];
  const sec = requireSection(req, ["rect", "round"], "The NDS column check");
  if (!sec.ok) errors.push(...sec.errors);
  if (req.fcStarMpa === undefined) {
    errors.push(fieldError("fcStarMpa", "Give F_c*, the reference compression design value parallel to grain multiplied by all adjustment factors except C_P, in MPa."));
  }
  if (req.eMinMpa === undefined) {
    errors.push(fieldError("eMinMpa", "Give E_min', the adjusted modulus of elasticity for stability, in MPa."));
  }
  if (errors.length || !sec.ok || req.fcStarMpa === undefined || req.eMinMpa === undefined) return { ok: false, errors };
  const { props, section } = sec;
  const fcStar = req.fcStarMpa;
  const eMin = req.eMinMpa;

  const steps: Step[] = [...props.steps];
  let d: number;
  if (section.shape === "round") {
    // NDS designs a round column as the square column of the same area.
    d = Math.sqrt(props.areaMm2);
    steps.push(step("Round column taken as a square of equal area, d = √A", "d", d, "mm", { source: "NDS 2018 §3.7.3", toConfirm: "clause number to be confirmed against NDS 2018" }));
  } else {
    d = props.leastDimensionMm as number;
    steps.push(step("Least cross-section dimension", "d", d, "mm", "NDS 2018 §3.7.1.3"));
  }
  const eff = effectiveLength(req.lengthMm, req, "nds");
  const le = eff.effectiveLengthMm;
  const ratio = le / d;
  const construction = req.duringConstruction ?? true;
  const limit = construction ? NDS_CONSTRUCTION_SLENDERNESS_LIMIT : NDS_SLENDERNESS_LIMIT;
  if (ratio > limit) {
    return {
      ok: false,
      errors: [
        fieldError(
          "lengthMm",
          construction
            ? `The slenderness l_e/d = ${fmt(ratio)} is over ${limit}, the NDS 2018 §3.7.1.4 limit for solid columns during construction (l_e = ${fmt(le)} mm, d = ${fmt(d)} mm). Shorten the unbraced length, brace the post or use a thicker section.`
            : `The slenderness l_e/d = ${fmt(ratio)} is over ${limit}, the NDS 2018 §3.7.1.4 limit for solid columns (l_e = ${fmt(le)} mm, d = ${fmt(d)} mm). Shorten the unbraced length, brace the post or use a thicker section.`,
        ),
      ],
    };
  }
  const timberType: TimberType = req.timberType ?? (section.shape === "round" ? "round" : "solid");
  const c = req.c ?? NDS_C[timberType];
  const fcE = ndsFcE(eMin, ratio);
  const cp = ndsCp(fcE, fcStar, c);
  const fcPrime = cp * fcStar;
  const capacity = fcPrime * props.areaMm2;

  const warnings = [...eff.warnings];
  if (construction && ratio > NDS_SLENDERNESS_LIMIT) {
    warnings.push(
      `l_e/d = ${fmt(ratio)} is over 50: NDS 2018 §3.7.1.4 allows up to 75 only during construction. This post must not stay in place as part of the permanent structure.`,
    );
  }
  if (req.c === undefined && req.timberType === undefined) {
    warnings.push(`c = ${fmt(c)} for ${TYPE_WORDS[timberType]} was assumed; give the timber type or the column parameter c if the member is glulam, SCL or a pole.`);
  }
  steps.push(
    ...eff.steps,
    step(construction ? "Slenderness ratio l_e/d (limit 75 during construction, 50 otherwise)" : "Slenderness ratio l_e/d (limit 50)", "l_e/d", ratio, "", "NDS 2018 §3.7.1.4"),
    step("Adjusted compression value (given), all factors except C_P", "F_c*", fcStar, "MPa", "User input"),
    step("Adjusted minimum modulus (given)", "E_min'", eMin, "MPa", "User input"),
    step("Critical buckling design value F_cE = 0.822·E_min'/(l_e/d)²", "F_cE", fcE, "MPa", "NDS 2018 §3.7.1.5 Eq. 3.7-1"),
    step(req.c !== undefined ? "Column parameter c (given)" : `Column parameter c, ${TYPE_WORDS[timberType]}`, "c", c, "", req.c !== undefined ? "User input" : "NDS 2018 §3.7.1.5"),
    step("C_P = (1 + F_cE/F_c*)/(2c) − √[((1 + F_cE/F_c*)/(2c))² − (F_cE/F_c*)/c]", "C_P", cp, "", "NDS 2018 §3.7.1.5 Eq. 3.7-1"),
    step("Adjusted compression design value F_c' = C_P·F_c*", "F_c'", fcPrime, "MPa", "NDS 2018 §3.7.1"),
    step("Allowable axial capacity P' = F_c'·A", "P'", capacity, "N", "NDS 2018 §3.6.3"),
  );
  return {
    ok: true,
    value: {
      capacityN: capacity,
      basis: "allowable-strength",
      loadBasis: "ASD load (e.g. D + L, unfactored) compared with the allowable capacity P' = C_P·F_c*·A; F_c* must include the load duration factor C_D for that load.",
      eulerN: fcE * props.areaMm2,
      slenderness: ratio,
      reductionFactor: cp,
      effectiveLengthMm: le,
      steps,
      warnings,
    },
  };
}

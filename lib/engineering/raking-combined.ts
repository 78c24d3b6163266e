// A steel raking shore checked for axial force plus bending: the raker spans
// head to foot as a pin-ended member inclined at θ from horizontal; its own
// weight w has a component w·cos θ across it, giving M = w·cos θ·L²/8 at mid
// length, and any load eccentricity e at the ends adds N·e. Both are amplified
// and checked with the axial force (EN 1993-1-1 §6.3.3 or AISC 360-16 §H1.1).

import { combinedBasis, combinedSteel } from "./combined";
import { fieldError, fmt, step } from "./steps";
import type { CalculationRequest, FieldError, MethodOutcome, Step } from "./types";

/** EN 1991-1-1 Table A.4: steel 77.0–78.5 kN/m³; the upper value is used for self-weight. */
export const STEEL_UNIT_WEIGHT_KN_M3 = 78.5;

export function runRakingCombined(req: CalculationRequest): MethodOutcome {
  const errors: FieldError[] = [];
  if (req.loadN === undefined) errors.push(fieldError("loadN", "Give the axial force in the raker in N (from the raking-shore geometry: F = H/cos θ)."));
  if (req.angleDeg === undefined) errors.push(fieldError("angleDeg", "Give the raker's angle from horizontal in degrees."));
  if (req.section === undefined) errors.push(fieldError("section", "Give the raker's section (chs, rhs, rect or round) and its steel."));
  if (errors.length || req.loadN === undefined || req.angleDeg === undefined || req.section === undefined) return { ok: false, errors };
  const theta = (req.angleDeg * Math.PI) / 180;
  const L = req.lengthMm;
  const code = req.plumbCode ?? "en1993";
  // Self-weight: given, or from the section area (A in mm² × 78.5 kN/m³ → N/m is A × 78.5e-3).
  const areaForWeight = (() => {
    const s = req.section;
    if (s.shape === "chs") return (Math.PI / 4) * (s.dMm ** 2 - (s.dMm - 2 * s.tMm) ** 2);
    if (s.shape === "rhs") return s.bMm * s.hMm - (s.bMm - 2 * s.tMm) * (s.hMm - 2 * s.tMm);
    if (s.shape === "rect") return s.bMm * s.hMm;
    if (s.shape === "round") return (Math.PI / 4) * s.dMm ** 2;
    return s.areaMm2;
  })();
  const w = req.selfWeightNPerM ?? areaForWeight * STEEL_UNIT_WEIGHT_KN_M3 * 1e-3;
  const wPerp = (w / 1000) * Math.cos(theta); // N/mm across the raker
  const mSelf = (wPerp * L * L) / 8;
  const ecc = req.eccentricityMm ?? 0;
  const mEcc = req.loadN * ecc;
  const m0 = mSelf + mEcc;
  const combined = combinedSteel(req, { axialN: req.loadN, fixedMomentNmm: mSelf, leverMm: ecc, code, designBasis: req.designBasis ?? "lrfd" }, "The raking-shore combined check");
  if (!combined.ok) return combined;
  const warnings = [...combined.warnings];
  if (req.selfWeightNPerM === undefined) {
    warnings.push(`The raker's self-weight was taken from its nominal steel area at ${STEEL_UNIT_WEIGHT_KN_M3} kN/m³ (${fmt(w)} N/m); give the self-weight for a different material or added fittings.`);
  }
  if (req.angleDeg < 45 || req.angleDeg > 75) warnings.push(`A raker at ${fmt(req.angleDeg)}° is outside the usual 45°–75° range (common practice).`);
  const steps: Step[] = [
    step("Raker length head to foot", "L", L, "mm", "User input"),
    step("Raker angle from horizontal", "θ", req.angleDeg, "°", "User input"),
    step(req.selfWeightNPerM !== undefined ? "Self-weight (given)" : `Self-weight from the nominal area × ${STEEL_UNIT_WEIGHT_KN_M3} kN/m³`, "w", w, "N/m", req.selfWeightNPerM !== undefined ? "User input" : "EN 1991-1-1 Table A.4"),
    step("Self-weight across the raker w·cos θ", "w⊥", wPerp * 1000, "N/m", "Statics"),
    step("Mid-length moment from self-weight w⊥·L²/8", "M_sw", mSelf, "N·mm", { source: "Statics", note: "simply supported span" }),
    step("Load eccentricity at the ends", "e", ecc, "mm", req.eccentricityMm !== undefined ? "User input" : { source: "User input", note: "none given" }),
    step("Moment from eccentricity N·e", "M_e", mEcc, "N·mm", "Statics"),
    step("First-order moment M_sw + M_e", "M_1st", m0, "N·mm", "Statics"),
    ...combined.steps,
  ];
  return {
    ok: true,
    value: {
      capacityN: combined.capacityN,
      basis: combinedBasis(code, req.designBasis),
      loadBasis:
        code === "en1993"
          ? "Factored (ULS) axial force in the raker N_Ed; the capacity is the axial force at which the combined check reaches 1 with the same self-weight and eccentricity."
          : `${req.designBasis === "asd" ? "ASD" : "LRFD factored"} axial force in the raker; the capacity is the axial force at which (H1-1) reaches 1.`,
      eulerN: combined.eulerN,
      effectiveLengthMm: combined.effectiveLengthMm,
      slenderness: combined.slenderness,
      reductionFactor: combined.reductionFactor,
      utilisation: combined.utilisation,
      checks: combined.checks,
      steps,
      warnings,
    },
  };
}

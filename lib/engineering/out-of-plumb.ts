// A member standing out of plumb, or loaded off its axis.
//
// Steel member (section + fy): the load is taken vertical, so the axial force
// is N/cos θ and each end must be held sideways by H = N·tan θ. Bending comes
// from the load's eccentricity at the end plates; if an end is free to sway,
// the offset Δ of the head over the base adds to it. The moment is checked
// with the axial force (EN 1993-1-1 §6.3.3 with the Annex A interaction
// factors, or AISC 360-16 §H1.1 with B1 = 1/(1 − αP_r/P_e1), see combined.ts).
//
// EN 1065 prop (propClass): the class strength assumes a plumb prop loaded
// centrally through its end plates. A prop out of plumb by more than the
// tolerance (1.5°, common practice in UK temporary works guidance; value to be
// confirmed against BS 5975 and EN 12812) is outside what its class rating
// covers and fails; within it, the axial force N/cos θ is compared with the
// safe working load and the horizontal force the head needs is given.

import { combinedBasis, combinedSteel } from "./combined";
import { runEn1065 } from "./en1065";
import { fieldError, fmt, step } from "./steps";
import type { CalculationRequest, FieldError, MethodOutcome, Step } from "./types";

export const PROP_PLUMB_TOLERANCE_DEG = 1.5;
const PLUMB_SOURCE = { source: "Common practice", note: "UK temporary works guidance: props plumb within 1.5°", toConfirm: "value to be confirmed against BS 5975 and EN 12812" };

function tiltOf(req: CalculationRequest): { ok: true; thetaRad: number; offsetMm: number; steps: Step[] } | { ok: false; errors: FieldError[] } {
  const L = req.lengthMm;
  if (req.outOfPlumbDeg !== undefined && req.outOfPlumbMm !== undefined) {
    return { ok: false, errors: [fieldError("outOfPlumbMm", "Give the lean either as an angle or as an offset of the head over the base, not both.")] };
  }
  if (req.outOfPlumbMm !== undefined) {
    if (req.outOfPlumbMm >= L) {
      return { ok: false, errors: [fieldError("outOfPlumbMm", `An offset of ${fmt(req.outOfPlumbMm)} mm cannot be as large as the member length ${fmt(L)} mm.`)] };
    }
    const theta = Math.asin(req.outOfPlumbMm / L);
    return {
      ok: true,
      thetaRad: theta,
      offsetMm: req.outOfPlumbMm,
      steps: [
        step("Offset of the head over the base (measured)", "Δ", req.outOfPlumbMm, "mm", "User input"),
        step("Angle out of plumb θ = asin(Δ/L)", "θ", (theta * 180) / Math.PI, "°", "Geometry"),
      ],
    };
  }
  const deg = req.outOfPlumbDeg ?? 0;
  const theta = (deg * Math.PI) / 180;
  const offset = L * Math.sin(theta);
  return {
    ok: true,
    thetaRad: theta,
    offsetMm: offset,
    steps: [
      step(req.outOfPlumbDeg !== undefined ? "Angle out of plumb (measured)" : "Angle out of plumb (none given: plumb)", "θ", deg, "°", req.outOfPlumbDeg !== undefined ? "User input" : "—"),
      step("Offset of the head over the base Δ = L·sin θ", "Δ", offset, "mm", "Geometry"),
    ],
  };
}

export function runOutOfPlumb(req: CalculationRequest): MethodOutcome {
  const errors: FieldError[] = [];
  if (req.loadN === undefined) errors.push(fieldError("loadN", "Give the vertical load on the member in N: the effect of leaning grows with the load."));
  if (req.outOfPlumbDeg === undefined && req.outOfPlumbMm === undefined && req.eccentricityMm === undefined) {
    errors.push(fieldError("outOfPlumbDeg", "Give how far the member is out of plumb (an angle or an offset), or the load's eccentricity at the ends."));
  }
  if (req.propClass === undefined && req.section === undefined) {
    errors.push(fieldError("section", "Give the member's section and steel (the section, and the yield strength fy or a steel grade), or the prop's EN 1065 class for a prop."));
  }
  if (errors.length || req.loadN === undefined) return { ok: false, errors };
  const tilt = tiltOf(req);
  if (!tilt.ok) return tilt;
  const N = req.loadN;
  const theta = tilt.thetaRad;
  const axial = N / Math.cos(theta);
  const horizontal = N * Math.tan(theta);
  const ecc = req.eccentricityMm ?? 0;
  const geometry: Step[] = [
    step("Member length", "L", req.lengthMm, "mm", "User input"),
    ...tilt.steps,
    step("Vertical load", "N", N, "N", "User input"),
    step("Axial force along the member N/cos θ", "N_ax", axial, "N", "Statics"),
    step("Horizontal force each end must be held by, H = N·tan θ", "H", horizontal, "N", "Statics"),
  ];

  if (req.propClass !== undefined) {
    const base = runEn1065(req);
    if (!base.ok) return base;
    const deg = (theta * 180) / Math.PI;
    const swl = base.value.capacityN as number;
    const warnings = [...base.value.warnings.filter((w) => !w.startsWith("EN 1065 class values assume"))];
    const steps: Step[] = [
      ...base.value.steps,
      ...geometry,
      step("Tolerance out of plumb within which the class rating applies", "θ_max", PROP_PLUMB_TOLERANCE_DEG, "°", PLUMB_SOURCE),
    ];
    let utilisation = axial / swl;
    if (deg > PROP_PLUMB_TOLERANCE_DEG) {
      warnings.push(
        `The prop is ${fmt(deg)}° out of plumb, more than the ${PROP_PLUMB_TOLERANCE_DEG}° its class rating assumes: re-plumb it, or have a temporary works designer assess it with its end details. It is shown as failing until then.`,
      );
      utilisation = Math.max(utilisation, 1 + (deg - PROP_PLUMB_TOLERANCE_DEG) / PROP_PLUMB_TOLERANCE_DEG);
      steps.push(step("Out of plumb beyond tolerance: the class rating does not apply", "—", "fails", "", PLUMB_SOURCE));
    }
    if (ecc > 0) {
      warnings.push(`A load ${fmt(ecc)} mm off the prop's axis is not covered by its EN 1065 class rating (central loading is assumed); have it assessed.`);
      utilisation = Math.max(utilisation, 1.0001);
    }
    if (horizontal > 0) {
      warnings.push(`The head and base must be held sideways by ${fmt(horizontal / 1000)} kN (H = N·tan θ); friction alone should not be relied on without a designer's check.`);
    }
    steps.push(step("Axial force / safe working load", "N_ax/SWL", axial / swl, "", { source: "EN 1065:1998 Table 2", note: "class rating" }));
    return {
      ok: true,
      value: {
        capacityN: swl,
        characteristicN: base.value.characteristicN,
        basis: "safe-working-load",
        loadBasis: "Working (unfactored) vertical load; the prop's safe working load is compared with the axial force N/cos θ, within the plumb tolerance only.",
        requiredForceN: horizontal,
        utilisation,
        steps,
        warnings,
      },
    };
  }

  const swayEnds = req.ends === "fixed-free" || req.ends === "fixed-sway" || req.ends === "pinned-sway";
  const leverMm = ecc + (swayEnds ? tilt.offsetMm : 0);
  const m0 = axial * leverMm;
  const code = req.plumbCode ?? "en1993";
  const combined = combinedSteel(req, { axialN: axial, fixedMomentNmm: 0, leverMm, code, designBasis: req.designBasis ?? "lrfd" }, "The out-of-plumb check");
  if (!combined.ok) return combined;
  const warnings = [...combined.warnings];
  if (horizontal > 0) warnings.push(`Each end must be held sideways by ${fmt(horizontal / 1000)} kN (H = N·tan θ); check the restraint that provides it.`);
  if (!swayEnds && tilt.offsetMm > 0) {
    warnings.push("Both ends are taken as held in position, so the lean adds axial force and a horizontal force at the ends but no bending; choose sway end conditions if the head is not held.");
  }
  const steps: Step[] = [
    ...geometry,
    step("Load eccentricity at the end plates", "e", ecc, "mm", req.eccentricityMm !== undefined ? "User input" : { source: "User input", note: "none given" }),
    step(swayEnds ? "Lever arm e + Δ (an end free to sway carries the offset)" : "Lever arm e (ends held in position)", "e_tot", leverMm, "mm", "Statics"),
    step("First-order moment N_ax·e_tot", "M_1st", m0, "N·mm", "Statics"),
    ...combined.steps,
  ];
  return {
    ok: true,
    value: {
      capacityN: combined.capacityN,
      basis: combinedBasis(code, req.designBasis),
      loadBasis:
        code === "en1993"
          ? "Factored (ULS) vertical load N_Ed; the capacity is the axial force at which the combined check reaches 1 for the same lean and eccentricity."
          : `${req.designBasis === "asd" ? "ASD" : "LRFD factored"} vertical load; the capacity is the axial force at which (H1-1) reaches 1 for the same lean and eccentricity.`,
      eulerN: combined.eulerN,
      effectiveLengthMm: combined.effectiveLengthMm,
      slenderness: combined.slenderness,
      reductionFactor: combined.reductionFactor,
      requiredForceN: horizontal,
      utilisation: combined.utilisation,
      checks: combined.checks,
      steps,
      warnings,
    },
  };
}

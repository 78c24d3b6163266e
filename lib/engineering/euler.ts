import { requireSection } from "./common";
import { effectiveLength } from "./effective-length";
import { E_STEEL_EN_MPA } from "./materials";
import { step } from "./steps";
import type { CalculationRequest, MethodOutcome } from "./types";

/** Elastic critical load N_cr = π²EI/L_cr² (N, with E in MPa, I in mm⁴, L in mm). */
export function eulerLoad(eMpa: number, iMm4: number, lcrMm: number): number {
  return (Math.PI * Math.PI * eMpa * iMm4) / (lcrMm * lcrMm);
}

export const EULER_SOURCE = { source: "Timoshenko & Gere, Theory of Elastic Stability §2.2", note: "Euler 1744" };

export function runEuler(req: CalculationRequest): MethodOutcome {
  const sec = requireSection(req, ["chs", "rhs", "rect", "round", "given"], "The Euler load");
  if (!sec.ok) return sec;
  const { props } = sec;
  const eff = effectiveLength(req.lengthMm, req);
  const e = req.eMpa ?? E_STEEL_EN_MPA;
  const ncr = eulerLoad(e, props.iMinMm4, eff.effectiveLengthMm);
  const lambda = eff.effectiveLengthMm / props.rMinMm;
  const steps = [
    ...props.steps,
    ...eff.steps,
    step(
      req.eMpa !== undefined ? "Modulus of elasticity (given by the user)" : "Modulus of elasticity (steel, default)",
      "E",
      e,
      "MPa",
      req.eMpa !== undefined ? "User input" : "EN 1993-1-1 §3.2.6(1)",
    ),
    step("Slenderness ratio L_cr/i", "λ", lambda, "", "Definition"),
    step("Elastic critical load N_cr = π²·E·I_min/L_cr²", "N_cr", ncr, "N", EULER_SOURCE),
  ];
  const warnings = [
    ...eff.warnings,
    "This is the theoretical elastic buckling load of a perfectly straight member: it has no safety margin and ignores crookedness, eccentric load and yielding. Do not use it as a safe load.",
  ];
  if (req.eMpa === undefined) warnings.push("E = 210 000 MPa (steel) was assumed; give the modulus of elasticity E for other materials.");
  return {
    ok: true,
    value: {
      capacityN: ncr,
      basis: "elastic-critical",
      loadBasis: "Theoretical elastic buckling load with no safety factor; not a safe working load or a design resistance.",
      eulerN: ncr,
      slenderness: lambda,
      effectiveLengthMm: eff.effectiveLengthMm,
      steps,
      warnings,
    },
  };
}

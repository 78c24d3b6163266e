// Point (nodal) braces along a compression member: the buckling load of the
// member between braces, the ideal brace stiffness that forces that mode, and
// the AISC 360-16 Appendix 6 design strength and stiffness for the braces.

import { requireSection } from "./common";
import { eulerLoad, EULER_SOURCE } from "./euler";
import { E_STEEL_AISC_MPA } from "./materials";
import { fieldError, fmt, step } from "./steps";
import type { CalculationRequest, FieldError, MethodOutcome, Step } from "./types";

/**
 * Ideal stiffness coefficient for n equally spaced braces on a pin-ended
 * member: β_i = coefficient·P/L_b with coefficient = 2[1 + cos(π/(n+1))],
 * giving 2, 3, 3.41, 3.62 … → 4 (Winter 1960; Yura 2001, "Fundamentals of
 * beam bracing", AISC Engineering Journal).
 */
export function idealBraceCoefficient(braces: number): number {
  return 2 * (1 + Math.cos(Math.PI / (braces + 1)));
}

export const APP6_PHI = 0.75;
export const APP6_OMEGA = 2.0;

/** AISC 360-16 (A-6-4): β_br = (1/φ)·8P_r/L_br (LRFD) or Ω·8P_r/L_br (ASD), N/mm. */
export function app6RequiredStiffness(prN: number, lbrMm: number, basis: "lrfd" | "asd"): number {
  const base = (8 * prN) / lbrMm;
  return basis === "lrfd" ? base / APP6_PHI : base * APP6_OMEGA;
}

export function runPointBrace(req: CalculationRequest): MethodOutcome {
  const errors: FieldError[] = [];
  // The brace requirement depends only on the member force, the braced length and the number of braces;
  // the section, when given, adds the member's own critical load between braces.
  const sec = req.section !== undefined ? requireSection(req, ["chs", "rhs", "rect", "round", "given"], "The point-brace check") : undefined;
  if (sec && !sec.ok) errors.push(...sec.errors);
  if (req.braces === undefined) errors.push(fieldError("braces", "Give the number of intermediate braces along the member (1 or more, equally spaced)."));
  if (req.loadN === undefined) {
    errors.push(fieldError("loadN", "Give the member's required axial strength P_r in N: the brace forces and stiffness are proportional to it."));
  }
  if (errors.length || (sec && !sec.ok) || req.braces === undefined || req.loadN === undefined) return { ok: false, errors };
  const props = sec && sec.ok ? sec.props : undefined;
  const n = req.braces;
  const pr = req.loadN;
  const basis = req.designBasis ?? "lrfd";
  const e = req.eMpa ?? E_STEEL_AISC_MPA;
  const lb = req.lengthMm / (n + 1);
  const coeff = idealBraceCoefficient(n);
  const ideal = (coeff * pr) / lb;
  const required = app6RequiredStiffness(pr, lb, basis);
  const force = 0.01 * pr;

  const warnings: string[] = [];
  if (req.k !== undefined || req.ends !== undefined) {
    warnings.push("End conditions and k are not used: with point braces the member buckles between braces, taken as pinned there (K = 1).");
  }
  const steps: Step[] = [
    ...(props ? props.steps : []),
    step("Member length", "L", req.lengthMm, "mm", "User input"),
    step("Number of equally spaced intermediate braces", "n", n, "", "User input"),
    step("Unbraced length between braces L_b = L/(n + 1)", "L_b", lb, "mm", "Geometry"),
    step("Required axial strength of the member (given)", "P_r", pr, "N", "User input"),
    step("Ideal stiffness coefficient 2[1 + cos(π/(n + 1))] (rigid links on springs)", "β_i·L_b/P", coeff, "", "Winter 1960, Timoshenko & Gere §2.8, Yura 2001 AISC Engineering Journal"),
    step("Ideal brace stiffness β_i = coefficient·P_r/L_b", "β_i", ideal, "N/mm", "Winter 1960, Yura 2001 AISC Engineering Journal"),
    step("Required brace strength P_br = 0.01·P_r", "P_br", force, "N", "AISC 360-16 Appendix 6 §6.2.2 Eq. A-6-3"),
    basis === "lrfd"
      ? step("Required brace stiffness β_br = (1/φ)·8P_r/L_br, φ = 0.75", "β_br", required, "N/mm", "AISC 360-16 Appendix 6 §6.2.2 Eq. A-6-4a")
      : step("Required brace stiffness β_br = Ω·8P_r/L_br, Ω = 2.00", "β_br", required, "N/mm", "AISC 360-16 Appendix 6 §6.2.2 Eq. A-6-4b"),
  ];
  const loadBasis = `P_r is the member's required axial strength (${basis === "lrfd" ? "LRFD factored" : "ASD"} load)`;
  if (!props) {
    warnings.push("No section was given, so the member's own buckling load between braces is not checked; give the section to check it.");
    return {
      ok: true,
      value: {
        basis: "brace-requirement",
        loadBasis: `${loadBasis}; the result is the stiffness and strength each brace needs, which depend only on P_r, the braced length and the number of braces.`,
        effectiveLengthMm: lb,
        idealStiffnessNPerMm: ideal,
        requiredStiffnessNPerMm: required,
        requiredForceN: force,
        steps,
        warnings,
      },
    };
  }
  const pcr = eulerLoad(e, props.iMinMm4, lb);
  if (req.eMpa === undefined) warnings.push("E = 200 000 MPa (steel, AISC 360-16) was assumed; give the modulus of elasticity E for other materials.");
  if (pr > pcr) {
    warnings.push(
      `The load ${fmt(pr)} N is more than the critical load between braces (${fmt(pcr)} N): even rigid braces cannot stop the member buckling between them.`,
    );
  }
  steps.push(
    step(req.eMpa !== undefined ? "Modulus of elasticity (given)" : "Modulus of elasticity, 29 000 ksi", "E", e, "MPa", req.eMpa !== undefined ? "User input" : "AISC 360-16 §E3"),
    step("Critical load between braces P_cr = π²·E·I_min/L_b² (K = 1)", "P_cr", pcr, "N", EULER_SOURCE),
  );
  return {
    ok: true,
    value: {
      capacityN: pcr,
      basis: "elastic-critical",
      loadBasis: `${loadBasis}; the capacity shown is the elastic critical load between braces, with no safety factor.`,
      eulerN: pcr,
      slenderness: lb / props.rMinMm,
      effectiveLengthMm: lb,
      idealStiffnessNPerMm: ideal,
      requiredStiffnessNPerMm: required,
      requiredForceN: force,
      steps,
      warnings,
    },
  };
}

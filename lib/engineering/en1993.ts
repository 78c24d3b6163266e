// Flexural buckling resistance of a uniform member in axial compression,
// EN 1993-1-1 §6.3.1. Cross-sections must be Class 1–3; a Class 4 (slender
// wall) tube is refused because local buckling is outside this check.

import { requireSection, resolveSteelFy } from "./common";
import { effectiveLength } from "./effective-length";
import { eulerLoad, EULER_SOURCE } from "./euler";
import { E_STEEL_EN_MPA } from "./materials";
import type { SectionProperties } from "./sections";
import { fieldError, fmt, step } from "./steps";
import type { BucklingCurve, CalculationRequest, FieldError, MethodOutcome, Section, Step } from "./types";

/** EN 1993-1-1 Table 6.1. */
export const IMPERFECTION_FACTORS: Record<BucklingCurve, number> = { a0: 0.13, a: 0.21, b: 0.34, c: 0.49, d: 0.76 };

/** Reduction factor χ, EN 1993-1-1 (6.49), capped at 1. */
export function en1993Chi(lambdaBar: number, alpha: number): number {
  const phi = 0.5 * (1 + alpha * (lambdaBar - 0.2) + lambdaBar * lambdaBar);
  const chi = 1 / (phi + Math.sqrt(phi * phi - lambdaBar * lambdaBar));
  return chi > 1 ? 1 : chi;
}

/** N_b,Rd = χ·A·fy/γM1 from raw numbers (N, mm², MPa). */
export function en1993BucklingResistance(areaMm2: number, fyMpa: number, ncrN: number, alpha: number, gammaM1: number): number {
  const lambdaBar = Math.sqrt((areaMm2 * fyMpa) / ncrN);
  return (en1993Chi(lambdaBar, alpha) * areaMm2 * fyMpa) / gammaM1;
}

const T62 = "EN 1993-1-1 Table 6.2";

/** Buckling curve from Table 6.2 for the shapes this engine knows. */
export function selectCurve(
  section: Section,
  fyMpa: number,
  formed: CalculationRequest["formed"],
  explicit: BucklingCurve | undefined,
): { ok: true; curve: BucklingCurve; steps: Step[]; warnings: string[] } | { ok: false; errors: FieldError[] } {
  if (explicit) {
    return { ok: true, curve: explicit, steps: [step("Buckling curve (given by the user)", "curve", explicit, "", "User input")], warnings: [] };
  }
  const warnings: string[] = [];
  switch (section.shape) {
    case "chs":
    case "rhs": {
      if (formed === "hot-finished") {
        const curve: BucklingCurve = fyMpa >= 460 ? "a0" : "a";
        if (fyMpa > 460) warnings.push(`Table 6.2 covers grades up to S460; fy = ${fmt(fyMpa)} MPa was given the S460 curve a0. Check EN 1993-1-12 for higher grades.`);
        return {
          ok: true,
          curve,
          steps: [step(`Buckling curve, hot-finished hollow section, ${fyMpa >= 460 ? "S460" : "S235–S420"}`, "curve", curve, "", T62)],
          warnings,
        };
      }
      if (formed === undefined) {
        warnings.push(
          "It was not said whether the tube is hot-finished or cold-formed, so the cold-formed curve c (the lower one) was used. Say which it is for a higher capacity if the tube is hot-finished (EN 10210).",
        );
      }
      return { ok: true, curve: "c", steps: [step("Buckling curve, cold-formed hollow section (any grade)", "curve", "c", "", T62)], warnings };
    }
    case "rect":
    case "round":
      return { ok: true, curve: "c", steps: [step("Buckling curve, solid section", "curve", "c", "", T62)], warnings };
    case "given":
      return {
        ok: false,
        errors: [
          fieldError(
            "curve",
            "For a section given only by its area and second moment, choose the buckling curve from EN 1993-1-1 Table 6.2 (a0, a, b, c or d).",
          ),
        ],
      };
  }
}

/** Class 3 limits of EN 1993-1-1 Table 5.2 for walls in uniform compression. */
export function checkEnClass(section: Section, fyMpa: number): { errors: FieldError[]; steps: Step[] } {
  const eps = Math.sqrt(235 / fyMpa);
  const steps: Step[] = [];
  if (section.shape === "chs") {
    const ratio = section.dMm / section.tMm;
    const limit = 90 * eps * eps;
    steps.push(step("Tube slenderness d/t (Class 3 limit 90ε², ε = √(235/fy))", "d/t", ratio, "", "EN 1993-1-1 Table 5.2 sheet 3"));
    if (ratio > limit) {
      return {
        errors: [
          fieldError(
            "section.tMm",
            `The tube wall is too thin for this check: d/t = ${fmt(ratio)} is over the Class 3 limit of ${fmt(limit)} (EN 1993-1-1 Table 5.2). Local buckling of the wall would reduce the capacity and is not covered here.`,
          ),
        ],
        steps,
      };
    }
  }
  if (section.shape === "rhs") {
    // c = b − 3t is the usual allowance for the corner radius of hollow sections when it is not known.
    const c = Math.max(section.bMm, section.hMm) - 3 * section.tMm;
    const ratio = c / section.tMm;
    const limit = 42 * eps;
    steps.push(step("Flat width to thickness c/t, c = b − 3t (Class 3 limit 42ε)", "c/t", ratio, "", "EN 1993-1-1 Table 5.2 sheet 1"));
    if (ratio > limit) {
      return {
        errors: [
          fieldError(
            "section.tMm",
            `The tube wall is too thin for this check: c/t = ${fmt(ratio)} is over the Class 3 limit of ${fmt(limit)} (EN 1993-1-1 Table 5.2). Local buckling of the wall would reduce the capacity and is not covered here.`,
          ),
        ],
        steps,
      };
    }
  }
  return { errors: [], steps };
}

export const SLENDERNESS_WARNING_LIMIT = 180;

export function runEn1993(req: CalculationRequest): MethodOutcome {
  const errors: FieldError[] = [];
  const sec = requireSection(req, ["chs", "rhs", "rect", "round", "given"], "EN 1993-1-1 buckling resistance", req.formed === "hot-finished" ? "hot-finished" : "cold-formed");
  if (!sec.ok) errors.push(...sec.errors);
  const props: SectionProperties | undefined = sec.ok ? sec.props : undefined;
  const fyRes = props ? resolveSteelFy(req, props) : undefined;
  if (fyRes && !fyRes.ok) errors.push(...fyRes.errors);
  if (!sec.ok && req.fyMpa === undefined && req.steelGrade === undefined) {
    errors.push(fieldError("fyMpa", "Give the steel's yield strength fy in MPa, or choose a steel grade."));
  }
  if (errors.length || !sec.ok || !props || !fyRes || !fyRes.ok) return { ok: false, errors };
  const fy = fyRes.value.fyMpa;
  const curveRes = selectCurve(sec.section, fy, req.formed, req.curve);
  if (!curveRes.ok) return curveRes;
  const cls = checkEnClass(sec.section, fy);
  if (cls.errors.length) return { ok: false, errors: cls.errors };

  const eff = effectiveLength(req.lengthMm, req, "en-steel");
  const e = req.eMpa ?? E_STEEL_EN_MPA;
  const gammaM1 = req.gammaM1 ?? 1.0;
  const a = props.areaMm2;
  const npl = a * fy;
  const ncr = eulerLoad(e, props.iMinMm4, eff.effectiveLengthMm);
  const lambda = eff.effectiveLengthMm / props.rMinMm;
  const lambdaBar = Math.sqrt(npl / ncr);
  const alpha = IMPERFECTION_FACTORS[curveRes.curve];
  const phi = 0.5 * (1 + alpha * (lambdaBar - 0.2) + lambdaBar * lambdaBar);
  const chi = en1993Chi(lambdaBar, alpha);
  const nbrd = (chi * npl) / gammaM1;

  const warnings = [...eff.warnings, ...fyRes.value.warnings, ...curveRes.warnings];
  if (props.kind === "given") {
    warnings.push("The section's class (EN 1993-1-1 §5.5) cannot be checked from an area and I alone; this check assumes it is Class 1, 2 or 3.");
  }
  if (lambdaBar <= 0.2) {
    warnings.push(
      `λ̄ = ${fmt(lambdaBar)} ≤ 0.2: buckling effects may be ignored (EN 1993-1-1 §6.3.1.2(4)); χ = 1 was used, so the resistance is the squash load A·fy/γM1.`,
    );
  }
  if (req.loadN !== undefined && req.loadN > 0 && req.loadN / ncr <= 0.04 && lambdaBar > 0.2) {
    warnings.push(
      `N_Ed/N_cr = ${fmt(req.loadN / ncr)} ≤ 0.04, so EN 1993-1-1 §6.3.1.2(4) would allow buckling to be ignored; the resistance shown still includes the buckling reduction χ = ${fmt(chi)}, which is on the safe side.`,
    );
  }
  if (lambda > SLENDERNESS_WARNING_LIMIT) {
    warnings.push(
      `The slenderness L_cr/i = ${fmt(lambda)} is over ${SLENDERNESS_WARNING_LIMIT}, beyond the usual limit for compression members (common practice; AISC 360-16 §E2 user note suggests 200). Such a member is very sensitive to crookedness and knocks on site.`,
    );
  }
  if (req.gammaM1 === undefined) {
    warnings.push("γM1 = 1.0 (EN 1993-1-1 §6.1 recommended value) was used; check the National Annex for your country.");
  }

  const steps: Step[] = [
    ...props.steps,
    ...fyRes.value.steps,
    ...cls.steps,
    ...eff.steps,
    step(req.eMpa !== undefined ? "Modulus of elasticity (given by the user)" : "Modulus of elasticity", "E", e, "MPa", req.eMpa !== undefined ? "User input" : "EN 1993-1-1 §3.2.6(1)"),
    step("Squash load A·fy", "N_pl", npl, "N", "EN 1993-1-1 §6.2.4 Eq. 6.10"),
    step("Elastic critical load N_cr = π²·E·I_min/L_cr²", "N_cr", ncr, "N", EULER_SOURCE),
    step("Slenderness ratio L_cr/i", "λ", lambda, "", "Definition"),
    step("Non-dimensional slenderness λ̄ = √(A·fy/N_cr)", "λ̄", lambdaBar, "", "EN 1993-1-1 §6.3.1.3 Eq. 6.50"),
    ...curveRes.steps,
    step("Imperfection factor", "α", alpha, "", "EN 1993-1-1 Table 6.1"),
    step("Φ = 0.5·[1 + α(λ̄ − 0.2) + λ̄²]", "Φ", phi, "", "EN 1993-1-1 §6.3.1.2 Eq. 6.49"),
    step("Reduction factor χ = 1/(Φ + √(Φ² − λ̄²)) ≤ 1", "χ", chi, "", "EN 1993-1-1 §6.3.1.2 Eq. 6.49"),
    step(req.gammaM1 !== undefined ? "Partial factor (given by the user)" : "Partial factor (recommended value)", "γM1", gammaM1, "", req.gammaM1 !== undefined ? "User input" : "EN 1993-1-1 §6.1(1) NOTE 2B"),
    step("Design buckling resistance N_b,Rd = χ·A·fy/γM1", "N_b,Rd", nbrd, "N", "EN 1993-1-1 §6.3.1.1 Eq. 6.47"),
  ];
  return {
    ok: true,
    value: {
      capacityN: nbrd,
      basis: "design-resistance",
      loadBasis: `Factored (ULS design) load N_Ed compared with the design buckling resistance N_b,Rd (γM1 = ${fmt(gammaM1)}); apply load factors such as EN 1990 γG = 1.35, γQ = 1.5 to the load before comparing.`,
      eulerN: ncr,
      slenderness: lambda,
      relativeSlenderness: lambdaBar,
      reductionFactor: chi,
      effectiveLengthMm: eff.effectiveLengthMm,
      steps,
      warnings,
    },
  };
}

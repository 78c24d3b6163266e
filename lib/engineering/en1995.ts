// Timber columns in axial compression, EN 1995-1-1 §6.3.2, about the least
// radius of gyration.

import { requireSection } from "./common";
import { effectiveLength } from "./effective-length";
import { eulerLoad, EULER_SOURCE } from "./euler";
import { BETA_C, findTimberClass, GAMMA_M_TIMBER, KMOD, TIMBER_CLASSES } from "./materials";
import { fieldError, fmt, step } from "./steps";
import type { CalculationRequest, FieldError, MethodOutcome, Step, TimberType } from "./types";

/** Relative slenderness λ_rel = (λ/π)·√(fc,0,k/E0,05), EN 1995-1-1 (6.21)/(6.22). */
export function en1995LambdaRel(lambda: number, fc0kMpa: number, e005Mpa: number): number {
  return (lambda / Math.PI) * Math.sqrt(fc0kMpa / e005Mpa);
}

/** Instability factor k_c, EN 1995-1-1 (6.25)/(6.27); 1 when λ_rel ≤ 0.3 (§6.3.2(2)). */
export function en1995Kc(lambdaRel: number, betaC: number): number {
  if (lambdaRel <= 0.3) return 1;
  const k = 0.5 * (1 + betaC * (lambdaRel - 0.3) + lambdaRel * lambdaRel);
  const kc = 1 / (k + Math.sqrt(k * k - lambdaRel * lambdaRel));
  return kc > 1 ? 1 : kc;
}

/** N_c,Rd = k_c·(kmod·fc,0,k/γM)·A from raw numbers (N). */
export function en1995Resistance(
  areaMm2: number,
  rMinMm: number,
  lefMm: number,
  fc0kMpa: number,
  e005Mpa: number,
  kmod: number,
  gammaM: number,
  betaC: number,
): number {
  const lambdaRel = en1995LambdaRel(lefMm / rMinMm, fc0kMpa, e005Mpa);
  return en1995Kc(lambdaRel, betaC) * ((kmod * fc0kMpa) / gammaM) * areaMm2;
}

/** Props, rakers and trench timbers stand outdoors: service class 3 (EN 1995-1-1 §2.3.1.3) unless the user says otherwise. */
const DEFAULT_SERVICE_CLASS = 3;
const DEFAULT_DURATION = "medium-term";

export function runEn1995(req: CalculationRequest): MethodOutcome {
  const errors: FieldError[] = [];
  const sec = requireSection(req, ["rect", "round", "given"], "EN 1995-1-1 timber column check");
  if (!sec.ok) errors.push(...sec.errors);

  const cls = req.strengthClass !== undefined ? findTimberClass(req.strengthClass) : undefined;
  if (req.strengthClass !== undefined && !cls) {
    errors.push(
      fieldError(
        "strengthClass",
        `Strength class "${req.strengthClass}" is not in the list (${TIMBER_CLASSES.map((c) => c.id).join(", ")}); give the compression strength f_c,0,k and the modulus E0,05 instead.`,
      ),
    );
  }
  const fc0k = req.fc0kMpa ?? cls?.fc0kMpa;
  const e005 = req.e005Mpa ?? cls?.e005Mpa;
  if (req.strengthClass === undefined || cls) {
    if (fc0k === undefined) errors.push(fieldError("fc0kMpa", "Give the characteristic compressive strength fc,0,k in MPa, or choose a strength class (e.g. C24)."));
    if (e005 === undefined) errors.push(fieldError("e005Mpa", "Give the 5th-percentile modulus E0,05 in MPa, or choose a strength class (e.g. C24)."));
  }
  if (errors.length || !sec.ok || fc0k === undefined || e005 === undefined) return { ok: false, errors };
  const { props } = sec;

  const timberType: TimberType = req.timberType ?? cls?.timberType ?? (sec.section.shape === "round" ? "round" : "solid");
  const betaC = req.betaC ?? BETA_C[timberType];
  const gammaM = req.gammaM ?? GAMMA_M_TIMBER[timberType];
  const serviceClass = req.serviceClass ?? DEFAULT_SERVICE_CLASS;
  const duration = req.loadDuration ?? DEFAULT_DURATION;
  const kmod = req.kmod ?? KMOD[serviceClass][duration];

  const eff = effectiveLength(req.lengthMm, req, "en-timber");
  const lef = eff.effectiveLengthMm;
  const lambda = lef / props.rMinMm;
  const lambdaRel = en1995LambdaRel(lambda, fc0k, e005);
  const kc = en1995Kc(lambdaRel, betaC);
  const kFactor = 0.5 * (1 + betaC * (lambdaRel - 0.3) + lambdaRel * lambdaRel);
  const fc0d = (kmod * fc0k) / gammaM;
  const nrd = kc * fc0d * props.areaMm2;
  const ncr = eulerLoad(e005, props.iMinMm4, lef);

  const warnings = [...eff.warnings];
  if (req.kmod === undefined && (req.serviceClass === undefined || req.loadDuration === undefined)) {
    warnings.push(
      `kmod = ${fmt(kmod)} for service class ${serviceClass}, ${duration} load (EN 1995-1-1 Table 3.1) was assumed${req.serviceClass === undefined && req.loadDuration === undefined ? "; medium-term covers propping left in place from a week to six months (Table 2.1) and service class 3 covers timber exposed to the weather, as props, rakers and trench timbers are" : ""}. Give kmod, the service class or the load duration class if your case differs (service class 2 for work under cover, EN 1995-1-1 §2.3.1.3).`,
    );
  }
  if (lambdaRel <= 0.3) {
    warnings.push(`λ_rel = ${fmt(lambdaRel)} ≤ 0.3, so k_c = 1: the post is short enough that only crushing governs (EN 1995-1-1 §6.3.2(2)).`);
  }
  if (lambda > 180) {
    warnings.push(`The slenderness L_ef/i = ${fmt(lambda)} is over 180, beyond the usual limit for timber compression members (common practice).`);
  }
  if (req.gammaM === undefined) {
    warnings.push(`γM = ${fmt(gammaM)} (EN 1995-1-1 Table 2.3 recommended value for ${timberType === "lvl" ? "LVL" : timberType === "glulam" ? "glued laminated timber" : "solid timber"}) was used; check the National Annex.`);
  }
  const classSource = cls ? cls.source : "User input";
  const steps: Step[] = [
    ...props.steps,
    ...(cls ? [step("Strength class", "class", cls.id, "", cls.source)] : []),
    step(req.fc0kMpa !== undefined ? "Characteristic compressive strength (given)" : "Characteristic compressive strength parallel to grain", "f_c,0,k", fc0k, "MPa", req.fc0kMpa !== undefined ? "User input" : classSource),
    step(req.e005Mpa !== undefined ? "5th-percentile modulus (given)" : "5th-percentile modulus of elasticity", "E_0,05", e005, "MPa", req.e005Mpa !== undefined ? "User input" : classSource),
    ...eff.steps,
    step("Slenderness ratio λ = L_ef/i", "λ", lambda, "", "EN 1995-1-1 §6.3.2(1)"),
    step("Relative slenderness λ_rel = (λ/π)·√(f_c,0,k/E_0,05)", "λ_rel", lambdaRel, "", "EN 1995-1-1 §6.3.2 Eq. 6.21/6.22"),
    step(req.betaC !== undefined ? "Straightness factor (given)" : `Straightness factor, ${timberType === "glulam" || timberType === "lvl" ? "glulam and LVL" : "solid timber"}`, "β_c", betaC, "", req.betaC !== undefined ? "User input" : "EN 1995-1-1 §6.3.2 Eq. 6.29"),
  ];
  if (lambdaRel <= 0.3) {
    steps.push(step("λ_rel ≤ 0.3: no buckling reduction", "k_c", kc, "", "EN 1995-1-1 §6.3.2(2) Eq. 6.19/6.20"));
  } else {
    steps.push(step("k = 0.5·[1 + β_c(λ_rel − 0.3) + λ_rel²]", "k", kFactor, "", "EN 1995-1-1 §6.3.2 Eq. 6.27/6.28"));
    steps.push(step("Instability factor k_c = 1/(k + √(k² − λ_rel²))", "k_c", kc, "", "EN 1995-1-1 §6.3.2 Eq. 6.25/6.26"));
  }
  steps.push(
    step(
      req.kmod !== undefined ? "Modification factor (given)" : `Modification factor, service class ${serviceClass}, ${duration}`,
      "k_mod",
      kmod,
      "",
      req.kmod !== undefined ? "User input" : "EN 1995-1-1 Table 3.1",
    ),
    step(req.gammaM !== undefined ? "Partial factor (given)" : "Partial factor for the material", "γ_M", gammaM, "", req.gammaM !== undefined ? "User input" : "EN 1995-1-1 §2.4.1 Table 2.3"),
    step("Design compressive strength f_c,0,d = k_mod·f_c,0,k/γ_M", "f_c,0,d", fc0d, "MPa", "EN 1995-1-1 §2.4.1 Eq. 2.14"),
    step("Design resistance N_c,Rd = k_c·f_c,0,d·A", "N_c,Rd", nrd, "N", "EN 1995-1-1 §6.3.2 Eq. 6.23/6.24"),
    step("Elastic critical load with E_0,05 (for reference)", "N_cr", ncr, "N", EULER_SOURCE),
  );
  return {
    ok: true,
    value: {
      capacityN: nrd,
      basis: "design-resistance",
      loadBasis: `Factored (ULS design) load compared with the design resistance N_c,Rd (k_mod ${fmt(kmod)}, γM ${fmt(gammaM)}); apply load factors such as EN 1990 γG = 1.35, γQ = 1.5 to the load before comparing.`,
      eulerN: ncr,
      slenderness: lambda,
      relativeSlenderness: lambdaRel,
      reductionFactor: kc,
      effectiveLengthMm: lef,
      steps,
      warnings,
    },
  };
}

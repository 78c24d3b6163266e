// Adjustable telescopic steel props classified to EN 1065. The standard gives
// a nominal characteristic strength for each class as a function of the
// extension actually used: classes A–C fall with the square of the extension,
// classes D and E keep one value over their whole range.
//
// AWAITING CONFIRMATION: the class formulas below (A 51, B 68, C 102 kN·m ×
// l_max/l²; D 34 kN; E 51 kN) and the combined factor 1.65 = γF 1.5 × γM 1.1
// were recalled from EN 1065:1998 Table 2 / clause 8 and EN 12812 and could
// not be re-read from the standard. Class B's 68·l_max/l² and class D's 34 kN
// match published descriptions of the standard, and 34/1.65 ≈ 20 kN and
// 51/1.65 ≈ 30 kN match commonly published permissible loads for classes D and
// E. The working says "value to be confirmed against EN 1065 Table 2" until a
// copy of the standard has been checked.

import { fieldError, fmt, step } from "./steps";
import type { CalculationRequest, FieldError, MethodOutcome, PropClass, Step } from "./types";

export const EN1065_SOURCE = { source: "EN 1065:1998 Table 2", note: "nominal characteristic strength", toConfirm: "value to be confirmed against EN 1065 Table 2" };
const FACTOR_SOURCE = { source: "EN 1065:1998 clause 8", note: "with EN 12812", toConfirm: "value to be confirmed against EN 1065 clause 8" };

/** kN·m coefficient for classes A–C and kN constant for D–E. */
export const EN1065_CLASS: Record<PropClass, { kind: "inverse-square"; coefficientKnM: number } | { kind: "constant"; kN: number }> = {
  A: { kind: "inverse-square", coefficientKnM: 51 },
  B: { kind: "inverse-square", coefficientKnM: 68 },
  C: { kind: "inverse-square", coefficientKnM: 102 },
  D: { kind: "constant", kN: 34 },
  E: { kind: "constant", kN: 51 },
};

export const EN1065_GAMMA_F = 1.5;
export const EN1065_GAMMA_M = 1.1;

/** Nominal characteristic strength R_y,k in N at extension l, for a prop whose maximum extension is l_max (both mm). */
export function en1065CharacteristicN(propClass: PropClass, maxExtensionMm: number, extensionMm: number): number {
  const c = EN1065_CLASS[propClass];
  if (c.kind === "constant") return c.kN * 1000;
  const lMax = maxExtensionMm / 1000;
  const l = extensionMm / 1000;
  return ((c.coefficientKnM * lMax) / (l * l)) * 1000;
}

export function runEn1065(req: CalculationRequest): MethodOutcome {
  const errors: FieldError[] = [];
  if (req.propClass === undefined) {
    errors.push(fieldError("propClass", "Choose the prop's EN 1065 class (A, B, C, D or E) as marked on the prop."));
  }
  if (req.maxExtensionMm === undefined) {
    errors.push(fieldError("maxExtensionMm", "Give the prop's maximum extension in mm (e.g. 3500 for a class D 35 prop)."));
  }
  if (errors.length || req.propClass === undefined || req.maxExtensionMm === undefined) return { ok: false, errors };
  const lMax = req.maxExtensionMm;
  const l = req.lengthMm;
  const minGiven = req.minExtensionMm !== undefined;
  // No minimum is invented: the prop's marked minimum (closed) extension is used when given,
  // and asked for when it is not.
  const lMin = req.minExtensionMm;
  if (lMin !== undefined && lMin >= lMax) {
    return {
      ok: false,
      errors: [
        fieldError(
          "minExtensionMm",
          `The minimum (closed) extension ${fmt(lMin)} mm must be shorter than the maximum extension ${fmt(lMax)} mm.`,
        ),
      ],
    };
  }
  if (l > lMax) {
    return {
      ok: false,
      errors: [
        fieldError(
          "lengthMm",
          `Extension ${fmt(l)} mm is longer than this prop's maximum extension of ${fmt(lMax)} mm; a prop must not be used beyond its range.`,
        ),
      ],
    };
  }
  if (lMin !== undefined && l < lMin) {
    return {
      ok: false,
      errors: [fieldError("lengthMm", `Extension ${fmt(l)} mm is shorter than this prop's minimum (closed) length of ${fmt(lMin)} mm; choose a shorter prop.`)],
    };
  }
  const cls = req.propClass;
  const rk = en1065CharacteristicN(cls, lMax, l);
  const gammaF = req.gammaF ?? EN1065_GAMMA_F;
  const gammaM = req.gammaM ?? EN1065_GAMMA_M;
  const factor = gammaF * gammaM;
  const swl = rk / factor;
  const def = EN1065_CLASS[cls];
  const steps: Step[] = [
    step("Prop class", "class", cls, "", "EN 1065:1998 §4"),
    step("Maximum extension", "l_max", lMax, "mm", { source: "User input", note: "from the prop's marking" }),
    minGiven
      ? step("Minimum extension (given)", "l_min", lMin as number, "mm", { source: "User input", note: "from the prop's marking" })
      : step("Minimum extension not given: the range below the extension is not checked", "l_min", "not given", "", { source: "User input", note: "not given: read it from the prop's marking" }),
    step("Extension used", "l", l, "mm", "User input"),
    def.kind === "inverse-square"
      ? step(`Nominal characteristic strength R_k = ${def.coefficientKnM}·l_max/l² (kN, lengths in m)`, "R_k", rk, "N", EN1065_SOURCE)
      : step(`Nominal characteristic strength R_k = ${def.kN} kN at every extension`, "R_k", rk, "N", EN1065_SOURCE),
    step(req.gammaF !== undefined ? "Load factor (given)" : "Load factor", "γF", gammaF, "", req.gammaF !== undefined ? "User input" : FACTOR_SOURCE),
    step(req.gammaM !== undefined ? "Resistance factor (given)" : "Resistance factor", "γM", gammaM, "", req.gammaM !== undefined ? "User input" : FACTOR_SOURCE),
    step("Combined factor γF·γM", "γ", factor, "", FACTOR_SOURCE),
    step("Safe working load SWL = R_k/(γF·γM)", "SWL", swl, "N", FACTOR_SOURCE),
  ];
  const warnings: string[] = [
    "EN 1065 class values assume the prop stands plumb, is loaded centrally through its end plates and is in good condition; a prop out of plumb, bent or with a substitute pin needs its own assessment.",
  ];
  if (!minGiven) {
    warnings.push("The prop's minimum (closed) extension was not given, so it is not checked that the prop can be set this short; give the prop's minimum extension from its marking.");
  }
  if (req.k !== undefined || req.ends !== undefined) {
    warnings.push("End conditions and k are not used: the EN 1065 class strength already assumes the prop's own end plates.");
  }
  if (req.section !== undefined) warnings.push("The section is not used: an EN 1065 prop is rated by its class, not by its tube size.");
  return {
    ok: true,
    value: {
      capacityN: swl,
      characteristicN: rk,
      basis: "safe-working-load",
      loadBasis: `Working (unfactored) load compared with the safe working load = characteristic strength / ${fmt(factor)} (γF ${fmt(gammaF)} × γM ${fmt(gammaM)}).`,
      steps,
      warnings,
    },
  };
}

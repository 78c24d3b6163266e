// The single entry point the route handler, the register and outside systems
// call. It never throws: every bad input becomes { ok: false, errors } with
// the request path and a sentence a site engineer can act on.

import { runAisc360 } from "./aisc360";
import { runEn1065 } from "./en1065";
import { runEn1993 } from "./en1993";
import { runEn1995 } from "./en1995";
import { runEuler } from "./euler";
import { runNds } from "./nds";
import { runBackpropSequence } from "./backprop";
import { runBaseBearing } from "./base-bearing";
import { runOutOfPlumb } from "./out-of-plumb";
import { runPointBrace } from "./point-brace";
import { runRakingCombined } from "./raking-combined";
import { isPlainObject, parseRequest } from "./request-schema";
import { fmt } from "./steps";
import { runSupplierTable } from "./supplier-table";
import type { CalculationRequest, CalculationResult, MethodOutcome } from "./types";
import { ENGINE_VERSION } from "./version";

function dispatch(req: CalculationRequest): MethodOutcome {
  switch (req.method) {
    case "euler":
      return runEuler(req);
    case "en1993":
      return runEn1993(req);
    case "aisc360-lrfd":
      return runAisc360(req, "lrfd");
    case "aisc360-asd":
      return runAisc360(req, "asd");
    case "en1065":
      return runEn1065(req);
    case "supplier-table":
      return runSupplierTable(req);
    case "en1995":
      return runEn1995(req);
    case "nds":
      return runNds(req);
    case "point-brace":
      return runPointBrace(req);
    case "out-of-plumb":
      return runOutOfPlumb(req);
    case "base-bearing":
      return runBaseBearing(req);
    case "backprop-sequence":
      return runBackpropSequence(req);
    case "raking-combined":
      return runRakingCombined(req);
  }
}

const NUMERIC_FIELDS = [
  "capacityN",
  "characteristicN",
  "eulerN",
  "slenderness",
  "relativeSlenderness",
  "reductionFactor",
  "effectiveLengthMm",
  "idealStiffnessNPerMm",
  "requiredStiffnessNPerMm",
  "requiredForceN",
  "utilisation",
  "maxSlabLoadRatio",
  "maxPropLoadRatio",
] as const;

/** Methods whose answer is not a force capacity: they may leave capacityN out. */
const NO_CAPACITY_METHODS = new Set(["point-brace", "backprop-sequence"]);

/** Runs a validated request. Exposed for the curve helper and the bench; use calculate() for anything from outside. */
export function calculateParsed(req: CalculationRequest): CalculationResult {
  const out = dispatch(req);
  if (!out.ok) return out;
  const v = out.value;
  // Extreme but individually valid inputs can still overflow; a NaN or an
  // infinity must never reach a permit.
  const bad =
    NUMERIC_FIELDS.some((f) => v[f] !== undefined && !Number.isFinite(v[f])) ||
    v.steps.some((s) => typeof s.value === "number" && !Number.isFinite(s.value)) ||
    (v.checks ?? []).some((c) => !Number.isFinite(c.utilisation) || !Number.isFinite(c.demand) || !Number.isFinite(c.resistance)) ||
    (v.stages ?? []).some((st) => [...st.slabLoadRatios, ...st.propLoadRatios].some((x) => !Number.isFinite(x))) ||
    (v.capacityN === undefined ? !NO_CAPACITY_METHODS.has(req.method) : !(v.capacityN > 0));
  if (bad) {
    return {
      ok: false,
      errors: [
        {
          field: "",
          message: "These values lead to a result that cannot be computed reliably (a number overflowed or came out as zero); check the units of the length, section and material values.",
        },
      ],
    };
  }
  const warnings = [...v.warnings];
  if (req.lengthMm !== undefined && req.lengthMm < 100) {
    warnings.push(`The length is only ${fmt(req.lengthMm)} mm; check it was entered in millimetres, not metres.`);
  }
  const result: CalculationResult = { ok: true, method: req.method, engineVersion: ENGINE_VERSION, ...v, warnings };
  if (v.utilisation !== undefined) {
    if (req.loadN !== undefined) result.loadN = req.loadN;
    result.pass = v.utilisation <= 1;
  } else if (req.loadN !== undefined && v.capacityN !== undefined) {
    const utilisation = req.loadN / v.capacityN;
    result.loadN = req.loadN;
    result.utilisation = utilisation;
    result.pass = utilisation <= 1;
  }
  return result;
}

export function calculate(request: unknown): CalculationResult {
  try {
    const parsed = parseRequest(request);
    if (!parsed.ok) return parsed;
    return calculateParsed(parsed.value);
  } catch {
    return {
      ok: false,
      errors: [{ field: "", message: "The calculation could not be carried out with these values; check every field and try again." }],
    };
  }
}

export interface CurvePoint {
  lengthMm: number;
  capacityN: number;
  eulerN?: number;
}

/**
 * Capacity against length for the calculator chart: `points` evenly spaced
 * lengths from `fromMm` to `toMm` inclusive, each run through the same checks
 * as calculate(); lengths the method refuses (beyond a prop's range, outside
 * a table, over a slenderness limit) are left out rather than drawn.
 */
export function capacityCurve(request: unknown, fromMm: number, toMm: number, points: number): CurvePoint[] {
  try {
    if (!isPlainObject(request)) return [];
    if (!Number.isFinite(fromMm) || !Number.isFinite(toMm) || !Number.isFinite(points)) return [];
    const n = Math.min(Math.max(Math.floor(points), 2), 1000);
    const lo = Math.min(fromMm, toMm);
    const hi = Math.max(fromMm, toMm);
    if (!(lo > 0)) return [];
    const base = parseRequest({ ...request, lengthMm: lo });
    if (!base.ok) return [];
    const out: CurvePoint[] = [];
    for (let i = 0; i < n; i++) {
      const lengthMm = lo + ((hi - lo) * i) / (n - 1);
      const r = calculateParsed({ ...base.value, lengthMm });
      if (r.ok && r.capacityN !== undefined) {
        const p: CurvePoint = { lengthMm, capacityN: r.capacityN };
        if (r.eulerN !== undefined) p.eulerN = r.eulerN;
        out.push(p);
      }
    }
    return out;
  } catch {
    return [];
  }
}

// Effective length factors for idealised end conditions. The recommended
// design values are larger than the theoretical ones where a "fixed" end is
// assumed, because real site connections are never fully rigid.

import { fmt, step } from "./steps";
import type { EndCondition, SourceRef, Step } from "./types";

export interface EndConditionInfo {
  id: EndCondition;
  label: string;
  theoreticalK: number;
  designK: number;
}

/** Which code's table of recommended effective length factors a method follows. */
export type KTable = "aisc" | "nds" | "en-steel" | "en-timber";

const TABLE = "AISC 360-16 Commentary Table C-A-7.1";

/**
 * Recommended design factors by code. AISC and NDS print the same six cases and
 * differ only in the last (pinned at one end, rotation fixed but free to sway at
 * the other: AISC 2.0, NDS 2.4). Eurocodes 3 and 5 give no such table; UK
 * practice for Eurocode work uses the nominal effective lengths of BS 5950-1
 * Table 22 (steel) and BS 5268-2 Table 19 (timber), which are used here.
 */
export const K_TABLES: Record<KTable, { source: string | SourceRef; k: Record<EndCondition, number>; note?: string }> = {
  aisc: {
    source: TABLE,
    k: { "fixed-fixed": 0.65, "fixed-pinned": 0.8, "fixed-sway": 1.2, "pinned-pinned": 1.0, "fixed-free": 2.1, "pinned-sway": 2.0 },
  },
  nds: {
    source: "NDS 2018 Appendix G Table G1",
    k: { "fixed-fixed": 0.65, "fixed-pinned": 0.8, "fixed-sway": 1.2, "pinned-pinned": 1.0, "fixed-free": 2.1, "pinned-sway": 2.4 },
  },
  "en-steel": {
    source: { source: "BS 5950-1:2000 Table 22", note: "nominal effective lengths, UK practice with EN 1993-1-1", toConfirm: "value to be confirmed against BS 5950-1:2000 Table 22" },
    k: { "fixed-fixed": 0.7, "fixed-pinned": 0.85, "fixed-sway": 1.2, "pinned-pinned": 1.0, "fixed-free": 2.0, "pinned-sway": 2.0 },
    note: "pinned-sway is not in BS 5950-1 Table 22; the theoretical 2.0 is used.",
  },
  "en-timber": {
    source: { source: "BS 5268-2:2002 Table 19", note: "effective lengths, UK practice with EN 1995-1-1", toConfirm: "value to be confirmed against BS 5268-2:2002 Table 19" },
    k: { "fixed-fixed": 0.7, "fixed-pinned": 0.85, "fixed-sway": 1.5, "pinned-pinned": 1.0, "fixed-free": 2.0, "pinned-sway": 2.0 },
    note: "pinned-sway is not in BS 5268-2 Table 19; the theoretical 2.0 is used.",
  },
};

export const END_CONDITIONS: readonly EndConditionInfo[] = [
  { id: "fixed-fixed", label: "Both ends fixed (rotation and translation held)", theoreticalK: 0.5, designK: 0.65 },
  { id: "fixed-pinned", label: "One end fixed, other pinned", theoreticalK: 0.7, designK: 0.8 },
  { id: "fixed-sway", label: "Both ends rotation fixed, one end free to move sideways", theoreticalK: 1.0, designK: 1.2 },
  { id: "pinned-pinned", label: "Both ends pinned (held in position, free to rotate)", theoreticalK: 1.0, designK: 1.0 },
  { id: "fixed-free", label: "One end fixed, other free (cantilever)", theoreticalK: 2.0, designK: 2.1 },
  { id: "pinned-sway", label: "One end pinned, other rotation fixed but free to move sideways", theoreticalK: 2.0, designK: 2.0 },
];

export const END_CONDITION_IDS = END_CONDITIONS.map((e) => e.id) as readonly EndCondition[];

export function endConditionInfo(id: EndCondition): EndConditionInfo {
  // The list is exhaustive over EndCondition, so find() cannot miss.
  return END_CONDITIONS.find((e) => e.id === id) as EndConditionInfo;
}

export interface EffectiveLength {
  k: number;
  effectiveLengthMm: number;
  steps: Step[];
  warnings: string[];
}

/**
 * Default when nothing is given is pinned-pinned (K = 1.0), which is how props,
 * struts and shores are normally idealised (end plates on packing are not
 * moment connections).
 */
export function effectiveLength(lengthMm: number, opts: { k?: number; ends?: EndCondition }, table: KTable = "aisc"): EffectiveLength {
  const steps: Step[] = [];
  const warnings: string[] = [];
  const ends = opts.ends ?? "pinned-pinned";
  const base = endConditionInfo(ends);
  const t = K_TABLES[table];
  const info = { ...base, designK: t.k[ends] };
  const TABLE = t.source;
  steps.push(step("System length between restraints", "L", lengthMm, "mm", "User input"));
  steps.push(step(`End conditions: ${info.label}`, "—", ends, "", TABLE));
  steps.push(step("Theoretical effective length factor", "K_theory", info.theoreticalK, "", "Timoshenko & Gere §2.3"));
  steps.push(step("Recommended design effective length factor", "K_design", info.designK, "", TABLE));
  let k: number;
  if (opts.k !== undefined) {
    k = opts.k;
    steps.push(step("Effective length factor used (given by the user)", "K", k, "", "User input"));
    if (opts.ends !== undefined && k < info.designK) {
      warnings.push(
        `The effective length factor K = ${fmt(k)} you gave is lower than the recommended design value ${fmt(info.designK)} for ${ends} ends (${TABLE}); make sure the end restraint really achieves it.`,
      );
    }
  } else {
    k = info.designK;
    if (opts.ends === undefined) {
      warnings.push("No end conditions were given, so both ends are taken as pinned (K = 1.0).");
    }
    steps.push(step("Effective length factor used (recommended design value)", "K", k, "", TABLE));
  }
  const effectiveLengthMm = k * lengthMm;
  steps.push(step("Effective (buckling) length L_cr = K·L", "L_cr", effectiveLengthMm, "mm", TABLE));
  return { k, effectiveLengthMm, steps, warnings };
}

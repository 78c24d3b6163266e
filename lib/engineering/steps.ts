import type { FieldError, SourceRef, Step } from "./types";

/** A line of the working; `source` is the citation only, with any "to be confirmed" or rule-of-thumb words beside it. */
export function step(label: string, symbol: string, value: number | string, unit: string, source: string | SourceRef): Step {
  const ref = typeof source === "string" ? { source } : source;
  return {
    label, symbol, value, unit, source: ref.source,
    ...(ref.toConfirm ? { toConfirm: ref.toConfirm } : {}),
    ...(ref.note ? { note: ref.note } : {}),
  };
}

/**
 * Number for a sentence a site engineer reads: at most 4 significant figures,
 * no exponent for everyday magnitudes, thousands left unseparated so the text
 * is the same in every locale.
 */
export function fmt(n: number): string {
  if (!Number.isFinite(n)) return String(n);
  if (n === 0) return "0";
  const abs = Math.abs(n);
  if (abs >= 1e9 || abs < 1e-4) return n.toExponential(3).replace(/\.?0+e/, "e");
  if (abs >= 1000) return String(Math.round(n));
  const p = Number(n.toPrecision(4));
  return String(p);
}

export function fieldError(field: string, message: string): FieldError {
  return { field, message };
}

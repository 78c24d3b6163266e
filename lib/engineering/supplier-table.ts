// Safe working loads read from a supplier's load table (length → safe load).
// A member's buckling capacity falls with about 1/L², a curve that sags below
// the straight line between two rows, so reading between rows along that line
// overstates the load. Between rows the load is interpolated linearly in 1/L²
// (exact when the table follows the Euler curve, and never above the straight
// line), or the lower row's load is taken; outside the table nothing is
// extrapolated.

import { fieldError, fmt, step } from "./steps";
import type { CalculationRequest, FieldError, MethodOutcome, Step, TableRow } from "./types";

/** Fraction of the last row's length within which a warning says the member is at the end of its rated range. */
export const TABLE_END_MARGIN = 0.02;

/** The row at or below `x` (binary search; the next row is above it), or -1 outside the table. */
function bracket(lengths: ArrayLike<number>, x: number): number {
  const n = lengths.length;
  if (n < 2 || !(x >= lengths[0]) || !(x <= lengths[n - 1])) return -1;
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (lengths[mid] <= x) lo = mid;
    else hi = mid;
  }
  return lo;
}

/**
 * Straight-line interpolation in a sorted table (kept for comparison and the
 * bench; the method itself reads on the 1/L² basis below); lengths must be strictly increasing
 * and `x` inside [lengths[0], lengths[n-1]]. Returns NaN outside, so callers
 * must range-check first (the wrapper does).
 */
export function interpolateTable(lengths: ArrayLike<number>, loads: ArrayLike<number>, x: number): number {
  const lo = bracket(lengths, x);
  if (lo < 0) return Number.NaN;
  const hi = lo + 1;
  const x0 = lengths[lo];
  const x1 = lengths[hi];
  const t = (x - x0) / (x1 - x0);
  return loads[lo] + t * (loads[hi] - loads[lo]);
}

/**
 * Interpolation linear in 1/L² between the rows either side of `x` (same rules
 * as interpolateTable). For a decreasing table this is never above the
 * straight-line value, because 1/L² is convex in L.
 */
export function interpolateTableInverseSquare(lengths: ArrayLike<number>, loads: ArrayLike<number>, x: number): number {
  const lo = bracket(lengths, x);
  if (lo < 0) return Number.NaN;
  const hi = lo + 1;
  const u0 = 1 / (lengths[lo] * lengths[lo]);
  const u1 = 1 / (lengths[hi] * lengths[hi]);
  const u = 1 / (x * x);
  const t = (u0 - u) / (u0 - u1);
  return loads[lo] + t * (loads[hi] - loads[lo]);
}

/** Sorts rows by length and checks the rules a table must meet; paths refer to the rows as the user entered them. */
export function prepareTable(table: TableRow[] | undefined): { ok: true; rows: TableRow[]; sorted: boolean } | { ok: false; errors: FieldError[] } {
  if (table === undefined) {
    return { ok: false, errors: [fieldError("table", "Enter the supplier's load table: at least two rows of length (mm) and safe load (N).")] };
  }
  if (table.length < 2) {
    return {
      ok: false,
      errors: [fieldError("table", `The supplier table needs at least two rows to read a value between them (got ${table.length}).`)],
    };
  }
  const indexed = table.map((row, i) => ({ row, i }));
  indexed.sort((a, b) => a.row.lengthMm - b.row.lengthMm);
  const errors: FieldError[] = [];
  for (let j = 1; j < indexed.length; j++) {
    if (indexed[j].row.lengthMm === indexed[j - 1].row.lengthMm) {
      const first = Math.min(indexed[j].i, indexed[j - 1].i);
      const second = Math.max(indexed[j].i, indexed[j - 1].i);
      errors.push(
        fieldError(
          `table.${second}.lengthMm`,
          `Rows ${first + 1} and ${second + 1} both give a length of ${fmt(indexed[j].row.lengthMm)} mm; each length may appear only once.`,
        ),
      );
    }
  }
  if (errors.length) return { ok: false, errors };
  const sorted = indexed.some((e, j) => e.i !== j);
  return { ok: true, rows: indexed.map((e) => e.row), sorted };
}

export function runSupplierTable(req: CalculationRequest): MethodOutcome {
  const prepared = prepareTable(req.table);
  if (!prepared.ok) return prepared;
  const rows = prepared.rows;
  const lengths = rows.map((r) => r.lengthMm);
  const loads = rows.map((r) => r.safeLoadN);
  const first = lengths[0];
  const last = lengths[lengths.length - 1];
  const l = req.lengthMm;
  if (l < first || l > last) {
    return {
      ok: false,
      errors: [
        fieldError(
          "lengthMm",
          `Length ${fmt(l)} mm is outside the supplier table, which covers ${fmt(first)}–${fmt(last)} mm; a load table must not be extrapolated. Use a member whose range covers this length.`,
        ),
      ],
    };
  }
  const rule = req.supplierInterpolation ?? "inverse-square";
  let hi = lengths.findIndex((x) => x >= l);
  if (hi <= 0) hi = 1;
  const lo = hi - 1;
  const exact = lengths[hi] === l ? hi : lengths[lo] === l ? lo : -1;
  // Between rows: the lower of the two loads for "lower-row"; otherwise linear in 1/L².
  const swl =
    exact >= 0 ? loads[exact] : rule === "lower-row" ? Math.min(loads[lo], loads[hi]) : interpolateTableInverseSquare(lengths, loads, l);
  const steps: Step[] = [
    step(`Supplier table with ${rows.length} rows${prepared.sorted ? " (sorted by length)" : ""}, range`, "L_min–L_max", `${fmt(first)}–${fmt(last)}`, "mm", { source: "Supplier's load table", note: "user input" }),
    step("Length used", "L", l, "mm", "User input"),
  ];
  if (exact >= 0) {
    steps.push(step(`Safe load read directly from row at ${fmt(lengths[exact])} mm`, "SWL", swl, "N", "Supplier's load table"));
  } else {
    steps.push(step("Row below", "L₁, P₁", `${fmt(lengths[lo])} mm, ${fmt(loads[lo])} N`, "", "Supplier's load table"));
    steps.push(step("Row above", "L₂, P₂", `${fmt(lengths[hi])} mm, ${fmt(loads[hi])} N`, "", "Supplier's load table"));
    if (rule === "lower-row") {
      steps.push(step("Between rows the lower of the two safe loads is taken (no interpolation)", "SWL", swl, "N", { source: "Supplier's load table", note: "lower row" }));
    } else {
      steps.push(
        step(
          "Interpolation linear in 1/L²: SWL = P₁ + (1/L₁² − 1/L²)/(1/L₁² − 1/L₂²)·(P₂ − P₁); follows the 1/L² fall of buckling capacity and never exceeds straight-line interpolation",
          "SWL",
          swl,
          "N",
          { source: "Timoshenko & Gere §2.2", note: "interpolation on the Euler 1/L² basis" },
        ),
      );
    }
  }
  const warnings: string[] = [];
  if (l === first || l === last || last - l <= TABLE_END_MARGIN * last) {
    warnings.push(
      `Length ${fmt(l)} mm is at the ${l === first ? "start" : "end"} of the supplier table (${fmt(first)}–${fmt(last)} mm); there is no margin for a slightly longer setting on site.`,
    );
  }
  for (let j = 1; j < rows.length; j++) {
    if (loads[j] > loads[j - 1]) {
      warnings.push(
        `The table's safe load rises from ${fmt(loads[j - 1])} N at ${fmt(lengths[j - 1])} mm to ${fmt(loads[j])} N at ${fmt(lengths[j])} mm; a longer member is normally weaker, so check the table was entered correctly.`,
      );
      break;
    }
  }
  if (req.k !== undefined || req.ends !== undefined) warnings.push("End conditions and k are not used: the supplier's table already assumes its own end conditions.");
  return {
    ok: true,
    value: {
      capacityN: swl,
      basis: "safe-working-load",
      loadBasis: "Working (unfactored) load compared with the supplier's safe working load.",
      steps,
      warnings,
    },
  };
}

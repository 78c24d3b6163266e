// The calculator's unit edges beyond the request itself: converting what is typed when the unit
// system changes, warning when a value is implausible for its field, and re-writing the engine's
// SI sentences (N, mm, MPa, kPa) in the units the person chose. The engine stays SI throughout.
import { fromKnPerM2, fromMm, fromMpa, fromN, MM_PER_IN, N_PER_LBF, parseLength, toKnPerM2, toMm, toMpa, toN } from "@/lib/units";
import type { CalculatorForm } from "@/lib/validations/calculator";

export type UnitSystem = "si" | "us";
type Quantity = "length" | "dim" | "area" | "inertia" | "force" | "stress" | "pressure" | "lineLoad";

/** Which quantity each typed field holds; fields not listed (K, factors, angles, counts) have no unit. */
export const FIELD_QUANTITY: Partial<Record<keyof CalculatorForm, Quantity>> = {
  length: "length",
  d: "dim", t: "dim", b: "dim", h: "dim",
  maxExtension: "dim", minExtension: "dim", plumbOffset: "dim", eccentricity: "dim",
  basePlateB: "dim", basePlateL: "dim", solePlateB: "dim", solePlateL: "dim", solePlateT: "dim", slabEffDepth: "dim",
  area: "area", iMin: "inertia",
  load: "force",
  e: "stress", fy: "stress", fc0k: "stress", e005: "stress", fcStar: "stress", eMin: "stress", fck: "stress",
  allowablePressure: "pressure", slabSelfWeight: "pressure", formworkLoad: "pressure", constructionLoad: "pressure",
  selfWeight: "lineLoad",
};

// lb/ft in N/m: 1 lbf per foot (NIST SP 811 B.8 gives 14.593 90 N/m).
const N_PER_M_PER_LB_FT = (N_PER_LBF * 1000) / (12 * MM_PER_IN);

/** SI value (mm, mm², mm⁴, N, MPa, kPa, N/m) of a number typed in `units`. */
export function toSi(q: Quantity, value: number, units: UnitSystem): number {
  if (units === "si") return q === "force" ? toN(value, "kN") : value;
  switch (q) {
    case "length":
    case "dim":
      return toMm(value, "in");
    case "area":
      return value * MM_PER_IN ** 2;
    case "inertia":
      return value * MM_PER_IN ** 4;
    case "force":
      return toN(value, "kip");
    case "stress":
      return toMpa(value, "ksi");
    case "pressure":
      return toKnPerM2(value, "psf");
    case "lineLoad":
      return value * N_PER_M_PER_LB_FT;
  }
}

/** The number to show for an SI value in `units` (the inverse of toSi). */
export function fromSi(q: Quantity, si: number, units: UnitSystem): number {
  if (units === "si") return q === "force" ? fromN(si, "kN") : si;
  switch (q) {
    case "length":
    case "dim":
      return fromMm(si, "in");
    case "area":
      return si / MM_PER_IN ** 2;
    case "inertia":
      return si / MM_PER_IN ** 4;
    case "force":
      return fromN(si, "kip");
    case "stress":
      return fromMpa(si, "ksi");
    case "pressure":
      return fromKnPerM2(si, "psf");
    case "lineLoad":
      return si / N_PER_M_PER_LB_FT;
  }
}

/** Five significant figures, no trailing zeros: 4000 mm → "157.48", and back → "4000". */
function typed(n: number): string {
  return String(Number(n.toPrecision(5)));
}

const PLAIN = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;
const plainNumber = (s: string): number | null => {
  const t = s.trim();
  return PLAIN.test(t) ? Number(t) : null;
};

function convertText(q: Quantity, text: string, from: UnitSystem, to: UnitSystem): string {
  if (text.trim() === "") return text;
  let si: number | null = null;
  if (q === "length") {
    // The length field also reads "3.5 m" or 9' 6"; whatever it reads becomes a plain number in the new unit.
    const r = parseLength(text, from === "us" ? "in" : "mm");
    si = r.ok ? r.value : null;
  } else {
    const n = plainNumber(text);
    si = n === null ? null : toSi(q, n, from);
  }
  // Text that cannot be read is kept exactly as typed: the person's input is never lost.
  return si === null || !Number.isFinite(si) ? text : typed(fromSi(q, si, to));
}

/** The form's typed values re-expressed in the other unit system (4000 mm → 157.48 in). */
export function convertFormUnits(values: CalculatorForm, from: UnitSystem, to: UnitSystem): CalculatorForm {
  if (from === to) return values;
  const out: CalculatorForm = { ...values, units: to };
  for (const [field, q] of Object.entries(FIELD_QUANTITY) as [keyof CalculatorForm, Quantity][]) {
    (out as Record<string, unknown>)[field] = convertText(q, String(values[field] ?? ""), from, to);
  }
  out.table = values.table
    .split(/\r?\n/)
    .map((line) => {
      const parts = line.split(/\s*[,;\t]\s*|\s+/).filter(Boolean);
      const [l, p] = parts.map(plainNumber);
      if (parts.length !== 2 || l == null || p == null) return line;
      return `${typed(fromSi("dim", toSi("dim", l, from), to))}, ${typed(fromSi("force", toSi("force", p, from), to))}`;
    })
    .join("\n");
  return out;
}

// --- plausibility -------------------------------------------------------------------------------

type Range = { min: number; max: number; what: string; reason: string };

/**
 * Usual ranges (SI) per field, common practice for a first look, not limits: a value outside is
 * warned about, never refused (the engine's own hard limits still refuse).
 */
export const PLAUSIBLE: Partial<Record<keyof CalculatorForm, Range>> = {
  length: { min: 100, max: 12_000, what: "length", reason: "props, struts and posts on site are usually 0.1 m to 12 m long (common practice)" },
  fy: { min: 200, max: 700, what: "steel yield strength", reason: "structural steels lie between about 200 MPa (S235 thick plate) and 700 MPa (high-strength grades) (common practice; EN 1993-1-1 Table 3.1, EN 1993-1-12)" },
  e: { min: 190_000, max: 215_000, what: "modulus of elasticity of steel", reason: "steel is 200–210 GPa (EN 1993-1-1 §3.2.6: 210 GPa; AISC 360-16: 200 GPa)" },
  fc0k: { min: 10, max: 60, what: "timber compression strength", reason: "EN 338 and EN 14080 classes give f_c,0,k of about 16–34 MPa (common practice range 10–60 MPa)" },
  e005: { min: 4_000, max: 20_000, what: "timber modulus E0,05", reason: "EN 338 and EN 14080 classes give E0,05 of about 4.7–17 GPa (common practice range 4–20 GPa)" },
  fcStar: { min: 2, max: 60, what: "timber compression design value", reason: "adjusted timber compression values lie between a few MPa and about 60 MPa (common practice; to be confirmed against the NDS Supplement tables)" },
  eMin: { min: 1_500, max: 10_000, what: "timber minimum modulus", reason: "NDS Emin values lie about 1.5–10 GPa (common practice; to be confirmed against the NDS Supplement tables)" },
};

/** Applies only where the field means what the range describes (E is steel's only under the steel methods). */
const STEEL_E_METHODS = ["en1993", "aisc360-lrfd", "aisc360-asd"];

const UNIT_WORDS: Record<UnitSystem, Record<Quantity, string>> = {
  si: { length: "mm", dim: "mm", area: "mm²", inertia: "mm⁴", force: "kN", stress: "MPa", pressure: "kPa", lineLoad: "N/m" },
  us: { length: "in", dim: "in", area: "in²", inertia: "in⁴", force: "kip", stress: "ksi", pressure: "psf", lineLoad: "lb/ft" },
};

const num = (n: number) => String(Number(n.toPrecision(4)));

/** Warnings, one per implausible field, in the chosen units: "A steel yield strength of 1 ksi…". */
export function plausibilityWarnings(values: CalculatorForm): Partial<Record<keyof CalculatorForm, string>> {
  const out: Partial<Record<keyof CalculatorForm, string>> = {};
  const units = values.units;
  for (const [field, range] of Object.entries(PLAUSIBLE) as [keyof CalculatorForm, Range][]) {
    if (field === "e" && !STEEL_E_METHODS.includes(values.method)) continue;
    const q = FIELD_QUANTITY[field]!;
    const text = String(values[field] ?? "");
    if (text.trim() === "") continue;
    let si: number | null;
    if (q === "length") {
      const r = parseLength(text, units === "us" ? "in" : "mm");
      si = r.ok ? r.value : null;
    } else {
      const n = plainNumber(text);
      si = n === null ? null : toSi(q, n, units);
    }
    if (si === null || !(si > 0) || (si >= range.min && si <= range.max)) continue;
    const u = UNIT_WORDS[units][q];
    out[field] =
      `A ${range.what} of ${num(fromSi(q, si, units))} ${u} is unusual: ${range.reason}, i.e. ` +
      `${num(fromSi(q, range.min, units))}–${num(fromSi(q, range.max, units))} ${u}. Check the value and its unit.`;
  }
  return out;
}

// --- engine sentences in the chosen units ----------------------------------------------------------

// Thousands may be grouped by a space or a comma ("50,000,000 N" from a schema's toLocaleString).
const NUM = String.raw`-?(?:\d{1,3}(?:[ \u00a0,]\d{3})+|\d+)(?:\.\d+)?(?:e[+-]?\d+)?`;
const SI_UNITS: [string, Quantity][] = [
  ["kPa (kN/m²)", "pressure"], ["kN/m²", "pressure"], ["kPa", "pressure"],
  ["mm⁴", "inertia"], ["mm²", "area"], ["mm", "dim"],
  ["MPa", "stress"], ["N/m", "lineLoad"], ["kN", "force"], ["N", "force"],
];
const esc = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
const MEASURE = new RegExp(`(?<![\\w.])(${NUM})(?:(\\s?[–-]\\s?)(${NUM}))?\\s(${SI_UNITS.map(([u]) => esc(u)).join("|")})(?![\\w/²⁴])`, "g");
const SI_FACTOR: Record<string, number> = { kN: 1000 };
/** A unit named on its own in brackets, "must be a number (N)". */
const BARE_UNIT = new RegExp(`\\((${SI_UNITS.map(([u]) => esc(u)).join("|")})\\)`, "g");

function words(n: number): string {
  if (n === 0) return "0";
  const a = Math.abs(n);
  if (a >= 1e9 || a < 1e-4) return n.toExponential(3).replace(/\.?0+e/, "e");
  return String(Number(n.toPrecision(4)));
}

/**
 * An engine sentence with every SI measure re-written in `units`: "at least 0 N (got -5000 N)"
 * becomes "at least 0 kN (got -5 kN)" on an SI form and "… kip" on a US one. Plain numbers
 * without a unit (factors, counts, clause numbers) are left alone. Every form that types kN (or
 * kip) over an API in N speaks its messages through this: the calculator, the member forms, the
 * library and the scheme form.
 */
export function speakUnits(message: string, units: UnitSystem): string {
  const unitOf = (unit: string) => SI_UNITS.find(([u]) => u === unit)![1];
  return message
    .replace(MEASURE, (whole, a: string, dash: string | undefined, b: string | undefined, unit: string) => {
      const q = unitOf(unit);
      const toUser = (t: string) => words(fromSi(q, Number(t.replace(/[ \u00a0,]/g, "")) * (SI_FACTOR[unit] ?? 1), units));
      const target = UNIT_WORDS[units][q];
      if (units === "si" && q !== "force") return whole; // already in the form's units
      return b !== undefined ? `${toUser(a)}${dash}${toUser(b)} ${target}` : `${toUser(a)} ${target}`;
    })
    .replace(BARE_UNIT, (whole, unit: string) => {
      const q = unitOf(unit);
      return units === "si" && q !== "force" ? whole : `(${UNIT_WORDS[units][q]})`;
    });
}

export type UnitSwitchMemory = { before: CalculatorForm; after: CalculatorForm };

/**
 * convertFormUnits for the Units switch, remembering the last switch so that going back restores
 * exactly what was typed (48.3 mm → 1.9016 in → 48.3 mm, not 48.301) for every field left unchanged.
 */
export function switchUnits(values: CalculatorForm, to: UnitSystem, memory: UnitSwitchMemory | null): { values: CalculatorForm; memory: UnitSwitchMemory } {
  const out = convertFormUnits(values, values.units, to);
  if (memory && memory.before.units === to && memory.after.units === values.units) {
    for (const f of [...Object.keys(FIELD_QUANTITY), "table"] as (keyof CalculatorForm)[]) {
      if (values[f] === memory.after[f]) (out as Record<string, unknown>)[f] = memory.before[f];
    }
  }
  return { values: out, memory: { before: values, after: out } };
}

const STEP_UNITS: Record<string, { q: Quantity; scale: number }> = {
  mm: { q: "dim", scale: 1 }, "mm²": { q: "area", scale: 1 }, "mm⁴": { q: "inertia", scale: 1 },
  N: { q: "force", scale: 1 }, kN: { q: "force", scale: 1000 },
  MPa: { q: "stress", scale: 1 }, "N/mm²": { q: "stress", scale: 1 },
  kPa: { q: "pressure", scale: 1 }, "kN/m²": { q: "pressure", scale: 1 }, "N/m": { q: "lineLoad", scale: 1 },
};

/** A working step's value for display in the chosen units (the engine's own step stays SI). */
export function stepInUnits(value: number | string, unit: string, units: UnitSystem): { value: number | string; unit: string } {
  const known = STEP_UNITS[unit];
  if (units === "si" || typeof value !== "number" || !known) return { value, unit };
  return { value: fromSi(known.q, value * known.scale, "us"), unit: UNIT_WORDS.us[known.q] };
}

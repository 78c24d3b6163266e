// Unit conversions and parse/format helpers for the edges of the product.
// The engine works in N, mm and MPa; everything typed by a user or shown to a
// user passes through here. Factors are built from the exact definitions
// (inch = 25.4 mm, pound-force = 0.45359237 kg × 9.80665 m/s²) so round trips
// lose nothing but floating-point rounding.

export const MM_PER_M = 1000;
export const MM_PER_CM = 10;
export const MM_PER_IN = 25.4;
export const MM_PER_FT = 12 * MM_PER_IN;
export const N_PER_KN = 1000;
export const N_PER_LBF = 0.45359237 * 9.80665;
export const N_PER_KIP = 1000 * N_PER_LBF;
/** 1 psi = 1 lbf/in² in N/mm². */
export const MPA_PER_PSI = N_PER_LBF / (MM_PER_IN * MM_PER_IN);
export const MPA_PER_KSI = 1000 * MPA_PER_PSI;
/** 1 psf = 1 lbf/ft² in kN/m². */
export const KN_PER_M2_PER_PSF = N_PER_LBF / N_PER_KN / ((MM_PER_FT / MM_PER_M) * (MM_PER_FT / MM_PER_M));

export type LengthUnit = "mm" | "cm" | "m" | "in" | "ft";
export type ForceUnit = "N" | "kN" | "lbf" | "kip";
export type StressUnit = "MPa" | "N/mm2" | "kPa" | "psi" | "ksi";
export type PressureUnit = "kN/m2" | "kPa" | "Pa" | "psf";

const LENGTH_TO_MM: Record<LengthUnit, number> = { mm: 1, cm: MM_PER_CM, m: MM_PER_M, in: MM_PER_IN, ft: MM_PER_FT };
const FORCE_TO_N: Record<ForceUnit, number> = { N: 1, kN: N_PER_KN, lbf: N_PER_LBF, kip: N_PER_KIP };
const STRESS_TO_MPA: Record<StressUnit, number> = { MPa: 1, "N/mm2": 1, kPa: 0.001, psi: MPA_PER_PSI, ksi: MPA_PER_KSI };
const PRESSURE_TO_KNM2: Record<PressureUnit, number> = { "kN/m2": 1, kPa: 1, Pa: 0.001, psf: KN_PER_M2_PER_PSF };

export const toMm = (value: number, unit: LengthUnit): number => value * LENGTH_TO_MM[unit];
export const fromMm = (mm: number, unit: LengthUnit): number => mm / LENGTH_TO_MM[unit];
export const toN = (value: number, unit: ForceUnit): number => value * FORCE_TO_N[unit];
export const fromN = (n: number, unit: ForceUnit): number => n / FORCE_TO_N[unit];
export const toMpa = (value: number, unit: StressUnit): number => value * STRESS_TO_MPA[unit];
export const fromMpa = (mpa: number, unit: StressUnit): number => mpa / STRESS_TO_MPA[unit];
export const toKnPerM2 = (value: number, unit: PressureUnit): number => value * PRESSURE_TO_KNM2[unit];
export const fromKnPerM2 = (knm2: number, unit: PressureUnit): number => knm2 / PRESSURE_TO_KNM2[unit];

export type ParseResult = { ok: true; value: number } | { ok: false; message: string };

const NUMBER = String.raw`[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?`;
const NUMBER_WITH_UNIT = new RegExp(`^(${NUMBER})\\s*(.*)$`);

/** Typographic primes and doubled apostrophes become ' and " so one grammar covers what phones and spreadsheets paste. */
function normalise(text: string): string {
  return text
    .trim()
    .replace(/[\u2019\u2032\u00b4`]/g, "'")
    .replace(/[\u201d\u201c\u2033]/g, '"')
    .replace(/''/g, '"')
    .replace(/\u00b2/g, "2")
    .replace(/\s+/g, " ");
}

function fail(message: string): ParseResult {
  return { ok: false, message };
}

function splitNumberAndUnit(raw: string, what: string): { value: number; unit: string } | { error: string } {
  if (raw === "") return { error: `Enter a ${what}.` };
  if (/\d,\d/.test(raw)) {
    return { error: `"${raw}" has a comma; use a point for decimals and no thousands separators (e.g. 3500 or 3.5).` };
  }
  const m = NUMBER_WITH_UNIT.exec(raw);
  if (!m) return { error: `"${raw}" is not a ${what} this form understands.` };
  const value = Number(m[1]);
  if (!Number.isFinite(value)) return { error: `"${raw}" is too large to be a ${what}.` };
  return { value, unit: m[2].trim() };
}

const LENGTH_ALIASES: Record<string, LengthUnit> = {
  mm: "mm", millimetre: "mm", millimetres: "mm", millimeter: "mm", millimeters: "mm",
  cm: "cm", centimetre: "cm", centimetres: "cm", centimeter: "cm", centimeters: "cm",
  m: "m", metre: "m", metres: "m", meter: "m", meters: "m",
  in: "in", inch: "in", inches: "in", '"': "in",
  ft: "ft", foot: "ft", feet: "ft", "'": "ft",
};

/** Feet-and-inches forms: 9' 6", 9'-6", 9 ft 6 in, 9' 6-1/2", 9' 6 1/2", 6 1/2", 9'. Returns inches, or null when the text is not of this form. */
function parseFeetInches(text: string): { inches: number } | { error: string } | null {
  let rest = text.toLowerCase();
  let sign = 1;
  if (rest.startsWith("-")) {
    sign = -1;
    rest = rest.slice(1).trim();
  }
  let feet = 0;
  let sawFeet = false;
  const feetMatch = /^(\d+(?:\.\d+)?)\s*(?:'|ft\b|feet\b|foot\b)/.exec(rest);
  if (feetMatch) {
    feet = Number(feetMatch[1]);
    sawFeet = true;
    rest = rest.slice(feetMatch[0].length).replace(/^[\s-]+/, "");
  }
  if (rest === "") return sawFeet ? { inches: sign * feet * 12 } : null;
  const inchMatch =
    /^(?:(\d+(?:\.\d+)?)(?:(?:\s+|\s*-\s*)(\d+)\s*\/\s*(\d+))?|(\d+)\s*\/\s*(\d+))\s*("|in\b|inch\b|inches\b)?$/.exec(rest);
  if (!inchMatch) return sawFeet ? { error: `"${text}" has feet but the inches part is not readable; write it like 9' 6" or 9' 6-1/2".` } : null;
  const hasInchMark = inchMatch[6] !== undefined;
  const hasFraction = inchMatch[2] !== undefined || inchMatch[4] !== undefined;
  // A bare number with no mark is not feet-and-inches; leave it to the plain parser.
  if (!sawFeet && !hasInchMark) return hasFraction ? { error: `"${text}" needs a unit, e.g. 6 1/2".` } : null;
  let inches = inchMatch[1] !== undefined ? Number(inchMatch[1]) : 0;
  const num = inchMatch[2] ?? inchMatch[4];
  const den = inchMatch[3] ?? inchMatch[5];
  if (num !== undefined && den !== undefined) {
    if (Number(den) === 0) return { error: `"${text}" has a fraction with zero below the line.` };
    inches += Number(num) / Number(den);
  }
  if (sawFeet && inches >= 12) return { error: `"${text}" has ${inches} inches; inches after feet should be under 12.` };
  return { inches: sign * (feet * 12 + inches) };
}

/** Reads a length such as "3500", "3.5 m", `9' 6"`, "114 in"; a bare number is taken in `defaultUnit`. Returns millimetres. */
export function parseLength(text: string, defaultUnit: LengthUnit = "mm"): ParseResult {
  if (typeof text !== "string") return fail("Enter a length as text, e.g. 3500 mm or 9' 6\".");
  const raw = normalise(text);
  const fi = parseFeetInches(raw);
  if (fi && "error" in fi) return fail(fi.error);
  if (fi) return { ok: true, value: fi.inches * MM_PER_IN };
  const parts = splitNumberAndUnit(raw, "length");
  if ("error" in parts) return fail(parts.error);
  const unitText = parts.unit.toLowerCase();
  const unit = unitText === "" ? defaultUnit : LENGTH_ALIASES[unitText];
  if (!unit) return fail(`"${parts.unit}" is not a length unit; use mm, m, cm, in, ft or feet-and-inches like 9' 6".`);
  return { ok: true, value: toMm(parts.value, unit) };
}

const FORCE_ALIASES: Record<string, ForceUnit> = {
  n: "N", newton: "N", newtons: "N",
  kn: "kN", kilonewton: "kN", kilonewtons: "kN",
  lbf: "lbf", lb: "lbf", lbs: "lbf", "lb-f": "lbf", pound: "lbf", pounds: "lbf",
  kip: "kip", kips: "kip", k: "kip",
};

/** Reads a force such as "25 kN", "5.6 kips", "1200 lbf"; returns newtons. */
export function parseForce(text: string, defaultUnit: ForceUnit = "N"): ParseResult {
  if (typeof text !== "string") return fail("Enter a force as text, e.g. 25 kN.");
  const parts = splitNumberAndUnit(normalise(text), "force");
  if ("error" in parts) return fail(parts.error);
  const unitText = parts.unit.toLowerCase();
  const unit = unitText === "" ? defaultUnit : FORCE_ALIASES[unitText];
  if (!unit) return fail(`"${parts.unit}" is not a force unit; use N, kN, lbf or kip.`);
  return { ok: true, value: toN(parts.value, unit) };
}

const STRESS_ALIASES: Record<string, StressUnit> = {
  mpa: "MPa", "n/mm2": "N/mm2", "n/mm^2": "N/mm2", "n/sq mm": "N/mm2",
  kpa: "kPa",
  psi: "psi", "lbf/in2": "psi", "lb/in2": "psi",
  ksi: "ksi", "kip/in2": "ksi",
};

/** Reads a stress or modulus such as "355 MPa", "50 ksi", "1600 psi"; returns MPa (N/mm²). */
export function parseStress(text: string, defaultUnit: StressUnit = "MPa"): ParseResult {
  if (typeof text !== "string") return fail("Enter a stress as text, e.g. 355 MPa.");
  const parts = splitNumberAndUnit(normalise(text), "stress");
  if ("error" in parts) return fail(parts.error);
  const unitText = parts.unit.toLowerCase().replace(/\s+/g, " ");
  const unit = unitText === "" ? defaultUnit : STRESS_ALIASES[unitText];
  if (!unit) return fail(`"${parts.unit}" is not a stress unit; use MPa, N/mm², psi or ksi.`);
  return { ok: true, value: toMpa(parts.value, unit) };
}

const PRESSURE_ALIASES: Record<string, PressureUnit> = {
  "kn/m2": "kN/m2", "kn/m^2": "kN/m2", "kn/sq m": "kN/m2",
  kpa: "kPa",
  pa: "Pa", "n/m2": "Pa",
  psf: "psf", "lb/ft2": "psf", "lbf/ft2": "psf",
};

/** Reads an area load such as "2.5 kN/m²", "2.5 kPa", "50 psf"; returns kN/m². */
export function parsePressure(text: string, defaultUnit: PressureUnit = "kN/m2"): ParseResult {
  if (typeof text !== "string") return fail("Enter an area load as text, e.g. 2.5 kN/m².");
  const parts = splitNumberAndUnit(normalise(text), "area load");
  if ("error" in parts) return fail(parts.error);
  const unitText = parts.unit.toLowerCase();
  const unit = unitText === "" ? defaultUnit : PRESSURE_ALIASES[unitText];
  if (!unit) return fail(`"${parts.unit}" is not an area-load unit; use kN/m², kPa or psf.`);
  return { ok: true, value: toKnPerM2(parts.value, unit) };
}

function fixed(value: number, decimals: number): string {
  const s = value.toFixed(decimals);
  // "-0" after rounding reads as a mistake on a permit.
  return /^-0(\.0*)?$/.test(s) ? s.slice(1) : s;
}

const UNIT_LABEL: Record<string, string> = { "kN/m2": "kN/m²", "N/mm2": "N/mm²" };

export function formatLength(mm: number, unit: LengthUnit = "mm", decimals = unit === "mm" ? 0 : 3): string {
  if (!Number.isFinite(mm)) return "—";
  if (unit === "ft") return formatFeetInches(mm);
  return `${fixed(fromMm(mm, unit), decimals)} ${unit}`;
}

/** Feet and inches to the nearest 1/denominator inch, e.g. 9' 6 1/2". */
export function formatFeetInches(mm: number, denominator = 16): string {
  if (!Number.isFinite(mm)) return "—";
  const sign = mm < 0 ? "-" : "";
  const totalUnits = Math.round((Math.abs(mm) / MM_PER_IN) * denominator);
  const feet = Math.floor(totalUnits / (12 * denominator));
  let remUnits = totalUnits - feet * 12 * denominator;
  const wholeInches = Math.floor(remUnits / denominator);
  remUnits -= wholeInches * denominator;
  let frac = "";
  if (remUnits > 0) {
    let n = remUnits;
    let d = denominator;
    while (n % 2 === 0 && d % 2 === 0) {
      n /= 2;
      d /= 2;
    }
    frac = ` ${n}/${d}`;
  }
  return `${sign}${feet}' ${wholeInches}${frac}"`;
}

export function formatForce(n: number, unit: ForceUnit = "kN", decimals = unit === "N" ? 0 : 2): string {
  if (!Number.isFinite(n)) return "—";
  return `${fixed(fromN(n, unit), decimals)} ${unit}`;
}

export function formatStress(mpa: number, unit: StressUnit = "MPa", decimals = unit === "psi" ? 0 : 1): string {
  if (!Number.isFinite(mpa)) return "—";
  return `${fixed(fromMpa(mpa, unit), decimals)} ${UNIT_LABEL[unit] ?? unit}`;
}

export function formatPressure(knm2: number, unit: PressureUnit = "kN/m2", decimals = unit === "psf" ? 1 : 2): string {
  if (!Number.isFinite(knm2)) return "—";
  return `${fixed(fromKnPerM2(knm2, unit), decimals)} ${UNIT_LABEL[unit] ?? unit}`;
}

// Type-level validation of a calculation request arriving as JSON. Every
// message names the field in words a site engineer uses and says what was
// received, so a form can show it next to the input. Cross-field rules
// (wall thicker than the radius, extension beyond the prop's range) are
// checked by each method, which knows what it needs.

import { z } from "zod";
import { END_CONDITION_IDS } from "./effective-length";
import { fmt } from "./steps";
import { SOIL_IDS } from "./soils";
import { ALL_METHOD_IDS, CHECK_METHOD_IDS, METHOD_IDS, type CalculationRequest, type FieldError, type Section, type TableRow } from "./types";

/** Words for what arrived, e.g. `the text "12"`, so the message says why it was refused. */
export function describeValue(v: unknown): string {
  if (v === undefined) return "nothing";
  if (v === null) return "an empty value (null)";
  if (typeof v === "string") return `the text "${v.length > 40 ? v.slice(0, 40) + "…" : v}"`;
  if (typeof v === "number") {
    if (Number.isNaN(v)) return "NaN (not a number)";
    if (!Number.isFinite(v)) return v > 0 ? "infinity" : "minus infinity";
    return fmt(v);
  }
  if (typeof v === "boolean") return `${v}`;
  if (Array.isArray(v)) return "a list";
  if (typeof v === "object") return "an object";
  return `a value of type ${typeof v}`;
}

interface NumberRule {
  label: string;
  unit?: string;
  /** Exclusive lower bound (default 0: the value must be positive). Set `min` instead for inclusive. */
  gt?: number;
  min?: number;
  max?: number;
  integer?: boolean;
  /** Extra hint appended to the range messages. */
  hint?: string;
}

function withUnit(n: unknown, unit?: string): string {
  const d = describeValue(n);
  return typeof n === "number" && Number.isFinite(n) && unit ? `${d} ${unit}` : d;
}

export function numberSchema(rule: NumberRule) {
  const unitWords = rule.unit ? ` in ${rule.unit}` : "";
  const hint = rule.hint ? ` ${rule.hint}` : "";
  let s = z.number({
    error: (iss) =>
      iss.input === undefined
        ? `${rule.label} is required.`
        : `${rule.label} must be a number${unitWords} (got ${describeValue(iss.input)}).`,
  });
  if (rule.min !== undefined) {
    const min = rule.min;
    s = s.min(min, { error: (iss) => `${rule.label} must be at least ${fmt(min)}${rule.unit ? " " + rule.unit : ""} (got ${withUnit(iss.input, rule.unit)}).${hint}` });
  } else {
    const gt = rule.gt ?? 0;
    s = s.gt(gt, {
      error: (iss) =>
        gt === 0
          ? `${rule.label} must be greater than zero (got ${withUnit(iss.input, rule.unit)}).${hint}`
          : `${rule.label} must be greater than ${fmt(gt)}${rule.unit ? " " + rule.unit : ""} (got ${withUnit(iss.input, rule.unit)}).${hint}`,
    });
  }
  if (rule.max !== undefined) {
    const max = rule.max;
    s = s.max(max, {
      error: (iss) =>
        `${rule.label} of ${withUnit(iss.input, rule.unit)} is outside the range this calculator accepts (up to ${fmt(max)}${rule.unit ? " " + rule.unit : ""}).${hint}`,
    });
  }
  if (rule.integer) {
    s = s.int({ error: (iss) => `${rule.label} must be a whole number (got ${describeValue(iss.input)}).` });
  }
  return s;
}

function enumSchema<const T extends readonly [string, ...string[]]>(values: T, label: string) {
  return z.enum(values, {
    error: (iss) =>
      iss.input === undefined
        ? `${label} is required.`
        : `${label} must be one of ${values.join(", ")} (got ${describeValue(iss.input)}).`,
  });
}

function textSchema(label: string) {
  return z
    .string({ error: (iss) => `${label} must be text (got ${describeValue(iss.input)}).` })
    .min(1, { error: `${label} must not be empty.` })
    .max(60, { error: `${label} is too long to be a class or grade name.` });
}

const LENGTH_MAX_MM = 100_000;
const DIM_MAX_MM = 5_000;

export const N = {
  lengthMm: numberSchema({ label: "Length", unit: "mm", max: LENGTH_MAX_MM }),
  k: numberSchema({
    label: "Effective length factor k",
    min: 0.5,
    max: 10,
    hint: "K below 0.5 would mean better than fully fixed ends; for intermediate restraints enter the length between restraints instead.",
  }),
  eMpa: numberSchema({ label: "Modulus of elasticity E", unit: "MPa", max: 1_000_000 }),
  fyMpa: numberSchema({ label: "Yield strength fy", unit: "MPa", max: 2_000 }),
  gammaM1: numberSchema({ label: "Partial factor γM1", min: 1, max: 2, hint: "A partial factor below 1 would increase the resistance." }),
  fc0kMpa: numberSchema({ label: "Characteristic compressive strength fc,0,k", unit: "MPa", max: 200 }),
  e005Mpa: numberSchema({ label: "5th-percentile modulus E0,05", unit: "MPa", max: 100_000 }),
  kmod: numberSchema({ label: "Modification factor kmod", max: 1.1, hint: "EN 1995-1-1 Table 3.1 values lie between 0.2 and 1.1." }),
  gammaM: numberSchema({ label: "Partial factor γM", min: 1, max: 3, hint: "A partial factor below 1 would increase the resistance." }),
  gammaF: numberSchema({ label: "Load factor γF", min: 1, max: 3, hint: "A load factor below 1 would increase the safe working load." }),
  betaC: numberSchema({ label: "Straightness factor βc", max: 0.5, hint: "EN 1995-1-1 Eq. 6.29 uses 0.2 for solid timber and 0.1 for glulam and LVL." }),
  fcStarMpa: numberSchema({ label: "Adjusted compression design value Fc*", unit: "MPa", max: 200 }),
  eMinMpa: numberSchema({ label: "Adjusted minimum modulus Emin'", unit: "MPa", max: 100_000 }),
  c: numberSchema({ label: "NDS column parameter c", min: 0.5, max: 1, hint: "NDS 2018 §3.7.1 uses 0.8 sawn lumber, 0.85 round poles, 0.9 glulam and SCL." }),
  maxExtensionMm: numberSchema({ label: "Maximum extension of the prop", unit: "mm", max: 10_000 }),
  minExtensionMm: numberSchema({ label: "Minimum (closed) extension of the prop", unit: "mm", max: 10_000 }),
  braces: numberSchema({ label: "Number of intermediate braces", min: 1, max: 50, integer: true }),
  loadN: numberSchema({ label: "Load", unit: "N", min: 0, max: 1e9, hint: "Enter the compressive load as a positive number." }),
  outOfPlumbDeg: numberSchema({ label: "Out of plumb angle", unit: "degrees", min: 0, max: 45, hint: "Give the measured lean from vertical, e.g. 3 for a prop found 3° out." }),
  outOfPlumbMm: numberSchema({ label: "Out of plumb offset (top relative to bottom)", unit: "mm", min: 0, max: 10_000 }),
  eccentricityMm: numberSchema({ label: "Load eccentricity", unit: "mm", min: 0, max: 5_000 }),
  plateMm: (label: string) => numberSchema({ label, unit: "mm", max: 10_000 }),
  allowablePressureKPa: numberSchema({ label: "Allowable bearing pressure", unit: "kPa (kN/m²)", max: 100_000 }),
  frictionCoefficient: numberSchema({ label: "Friction coefficient μ at the base", max: 1, hint: "Give the coefficient between the base and what it stands on, e.g. from the designer's brief." }),
  slabDepthMm: numberSchema({ label: "Slab depth", unit: "mm", max: 3_000 }),
  slabEffectiveDepthMm: numberSchema({ label: "Slab effective depth d", unit: "mm", max: 3_000 }),
  fckMpa: numberSchema({ label: "Concrete strength f_ck (or f'c)", unit: "MPa", min: 8, max: 100, hint: "EN 1992-1-1 Table 3.1 covers C12/15 to C90/105." }),
  rhoL: numberSchema({ label: "Tension reinforcement ratio ρl", min: 0, max: 0.02, hint: "EN 1992-1-1 §6.4.4 caps ρl at 0.02." }),
  shoredLevels: numberSchema({ label: "Number of shored levels", min: 1, max: 6, integer: true, hint: "The simplified method is set up here for 1 to 6 levels of props." }),
  slabSelfWeightKPa: numberSchema({ label: "Slab self-weight", unit: "kPa (kN/m²)", max: 100 }),
  formworkKPa: numberSchema({ label: "Formwork self-weight", unit: "kPa (kN/m²)", min: 0, max: 50 }),
  constructionKPa: numberSchema({ label: "Construction operations load", unit: "kPa (kN/m²)", min: 0, max: 50 }),
  cycles: numberSchema({ label: "Number of casting cycles", min: 1, max: 40, integer: true }),
  angleDeg: numberSchema({ label: "Raker angle from horizontal", unit: "degrees", gt: 0, max: 89.9 }),
  selfWeightNPerM: numberSchema({ label: "Self-weight of the member", unit: "N/m", min: 0, max: 100_000 }),
  cornerRadiusMm: numberSchema({ label: "Outside corner radius", unit: "mm", min: 0, max: 1_000 }),
  tableLengthMm: numberSchema({ label: "length", unit: "mm", max: LENGTH_MAX_MM }),
  tableSafeLoadN: numberSchema({ label: "safe load", unit: "N", max: 1e9 }),
};

const dim = (label: string) => numberSchema({ label, unit: "mm", max: DIM_MAX_MM });

const SECTION_SHAPES = ["chs", "rhs", "rect", "round", "given"] as const;
const SECTION_SCHEMAS = {
  chs: z.object({ shape: z.literal("chs"), dMm: dim("Outside diameter D"), tMm: dim("Wall thickness t") }),
  rhs: z.object({ shape: z.literal("rhs"), bMm: dim("Width b"), hMm: dim("Depth h"), tMm: dim("Wall thickness t"), cornerRadiusMm: N.cornerRadiusMm.optional() }),
  rect: z.object({ shape: z.literal("rect"), bMm: dim("Width b"), hMm: dim("Depth h") }),
  round: z.object({ shape: z.literal("round"), dMm: dim("Diameter D") }),
  given: z.object({
    shape: z.literal("given"),
    areaMm2: numberSchema({ label: "Cross-section area A", unit: "mm²", max: 1e7 }),
    iMinMm4: numberSchema({ label: "Least second moment of area I_min", unit: "mm⁴", max: 1e13 }),
  }),
} as const;

const bool = (label: string) => z.boolean({ error: (iss) => `${label} must be true or false (got ${describeValue(iss.input)}).` });

/** Methods that do not read a member length. */
export const LENGTHLESS_METHODS: readonly string[] = ["base-bearing", "backprop-sequence"];

const FLAT_SCHEMA = z.object({
  lengthMm: N.lengthMm.optional(),
  k: N.k.optional(),
  ends: enumSchema(END_CONDITION_IDS as unknown as readonly [string, ...string[]], "End conditions").optional(),
  eMpa: N.eMpa.optional(),
  fyMpa: N.fyMpa.optional(),
  steelGrade: textSchema("Steel grade").optional(),
  formed: enumSchema(["hot-finished", "cold-formed"], "How the section was made").optional(),
  curve: enumSchema(["a0", "a", "b", "c", "d"], "Buckling curve").optional(),
  gammaM1: N.gammaM1.optional(),
  fc0kMpa: N.fc0kMpa.optional(),
  e005Mpa: N.e005Mpa.optional(),
  kmod: N.kmod.optional(),
  serviceClass: z
    .union([z.literal(1), z.literal(2), z.literal(3)], {
      error: (iss) => `Service class must be 1, 2 or 3 (EN 1995-1-1 §2.3.1.3) (got ${describeValue(iss.input)}).`,
    })
    .optional(),
  loadDuration: enumSchema(["permanent", "long-term", "medium-term", "short-term", "instantaneous"], "Load duration class").optional(),
  gammaM: N.gammaM.optional(),
  betaC: N.betaC.optional(),
  strengthClass: textSchema("Strength class").optional(),
  timberType: enumSchema(["solid", "round", "glulam", "lvl"], "Timber type").optional(),
  fcStarMpa: N.fcStarMpa.optional(),
  eMinMpa: N.eMinMpa.optional(),
  c: N.c.optional(),
  propClass: enumSchema(["A", "B", "C", "D", "E"], "Prop class").optional(),
  maxExtensionMm: N.maxExtensionMm.optional(),
  minExtensionMm: N.minExtensionMm.optional(),
  gammaF: N.gammaF.optional(),
  braces: N.braces.optional(),
  designBasis: enumSchema(["lrfd", "asd"], "Design basis").optional(),
  loadN: N.loadN.optional(),
  fyFrom: enumSchema(["product-standard", "en1993-table-3.1"], "Source of the yield strength").optional(),
  hssWeld: enumSchema(["erw", "saw"], "Tube welding").optional(),
  duringConstruction: bool("During construction").optional(),
  supplierInterpolation: enumSchema(["inverse-square", "lower-row"], "Supplier table interpolation").optional(),
  outOfPlumbDeg: N.outOfPlumbDeg.optional(),
  outOfPlumbMm: N.outOfPlumbMm.optional(),
  eccentricityMm: N.eccentricityMm.optional(),
  plumbCode: enumSchema(["en1993", "aisc360"], "Design code for the out-of-plumb check").optional(),
  basePlateBMm: N.plateMm("Base plate width").optional(),
  basePlateLMm: N.plateMm("Base plate length").optional(),
  solePlateBMm: N.plateMm("Sole plate width").optional(),
  solePlateLMm: N.plateMm("Sole plate length").optional(),
  solePlateTMm: N.plateMm("Sole plate thickness").optional(),
  allowablePressureKPa: N.allowablePressureKPa.optional(),
  frictionCoefficient: N.frictionCoefficient.optional(),
  soil: enumSchema(SOIL_IDS, "Ground type").optional(),
  slabDepthMm: N.slabDepthMm.optional(),
  slabEffectiveDepthMm: N.slabEffectiveDepthMm.optional(),
  fckMpa: N.fckMpa.optional(),
  rhoL: N.rhoL.optional(),
  punchingCode: enumSchema(["en1992", "aci318"], "Punching code").optional(),
  shoredLevels: N.shoredLevels.optional(),
  slabSelfWeightKPa: N.slabSelfWeightKPa.optional(),
  formworkKPa: N.formworkKPa.optional(),
  constructionKPa: N.constructionKPa.optional(),
  cycles: N.cycles.optional(),
  angleDeg: N.angleDeg.optional(),
  selfWeightNPerM: N.selfWeightNPerM.optional(),
});

export function issuesToErrors(issues: readonly { path: readonly PropertyKey[]; message: string }[], prefix = ""): FieldError[] {
  return issues.map((i) => {
    const inner = i.path.map((p) => String(p)).join(".");
    const field = prefix && inner ? `${prefix}.${inner}` : prefix || inner;
    return { field, message: i.message };
  });
}

export function isPlainObject(v: unknown): v is Record<string, unknown> {
  return typeof v === "object" && v !== null && !Array.isArray(v);
}

/** Reads an own property only, so inherited names such as "constructor" are never taken for input. */
export function own(obj: Record<string, unknown>, key: string): unknown {
  return Object.prototype.hasOwnProperty.call(obj, key) ? obj[key] : undefined;
}

export function parseSection(raw: unknown, path = "section"): { ok: true; value: Section } | { ok: false; errors: FieldError[] } {
  if (!isPlainObject(raw)) {
    return {
      ok: false,
      errors: [{ field: path, message: `The section must be an object with a shape (chs, rhs, rect, round or given) and its dimensions (got ${describeValue(raw)}).` }],
    };
  }
  const shape = own(raw, "shape");
  if (typeof shape !== "string" || !(SECTION_SHAPES as readonly string[]).includes(shape)) {
    return {
      ok: false,
      errors: [
        {
          field: `${path}.shape`,
          message:
            shape === undefined
              ? "Choose a section shape: chs (circular tube), rhs (rectangular tube), rect (solid rectangle), round (solid round) or given (area and I)."
              : `Section shape must be chs, rhs, rect, round or given (got ${describeValue(shape)}).`,
        },
      ],
    };
  }
  const schema = SECTION_SCHEMAS[shape as (typeof SECTION_SHAPES)[number]];
  const copy: Record<string, unknown> = {};
  for (const key of Object.keys(schema.shape)) {
    const v = own(raw, key);
    if (v !== undefined) copy[key] = v;
  }
  const res = schema.safeParse(copy);
  if (!res.success) return { ok: false, errors: issuesToErrors(res.error.issues, path) };
  return { ok: true, value: res.data as Section };
}

export function parseTable(raw: unknown, path = "table"): { ok: true; value: TableRow[] } | { ok: false; errors: FieldError[] } {
  if (!Array.isArray(raw)) {
    return {
      ok: false,
      errors: [{ field: path, message: `The supplier table must be a list of rows, each with a length and a safe load (got ${describeValue(raw)}).` }],
    };
  }
  if (raw.length > 500) {
    return { ok: false, errors: [{ field: path, message: `The supplier table has ${raw.length} rows; up to 500 are accepted.` }] };
  }
  const errors: FieldError[] = [];
  const rows: TableRow[] = [];
  raw.forEach((row, i) => {
    const rowPath = `${path}.${i}`;
    if (!isPlainObject(row)) {
      errors.push({ field: rowPath, message: `Row ${i + 1} of the supplier table must have a length and a safe load (got ${describeValue(row)}).` });
      return;
    }
    const l = N.tableLengthMm.safeParse(own(row, "lengthMm"));
    const p = N.tableSafeLoadN.safeParse(own(row, "safeLoadN"));
    if (!l.success) errors.push({ field: `${rowPath}.lengthMm`, message: `Row ${i + 1}: ${l.error.issues[0].message}` });
    if (!p.success) errors.push({ field: `${rowPath}.safeLoadN`, message: `Row ${i + 1}: ${p.error.issues[0].message}` });
    if (l.success && p.success) rows.push({ lengthMm: l.data, safeLoadN: p.data });
  });
  if (errors.length) return { ok: false, errors };
  return { ok: true, value: rows };
}

export type ParsedRequest = { ok: true; value: CalculationRequest } | { ok: false; errors: FieldError[] };

/** Type validation of the whole request. Section and table are parsed only when present; each method decides whether it needs them. */
export function parseRequest(raw: unknown): ParsedRequest {
  if (!isPlainObject(raw)) {
    return {
      ok: false,
      errors: [{ field: "", message: `The calculation request must be an object with a method and a length (got ${describeValue(raw)}).` }],
    };
  }
  const method = own(raw, "method");
  if (method === undefined) {
    return { ok: false, errors: [{ field: "method", message: `Choose a calculation method: ${ALL_METHOD_IDS.join(", ")}.` }] };
  }
  const otherChecks = { field: "", message: `Besides member capacity, these checks are methods too: ${CHECK_METHOD_IDS.join(", ")}.` };
  if (typeof method !== "string" || !(ALL_METHOD_IDS as readonly string[]).includes(method)) {
    return {
      ok: false,
      errors: [{ field: "method", message: `Unknown calculation method (got ${describeValue(method)}); choose one of ${METHOD_IDS.join(", ")}.` }, otherChecks],
    };
  }
  // Copy only known keys, read as own properties, so a "__proto__" key in the JSON can never inject fields.
  const flatInput: Record<string, unknown> = {};
  for (const key of Object.keys(FLAT_SCHEMA.shape)) {
    const v = own(raw, key);
    if (v !== undefined) flatInput[key] = v;
  }
  const errors: FieldError[] = [];
  const flat = FLAT_SCHEMA.safeParse(flatInput);
  if (!flat.success) errors.push(...issuesToErrors(flat.error.issues));
  if (flatInput.lengthMm === undefined && !LENGTHLESS_METHODS.includes(method)) {
    errors.unshift({ field: "lengthMm", message: "Length is required." });
  }
  let section: Section | undefined;
  const rawSection = own(raw, "section");
  if (rawSection !== undefined) {
    const s = parseSection(rawSection);
    if (s.ok) section = s.value;
    else errors.push(...s.errors);
  }
  let table: TableRow[] | undefined;
  const rawTable = own(raw, "table");
  if (rawTable !== undefined) {
    const t = parseTable(rawTable);
    if (t.ok) table = t.value;
    else errors.push(...t.errors);
  }
  if (errors.length || !flat.success) return { ok: false, errors };
  const value = { ...flat.data, method, section, table } as CalculationRequest;
  return { ok: true, value };
}

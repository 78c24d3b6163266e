// One schema for the organisation's member library (every kind of type), used by the library
// form and parsed again by the server. SI values: mm, N, MPa.
import { z } from "zod";
import { memberTypeKind } from "@/db/schema";
import { STEEL_GRADES, TIMBER_CLASSES } from "@/lib/engineering/materials";

export const MEMBER_TYPE_KINDS = memberTypeKind.enumValues;
export type MemberTypeKind = (typeof MEMBER_TYPE_KINDS)[number];

export const MEMBER_TYPE_KIND_LABELS: Record<MemberTypeKind, string> = {
  "en1065-prop": "Adjustable prop (EN 1065 class)",
  "supplier-table": "Prop or strut with a supplier's load table",
  "steel-section": "Steel section",
  "timber-section": "Timber section",
  "trench-strut": "Trench strut with a supplier's table",
};

export const PROP_CLASSES = ["A", "B", "C", "D", "E"] as const;
export const STEEL_GRADE_IDS = STEEL_GRADES.map((g) => g.id) as [string, ...string[]];
export const TIMBER_CLASS_IDS = TIMBER_CLASSES.map((c) => c.id) as [string, ...string[]];
export const FORMED = ["hot-finished", "cold-formed"] as const;
export const TIMBER_TYPES = ["solid", "round", "glulam", "lvl"] as const;
export const MAX_TABLE_ROWS = 60;

const num = (label: string, unit: string, max: number) =>
  z
    .number({ error: (i) => (i.input === undefined || i.input === null || Number.isNaN(i.input) ? `Enter the ${label}.` : `The ${label} must be a number (${unit}).`) })
    .refine(Number.isFinite, `The ${label} must be a finite number.`)
    .refine((v) => v > 0, `The ${label} must be more than 0 ${unit}.`)
    .refine((v) => v <= max, `The ${label} must be at most ${max.toLocaleString("en-GB")} ${unit}; check the unit.`);

const common = {
  name: z
    .string({ error: () => "Give the type a name." })
    .trim()
    .min(2, "Give the type a name people will recognise (at least 2 characters).")
    .max(120, "A type name has at most 120 characters."),
  supplier: z.string().trim().max(120, "The supplier has at most 120 characters.").nullable().optional(),
  notes: z.string().trim().max(2000, "Notes have at most 2000 characters.").nullable().optional(),
};

export const tableRowSchema = z.object({
  lengthMm: num("length", "mm", 30_000),
  safeLoadN: num("safe working load", "N", 50_000_000),
});

export const loadTableSchema = z
  .array(tableRowSchema, { error: () => "Enter the supplier's table as rows of length and safe load." })
  .min(2, "A load table needs at least two rows (length and safe load) to read between.")
  .max(MAX_TABLE_ROWS, `A load table has at most ${MAX_TABLE_ROWS} rows.`)
  .superRefine((rows, ctx) => {
    for (let i = 1; i < rows.length; i++) {
      if (rows[i]!.lengthMm <= rows[i - 1]!.lengthMm) {
        ctx.addIssue({
          code: "custom",
          path: [i, "lengthMm"],
          message: `Row ${i + 1}: lengths must increase down the table (${rows[i]!.lengthMm} mm follows ${rows[i - 1]!.lengthMm} mm).`,
        });
      }
    }
  });

const steelSection = z.discriminatedUnion(
  "shape",
  [
    z.object({ shape: z.literal("chs"), dMm: num("outside diameter", "mm", 3000), tMm: num("wall thickness", "mm", 200) }),
    z.object({ shape: z.literal("rhs"), bMm: num("width", "mm", 3000), hMm: num("depth", "mm", 3000), tMm: num("wall thickness", "mm", 200) }),
    z.object({ shape: z.literal("rect"), bMm: num("width", "mm", 3000), hMm: num("depth", "mm", 3000) }),
    z.object({ shape: z.literal("round"), dMm: num("diameter", "mm", 3000) }),
    z.object({ shape: z.literal("given"), areaMm2: num("area", "mm²", 1e7), iMinMm4: num("least second moment of area", "mm⁴", 1e13) }),
  ],
  { error: () => "Choose the section shape: CHS, RHS/SHS, solid rectangle, solid round or given properties." },
);

const timberSection = z.discriminatedUnion(
  "shape",
  [
    z.object({ shape: z.literal("rect"), bMm: num("width", "mm", 2000), hMm: num("depth", "mm", 2000) }),
    z.object({ shape: z.literal("round"), dMm: num("diameter", "mm", 2000) }),
  ],
  { error: () => "Choose the timber section: rectangular or round." },
);

const range = {
  minExtensionMm: num("minimum extension", "mm", 30_000),
  maxExtensionMm: num("maximum extension", "mm", 30_000),
};

export const memberTypeSchema = z
  .discriminatedUnion(
    "kind",
    [
      z.object({ ...common, kind: z.literal("en1065-prop"), params: z.object({ propClass: z.enum(PROP_CLASSES, { error: () => "Choose the EN 1065 class (A to E)." }) }), ...range }),
      z.object({ ...common, kind: z.literal("supplier-table"), params: z.object({ table: loadTableSchema }) }),
      z.object({ ...common, kind: z.literal("trench-strut"), params: z.object({ table: loadTableSchema }) }),
      z.object({
        ...common,
        kind: z.literal("steel-section"),
        params: z.object({
          section: steelSection,
          grade: z.enum(STEEL_GRADE_IDS, { error: () => `Choose a steel grade: ${STEEL_GRADE_IDS.join(", ")}.` }),
          formed: z.enum(FORMED, { error: () => "Say whether the section is hot-finished or cold-formed (it decides the buckling curve)." }),
        }),
      }),
      z.object({
        ...common,
        kind: z.literal("timber-section"),
        params: z.object({
          section: timberSection,
          strengthClass: z.enum(TIMBER_CLASS_IDS, { error: () => `Choose a strength class: ${TIMBER_CLASS_IDS.join(", ")}.` }),
          timberType: z.enum(TIMBER_TYPES).optional(),
        }),
      }),
    ],
    { error: () => `Choose what kind of member this is: ${MEMBER_TYPE_KINDS.join(", ")}.` },
  )
  .superRefine((v, ctx) => {
    if (v.kind === "en1065-prop" && v.minExtensionMm >= v.maxExtensionMm) {
      ctx.addIssue({ code: "custom", path: ["minExtensionMm"], message: "The minimum extension must be less than the maximum extension." });
    }
  });

export type MemberTypeInput = z.input<typeof memberTypeSchema>;
export type MemberTypeParsed = z.output<typeof memberTypeSchema>;

/** Reads a pasted supplier table: one row per line, "length, load" (mm and kN; a header line is skipped). */
export function parseTableCsv(text: string): { rows: { lengthMm: number; safeLoadN: number }[]; errors: string[] } {
  const rows: { lengthMm: number; safeLoadN: number }[] = [];
  const errors: string[] = [];
  const lines = text.split(/\r?\n/);
  lines.forEach((raw, i) => {
    const line = raw.trim();
    if (!line) return;
    const cells = line.split(/[,;\t]/).map((c) => c.trim());
    if (cells.length < 2) {
      errors.push(`Line ${i + 1}: expected two values, length (mm) and safe load (kN), separated by a comma, semicolon or tab.`);
      return;
    }
    const [a, b] = cells;
    const length = Number(a);
    const load = Number(b);
    if (!Number.isFinite(length) || !Number.isFinite(load)) {
      // A header line (words) at the top is fine; anywhere else it is a mistake.
      if (rows.length === 0 && errors.length === 0 && /[a-z]/i.test(line)) return;
      errors.push(`Line ${i + 1}: "${line}" is not two numbers (length in mm, safe load in kN).`);
      return;
    }
    if (length <= 0 || load <= 0) {
      errors.push(`Line ${i + 1}: length and safe load must both be more than 0.`);
      return;
    }
    rows.push({ lengthMm: length, safeLoadN: load * 1000 });
  });
  return { rows, errors };
}

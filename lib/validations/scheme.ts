// One schema for a scheme (a temporary works design), used by the form and parsed again by the
// server. SI values: N, mm, kN/m³, kN/m².
import { z } from "zod";

const optionalNumber = (label: string, unit: string, max: number, min = 0, allowZero = false) =>
  z
    .number({ error: () => `The ${label} must be a number (${unit}).` })
    .refine(Number.isFinite, `The ${label} must be a finite number.`)
    .refine((v) => (allowZero ? v >= min : v > min), allowZero ? `The ${label} cannot be negative.` : `The ${label} must be more than ${min} ${unit}.`)
    .refine((v) => v <= max, `The ${label} must be at most ${max.toLocaleString("en-GB")} ${unit}; check the unit.`)
    .nullable()
    .optional();

const date = (label: string) =>
  z
    .union([z.string(), z.date(), z.null()])
    .optional()
    .transform((v, ctx) => {
      if (v == null || v === "") return null;
      const d = v instanceof Date ? v : new Date(v);
      if (!Number.isFinite(d.getTime())) {
        ctx.addIssue({ code: "custom", message: `${label} must be a date, e.g. 2025-06-30.` });
        return z.NEVER;
      }
      return d;
    });

const kPa = (label: string) =>
  z
    .number({ error: () => `The ${label} must be a number (kN/m²).` })
    .refine(Number.isFinite, `The ${label} must be a finite number.`)
    .refine((v) => v >= 0, `The ${label} cannot be negative.`)
    .refine((v) => v <= 50, `The ${label} must be at most 50 kN/m²; check the unit.`)
    .optional();

/**
 * Back-propping through the casting cycle (Grundy & Kabaila 1963): how many levels of props are in
 * use at once, and the formwork and construction loads at casting (kN/m²). The slab's self-weight
 * is the scheme's own slab (thickness × density).
 */
export const schemeBackpropSchema = z
  .object(
    {
      shoredLevels: z
        .number({ error: () => "Give the number of levels of props in use at once (1 to 6)." })
        .int("The number of levels of props is a whole number from 1 to 6.")
        .min(1, "The number of levels of props is from 1 to 6.")
        .max(6, "The number of levels of props is from 1 to 6 (the simplified method is set up here for 1 to 6)."),
      formworkKPa: kPa("formwork self-weight at casting"),
      constructionKPa: kPa("construction load while casting"),
      cycles: z
        .number({ error: () => "The number of casting cycles must be a whole number." })
        .int("The number of casting cycles must be a whole number.")
        .min(2, "Follow at least 2 casting cycles.")
        .max(40, "Follow at most 40 casting cycles.")
        .optional(),
    },
    { error: () => "Back-propping must give the number of levels of props in use at once (1 to 6), and may give the formwork and construction loads (kN/m²)." },
  )
  .strict()
  .superRefine((v, ctx) => {
    if (v.cycles !== undefined && v.cycles < v.shoredLevels + 1)
      ctx.addIssue({ code: "custom", path: ["cycles"], message: `With ${v.shoredLevels} levels of props follow at least ${v.shoredLevels + 1} casting cycles.` });
  });

export const SCHEME_CATEGORIES = [
  { value: 0, label: "Category 0 — standard solution, site issues only" },
  { value: 1, label: "Category 1 — simple design, checked within the design team" },
  { value: 2, label: "Category 2 — checked by someone not involved in the design" },
  { value: 3, label: "Category 3 — complex: checked by another organisation" },
] as const;

export const schemeSchema = z
  .object({
    reference: z
      .string({ error: () => "Give the scheme's reference, e.g. TW-014." })
      .trim()
      .min(1, "Give the scheme's reference, e.g. TW-014.")
      .max(40, "A reference has at most 40 characters."),
    title: z.string({ error: () => "Give the scheme a title." }).trim().min(1, "Give the scheme a title.").max(160, "A title has at most 160 characters."),
    designerName: z.string({ error: () => "Name the designer." }).trim().min(1, "Name the temporary works designer.").max(120, "The designer's name has at most 120 characters."),
    category: z
      .number({ error: () => "Choose the design check category (0 to 3)." })
      .int("The design check category is a whole number from 0 to 3.")
      .min(0, "The design check category is from 0 to 3.")
      .max(3, "The design check category is from 0 to 3 (BS 5975)."),
    designLoadN: optionalNumber("design load per member", "N", 50_000_000),
    designSpacingXMm: optionalNumber("design spacing X", "mm", 20_000),
    designSpacingYMm: optionalNumber("design spacing Y", "mm", 20_000),
    slabThicknessMm: optionalNumber("slab thickness", "mm", 5_000),
    concreteDensityKnM3: optionalNumber("concrete density", "kN/m³", 60),
    formworkKnM2: optionalNumber("formwork self-weight", "kN/m²", 50, 0, true),
    constructionKnM2: optionalNumber("construction operations load", "kN/m²", 50, 0, true),
    backprop: schemeBackpropSchema.nullable().optional(),
    validFrom: date("Valid from"),
    validUntil: date("Valid until"),
  })
  .superRefine((v, ctx) => {
    if (v.validFrom && v.validUntil && v.validUntil <= v.validFrom) {
      ctx.addIssue({ code: "custom", path: ["validUntil"], message: "Valid until must be after valid from." });
    }
  });

export type SchemeInput = z.input<typeof schemeSchema>;
export type SchemeParsed = z.output<typeof schemeSchema>;

export const SCHEME_FILE_KINDS = ["drawing", "certificate"] as const;
export const MAX_SCHEME_FILE_BYTES = 25 * 1024 * 1024;

export const schemeFilePresignSchema = z.object({
  kind: z.enum(SCHEME_FILE_KINDS, { error: () => "Say which file this is: drawing or certificate." }),
  contentType: z
    .string({ error: () => "Give the file's content type." })
    .regex(/^(application\/pdf|image\/[a-z0-9.+-]+)$/i, "Drawings and certificates must be a PDF or an image."),
  size: z
    .number({ error: () => "Give the file's size in bytes." })
    .int("The size must be a whole number of bytes.")
    .positive("The file is empty (0 bytes).")
    .max(MAX_SCHEME_FILE_BYTES, "The file is larger than 25 MB; export the drawing at a lower resolution."),
});

const calendarDate = (label: string) =>
  z
    .string({ error: () => `${label} must be a date, e.g. 2025-06-30.` })
    .regex(/^\d{4}-\d{2}-\d{2}$/, `${label} must be a date, e.g. 2025-06-30.`)
    .refine((v) => Number.isFinite(Date.parse(`${v}T00:00:00Z`)) && new Date(`${v}T00:00:00Z`).toISOString().startsWith(v), `${label} is not a real date.`);

/**
 * After the PUT: which file it was, and what the document says. A certificate needs its checker,
 * check category and date (checked on the server together with the file's contents, so every
 * problem is reported at once); a drawing may give its number, revision and date.
 */
export const schemeFileCompleteSchema = z.object({
  kind: z.enum(SCHEME_FILE_KINDS, { error: () => "Say which file this is: drawing or certificate." }),
  key: z.string({ error: () => "Give the key returned when the upload started." }).min(1),
  drawingNumber: z.string().trim().min(1, "Give the drawing number, or leave it out.").max(60, "A drawing number has at most 60 characters.").optional(),
  revision: z
    .string()
    .trim()
    .toUpperCase()
    .regex(/^[A-Z]{1,2}[0-9]{0,2}$/, "A revision is a letter, optionally with a number (A, B, P1, C02).")
    .optional(),
  documentDate: calendarDate("The date").optional(),
  checkerName: z.string().trim().max(120, "The checker's name has at most 120 characters.").optional(),
  checkCategory: z.number({ error: () => "Choose the check category (0 to 3)." }).int("The check category is 0 to 3.").min(0, "The check category is 0 to 3.").max(3, "The check category is 0 to 3 (BS 5975).").optional(),
  signedImageConfirmed: z.boolean({ error: () => "Confirm (true) that the image shows the whole signed certificate." }).optional(),
});
export type SchemeFileComplete = z.output<typeof schemeFileCompleteSchema>;

// Zone plans: the upload's start and completion, a member's place on the plan, and the plan's
// filters (shared by the page's controls and the API). Positions are fractions 0–1 of the image.
import { z } from "zod";
import { memberStatus } from "@/db/schema";

/** Largest plan file accepted (20 MB): a scanned A1 drawing or a one-page PDF export fits well under it. */
export const MAX_PLAN_BYTES = 20 * 1024 * 1024;
/** Longest side of the plan image as kept and shown. */
export const MAX_PLAN_PX = 4000;

export const zonePlanPresignSchema = z.object({
  contentType: z
    .string({ error: () => "Give the plan's content type, e.g. image/png or application/pdf." })
    .regex(/^(application\/pdf|image\/[a-z0-9.+-]+)$/i, "A plan must be an image (PNG, JPEG or WebP) or a one-page PDF."),
  size: z
    .number({ error: () => "Give the plan's size in bytes." })
    .int("The size must be a whole number of bytes.")
    .positive("The file is empty (0 bytes).")
    .max(MAX_PLAN_BYTES, "The plan is larger than 20 MB; export it at a lower resolution or as a PDF."),
});

const fraction = (label: string) =>
  z
    .number({ error: () => `${label} must be a number from 0 to 1 (a fraction of the plan's ${label === "x" || label === "x1" || label === "x2" ? "width" : "height"}).` })
    .refine(Number.isFinite, `${label} must be a finite number.`)
    .refine((v) => v >= 0 && v <= 1, `${label} must be from 0 to 1 (a fraction of the plan); the point is off the plan.`);

export const planScaleSchema = z
  .object(
    {
      x1: fraction("x1"),
      y1: fraction("y1"),
      x2: fraction("x2"),
      y2: fraction("y2"),
      distanceMm: z
        .number({ error: () => "Give the real distance between the two points, in mm." })
        .refine(Number.isFinite, "The distance must be a finite number of mm.")
        .refine((v) => v > 0, "The distance between the two points must be more than 0 mm.")
        .refine((v) => v <= 1_000_000, "The distance must be at most 1,000,000 mm (1 km); check the unit."),
    },
    { error: () => "The scale is two points on the plan (x1, y1 and x2, y2, as fractions 0–1 of the image) and the real distance between them in mm." },
  )
  .strict()
  .refine((s) => s.x1 !== s.x2 || s.y1 !== s.y2, { path: ["x2"], message: "The two scale points are the same point; pick two points apart." });

export const zonePlanCompleteSchema = z.object({
  key: z.string({ error: () => "Give the key the upload was started with." }).min(1, "Give the key the upload was started with."),
  scale: planScaleSchema.nullable().optional(),
});
export type ZonePlanComplete = z.output<typeof zonePlanCompleteSchema>;

/** Where a member stands on its zone's plan, or null to take it off the plan. */
export const planPositionSchema = z
  .object({ x: fraction("x"), y: fraction("y") }, { error: () => "The place on the plan must be x and y, fractions 0–1 across and down the plan, or empty (null) for none." })
  .strict()
  .nullable();
export type PlanPosition = z.output<typeof planPositionSchema>;

export const PLAN_CHECK_FILTERS = ["pass", "fail", "none"] as const;

export const zonePlanQuerySchema = z.object({
  status: z.enum(memberStatus.enumValues, { error: () => `The status filter must be one of: ${memberStatus.enumValues.join(", ")}.` }).optional(),
  check: z.enum(PLAN_CHECK_FILTERS, { error: () => "The check filter must be pass, fail or none (no completed check)." }).optional(),
  q: z.string().trim().max(40, "A tag search has at most 40 characters.").optional(),
});
export type ZonePlanQuery = z.output<typeof zonePlanQuerySchema>;

export const zonePlanPdfQuerySchema = zonePlanQuerySchema.extend({
  paper: z.enum(["a3", "a4"], { error: () => "The paper size must be a3 or a4." }).default("a3"),
});

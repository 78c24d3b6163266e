// One schema for recording an inspection: the phone form validates with it and the API parses
// the same input again. A coordinator's "inspect now" trigger has its own small schema.
import { z } from "zod";
import { inspectionResult } from "@/db/schema";
import { clientIdSchema } from "./member";

export const MAX_INSPECTION_PHOTOS = 20;

const resultSchema = (what: string) =>
  z.enum(inspectionResult.enumValues, { error: () => `${what} must be "pass" or "fail".` });

/** A measure of the plumb reading: a finite number within [min, max] in its unit, with its own sentence. */
const reading = (label: string, unit: string, max: number, positive = false) =>
  z
    .number({ error: (i) => `The ${label} must be a number in ${unit}${i.input === null ? "" : ` (got ${typeof i.input === "string" ? `"${i.input}"` : String(i.input)})`}.` })
    .refine(Number.isFinite, `The ${label} must be a finite number in ${unit}.`)
    .refine((v) => (positive ? v > 0 : v >= 0), positive ? `The ${label} must be more than 0 ${unit}.` : `The ${label} cannot be negative; give how far it leans, in ${unit}.`)
    .refine((v) => v <= max, `The ${label} must be at most ${max.toLocaleString("en-GB")} ${unit}; check the unit.`);

export const inspectionItemSchema = z.object({
  check: z
    .string({ error: () => "Each checklist item needs its check (e.g. \"plumb\")." })
    .trim()
    .min(1, "Each checklist item needs its check (e.g. \"plumb\").")
    .max(100, "A check name has at most 100 characters."),
  result: resultSchema("Each checklist item's result"),
  note: z.string({ error: () => "A note must be text." }).trim().max(500, "A note has at most 500 characters.").optional(),
});

export const inspectionSchema = z
  .object({
    result: resultSchema("The overall result"),
    items: z.array(inspectionItemSchema, { error: () => "The checklist must be a list of answers, one per check." }).max(30, "At most 30 checklist items.").optional(),
    notes: z.string({ error: () => "Notes must be text." }).trim().max(2000, "Notes have at most 2,000 characters.").optional(),
    photoIds: z
      .array(z.string().uuid("Each photo id must be the id of an uploaded photo."), { error: () => "The photos must be a list of photo ids, as returned by the upload." })
      .max(MAX_INSPECTION_PHOTOS, `At most ${MAX_INSPECTION_PHOTOS} photos per inspection.`)
      .optional(),
    clientId: clientIdSchema.optional(),
    /** Plumb reading as an angle from vertical (degrees) … */
    plumbDeg: reading("out-of-plumb angle", "degrees", 45).optional(),
    /** … or as an offset (mm) over a height (mm; the member's length when left out). */
    plumbOffsetMm: reading("out-of-plumb offset", "mm", 5_000).optional(),
    plumbOverMm: reading("height the offset was measured over", "mm", 30_000, true).optional(),
  })
  .superRefine((v, ctx) => {
    if (v.plumbDeg !== undefined && v.plumbOffsetMm !== undefined)
      ctx.addIssue({ code: "custom", path: ["plumbOffsetMm"], message: "Give the plumb reading either as an angle or as an offset, not both." });
    if (v.plumbOverMm !== undefined && v.plumbOffsetMm === undefined)
      ctx.addIssue({ code: "custom", path: ["plumbOffsetMm"], message: "Give the offset (mm) measured over that height, or leave the height out." });
    if (v.plumbOverMm !== undefined && v.plumbOffsetMm !== undefined && v.plumbOffsetMm >= v.plumbOverMm)
      ctx.addIssue({ code: "custom", path: ["plumbOffsetMm"], message: `An offset of ${v.plumbOffsetMm} mm over ${v.plumbOverMm} mm is 45° or more; check the reading.` });
    const items = v.items ?? [];
    const seen = new Set<string>();
    items.forEach((it, i) => {
      if (seen.has(it.check)) ctx.addIssue({ code: "custom", path: ["items", i, "check"], message: `"${it.check}" is answered twice.` });
      seen.add(it.check);
      if (it.result === "fail" && !it.note)
        ctx.addIssue({ code: "custom", path: ["items", i, "note"], message: "Say what is wrong when an item fails." });
    });
    // Safety: one failed item means the member is not fit to carry load.
    if (v.result === "pass" && items.some((it) => it.result === "fail"))
      ctx.addIssue({ code: "custom", path: ["result"], message: "An inspection with a failed item cannot pass; record it as failed." });
    if (v.photoIds && new Set(v.photoIds).size !== v.photoIds.length)
      ctx.addIssue({ code: "custom", path: ["photoIds"], message: "The same photo is listed twice." });
  });

export type InspectionInput = z.infer<typeof inspectionSchema>;

/** At most this many members are recorded satisfactory in one bulk request. */
export const MAX_BULK_INSPECTIONS = 200;

/**
 * "All satisfactory" for members chosen in the register: each is recorded as its own passing
 * inspection with every checklist item satisfactory. Only passes: a failure needs its item's note,
 * so it is recorded on the member's own checklist.
 */
export const bulkInspectionSchema = z
  .object({
    memberIds: z
      .array(z.string({ error: () => "Each member id must be text." }).uuid("Each member id must be the id of a member in the register."), {
        error: () => "The members must be a list of member ids.",
      })
      .min(1, "Choose at least one member.")
      .max(MAX_BULK_INSPECTIONS, `At most ${MAX_BULK_INSPECTIONS} members at once; choose fewer.`),
    result: z.literal("pass", {
      error: () => 'The result must be "pass": only satisfactory inspections are recorded in bulk; record a failure on the member\'s own checklist, with what is wrong.',
    }),
    notes: z.string({ error: () => "Notes must be text." }).trim().max(2000, "Notes have at most 2,000 characters.").optional(),
    clientId: clientIdSchema.optional(),
  })
  .superRefine((v, ctx) => {
    const seen = new Set<string>();
    v.memberIds.forEach((id, i) => {
      if (seen.has(id)) ctx.addIssue({ code: "custom", path: ["memberIds", i], message: "This member is listed twice." });
      seen.add(id);
    });
  });

export type BulkInspectionInput = z.infer<typeof bulkInspectionSchema>;

export const inspectionTriggerSchema = z.object({
  zoneId: z.string().uuid("Choose a zone from the list, or the whole site.").nullable().optional(),
  reason: z
    .string({ error: () => "Say why inspections are due now (e.g. high winds overnight)." })
    .trim()
    .min(3, "Say why inspections are due now (e.g. high winds overnight).")
    .max(300, "A reason has at most 300 characters."),
});

export type InspectionTriggerInput = z.infer<typeof inspectionTriggerSchema>;

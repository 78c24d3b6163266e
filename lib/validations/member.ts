// One schema for logging and editing a member: the phone form validates with it and the server
// parses the same input again. Values are SI (mm, N); the form converts ft-in and kN at its edge.
import { z } from "zod";
import { endCondition, loadSource, memberStatus, type MemberBase } from "@/db/schema";
import { N } from "@/lib/engineering/request-schema";
import { SOIL_IDS } from "@/lib/engineering/soils";
import { planPositionSchema } from "./zone-plan";

export const MAX_PHOTOS_PER_MEMBER = 20;
/** Largest photo accepted (15 MB). */
export const MAX_PHOTO_BYTES = 15 * 1024 * 1024;
export const TAG_PATTERN = /^[A-Za-z0-9][A-Za-z0-9\-_./ ]*$/;

/** A UUID the phone makes for a create, so a retried request returns the first record instead of a second. */
export const clientIdSchema = z
  .string({ error: () => "The device's own id for this record must be a UUID made on the device." })
  .uuid("The device's own id for this record must be a UUID made on the device (a random version 4 UUID).");

const uuid = (what: string) => z.string({ error: () => `Choose ${what}.` }).uuid(`Choose ${what} from the list.`);

const positive = (label: string, unit: string, max: number) =>
  z
    .number({ error: (i) => (i.input === undefined || i.input === null ? `Enter the ${label}.` : `The ${label} must be a number (${unit}).`) })
    .refine(Number.isFinite, `The ${label} must be a finite number.`)
    .refine((v) => v > 0, `The ${label} must be more than 0 ${unit}.`)
    .refine((v) => v <= max, `The ${label} must be at most ${max.toLocaleString("en-GB")} ${unit}; check the unit.`);

export const endConditionSchema = z.enum(endCondition.enumValues, {
  error: () => `End conditions must be one of: ${endCondition.enumValues.join(", ")}.`,
});
export const loadSourceSchema = z.enum(loadSource.enumValues, {
  error: () => "Load must be given directly (direct), derived from the scheme's slab (slab) or from the scheme's back-propping (backprop).",
});

export const tagSchema = z
  .string({ error: () => "Enter the member's tag (the code on its label)." })
  .trim()
  .min(1, "Enter the member's tag (the code on its label).")
  .max(40, "A tag has at most 40 characters.")
  .regex(TAG_PATTERN, "A tag starts with a letter or digit and uses only letters, digits, spaces and - _ . /");

/**
 * What the member stands on, as the engine's base-bearing inputs (SI: mm, kPa, MPa). The ground is
 * an allowable pressure typed or a soil from the common-practice table; a back-prop on a slab gives
 * the slab (depth or effective depth, and f_ck) for punching. Rules between the fields (a whole
 * sole plate, a ground or a slab) are the engine's, reported under `base.<field>`.
 */
export const memberBaseSchema = z
  .object(
    {
      basePlateBMm: N.plateMm("Base plate width"),
      basePlateLMm: N.plateMm("Base plate length"),
      solePlateBMm: N.plateMm("Sole plate width").optional(),
      solePlateLMm: N.plateMm("Sole plate length").optional(),
      solePlateTMm: N.plateMm("Sole plate thickness").optional(),
      allowablePressureKPa: N.allowablePressureKPa.optional(),
      soil: z.enum(SOIL_IDS, { error: () => `Ground type must be one of ${SOIL_IDS.join(", ")}.` }).optional(),
      slabDepthMm: N.slabDepthMm.optional(),
      slabEffectiveDepthMm: N.slabEffectiveDepthMm.optional(),
      fckMpa: N.fckMpa.optional(),
      rhoL: N.rhoL.optional(),
      punchingCode: z.enum(["en1992", "aci318"], { error: () => "Punching code must be en1992 (EN 1992-1-1 §6.4) or aci318 (ACI 318-19 §22.6)." }).optional(),
    },
    { error: () => "The base must be an object: base plate width and length in mm, and the ground or the slab below." },
  )
  .strict() satisfies z.ZodType<MemberBase>;

const base = {
  tag: tagSchema,
  zoneId: uuid("a zone").nullable().optional(),
  schemeId: uuid("a scheme").nullable().optional(),
  memberTypeId: uuid("the member type"),
  extensionMm: positive("measured extension", "mm", 30_000),
  endConditions: endConditionSchema.default("pinned-pinned"),
  loadSource: loadSourceSchema.default("direct"),
  loadN: positive("working load", "N", 50_000_000).optional(),
  /** Level of props for a load from back-propping: 1 = right under the slab being cast. */
  level: z
    .number({ error: () => "The level of props must be a whole number from 1 (right under the slab being cast) to 6." })
    .int("The level of props must be a whole number from 1 (right under the slab being cast) to 6.")
    .min(1, "The level of props is 1 (right under the slab being cast) or more.")
    .max(6, "The level of props is at most 6.")
    .nullable()
    .optional(),
  spacingXMm: positive("as-built spacing X", "mm", 20_000).nullable().optional(),
  spacingYMm: positive("as-built spacing Y", "mm", 20_000).nullable().optional(),
  notes: z.string().trim().max(2000, "Notes have at most 2000 characters.").nullable().optional(),
  base: memberBaseSchema.nullable().optional(),
};

type LoadShape = { loadSource?: "direct" | "slab" | "backprop"; loadN?: number; spacingXMm?: number | null; spacingYMm?: number | null; schemeId?: string | null; level?: number | null };

/**
 * Cross-field rules: a direct load needs loadN; a slab-derived load needs a scheme and both
 * spacings; a load from back-propping needs those and the member's level of props.
 */
function loadRules(v: LoadShape, ctx: z.RefinementCtx) {
  const source = v.loadSource ?? "direct";
  if (source !== "backprop" && v.level != null)
    ctx.addIssue({ code: "custom", path: ["level"], message: "A level of props applies only to a load from the scheme's back-propping; choose that load source or leave the level out." });
  if (source === "direct") {
    if (v.loadN === undefined) ctx.addIssue({ code: "custom", path: ["loadN"], message: "Enter the working load the member carries, or derive it from the scheme's slab." });
    return;
  }
  const from = source === "slab" ? "the slab" : "the back-propping";
  if (!v.schemeId) ctx.addIssue({ code: "custom", path: ["schemeId"], message: source === "slab" ? "Choose the scheme whose slab this member carries to derive its load." : "Choose the back-propped scheme this member belongs to, to derive its load." });
  if (v.spacingXMm == null) ctx.addIssue({ code: "custom", path: ["spacingXMm"], message: `Enter the as-built spacing X (mm) to derive the load from ${from}.` });
  if (v.spacingYMm == null) ctx.addIssue({ code: "custom", path: ["spacingYMm"], message: `Enter the as-built spacing Y (mm) to derive the load from ${from}.` });
  if (source === "backprop" && v.level == null)
    ctx.addIssue({ code: "custom", path: ["level"], message: "Choose the member's level of props: 1 is right under the slab being cast, 2 the level below, and so on." });
}

export const memberCreateSchema = z
  .object({
    ...base,
    photoIds: z
      .array(z.string().uuid("Each photo id must be the id returned by the upload."), { error: () => "The photos must be a list of photo ids, as returned by the upload." })
      .max(MAX_PHOTOS_PER_MEMBER, `At most ${MAX_PHOTOS_PER_MEMBER} photos per member.`)
      .optional(),
    /** Ask for the member to be submitted at once (allowed only when its check passes). */
    submit: z.boolean({ error: () => "Whether to submit the member at once must be true or false." }).optional(),
    clientId: clientIdSchema.optional(),
    /** Where it stands on its zone's plan (fractions 0–1 of the image), or null. */
    planPosition: planPositionSchema.optional(),
  })
  .superRefine(loadRules);

export type MemberCreateInput = z.input<typeof memberCreateSchema>;
export type MemberCreate = z.output<typeof memberCreateSchema>;

/** Statuses a person may set by editing; loaded and struck follow from permits. */
export const EDITABLE_STATUSES = ["draft", "submitted", "out_of_service"] as const;

export const memberPatchSchema = z
  .object({
    tag: base.tag,
    zoneId: base.zoneId,
    schemeId: base.schemeId,
    memberTypeId: base.memberTypeId,
    extensionMm: base.extensionMm,
    endConditions: endConditionSchema,
    loadSource: loadSourceSchema,
    loadN: base.loadN,
    level: base.level,
    spacingXMm: base.spacingXMm,
    spacingYMm: base.spacingYMm,
    notes: base.notes,
    planPosition: planPositionSchema,
    base: base.base,
    status: z.enum(memberStatus.enumValues, { error: () => `Status must be one of: ${EDITABLE_STATUSES.join(", ")}.` }),
    /** The member's `version` the edit was made against; a newer one on the server is a 409 conflict. */
    baseVersion: z
      .number({ error: () => "Give the version number of the member record the edit was based on." })
      .int("The version the edit was based on must be a whole number.")
      .positive("The version the edit was based on must be 1 or more."),
  })
  .partial()
  .strict();

export type MemberPatch = z.output<typeof memberPatchSchema>;

/** Fields whose change alters the capacity check. */
export const CHECK_FIELDS = ["extensionMm", "loadN", "loadSource", "level", "spacingXMm", "spacingYMm", "endConditions", "memberTypeId", "schemeId", "base"] as const;

/** The whole member after a patch, re-validated with the same rules as a new one. */
export const memberStateSchema = z.object({ ...base }).superRefine(loadRules);

export const photoPresignSchema = z.object({
  contentType: z
    .string({ error: () => "Give the photo's content type, e.g. image/jpeg." })
    .regex(/^image\/[a-z0-9.+-]+$/i, "Only photos can be uploaded here (a content type starting with image/)."),
  size: z
    .number({ error: () => "Give the photo's size in bytes." })
    .int("The size must be a whole number of bytes.")
    .positive("The photo is empty (0 bytes).")
    .max(MAX_PHOTO_BYTES, "The photo is larger than 15 MB; take it again at a lower resolution."),
  clientId: clientIdSchema.optional(),
});
export type PhotoPresignInput = z.output<typeof photoPresignSchema>;

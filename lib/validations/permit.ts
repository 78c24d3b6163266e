// One zod schema per permit form, used by the client (zodResolver) and parsed again on the server.
import { z } from "zod";
import { permitKind, permitStatus } from "@/db/schema";

/** Longest validity a coordinator may give a permit; longer work gets a new permit. */
export const MAX_VALIDITY_DAYS = 28;
/** Longest a supervisor's delegated issuing scope may run before the coordinator renews it. */
export const MAX_DELEGATION_DAYS = 90;
export const MAX_MEMBERS_PER_PERMIT = 500;

const uuid = (what: string) => z.string({ error: `Choose ${what}.` }).uuid({ error: `Choose ${what}.` });
const text = (max: number, what: string) =>
  z
    .string({ error: `Enter ${what}.` })
    .trim()
    .max(max, { error: `Keep ${what} under ${max} characters.` });

export const permitKindSchema = z.enum(permitKind.enumValues, { error: "Choose a permit to load or a permit to strike." });
export const permitStatusSchema = z.enum(permitStatus.enumValues);

export const strengthResultSchema = z.object({
  specimen: z.enum(["cube", "cylinder"], { error: "Choose cube or cylinder." }),
  strengthMpa: z
    .number({ error: "Enter the result in MPa (N/mm²)." })
    .positive({ error: "A strength result is more than 0 MPa." })
    .max(150, { error: "A concrete strength result above 150 MPa is not plausible; check the value." }),
});

/** What a permit to strike records as the evidence that the permanent works can carry themselves. */
export const strikeEvidenceSchema = z.discriminatedUnion("basis", [
  z.object({
    basis: z.literal("strength"),
    concreteAgeDays: z
      .number({ error: "Enter the age of the concrete in days." })
      .int({ error: "Enter the age in whole days." })
      .min(1, { error: "The concrete must be at least 1 day old." })
      .max(365, { error: "Enter an age of at most 365 days." }),
    requiredStrengthMpa: z
      .number({ error: "Enter the required striking strength in MPa." })
      .positive({ error: "The required striking strength is more than 0 MPa." })
      .max(100, { error: "A required striking strength above 100 MPa is not plausible; check the value." }),
    results: z
      .array(strengthResultSchema, { error: "Add at least one strength result." })
      .min(1, { error: "Add at least one strength result." })
      .max(12, { error: "Add at most 12 results; summarise the rest in the note." }),
    note: text(1000, "a note").optional(),
  }),
  z.object({
    basis: z.literal("designer"),
    instruction: text(2000, "the designer's instruction").min(10, { error: "Quote the designer's instruction (at least 10 characters)." }),
    reference: text(200, "the instruction's reference").optional(),
  }),
]);
export type StrikeEvidence = z.infer<typeof strikeEvidenceSchema>;

export const permitRequestSchema = z
  .object({
    kind: permitKindSchema,
    scope: z.enum(["members", "scheme-zone"], { error: "Choose members or a scheme in a zone." }),
    memberIds: z.array(z.string().uuid({ error: "That member is not on this site." })).max(MAX_MEMBERS_PER_PERMIT).optional(),
    schemeId: z.string().optional(),
    zoneId: z.string().optional(),
    note: text(1000, "a note").optional(),
    evidence: strikeEvidenceSchema.optional(),
  })
  .superRefine((v, ctx) => {
    if (v.scope === "members") {
      if (!v.memberIds || v.memberIds.length === 0) ctx.addIssue({ code: "custom", path: ["memberIds"], message: "Choose at least one member." });
    } else {
      if (!v.schemeId || !z.string().uuid().safeParse(v.schemeId).success) ctx.addIssue({ code: "custom", path: ["schemeId"], message: "Choose a scheme." });
      if (!v.zoneId || !z.string().uuid().safeParse(v.zoneId).success) ctx.addIssue({ code: "custom", path: ["zoneId"], message: "Choose a zone." });
    }
    if (v.kind === "strike" && !v.evidence) {
      ctx.addIssue({ code: "custom", path: ["evidence"], message: "A permit to strike needs the evidence: strength results or the designer's instruction." });
    }
    if (v.kind === "load" && v.evidence) {
      ctx.addIssue({ code: "custom", path: ["evidence"], message: "Striking evidence belongs on a permit to strike, not a permit to load." });
    }
  });
export type PermitRequestInput = z.input<typeof permitRequestSchema>;
export type PermitRequest = z.output<typeof permitRequestSchema>;

/** validUntil is an ISO date-time; its range (future, at most MAX_VALIDITY_DAYS) is checked against the clock on the server. */
export const permitIssueSchema = z.object({
  validUntil: z
    .string()
    .refine((s) => !Number.isNaN(Date.parse(s)), { error: "Enter the date and time the permit expires." })
    .optional(),
  conditions: text(2000, "the conditions").optional(),
});
export type PermitIssueInput = z.input<typeof permitIssueSchema>;

export const permitReasonSchema = z.object({
  reason: text(1000, "the reason").min(3, { error: "Give the reason (at least 3 characters); it is sent to the people concerned." }),
});

export const delegationSchema = z.object({
  userId: uuid("a supervisor"),
  zoneIds: z.array(z.string().uuid({ error: "Choose zones on this site." }), { error: "Choose at least one zone." }).min(1, { error: "Choose at least one zone." }),
  validUntil: z.string({ error: "Enter until when the supervisor may issue." }).refine((s) => !Number.isNaN(Date.parse(s)), {
    error: "Enter until when the supervisor may issue.",
  }),
});

export const permitListQuerySchema = z.object({
  status: permitStatusSchema.optional(),
  kind: permitKindSchema.optional(),
  sort: z.enum(["requested", "number", "status", "kind", "scope", "validUntil"]).default("requested"),
  dir: z.enum(["asc", "desc"]).default("desc"),
});
export type PermitListQuery = z.output<typeof permitListQuerySchema>;

/** "PTL-0007" (permit to load) or "PTS-0003" (permit to strike); one sequence per site. */
export function permitNumberLabel(kind: "load" | "strike", number: number | null): string | null {
  if (number == null) return null;
  return `${kind === "load" ? "PTL" : "PTS"}-${String(number).padStart(4, "0")}`;
}

export const PERMIT_KIND_LABELS = { load: "Permit to load", strike: "Permit to strike" } as const;

/** Confirming striking: every member still standing (no body), the chosen members, or one zone's. */
export const confirmStruckSchema = z
  .object({
    memberIds: z
      .array(z.string().uuid({ error: "That member is not in this permit." }), { error: "Choose the members that have been struck." })
      .min(1, { error: "Choose at least one member that has been struck." })
      .max(MAX_MEMBERS_PER_PERMIT)
      .optional(),
    zoneId: z.string().uuid({ error: "Choose a zone of this permit." }).optional(),
  })
  .refine((v) => !(v.memberIds && v.zoneId), { path: ["zoneId"], error: "Confirm by members or by zone, not both at once." });
export type ConfirmStruckInput = z.output<typeof confirmStruckSchema>;

export const amendEvidenceSchema = z.object({
  evidence: strikeEvidenceSchema,
});

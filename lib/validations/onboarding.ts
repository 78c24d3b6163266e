// Forms and bodies of first-run setup, sites, invitations, people and passwords.
import { z } from "zod";
import { designCode, siteRole, unitSystem } from "@/db/schema";
import { MAX_PASSWORD_LENGTH } from "@/lib/auth/password-policy";

const email = z.string({ error: () => "Enter an e-mail address." }).trim().min(1, "Enter an e-mail address.").max(254, "That e-mail address is too long.").email("Enter a valid e-mail address.");
const personName = z.string({ error: () => "Enter a name." }).trim().min(1, "Enter a name.").max(120, "Use at most 120 characters.");
/** The length and guessability rules run on the server (lib/auth/password-policy.ts) with the person's name and e-mail. */
const password = z.string({ error: () => "Enter a password." }).min(1, "Enter a password.").max(MAX_PASSWORD_LENGTH, `Use at most ${MAX_PASSWORD_LENGTH} characters.`);

export const setupSchema = z.object({
  organisationName: z.string({ error: () => "Enter your organisation's name." }).trim().min(2, "Enter your organisation's name.").max(120, "Use at most 120 characters."),
  name: personName,
  email,
  password,
});
export type SetupInput = z.infer<typeof setupSchema>;

function validTimezone(tz: string) {
  try {
    new Intl.DateTimeFormat("en-GB", { timeZone: tz });
    return true;
  } catch {
    return false;
  }
}

const siteFields = {
  name: z.string({ error: () => "Enter the site's name." }).trim().min(2, "Enter the site's name.").max(120, "Use at most 120 characters."),
  code: z
    .string({ error: () => "Enter a short code (2–12 letters or digits)." })
    .trim()
    .min(2, "Enter a short code (2–12 letters or digits).")
    .max(12, "Use at most 12 characters.")
    .regex(/^[A-Za-z0-9-]+$/, "Use letters, digits and hyphens only."),
  address: z.string({ error: () => "The address is text." }).trim().max(300, "Use at most 300 characters.").nullish(),
  units: z.enum(unitSystem.enumValues, { error: "Choose SI (mm, kN) or US (in, kip)." }),
  basis: z.enum(["eurocode", "aisc-lrfd", "aisc-asd", "aisc"], { error: "Choose the design basis: Eurocode or AISC." }),
  inspectionIntervalDays: z.int({ error: () => "Enter the inspection interval in whole days." }).min(1, "At least 1 day.").max(90, "At most 90 days."),
  permitValidityDays: z.int({ error: () => "Enter the permit validity in whole days." }).min(1, "At least 1 day.").max(90, "At most 90 days."),
  permitWarningHours: z.int({ error: () => "Enter the warning time in whole hours." }).min(1, "At least 1 hour.").max(168, "At most 168 hours (7 days)."),
  timezone: z.string({ error: () => "Choose a time zone such as Europe/London." }).trim().refine(validTimezone, "Choose a time zone such as Europe/London."),
};

export const siteCreateSchema = z.object({
  ...siteFields,
  inspectionIntervalDays: siteFields.inspectionIntervalDays.default(7),
  permitValidityDays: siteFields.permitValidityDays.default(7),
  permitWarningHours: siteFields.permitWarningHours.default(24),
  timezone: siteFields.timezone.default("Europe/London"),
});
export type SiteCreateInput = z.input<typeof siteCreateSchema>;

export const sitePatchSchema = z
  .object({
    ...Object.fromEntries(Object.entries(siteFields).map(([k, v]) => [k, v.optional()])),
    archived: z.boolean({ error: "Archived must be true or false." }).optional(),
  } as { [K in keyof typeof siteFields]: z.ZodOptional<(typeof siteFields)[K]> } & { archived: z.ZodOptional<z.ZodBoolean> })
  .refine((v) => Object.values(v).some((x) => x !== undefined), { message: "Send at least one field to change.", path: ["_"] });
export type SitePatchInput = z.infer<typeof sitePatchSchema>;

/** The API's basis word → the stored design code. "aisc" means AISC 360 LRFD. */
export function designCodeFor(basis: SiteCreateInput["basis"]): (typeof designCode.enumValues)[number] {
  return basis === "eurocode" ? "en1993" : basis === "aisc-asd" ? "aisc360-asd" : "aisc360-lrfd";
}
export function basisFor(code: (typeof designCode.enumValues)[number]): "eurocode" | "aisc-lrfd" | "aisc-asd" {
  return code === "en1993" ? "eurocode" : code === "aisc360-asd" ? "aisc-asd" : "aisc-lrfd";
}

const roles = z
  .array(z.enum(siteRole.enumValues, { error: `Each role is one of ${siteRole.enumValues.join(", ")}.` }), { error: "Give a list of roles." })
  .transform((r) => [...new Set(r)]);

export const invitationSchema = z.object({
  email,
  name: personName.nullish(),
  roles: roles.refine((r) => r.length > 0, "Choose at least one role."),
});
export type InvitationInput = z.input<typeof invitationSchema>;

export const acceptInvitationSchema = z.object({ name: personName.optional(), password: password.optional() });

export const rolesSchema = z.object({ roles: roles.refine((r) => r.length > 0, "Choose at least one role, or remove the person from the site.") });

export const resetRequestSchema = z.object({ email });
export const resetPasswordSchema = z.object({ password });
export const changePasswordSchema = z.object({
  currentPassword: z.string({ error: () => "Enter your current password." }).min(1, "Enter your current password."),
  newPassword: password,
});

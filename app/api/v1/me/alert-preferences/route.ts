import { listPreferences, setPreferences } from "@/db/queries/alerts";
import { apiHandler, readJson } from "@/lib/api";
import { requireApiUser } from "@/lib/auth";
import { fieldErrorsFromZod, ValidationError } from "@/lib/errors";
import { ALERT_KINDS, DEFAULT_DELIVERY } from "@/lib/alerts/kinds";
import { alertPreferencesSchema } from "@/lib/validations/alert";

async function current(userId: string) {
  const rows = await listPreferences({ userIds: [userId] });
  return ALERT_KINDS.map((kind) => ({ kind, delivery: rows.find((r) => r.kind === kind)?.delivery ?? DEFAULT_DELIVERY }));
}

/** How the signed-in person receives each kind of alert. */
export const GET = apiHandler(async () => {
  const user = await requireApiUser();
  return { preferences: await current(user.id) };
});

export const PUT = apiHandler(async (req) => {
  const user = await requireApiUser();
  const parsed = alertPreferencesSchema.safeParse(await readJson(req));
  if (!parsed.success) throw new ValidationError(fieldErrorsFromZod(parsed.error.issues));
  const kinds = parsed.data.preferences.map((p) => p.kind);
  if (new Set(kinds).size !== kinds.length) throw new ValidationError({ preferences: "Each kind may appear once." });
  await setPreferences({ userId: user.id, values: parsed.data.preferences });
  return { preferences: await current(user.id) };
});

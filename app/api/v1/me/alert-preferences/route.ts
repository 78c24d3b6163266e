import { listPreferences, setPreferences } from "@/db/queries/alerts";
import { userRoute } from "@/lib/api/route";
import { ValidationError } from "@/lib/errors";
import { ALERT_KINDS, DEFAULT_DELIVERY } from "@/lib/alerts/kinds";
import { alertPreferencesSchema } from "@/lib/validations/alert";

async function current(userId: string) {
  const rows = await listPreferences({ userIds: [userId] });
  return ALERT_KINDS.map((kind) => ({ kind, delivery: rows.find((r) => r.kind === kind)?.delivery ?? DEFAULT_DELIVERY }));
}

/** How the signed-in person receives each kind of alert. */
export const GET = userRoute({}, async ({ user }) => ({ preferences: await current(user.id) }));

export const PUT = userRoute({ body: alertPreferencesSchema }, async ({ user, input }) => {
  const kinds = input.preferences.map((p) => p.kind);
  if (new Set(kinds).size !== kinds.length) throw new ValidationError({ preferences: "Each kind may appear once." });
  await setPreferences({ userId: user.id, values: input.preferences });
  return { preferences: await current(user.id) };
});

import { getAlertForUser, markAlertsRead } from "@/db/queries/alerts";
import { apiHandler } from "@/lib/api";
import { requireApiUser } from "@/lib/auth";
import { assertSitePermission, isUuid } from "@/lib/authz";
import { NotFoundError } from "@/lib/errors";

/** Marks one alert read for the signed-in person (again is harmless). */
export const POST = apiHandler<{ alertId: string }>(async (_req, { params }) => {
  const user = await requireApiUser();
  if (!isUuid(params.alertId)) throw new NotFoundError("That alert");
  const alert = await getAlertForUser({ alertId: params.alertId, organisationId: user.organisationId });
  if (!alert) throw new NotFoundError("That alert");
  await assertSitePermission(user, alert.siteId, "viewAlerts");
  await markAlertsRead({ alertIds: [alert.id], userId: user.id });
  return { id: alert.id, read: true };
});

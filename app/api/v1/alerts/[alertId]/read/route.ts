import { markAlertsRead } from "@/db/queries/alerts";
import { siteRoute } from "@/lib/api/route";

/** Marks one alert read for the signed-in person (again is harmless). */
export const POST = siteRoute({ resource: "alert", permission: "viewAlerts" }, async ({ user, resource: alert }) => {
  await markAlertsRead({ alertIds: [alert.id], userId: user.id });
  return { id: alert.id, read: true };
});

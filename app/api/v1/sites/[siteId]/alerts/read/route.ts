import { markSiteAlertsRead } from "@/db/queries/alerts";
import { siteRoute } from "@/lib/api/route";

/** Marks every alert of the site read for the signed-in person. */
export const POST = siteRoute({ resource: "site", permission: "viewAlerts" }, async ({ user, site }) => {
  const marked = await markSiteAlertsRead({ siteId: site.id, userId: user.id });
  return { marked };
});

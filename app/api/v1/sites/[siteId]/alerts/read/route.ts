import { markSiteAlertsRead } from "@/db/queries/alerts";
import { apiHandler } from "@/lib/api";
import { requireApiUser } from "@/lib/auth";
import { assertSitePermission } from "@/lib/authz";

/** Marks every alert of the site read for the signed-in person. */
export const POST = apiHandler<{ siteId: string }>(async (_req, { params }) => {
  const user = await requireApiUser();
  const { site } = await assertSitePermission(user, params.siteId, "viewAlerts");
  const marked = await markSiteAlertsRead({ siteId: site.id, userId: user.id });
  return { marked };
});

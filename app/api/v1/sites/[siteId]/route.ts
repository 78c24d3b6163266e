import { getSiteCounts } from "@/db/queries/sites";
import { siteRoute } from "@/lib/api/route";

export const GET = siteRoute({ resource: "site", permission: "viewSite" }, async ({ site, roles }) => {
  const counts = await getSiteCounts({ siteId: site.id });
  return { site: { ...site, roles }, counts };
});

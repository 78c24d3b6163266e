import { getSiteCounts } from "@/db/queries/sites";
import { siteRoute } from "@/lib/api/route";
import { changeSite, siteView } from "@/lib/sites/manage";
import { sitePatchSchema } from "@/lib/validations/onboarding";

export const GET = siteRoute({ resource: "site", permission: "viewSite" }, async ({ site, roles }) => {
  const counts = await getSiteCounts({ siteId: site.id });
  return { site: { ...site, roles }, counts };
});

/** Admins change the site's name, code and policies, or archive it ({ archived: true }) and restore it. */
export const PATCH = siteRoute(
  { resource: "site", permission: "manageSite", forbidden: "Changing a site's settings is for organisation admins.", body: sitePatchSchema, allowArchived: true },
  async ({ user, site, input }) => ({ site: siteView(await changeSite({ user, site, input })) }),
);

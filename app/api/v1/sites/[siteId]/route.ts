import { getSiteCounts } from "@/db/queries/sites";
import { apiHandler } from "@/lib/api";
import { siteRoute } from "@/lib/api/route";
import { requireApiUser } from "@/lib/auth";
import { getSiteAccess } from "@/lib/authz";
import { changeSite, siteView } from "@/lib/sites/manage";
import { sitePatchSchema } from "@/lib/validations/onboarding";

export const GET = apiHandler<{ siteId: string }>(async (_req, { params }) => {
  const user = await requireApiUser();
  const { site, roles } = await getSiteAccess(user, params.siteId);
  const counts = await getSiteCounts({ siteId: site.id });
  return { site: { ...site, roles }, counts };
});

/** Admins change the site's name, code and policies, or archive it ({ archived: true }) and restore it. */
export const PATCH = siteRoute(
  { resource: "site", permission: "manageSite", forbidden: "Changing a site's settings is for organisation admins.", body: sitePatchSchema, allowArchived: true },
  async ({ user, site, input }) => ({ site: siteView(await changeSite({ user, site, input })) }),
);

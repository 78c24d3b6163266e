import { getSiteCounts } from "@/db/queries/sites";
import { apiHandler } from "@/lib/api";
import { requireApiUser } from "@/lib/auth";
import { getSiteAccess } from "@/lib/authz";

export const GET = apiHandler<{ siteId: string }>(async (_req, { params }) => {
  const user = await requireApiUser();
  const { site, roles } = await getSiteAccess(user, params.siteId);
  const counts = await getSiteCounts({ siteId: site.id });
  return { site: { ...site, roles }, counts };
});

import { listZones } from "@/db/queries/zones";
import { apiHandler, created, readJson } from "@/lib/api";
import { requireApiUser } from "@/lib/auth";
import { getSiteAccess } from "@/lib/authz";
import { createZone } from "@/lib/register/schemes";

export const GET = apiHandler<{ siteId: string }>(async (_req, { params }) => {
  const user = await requireApiUser();
  const { site } = await getSiteAccess(user, params.siteId);
  return { items: await listZones({ siteId: site.id }) };
});

export const POST = apiHandler<{ siteId: string }>(async (req, { params }) => {
  const user = await requireApiUser();
  const input = await readJson(req);
  return created(await createZone({ user, siteId: params.siteId, input }));
});

import { listMemberTypes } from "@/db/queries/member-types";
import { apiHandler, created, readJson } from "@/lib/api";
import { requireApiUser } from "@/lib/auth";
import { getSiteAccess } from "@/lib/authz";
import { createMemberType } from "@/lib/register/member-types";

export const GET = apiHandler<{ siteId: string }>(async (_req, { params }) => {
  const user = await requireApiUser();
  const { site } = await getSiteAccess(user, params.siteId);
  return { items: await listMemberTypes({ organisationId: site.organisationId }) };
});

export const POST = apiHandler<{ siteId: string }>(async (req, { params }) => {
  const user = await requireApiUser();
  const input = await readJson(req);
  return created(await createMemberType({ user, siteId: params.siteId, input }));
});

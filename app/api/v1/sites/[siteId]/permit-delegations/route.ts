// Issuing scope a coordinator gives a supervisor: which zones, until when; who gave it and when.
import { listDelegations } from "@/db/queries/permits";
import { apiHandler, created, readJson } from "@/lib/api";
import { requireApiUser } from "@/lib/auth";
import { assertSitePermission } from "@/lib/authz";
import { delegateIssuing } from "@/lib/permits";

export const GET = apiHandler<{ siteId: string }>(async (_req, { params }) => {
  const user = await requireApiUser();
  const { site } = await assertSitePermission(user, params.siteId, "viewSite");
  return { delegations: await listDelegations({ siteId: site.id }) };
});

export const POST = apiHandler<{ siteId: string }>(async (req, { params }) => {
  const user = await requireApiUser();
  await assertSitePermission(user, params.siteId, "delegatePermits");
  const body = await readJson(req);
  return created({ delegation: await delegateIssuing({ user, siteId: params.siteId, body }) });
});

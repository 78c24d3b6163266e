// GET /api/v1/sites/{siteId}/members — the register list (filters, sort, keyset paging).
import "server-only";
import { listMembers } from "@/db/queries/member-list";
import { apiHandler } from "@/lib/api";
import { requireApiUser } from "@/lib/auth";
import { assertSitePermission } from "@/lib/authz";
import { parseMemberListRequest } from "./member-query";

export const GET = apiHandler<{ siteId: string }>(async (req, { params }) => {
  const user = await requireApiUser();
  await assertSitePermission(user, params.siteId, "viewSite");
  const { limit, cursor, sort, dir, filters } = parseMemberListRequest(req);
  return listMembers({ siteId: params.siteId, filters, sort, dir, limit, cursor });
});

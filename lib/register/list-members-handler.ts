// GET /api/v1/sites/{siteId}/members — the register list (filters, sort, keyset paging).
import "server-only";
import { listMembersJson } from "@/db/queries/member-list";
import { siteRoute } from "@/lib/api/route";
import { memberListQuery } from "./member-query";

export const GET = siteRoute({ resource: "site", permission: "viewSite", query: memberListQuery() }, async ({ site, query }) => {
  const { limit, cursor, sort, dir, filters } = query;
  const body = await listMembersJson({ siteId: site.id, filters, sort, dir, limit, cursor });
  return new Response(body as BodyInit, { headers: { "content-type": "application/json" } });
});

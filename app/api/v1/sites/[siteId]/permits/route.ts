// A site's permits: list (filter, sort) and request a permit to load or to strike.
import { listPermits } from "@/db/queries/permits";
import { created } from "@/lib/api";
import { siteRoute } from "@/lib/api/route";
import { requestPermit } from "@/lib/permits";
import { requestReference } from "@/lib/permits/words";
import { permitListQuerySchema, permitNumberLabel, permitRequestSchema } from "@/lib/validations/permit";

export const GET = siteRoute({ resource: "site", permission: "viewSite", query: permitListQuerySchema }, async ({ site, query }) => {
  const rows = await listPermits({ siteId: site.id, ...query });
  return { permits: rows.map((r) => ({ ...r, numberLabel: permitNumberLabel(r.kind, r.number), requestReference: requestReference(r, site.timezone) })) };
});

export const POST = siteRoute({ resource: "site", permission: "requestPermit", body: permitRequestSchema }, async (ctx) => {
  const permit = await requestPermit(ctx);
  return created({ permit: { id: permit.id, kind: permit.kind, status: permit.status, requestedAt: permit.requestedAt } });
});

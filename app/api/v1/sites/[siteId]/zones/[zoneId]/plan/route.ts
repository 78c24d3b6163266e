import { siteRoute } from "@/lib/api/route";
import { presignZonePlan, zonePlanView } from "@/lib/zone-plans";
import { zonePlanPresignSchema, zonePlanQuerySchema } from "@/lib/validations/zone-plan";

/**
 * The zone's plan for every role on the site: { imageUrl, width, height, scale, pins: [{ memberId, tag,
 * x, y, status, pass, utilisation, … }], unpinned: [...] }; `imageUrl` is null while the zone has no plan.
 * Filters like the register's: ?status=, ?check=pass|fail|none, ?q= (tag contains).
 */
export const GET = siteRoute({ resource: "zone", permission: "viewSite", query: zonePlanQuerySchema }, async ({ site, resource: zone, query }) =>
  zonePlanView({ site, zone, query }),
);

/** { contentType, size } → { key, uploadUrl, headers }: the browser PUTs the plan there, then calls …/plan/complete. */
export const POST = siteRoute(
  { resource: "zone", permission: "manageZones", forbidden: "Only a designer, coordinator or admin may upload a zone's plan.", body: zonePlanPresignSchema },
  async ({ site, resource: zone, input }) => presignZonePlan({ site, zone, input }),
);

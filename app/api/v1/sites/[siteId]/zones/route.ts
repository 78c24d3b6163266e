import { listZones } from "@/db/queries/zones";
import { created } from "@/lib/api";
import { siteRoute } from "@/lib/api/route";
import { createZone } from "@/lib/register/schemes";
import { zoneSchema } from "@/lib/validations/zone";

export const GET = siteRoute({ resource: "site", permission: "viewSite" }, async ({ site }) => ({ items: await listZones({ siteId: site.id }) }));

export const POST = siteRoute({ resource: "site", permission: "manageZones", body: zoneSchema }, async ({ user, site, input }) =>
  created(await createZone({ user, site, input })),
);

import { siteRoute } from "@/lib/api/route";
import { editZone } from "@/lib/register/schemes";
import { zoneSchema } from "@/lib/validations/zone";

export const PATCH = siteRoute({ resource: "zone", permission: "manageZones", body: zoneSchema }, async ({ user, site, resource: zone, input }) =>
  editZone({ user, site, zone, input }),
);

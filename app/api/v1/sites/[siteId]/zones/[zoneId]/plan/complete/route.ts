import { siteRoute } from "@/lib/api/route";
import { completeZonePlan } from "@/lib/zone-plans";
import { zonePlanCompleteSchema } from "@/lib/validations/zone-plan";

/** { key, scale? } → the plan (as GET returns it) once the file is an image or a one-page PDF; 422 with the reason otherwise. */
export const POST = siteRoute(
  { resource: "zone", permission: "manageZones", forbidden: "Only a designer, coordinator or admin may upload a zone's plan.", body: zonePlanCompleteSchema },
  async ({ user, site, resource: zone, input }) => completeZonePlan({ user, site, zone, input }),
);

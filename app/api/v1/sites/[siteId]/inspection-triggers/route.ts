import { created } from "@/lib/api";
import { siteRoute } from "@/lib/api/route";
import { triggerInspections } from "@/lib/inspections/trigger";
import { inspectionTriggerSchema } from "@/lib/validations/inspection";

/** "After an incident or adverse weather": makes inspections due now for a zone or the whole site. */
export const POST = siteRoute(
  { resource: "site", permission: "triggerInspections", body: inspectionTriggerSchema },
  async ({ user, site, input }) => created(await triggerInspections({ user, site, input })),
);

import { created } from "@/lib/api";
import { siteRoute } from "@/lib/api/route";
import { recordBulkSatisfactory } from "@/lib/inspections/bulk";
import { bulkInspectionSchema } from "@/lib/validations/inspection";

/**
 * "All satisfactory" for chosen members: each recorded as its own passing inspection, all or
 * nothing (201). 404 with `fields` when a member is not on this site; 422 with a reason per member
 * that cannot be inspected. With a `clientId` already used for these members: 200, nothing new.
 */
export const POST = siteRoute(
  { resource: "site", permission: "inspect", body: bulkInspectionSchema, forbidden: "Recording inspections is for site engineers, supervisors and coordinators." },
  async ({ user, site, input }) => {
    const out = await recordBulkSatisfactory({ user, site, input });
    return out.recorded > 0 ? created(out) : out;
  },
);

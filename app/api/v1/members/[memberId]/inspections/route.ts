import { listInspections } from "@/db/queries/inspections";
import { created } from "@/lib/api";
import { siteRoute } from "@/lib/api/route";
import { recordInspection } from "@/lib/inspections/record";
import { inspectionSchema } from "@/lib/validations/inspection";

/** A member's inspection history, newest first. */
export const GET = siteRoute({ resource: "member", permission: "viewSite" }, async ({ resource: member }) => {
  const items = await listInspections({ memberId: member.id });
  return { member: { id: member.id, tag: member.tag, status: member.status }, items };
});

/**
 * Records an inspection (201); a failed one takes the member out of service and out of its permits.
 * With a `clientId` this member already has an inspection for: 200 with that inspection, nothing new.
 */
export const POST = siteRoute({ resource: "member", permission: "inspect", body: inspectionSchema }, async ({ user, resource: member, input }) => {
  const { replayed, ...body } = await recordInspection({ user, member, input });
  return replayed ? body : created(body);
});

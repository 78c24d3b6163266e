// "After an incident or adverse weather": makes inspections due now for a zone or the whole site,
// with its audit row in the same transaction. The route has checked `triggerInspections`.
import "server-only";
import { transaction } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { insertInspectionTrigger, zoneBelongsToSite } from "@/db/queries/inspections";
import type { SessionUser } from "@/db/queries/users";
import { ValidationError } from "@/lib/errors";
import type { InspectionTriggerInput } from "@/lib/validations/inspection";

export async function triggerInspections({ user, site, input }: { user: SessionUser; site: { id: string; organisationId: string }; input: InspectionTriggerInput }) {
  const zoneId = input.zoneId ?? null;
  const zone = zoneId ? await zoneBelongsToSite({ zoneId, siteId: site.id }) : null;
  if (zoneId && !zone) throw new ValidationError({ zoneId: "That zone is not on this site." });
  const trigger = await transaction(async (tx) => {
    const row = await insertInspectionTrigger({ siteId: site.id, zoneId, reason: input.reason, triggeredBy: user.id }, tx);
    await recordAudit(
      { organisationId: site.organisationId, siteId: site.id, actorId: user.id, action: "inspections.triggered", entityType: "inspection_trigger", entityId: row.id, after: { zone: zone?.name ?? "whole site", reason: row.reason } },
      tx,
    );
    return row;
  });
  return { trigger: { id: trigger.id, zoneId, zoneName: zone?.name ?? null, reason: trigger.reason, triggeredAt: trigger.triggeredAt } };
}

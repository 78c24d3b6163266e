import { recordAudit } from "@/db/queries/audit";
import { insertInspectionTrigger, zoneBelongsToSite } from "@/db/queries/inspections";
import { db } from "@/db";
import { apiHandler, created, readJson } from "@/lib/api";
import { requireApiUser } from "@/lib/auth";
import { assertSitePermission } from "@/lib/authz";
import { fieldErrorsFromZod, ValidationError } from "@/lib/errors";
import { inspectionTriggerSchema } from "@/lib/validations/inspection";

/** "After an incident or adverse weather": makes inspections due now for a zone or the whole site. */
export const POST = apiHandler<{ siteId: string }>(async (req, { params }) => {
  const user = await requireApiUser();
  const { site } = await assertSitePermission(user, params.siteId, "triggerInspections");
  const parsed = inspectionTriggerSchema.safeParse(await readJson(req));
  if (!parsed.success) throw new ValidationError(fieldErrorsFromZod(parsed.error.issues));
  const zoneId = parsed.data.zoneId ?? null;
  const zone = zoneId ? await zoneBelongsToSite({ zoneId, siteId: site.id }) : null;
  if (zoneId && !zone) throw new ValidationError({ zoneId: "That zone is not on this site." });
  const trigger = await db.transaction(async (tx) => {
    const row = await insertInspectionTrigger({ siteId: site.id, zoneId, reason: parsed.data.reason, triggeredBy: user.id }, tx);
    await recordAudit(
      { organisationId: site.organisationId, siteId: site.id, actorId: user.id, action: "inspections.triggered", entityType: "inspection_trigger", entityId: row.id, after: { zone: zone?.name ?? "whole site", reason: row.reason } },
      tx,
    );
    return row;
  });
  return created({ trigger: { id: trigger.id, zoneId, zoneName: zone?.name ?? null, reason: trigger.reason, triggeredAt: trigger.triggeredAt } });
});

// Issuing scope: the coordinator lets a supervisor decide permits for some zones until a date.
import "server-only";
import { transaction } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { listSiteRoleEmails } from "@/db/queries/memberships";
import { countSiteZones, insertDelegation, revokeDelegation } from "@/db/queries/permits";
import type { SessionUser } from "@/db/queries/users";
import type { permitDelegations } from "@/db/schema";
import type { Site } from "@/lib/api/resources";
import { ConflictError, ValidationError } from "@/lib/errors";
import { MAX_DELEGATION_DAYS } from "@/lib/validations/permit";
import { DAY } from "./words";

type Delegation = typeof permitDelegations.$inferSelect;

export async function delegateIssuing(
  { user, site, input }: { user: SessionUser; site: Site; input: { userId: string; zoneIds: string[]; validUntil: string } },
  now = new Date(),
) {
  const siteId = site.id;
  const validUntil = new Date(input.validUntil);
  const fields: Record<string, string> = {};
  if (validUntil.getTime() <= now.getTime()) fields.validUntil = "The scope must run until a time in the future.";
  else if (validUntil.getTime() > now.getTime() + MAX_DELEGATION_DAYS * DAY) fields.validUntil = `Give issuing scope for at most ${MAX_DELEGATION_DAYS} days at a time.`;
  const supervisors = await listSiteRoleEmails({ siteId, role: "supervisor" });
  if (!supervisors.some((s) => s.userId === input.userId)) fields.userId = "Issuing scope can be given only to a temporary works supervisor on this site.";
  const zoneIds = [...new Set(input.zoneIds)];
  if ((await countSiteZones({ siteId, zoneIds })) !== zoneIds.length) fields.zoneIds = "Choose zones on this site.";
  if (Object.keys(fields).length) throw new ValidationError(fields);
  return transaction(async (tx) => {
    const row = await insertDelegation({ siteId, userId: input.userId, zoneIds, validUntil, grantedBy: user.id }, tx);
    await recordAudit(
      { organisationId: user.organisationId, siteId, actorId: user.id, action: "permit_delegation.granted", entityType: "permit_delegation", entityId: row.id, after: { userId: input.userId, zoneIds, validUntil } },
      tx,
    );
    return row;
  });
}

export async function revokeIssuing({ user, resource: d }: { user: SessionUser; resource: Delegation }) {
  return transaction(async (tx) => {
    const row = await revokeDelegation({ delegationId: d.id, at: new Date() }, tx);
    if (!row) throw new ConflictError("This issuing scope was already revoked.");
    await recordAudit(
      { organisationId: user.organisationId, siteId: d.siteId, actorId: user.id, action: "permit_delegation.revoked", entityType: "permit_delegation", entityId: d.id, before: { revokedAt: null }, after: { revokedAt: row.revokedAt } },
      tx,
    );
    return row;
  });
}

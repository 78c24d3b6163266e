import "server-only";
import { and, desc, eq } from "drizzle-orm";
import { db, type DbOrTx } from "@/db";
import { auditEvents, users } from "@/db/schema";

export type AuditInput = {
  organisationId: string;
  siteId?: string | null;
  actorId?: string | null;
  action: string;
  entityType: string;
  entityId?: string | null;
  before?: unknown;
  after?: unknown;
};

/** Many audit rows at once (a re-check of every member of a type), in batches of a thousand. */
export async function recordAudits(events: AuditInput[], tx: DbOrTx = db) {
  const rows = events.map((e) => ({
    organisationId: e.organisationId,
    siteId: e.siteId ?? null,
    actorId: e.actorId ?? null,
    action: e.action,
    entityType: e.entityType,
    entityId: e.entityId ?? null,
    before: e.before ?? null,
    after: e.after ?? null,
  }));
  for (let i = 0; i < rows.length; i += 1000) await tx.insert(auditEvents).values(rows.slice(i, i + 1000));
}

/** Call inside the same transaction as the change it records. */
export async function recordAudit(e: AuditInput, tx: DbOrTx = db) {
  await tx.insert(auditEvents).values({
    organisationId: e.organisationId,
    siteId: e.siteId ?? null,
    actorId: e.actorId ?? null,
    action: e.action,
    entityType: e.entityType,
    entityId: e.entityId ?? null,
    before: e.before ?? null,
    after: e.after ?? null,
  });
}

export async function listAuditForEntity(
  { entityType, entityId, organisationId }: { entityType: string; entityId: string; organisationId: string },
  tx: DbOrTx = db,
) {
  return tx
    .select({
      id: auditEvents.id,
      action: auditEvents.action,
      before: auditEvents.before,
      after: auditEvents.after,
      at: auditEvents.at,
      actorName: users.name,
    })
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.actorId))
    .where(and(eq(auditEvents.entityType, entityType), eq(auditEvents.entityId, entityId), eq(auditEvents.organisationId, organisationId)))
    .orderBy(desc(auditEvents.at), desc(auditEvents.id));
}

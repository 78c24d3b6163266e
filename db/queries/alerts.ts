import "server-only";
import { and, count, desc, eq, gt, inArray, isNull, lte, sql } from "drizzle-orm";
import { db, type DbOrTx } from "@/db";
import {
  alertPreferences, alertReads, alerts, memberships, members, outbox, sites, users, type SiteRole,
} from "@/db/schema";
import { failingNow } from "./member-history";

export type AlertRow = typeof alerts.$inferSelect;
export type NewAlert = Omit<typeof alerts.$inferInsert, "id" | "createdAt"> & { createdAt?: Date };

/**
 * Inserts alerts that have not fired yet. The unique (kind, subject, threshold) key makes each
 * fire once, however many scans or workers try: only the rows inserted now come back.
 */
export async function insertNewAlerts(values: NewAlert[], tx: DbOrTx = db): Promise<AlertRow[]> {
  if (values.length === 0) return [];
  return tx
    .insert(alerts)
    .values(values)
    .onConflictDoNothing({ target: [alerts.kind, alerts.subjectId, alerts.threshold] })
    .returning();
}

/** People holding any of the roles on the sites, with their roles there (disabled accounts left out). */
export async function listSitePeopleWithRoles({ siteIds, roles }: { siteIds: string[]; roles: readonly SiteRole[] }, tx: DbOrTx = db) {
  if (siteIds.length === 0 || roles.length === 0) return [];
  return tx
    .select({ siteId: memberships.siteId, userId: users.id, email: users.email, name: users.name, role: memberships.role })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(inArray(memberships.siteId, siteIds), inArray(memberships.role, [...roles]), isNull(users.disabledAt)));
}

export async function listPreferences({ userIds }: { userIds: string[] }, tx: DbOrTx = db) {
  if (userIds.length === 0) return [];
  return tx
    .select({ userId: alertPreferences.userId, kind: alertPreferences.kind, delivery: alertPreferences.delivery })
    .from(alertPreferences)
    .where(inArray(alertPreferences.userId, userIds));
}

export async function setPreferences(
  { userId, values }: { userId: string; values: { kind: string; delivery: (typeof alertPreferences.delivery.enumValues)[number] }[] },
  tx: DbOrTx = db,
) {
  if (values.length === 0) return;
  await tx
    .insert(alertPreferences)
    .values(values.map((v) => ({ userId, kind: v.kind, delivery: v.delivery })))
    .onConflictDoUpdate({ target: [alertPreferences.userId, alertPreferences.kind], set: { delivery: sql`excluded.delivery` } });
}

/** Users who chose the digest for at least one kind. */
export async function listDigestUsers(tx: DbOrTx = db) {
  return tx
    .selectDistinct({ userId: users.id, email: users.email, name: users.name })
    .from(alertPreferences)
    .innerJoin(users, eq(users.id, alertPreferences.userId))
    .where(and(eq(alertPreferences.delivery, "digest"), isNull(users.disabledAt)));
}

/** The alerts of the sites created in [from, to), newest first (for a digest). */
export async function listAlertsBetween({ siteIds, from, to }: { siteIds: string[]; from: Date; to: Date }, tx: DbOrTx = db) {
  if (siteIds.length === 0) return [];
  return tx
    .select({ alert: alerts, siteName: sites.name })
    .from(alerts)
    .innerJoin(sites, eq(sites.id, alerts.siteId))
    .where(and(inArray(alerts.siteId, siteIds), gt(alerts.createdAt, from), lte(alerts.createdAt, to)))
    .orderBy(desc(alerts.createdAt));
}

/** Roles a user holds, per site. */
export async function listUserSiteRoles({ userId }: { userId: string }, tx: DbOrTx = db) {
  return tx.select({ siteId: memberships.siteId, role: memberships.role }).from(memberships).where(eq(memberships.userId, userId));
}

/** True once the digest of that day has been queued for the user (the caller holds the advisory lock). */
export async function digestAlreadyQueued({ userId, kind }: { userId: string; kind: string }, tx: DbOrTx = db) {
  const [row] = await tx.select({ id: outbox.id }).from(outbox).where(and(eq(outbox.toUserId, userId), eq(outbox.kind, kind))).limit(1);
  return Boolean(row);
}

export async function advisoryXactLock(key: string, tx: DbOrTx) {
  await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${key}))`);
}

// ------------------------------------------------------------------ the app's list
export async function listSiteAlerts(
  { siteId, userId, unreadOnly = false, limit = 100 }: { siteId: string; userId: string; unreadOnly?: boolean; limit?: number },
  tx: DbOrTx = db,
) {
  const rows = await tx
    .select({
      id: alerts.id,
      kind: alerts.kind,
      subjectType: alerts.subjectType,
      subjectId: alerts.subjectId,
      title: alerts.title,
      body: alerts.body,
      link: alerts.link,
      createdAt: alerts.createdAt,
      readAt: alertReads.readAt,
    })
    .from(alerts)
    .leftJoin(alertReads, and(eq(alertReads.alertId, alerts.id), eq(alertReads.userId, userId)))
    .where(and(eq(alerts.siteId, siteId), unreadOnly ? isNull(alertReads.readAt) : undefined))
    .orderBy(desc(alerts.createdAt), desc(alerts.id))
    .limit(limit);
  return rows.map((r) => ({ ...r, read: r.readAt != null }));
}

export async function countUnreadAlerts({ siteId, userId }: { siteId: string; userId: string }, tx: DbOrTx = db) {
  const [row] = await tx
    .select({ n: count() })
    .from(alerts)
    .leftJoin(alertReads, and(eq(alertReads.alertId, alerts.id), eq(alertReads.userId, userId)))
    .where(and(eq(alerts.siteId, siteId), isNull(alertReads.readAt)));
  return row?.n ?? 0;
}

/** An alert only when its site belongs to the organisation (site access is checked by the caller). */
export async function getAlertForUser({ alertId, organisationId }: { alertId: string; organisationId: string }, tx: DbOrTx = db) {
  const [row] = await tx
    .select({ id: alerts.id, siteId: alerts.siteId })
    .from(alerts)
    .innerJoin(sites, eq(sites.id, alerts.siteId))
    .where(and(eq(alerts.id, alertId), eq(sites.organisationId, organisationId)))
    .limit(1);
  return row ?? null;
}

export async function markAlertsRead({ alertIds, userId }: { alertIds: string[]; userId: string }, tx: DbOrTx = db) {
  if (alertIds.length === 0) return 0;
  const rows = await tx
    .insert(alertReads)
    .values(alertIds.map((alertId) => ({ alertId, userId })))
    .onConflictDoNothing()
    .returning({ alertId: alertReads.alertId });
  return rows.length;
}

export async function markSiteAlertsRead({ siteId, userId }: { siteId: string; userId: string }, tx: DbOrTx = db) {
  const rows = (await tx.execute(sql`
    insert into alert_reads (alert_id, user_id)
    select a.id, ${userId}::uuid from alerts a where a.site_id = ${siteId}::uuid
    on conflict do nothing returning alert_id`)) as unknown as unknown[];
  return rows.length;
}

// ------------------------------------------------------------------ scans
const siteFilter = (col: unknown, siteIds?: string[] | null) =>
  siteIds ? (siteIds.length ? inArray(col as typeof sites.id, siteIds) : sql`false`) : undefined;

/** Members whose latest check fails and that have no overload alert for that check yet. */
export async function findUnalertedOverloads({ siteIds }: { siteIds?: string[] | null }, tx: DbOrTx = db) {
  return tx
    .select({
      memberId: members.id,
      siteId: members.siteId,
      tag: members.tag,
      checkId: members.latestCheckId,
      utilisation: members.utilisation,
      capacityN: members.capacityN,
      loadN: members.loadN,
      extensionMm: members.extensionMm,
      siteName: sites.name,
    })
    .from(members)
    .innerJoin(sites, eq(sites.id, members.siteId))
    .where(
      and(
        failingNow(),
        sql`${members.latestCheckId} is not null`,
        siteFilter(members.siteId, siteIds),
        sql`not exists (select 1 from alerts a where a.kind = 'member_overloaded' and a.subject_id = ${members.id} and a.threshold = ${members.latestCheckId}::text)`,
      ),
    )
    // A fixed order keeps two workers inserting the same alerts in the same order (no deadlock).
    .orderBy(members.id)
    .limit(1000);
}

/** Members currently failing their check on a site (for the overview), worst first. */
export async function listCurrentOverloads({ siteId }: { siteId: string }, tx: DbOrTx = db) {
  return tx
    .select({
      memberId: members.id,
      tag: members.tag,
      status: members.status,
      utilisation: members.utilisation,
      capacityN: members.capacityN,
      loadN: members.loadN,
      extensionMm: members.extensionMm,
    })
    .from(members)
    .where(failingNow(siteId))
    .orderBy(sql`${members.utilisation} desc nulls first`, members.tag)
    .limit(50);
}

/** Outbox messages that keep failing (given up, or 3+ attempts and not sent); alert e-mails about failing mail are left out. */
export async function findFailingEmails({ siteIds, minAttempts }: { siteIds?: string[] | null; minAttempts: number }, tx: DbOrTx = db) {
  return tx
    .select({
      id: outbox.id,
      siteId: outbox.siteId,
      toEmail: outbox.toEmail,
      subject: outbox.subject,
      status: outbox.status,
      attempts: outbox.attempts,
      lastError: outbox.lastError,
    })
    .from(outbox)
    .where(
      and(
        sql`${outbox.siteId} is not null`,
        sql`${outbox.status} <> 'sent'`,
        sql`(${outbox.status} = 'failed' or ${outbox.attempts} >= ${minAttempts})`,
        sql`${outbox.kind} <> 'alert:email_failing'`,
        siteFilter(outbox.siteId, siteIds),
        sql`not exists (select 1 from alerts a where a.kind = 'email_failing' and a.subject_id = ${outbox.id})`,
      ),
    )
    .orderBy(outbox.id)
    .limit(500);
}

export async function listSiteNames({ siteIds }: { siteIds: string[] }, tx: DbOrTx = db) {
  if (siteIds.length === 0) return new Map<string, { name: string; timezone: string }>();
  const rows = await tx.select({ id: sites.id, name: sites.name, timezone: sites.timezone }).from(sites).where(inArray(sites.id, siteIds));
  return new Map(rows.map((r) => [r.id, { name: r.name, timezone: r.timezone }]));
}

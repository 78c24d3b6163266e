import "server-only";
import { and, desc, eq, inArray, isNull, or, sql } from "drizzle-orm";
import { db, type DbOrTx } from "@/db";
import {
  inspections, inspectionTriggers, members, photos, sites, users, zones, type Inspection,
} from "@/db/schema";

type MemberStatus = (typeof members.status.enumValues)[number];

const toDate = (v: unknown): Date | null => (v == null ? null : v instanceof Date ? v : new Date(String(v)));

/** The member and what an inspection needs from its site, locked so two inspections cannot interleave. */
export async function lockMemberForInspection({ memberId }: { memberId: string }, tx: DbOrTx) {
  const [row] = await tx
    .select({
      id: members.id,
      siteId: members.siteId,
      tag: members.tag,
      status: members.status,
      checkPass: members.checkPass,
      extensionMm: members.extensionMm,
      organisationId: sites.organisationId,
      designCode: sites.designCode,
      unitSystem: sites.unitSystem,
      siteName: sites.name,
      inspectionIntervalDays: sites.inspectionIntervalDays,
      siteTimezone: sites.timezone,
    })
    .from(members)
    .innerJoin(sites, eq(sites.id, members.siteId))
    .where(eq(members.id, memberId))
    .for("update", { of: members })
    .limit(1);
  return row ?? null;
}

export async function getLatestInspection({ memberId }: { memberId: string }, tx: DbOrTx = db): Promise<Inspection | null> {
  const [row] = await tx
    .select()
    .from(inspections)
    .where(eq(inspections.memberId, memberId))
    .orderBy(desc(inspections.inspectedAt), desc(inspections.createdAt))
    .limit(1);
  return row ?? null;
}

/** The inspection a phone already recorded with this clientId for this member (a retried request), if any. */
export async function getInspectionByClientId({ memberId, clientId }: { memberId: string; clientId: string }, tx: DbOrTx = db) {
  const [row] = await tx
    .select({
      id: inspections.id,
      memberId: inspections.memberId,
      result: inspections.result,
      items: inspections.items,
      notes: inspections.notes,
      inspectedAt: inspections.inspectedAt,
      nextDueAt: inspections.nextDueAt,
      plumbDeg: inspections.plumbDeg,
      plumbOffsetMm: inspections.plumbOffsetMm,
      plumbOverMm: inspections.plumbOverMm,
      inspectorName: users.name,
    })
    .from(inspections)
    .leftJoin(users, eq(users.id, inspections.inspectorId))
    .where(and(eq(inspections.memberId, memberId), eq(inspections.clientId, clientId)))
    .limit(1);
  if (!row) return null;
  const pics = await tx.select({ id: photos.id }).from(photos).where(eq(photos.inspectionId, row.id)).orderBy(photos.createdAt);
  return { ...row, photoIds: pics.map((p) => p.id) };
}

export async function insertInspection(values: typeof inspections.$inferInsert, tx: DbOrTx = db): Promise<Inspection> {
  const [row] = await tx.insert(inspections).values(values).returning();
  return row!;
}

/** The photos an inspection may claim: this member's (or not yet attached), not rejected, not used by another inspection. */
export async function findPhotosForInspection(
  { siteId, memberId, photoIds }: { siteId: string; memberId: string; photoIds: string[] },
  tx: DbOrTx = db,
) {
  if (photoIds.length === 0) return [];
  return tx
    .select({ id: photos.id, status: photos.status })
    .from(photos)
    .where(
      and(
        eq(photos.siteId, siteId),
        inArray(photos.id, photoIds),
        or(eq(photos.memberId, memberId), isNull(photos.memberId)),
        isNull(photos.inspectionId),
      ),
    );
}

export async function attachInspectionPhotos(
  { memberId, inspectionId, photoIds }: { memberId: string; inspectionId: string; photoIds: string[] },
  tx: DbOrTx = db,
) {
  if (photoIds.length === 0) return 0;
  const rows = await tx
    .update(photos)
    .set({ inspectionId, memberId })
    .where(and(inArray(photos.id, photoIds), isNull(photos.inspectionId)))
    .returning({ id: photos.id });
  return rows.length;
}

/** Status change caused by an inspection (out of service on a fail, back to submitted on a pass). */
export async function setMemberStatusForInspection({ memberId, status }: { memberId: string; status: MemberStatus }, tx: DbOrTx) {
  await tx.update(members).set({ status, updatedAt: new Date(), version: sql`${members.version} + 1` }).where(eq(members.id, memberId));
}

/** A member's inspections, newest first, with who did them and their photos. */
export async function listInspections({ memberId }: { memberId: string }, tx: DbOrTx = db) {
  const rows = await tx
    .select({
      id: inspections.id,
      result: inspections.result,
      items: inspections.items,
      notes: inspections.notes,
      inspectedAt: inspections.inspectedAt,
      nextDueAt: inspections.nextDueAt,
      plumbDeg: inspections.plumbDeg,
      plumbOffsetMm: inspections.plumbOffsetMm,
      plumbOverMm: inspections.plumbOverMm,
      inspectorName: users.name,
    })
    .from(inspections)
    .leftJoin(users, eq(users.id, inspections.inspectorId))
    .where(eq(inspections.memberId, memberId))
    .orderBy(desc(inspections.inspectedAt), desc(inspections.createdAt));
  if (rows.length === 0) return [];
  const pics = await tx
    .select({ id: photos.id, inspectionId: photos.inspectionId })
    .from(photos)
    .where(and(inArray(photos.inspectionId, rows.map((r) => r.id)), eq(photos.status, "ready")));
  return rows.map((r) => ({ ...r, photoIds: pics.filter((p) => p.inspectionId === r.id).map((p) => p.id) }));
}

export type RoundRow = {
  memberId: string;
  siteId: string;
  tag: string;
  status: MemberStatus;
  zoneId: string | null;
  zoneName: string | null;
  schemeId: string | null;
  schemeReference: string | null;
  lastResult: "pass" | "fail" | null;
  lastInspectedAt: Date | null;
  nextDueAt: Date | null;
  triggeredAt: Date | null;
  triggerReason: string | null;
  inspectionIntervalDays: number;
  siteTimezone: string;
};

/**
 * Members with their latest inspection and the first coordinator trigger covering them since it
 * (a whole-site trigger or one for their zone). The caller turns this into due/overdue words.
 */
export async function listInspectionRound(
  { siteIds, statuses, zoneId, schemeId }: { siteIds?: string[] | null; statuses: MemberStatus[]; zoneId?: string | null; schemeId?: string | null },
  tx: DbOrTx = db,
): Promise<RoundRow[]> {
  const siteFilter = siteIds ? (siteIds.length ? sql`and m.site_id in (${sql.join(siteIds.map((s) => sql`${s}::uuid`), sql`, `)})` : sql`and false`) : sql``;
  const rows = (await tx.execute(sql`
    select m.id as member_id, m.site_id, m.tag, m.status, m.zone_id, z.name as zone_name, m.scheme_id, sc.reference as scheme_reference,
      li.result as last_result, li.inspected_at as last_inspected_at, li.next_due_at,
      tr.triggered_at, tr.reason as trigger_reason, s.inspection_interval_days, s.timezone as site_timezone
    from members m
    join sites s on s.id = m.site_id
    left join zones z on z.id = m.zone_id
    left join schemes sc on sc.id = m.scheme_id
    left join lateral (
      select i.result, i.inspected_at, i.next_due_at from inspections i
      where i.member_id = m.id order by i.inspected_at desc, i.created_at desc limit 1
    ) li on true
    left join lateral (
      select t.triggered_at, t.reason from inspection_triggers t
      where t.site_id = m.site_id and (t.zone_id is null or t.zone_id = m.zone_id)
        and t.triggered_at > coalesce(li.inspected_at, '-infinity'::timestamptz)
      order by t.triggered_at asc limit 1
    ) tr on true
    where m.status in (${sql.join(statuses.map((s) => sql`${s}::member_status`), sql`, `)})
      ${siteFilter}
      ${zoneId ? sql`and m.zone_id = ${zoneId}::uuid` : sql``}
      ${schemeId ? sql`and m.scheme_id = ${schemeId}::uuid` : sql``}
    order by m.tag`)) as unknown as Record<string, unknown>[];
  return rows.map((r) => ({
    memberId: r.member_id as string,
    siteId: r.site_id as string,
    tag: r.tag as string,
    status: r.status as MemberStatus,
    zoneId: (r.zone_id as string | null) ?? null,
    zoneName: (r.zone_name as string | null) ?? null,
    schemeId: (r.scheme_id as string | null) ?? null,
    schemeReference: (r.scheme_reference as string | null) ?? null,
    lastResult: (r.last_result as "pass" | "fail" | null) ?? null,
    lastInspectedAt: toDate(r.last_inspected_at),
    nextDueAt: toDate(r.next_due_at),
    triggeredAt: toDate(r.triggered_at),
    triggerReason: (r.trigger_reason as string | null) ?? null,
    inspectionIntervalDays: Number(r.inspection_interval_days),
    siteTimezone: r.site_timezone as string,
  }));
}

export async function insertInspectionTrigger(values: typeof inspectionTriggers.$inferInsert, tx: DbOrTx = db) {
  const [row] = await tx.insert(inspectionTriggers).values(values).returning();
  return row!;
}

export async function listRecentTriggers({ siteId, limit = 5 }: { siteId: string; limit?: number }, tx: DbOrTx = db) {
  return tx
    .select({
      id: inspectionTriggers.id,
      reason: inspectionTriggers.reason,
      triggeredAt: inspectionTriggers.triggeredAt,
      zoneName: zones.name,
      triggeredByName: users.name,
    })
    .from(inspectionTriggers)
    .leftJoin(zones, eq(zones.id, inspectionTriggers.zoneId))
    .leftJoin(users, eq(users.id, inspectionTriggers.triggeredBy))
    .where(eq(inspectionTriggers.siteId, siteId))
    .orderBy(desc(inspectionTriggers.triggeredAt))
    .limit(limit);
}

/** Zones and schemes of a site, for the round's filters and the trigger form. */
export async function listRoundFilters({ siteId }: { siteId: string }, tx: DbOrTx = db) {
  const [zs, ss] = await Promise.all([
    tx.select({ id: zones.id, name: zones.name }).from(zones).where(eq(zones.siteId, siteId)).orderBy(zones.name),
    tx.execute(sql`select id, reference, title from schemes where site_id = ${siteId}::uuid order by reference`),
  ]);
  return {
    zones: zs,
    schemes: (ss as unknown as { id: string; reference: string; title: string }[]).map((s) => ({ id: s.id, reference: s.reference, title: s.title })),
  };
}

export async function zoneBelongsToSite({ zoneId, siteId }: { zoneId: string; siteId: string }, tx: DbOrTx = db) {
  const [row] = await tx.select({ id: zones.id, name: zones.name }).from(zones).where(and(eq(zones.id, zoneId), eq(zones.siteId, siteId))).limit(1);
  return row ?? null;
}

/** What the inspect page shows about the member (site access is checked by the caller). */
export async function getMemberForInspection({ memberId, siteId }: { memberId: string; siteId: string }, tx: DbOrTx = db) {
  const rows = (await tx.execute(sql`
    select m.id, m.tag, m.status, m.extension_mm, m.load_n, m.check_pass, m.utilisation, z.name as zone_name, mt.name as member_type_name
    from members m
    join member_types mt on mt.id = m.member_type_id
    left join zones z on z.id = m.zone_id
    where m.id = ${memberId}::uuid and m.site_id = ${siteId}::uuid
    limit 1`)) as unknown as Record<string, unknown>[];
  const r = rows[0];
  if (!r) return null;
  return {
    id: r.id as string,
    tag: r.tag as string,
    status: r.status as MemberStatus,
    extensionMm: Number(r.extension_mm),
    loadN: Number(r.load_n),
    checkPass: (r.check_pass as boolean | null) ?? null,
    utilisation: r.utilisation == null ? null : Number(r.utilisation),
    zoneName: (r.zone_name as string | null) ?? null,
    memberTypeName: r.member_type_name as string,
  };
}

/** The members of a site among `memberIds` (others — another site's, another organisation's, none — are left out), for a bulk record. */
export async function listSiteMembersForInspection({ siteId, memberIds }: { siteId: string; memberIds: string[] }, tx: DbOrTx = db) {
  if (memberIds.length === 0) return [];
  return tx
    .select({ id: members.id, tag: members.tag, status: members.status })
    .from(members)
    .where(and(eq(members.siteId, siteId), inArray(members.id, memberIds)));
}

// What the member record shows about a member's past: its latest inspection, the permits it has
// been on, and the rule for "failing now" that the alerts and the overview counts share.
import "server-only";
import { and, count, desc, eq, inArray, ne, sql, type SQL } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import { db, type DbOrTx } from "@/db";
import { inspections, members, memberTypes, permitMembers, permits, schemes, users, zones } from "@/db/schema";

/**
 * A member failing its capacity check now: every member whose latest check fails, whatever its
 * status — a draft or an imported row is normally already standing on site — except one struck
 * under a permit to strike, which no longer carries anything. The overload sweep, the overview's
 * "overloaded now" list and its "failing the check" count all use this one rule.
 */
export function failingNow(siteId?: string): SQL {
  return and(
    eq(members.checkPass, false),
    ne(members.status, "struck"),
    ...(siteId ? [eq(members.siteId, siteId)] : []),
  )!;
}

export async function countFailingNow({ siteId }: { siteId: string }, tx: DbOrTx = db): Promise<number> {
  const [row] = await tx.select({ n: count() }).from(members).where(failingNow(siteId));
  return row?.n ?? 0;
}

/** The latest inspection of a member and who made it (for the reason a status cannot be edited). */
export async function getLastInspectionSummary({ memberId }: { memberId: string }, tx: DbOrTx = db) {
  const [row] = await tx
    .select({ result: inspections.result, inspectedAt: inspections.inspectedAt, inspectorName: users.name })
    .from(inspections)
    .leftJoin(users, eq(users.id, inspections.inspectorId))
    .where(eq(inspections.memberId, memberId))
    .orderBy(desc(inspections.inspectedAt), desc(inspections.createdAt))
    .limit(1);
  return row ?? null;
}

const requester = alias(users, "requester");
const approver = alias(users, "approver");

/** Every permit that has named this member, newest first, with whether it still covers it. */
export async function listPermitsOfMember({ memberId }: { memberId: string }, tx: DbOrTx = db) {
  return tx
    .select({
      id: permits.id,
      kind: permits.kind,
      number: permits.number,
      status: permits.status,
      requestedAt: permits.requestedAt,
      requestedByName: requester.name,
      issuedAt: permits.issuedAt,
      approvedByName: approver.name,
      validUntil: permits.validUntil,
      closedAt: permits.closedAt,
      struckConfirmedAt: permits.struckConfirmedAt,
      removedAt: permitMembers.removedAt,
      removedReason: permitMembers.removedReason,
    })
    .from(permitMembers)
    .innerJoin(permits, eq(permits.id, permitMembers.permitId))
    .leftJoin(requester, eq(requester.id, permits.requestedBy))
    .leftJoin(approver, eq(approver.id, permits.approvedBy))
    .where(eq(permitMembers.memberId, memberId))
    .orderBy(desc(permits.requestedAt), sql`${permits.id}`);
}

export type MemberPermitRow = Awaited<ReturnType<typeof listPermitsOfMember>>[number];

/** Names for the zone, scheme and member type ids an audit trail mentions (so history never shows an id). */
export async function getNamesForIds(
  { organisationId, siteId, zoneIds, schemeIds, memberTypeIds }: { organisationId: string; siteId: string; zoneIds: string[]; schemeIds: string[]; memberTypeIds: string[] },
  tx: DbOrTx = db,
) {
  const [z, s, t] = await Promise.all([
    zoneIds.length ? tx.select({ id: zones.id, name: zones.name }).from(zones).where(and(eq(zones.siteId, siteId), inArray(zones.id, zoneIds))) : [],
    schemeIds.length
      ? tx.select({ id: schemes.id, reference: schemes.reference, title: schemes.title }).from(schemes).where(and(eq(schemes.siteId, siteId), inArray(schemes.id, schemeIds)))
      : [],
    memberTypeIds.length
      ? tx.select({ id: memberTypes.id, name: memberTypes.name }).from(memberTypes).where(and(eq(memberTypes.organisationId, organisationId), inArray(memberTypes.id, memberTypeIds)))
      : [],
  ]);
  return {
    zone: new Map(z.map((r) => [r.id, r.name])),
    scheme: new Map(s.map((r) => [r.id, `${r.reference} — ${r.title}`])),
    memberType: new Map(t.map((r) => [r.id, r.name])),
  };
}

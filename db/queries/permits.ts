import "server-only";
import { and, asc, desc, eq, gt, inArray, isNull, ne, sql, type SQL } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import { db, type DbOrTx } from "@/db";
import {
  memberTypes, members, permitDelegations, permitMembers, permits, schemeDocuments, schemes, sites, users, zones,
  type Permit, type SiteRole,
} from "@/db/schema";

type MemberStatus = (typeof members.status.enumValues)[number];
type PermitStatus = (typeof permits.status.enumValues)[number];

// ------------------------------------------------------------------ permits
export async function insertPermit(values: typeof permits.$inferInsert, tx: DbOrTx = db): Promise<Permit> {
  const [row] = await tx.insert(permits).values(values).returning();
  return row!;
}

export async function insertPermitMembers({ permitId, memberIds }: { permitId: string; memberIds: string[] }, tx: DbOrTx = db) {
  if (memberIds.length === 0) return;
  await tx.insert(permitMembers).values(memberIds.map((memberId) => ({ permitId, memberId })));
}

/** A permit only when its site belongs to the user's organisation; site access is checked by the caller. */
export async function getPermitForUser({ permitId, organisationId }: { permitId: string; organisationId: string }, tx: DbOrTx = db) {
  const [row] = await tx
    .select({ permit: permits })
    .from(permits)
    .innerJoin(sites, eq(sites.id, permits.siteId))
    .where(and(eq(permits.id, permitId), eq(sites.organisationId, organisationId)))
    .limit(1);
  return row?.permit ?? null;
}

/** Locks the permit row for a state change: a second transaction waits here, then sees the new state. */
export async function getPermitForUpdate({ permitId }: { permitId: string }, tx: DbOrTx) {
  const [row] = await tx.select().from(permits).where(eq(permits.id, permitId)).for("update").limit(1);
  return row ?? null;
}

export async function updatePermit({ permitId, values }: { permitId: string; values: Partial<typeof permits.$inferInsert> }, tx: DbOrTx = db) {
  const [row] = await tx
    .update(permits)
    .set({ ...values, updatedAt: new Date() })
    .where(eq(permits.id, permitId))
    .returning();
  return row!;
}

/** The next value of one of a site's counters. The UPDATE holds the site row's lock until the
 * transaction ends, so concurrent callers queue here, and a rolled-back one gives its number back. */
async function nextSiteCounter(siteId: string, key: "permitCounter" | "requestCounter", tx: DbOrTx) {
  const [row] = await tx
    .update(sites)
    .set({ [key]: sql`${sites[key]} + 1` })
    .where(eq(sites.id, siteId))
    .returning({ n: sites[key] });
  return row!.n;
}

/** Next permit number of a site: no gaps, no repeats. */
export const nextPermitNumber = ({ siteId }: { siteId: string }, tx: DbOrTx) => nextSiteCounter(siteId, "permitCounter", tx);

/** Next permit request number of a site, the same way, in the request's own transaction. */
export const nextRequestNumber = ({ siteId }: { siteId: string }, tx: DbOrTx) => nextSiteCounter(siteId, "requestCounter", tx);

/** Ids of the members in a permit's scope (not removed). */
export async function listPermitMemberIds({ permitId }: { permitId: string }, tx: DbOrTx = db) {
  const rows = await tx
    .select({ id: permitMembers.memberId })
    .from(permitMembers)
    .where(and(eq(permitMembers.permitId, permitId), isNull(permitMembers.removedAt)));
  return rows.map((r) => r.id);
}

/** The person who requested a permit, for e-mails. */
export async function getPermitRequester({ userId }: { userId: string }, tx: DbOrTx = db) {
  const [row] = await tx.select({ id: users.id, email: users.email, name: users.name }).from(users).where(eq(users.id, userId));
  return row ?? null;
}

/** What the issue preconditions need of each scheme, with its latest design check certificate. */
export async function listSchemeFacts({ schemeIds }: { schemeIds: (string | null)[] }, tx: DbOrTx = db) {
  const ids = [...new Set(schemeIds.filter((s): s is string => !!s))];
  if (ids.length === 0) return [];
  return tx
    .select({
      id: schemes.id,
      reference: schemes.reference,
      category: schemes.category,
      certificateKey: schemes.certificateKey,
      validUntil: schemes.validUntil,
      // Qualified by hand: with one table in the query drizzle leaves its columns unqualified, and
      // an unqualified "id" inside the subquery would be the document's own.
      certificate: sql<{ checkerName: string | null; checkCategory: number | null; documentDate: string | null } | null>`(
        select json_build_object('checkerName', d.checker_name, 'checkCategory', d.check_category, 'documentDate', d.document_date)
        from ${schemeDocuments} d where d.scheme_id = "schemes"."id" and d.kind = 'certificate' and d.object_key = "schemes"."certificate_key"
        order by d.created_at desc limit 1)`,
    })
    .from(schemes)
    .where(inArray(schemes.id, ids));
}

/** How many of `zoneIds` are zones of the site. */
export async function countSiteZones({ siteId, zoneIds }: { siteId: string; zoneIds: string[] }, tx: DbOrTx = db) {
  if (zoneIds.length === 0) return 0;
  const [row] = await tx
    .select({ n: sql<number>`count(*)::int` })
    .from(zones)
    .where(and(eq(zones.siteId, siteId), inArray(zones.id, zoneIds)));
  return row?.n ?? 0;
}

/** Issued permits to load that cover any of the members (for closing those left with nothing standing). */
export async function listIssuedLoadPermitsCovering({ memberIds }: { memberIds: string[] }, tx: DbOrTx = db) {
  if (memberIds.length === 0) return [] as string[];
  const rows = await tx
    .selectDistinct({ id: permits.id })
    .from(permitMembers)
    .innerJoin(permits, eq(permits.id, permitMembers.permitId))
    .where(and(inArray(permitMembers.memberId, memberIds), isNull(permitMembers.removedAt), eq(permits.kind, "load"), eq(permits.status, "issued")));
  return rows.map((r) => r.id);
}

/** Members of a permit still standing under it: in scope, not struck and not out of service. */
export async function countStandingMembers({ permitId }: { permitId: string }, tx: DbOrTx = db) {
  const [row] = await tx
    .select({ n: sql<number>`count(*)::int` })
    .from(permitMembers)
    .innerJoin(members, eq(members.id, permitMembers.memberId))
    .where(and(eq(permitMembers.permitId, permitId), isNull(permitMembers.removedAt), sql`${members.status} not in ('struck', 'out_of_service')`));
  return row?.n ?? 0;
}

const requester = alias(users, "requester");
const approver = alias(users, "approver");
const closer = alias(users, "closer");
const striker = alias(users, "striker");

const scopeSize = sql<number>`(select count(*)::int from permit_members pm where pm.permit_id = ${permits.id} and pm.removed_at is null)`;

/** One permit with the names and references its page and PDF show. */
export async function getPermitView({ permitId }: { permitId: string }, tx: DbOrTx = db) {
  const [row] = await tx
    .select({
      permit: permits,
      scopeSize,
      siteName: sites.name,
      siteCode: sites.code,
      siteOrganisationId: sites.organisationId,
      siteUnitSystem: sites.unitSystem,
      siteTimezone: sites.timezone,
      sitePermitValidityHours: sites.permitValidityHours,
      zoneName: zones.name,
      schemeReference: schemes.reference,
      schemeTitle: schemes.title,
      schemeCategory: schemes.category,
      schemeCertificateKey: schemes.certificateKey,
      schemeValidUntil: schemes.validUntil,
      schemeDesignerName: schemes.designerName,
      requestedByName: requester.name,
      requestedByEmail: requester.email,
      approvedByName: approver.name,
      closedByName: closer.name,
      struckConfirmedByName: striker.name,
    })
    .from(permits)
    .innerJoin(sites, eq(sites.id, permits.siteId))
    .leftJoin(zones, eq(zones.id, permits.zoneId))
    .leftJoin(schemes, eq(schemes.id, permits.schemeId))
    .innerJoin(requester, eq(requester.id, permits.requestedBy))
    .leftJoin(approver, eq(approver.id, permits.approvedBy))
    .leftJoin(closer, eq(closer.id, permits.closedBy))
    .leftJoin(striker, eq(striker.id, permits.struckConfirmedBy))
    .where(eq(permits.id, permitId))
    .limit(1);
  return row ?? null;
}
export type PermitView = NonNullable<Awaited<ReturnType<typeof getPermitView>>>;

export type PermitListFilter = {
  siteId: string;
  status?: PermitStatus;
  kind?: "load" | "strike";
  sort?: "requested" | "number" | "status" | "kind" | "scope" | "validUntil";
  dir?: "asc" | "desc";
};

export async function listPermits(f: PermitListFilter, tx: DbOrTx = db) {
  const where: SQL[] = [eq(permits.siteId, f.siteId)];
  if (f.status) where.push(eq(permits.status, f.status));
  if (f.kind) where.push(eq(permits.kind, f.kind));
  const key = {
    requested: permits.requestedAt,
    number: permits.number,
    status: permits.status,
    kind: permits.kind,
    scope: scopeSize,
    validUntil: permits.validUntil,
  }[f.sort ?? "requested"];
  const dir = f.dir === "asc" ? sql`asc nulls last` : sql`desc nulls last`;
  return tx
    .select({
      id: permits.id,
      kind: permits.kind,
      number: permits.number,
      requestNumber: permits.requestNumber,
      status: permits.status,
      requestedAt: permits.requestedAt,
      issuedAt: permits.issuedAt,
      validUntil: permits.validUntil,
      scopeSize,
      zoneName: zones.name,
      schemeReference: schemes.reference,
      requestedByName: requester.name,
      pdfReady: sql<boolean>`${permits.pdfKey} is not null`,
    })
    .from(permits)
    .leftJoin(zones, eq(zones.id, permits.zoneId))
    .leftJoin(schemes, eq(schemes.id, permits.schemeId))
    .innerJoin(requester, eq(requester.id, permits.requestedBy))
    .where(and(...where))
    .orderBy(sql`${key} ${dir}`, desc(permits.requestedAt), asc(permits.id))
    .limit(500);
}

export async function countPermitsAwaitingReview({ siteId }: { siteId: string }, tx: DbOrTx = db) {
  const [row] = await tx
    .select({ n: sql<number>`count(*)::int` })
    .from(permits)
    .where(and(eq(permits.siteId, siteId), eq(permits.status, "requested")));
  return row?.n ?? 0;
}

/** Issued permits whose PDF was not stored yet (rendering failed or the process stopped after commit). */
export async function listPermitsAwaitingPdf({ limit, olderThanSeconds }: { limit: number; olderThanSeconds: number }, tx: DbOrTx = db) {
  return tx
    .select({ id: permits.id })
    .from(permits)
    .where(
      and(
        inArray(permits.status, ["issued", "closed", "withdrawn", "expired"]),
        sql`${permits.issuedAt} < now() - make_interval(secs => ${olderThanSeconds})`,
        isNull(permits.pdfKey),
      ),
    )
    .orderBy(asc(permits.issuedAt))
    .limit(limit);
}

// ------------------------------------------------- expiry and inspections
/** Issued permits with a validity end, with their site's warning time. */
export async function listIssuedPermitsForExpiry({ siteIds }: { siteIds?: string[] | null }, tx: DbOrTx = db) {
  return tx
    .select({
      id: permits.id,
      siteId: permits.siteId,
      kind: permits.kind,
      number: permits.number,
      validUntil: permits.validUntil,
      organisationId: sites.organisationId,
      siteName: sites.name,
      expiryWarningHours: sites.expiryWarningHours,
      siteTimezone: sites.timezone,
    })
    .from(permits)
    .innerJoin(sites, eq(sites.id, permits.siteId))
    .where(and(eq(permits.status, "issued"), sql`${permits.validUntil} is not null`, siteIds ? (siteIds.length ? inArray(permits.siteId, siteIds) : sql`false`) : undefined));
}

/** Marks an issued permit expired; returns nothing when another worker already did. */
export async function expireIssuedPermit({ permitId, now }: { permitId: string; now: Date }, tx: DbOrTx) {
  const [row] = await tx
    .update(permits)
    .set({ status: "expired", updatedAt: now })
    .where(and(eq(permits.id, permitId), eq(permits.status, "issued")))
    .returning({ id: permits.id });
  return row ?? null;
}

/**
 * Members of an expired permit that were loaded under it and are not covered by another permit to
 * load still in force: they go back to submitted.
 */
export async function unloadMembersOfExpiredPermit({ permitId, now }: { permitId: string; now: Date }, tx: DbOrTx) {
  const rows = (await tx.execute(sql`
    update members m set status = 'submitted', updated_at = ${now.toISOString()}::timestamptz, version = m.version + 1
    from permit_members pm
    where pm.permit_id = ${permitId}::uuid and pm.member_id = m.id and pm.removed_at is null and m.status = 'loaded'
      and not exists (
        select 1 from permit_members pm2 join permits p2 on p2.id = pm2.permit_id
        where pm2.member_id = m.id and pm2.removed_at is null and p2.id <> ${permitId}::uuid
          and p2.kind = 'load' and p2.status = 'issued' and p2.valid_until > ${now.toISOString()}::timestamptz)
    returning m.id, m.tag`)) as unknown as { id: string; tag: string }[];
  return rows.map((r) => ({ id: r.id, tag: r.tag }));
}

/**
 * Takes the member out of the scope of every issued permit that still covers it and returns those
 * permits (with their recipients) so they can be told.
 */
export async function removeMemberFromIssuedPermits(
  { memberId, reason, now }: { memberId: string; reason: string; now: Date },
  tx: DbOrTx,
) {
  const covering = await tx
    .select({ id: permits.id, number: permits.number, kind: permits.kind, recipients: permits.recipients, validUntil: permits.validUntil })
    .from(permitMembers)
    .innerJoin(permits, eq(permits.id, permitMembers.permitId))
    .where(and(eq(permitMembers.memberId, memberId), isNull(permitMembers.removedAt), eq(permits.status, "issued")))
    .for("update", { of: permitMembers });
  if (covering.length === 0) return [];
  await tx
    .update(permitMembers)
    .set({ removedAt: now, removedReason: reason })
    .where(and(eq(permitMembers.memberId, memberId), isNull(permitMembers.removedAt), inArray(permitMembers.permitId, covering.map((p) => p.id))));
  return covering;
}

// ---------------------------------------------------------------- members
/** What the request form, the review page and the PDF show for each member. */
function memberReviewColumns(excludePermitId: string | null) {
  return {
    id: members.id,
    siteId: members.siteId,
    tag: members.tag,
    status: members.status,
    zoneId: members.zoneId,
    zoneName: zones.name,
    schemeId: members.schemeId,
    schemeReference: schemes.reference,
    memberTypeName: memberTypes.name,
    extensionMm: members.extensionMm,
    loadN: members.loadN,
    capacityN: members.capacityN,
    utilisation: members.utilisation,
    checkPass: members.checkPass,
    latestCheckId: members.latestCheckId,
    readyPhotos: sql<number>`(select count(*)::int from photos p where p.member_id = ${members.id} and p.status = 'ready')`,
    pendingPhotos: sql<number>`(select count(*)::int from photos p where p.member_id = ${members.id} and p.status = 'pending')`,
    latestInspection: sql<{ result: "pass" | "fail"; inspectedAt: string; nextDueAt: string | null } | null>`(
      select json_build_object('result', i.result, 'inspectedAt', i.inspected_at, 'nextDueAt', i.next_due_at)
      from inspections i where i.member_id = ${members.id}
      order by i.inspected_at desc, i.created_at desc limit 1)`,
    /** Another issued permit of the same kind that already covers the member. */
    coveredBy: sql<{ id: string; kind: "load" | "strike"; number: number | null } | null>`(
      select json_build_object('id', op.id, 'kind', op.kind, 'number', op.number)
      from permit_members opm join permits op on op.id = opm.permit_id
      where opm.member_id = ${members.id} and opm.removed_at is null and op.status = 'issued'
        ${excludePermitId ? sql`and op.id <> ${excludePermitId}::uuid` : sql``}
      order by op.issued_at desc limit 1)`,
  };
}

export type ReviewMember = {
  id: string;
  siteId: string;
  tag: string;
  status: MemberStatus;
  zoneId: string | null;
  zoneName: string | null;
  schemeId: string | null;
  schemeReference: string | null;
  memberTypeName: string;
  extensionMm: number;
  loadN: number;
  capacityN: number | null;
  utilisation: number | null;
  checkPass: boolean | null;
  latestCheckId: string | null;
  readyPhotos: number;
  pendingPhotos: number;
  latestInspection: { result: "pass" | "fail"; inspectedAt: string; nextDueAt: string | null } | null;
  coveredBy: { id: string; kind: "load" | "strike"; number: number | null } | null;
};

function reviewQuery(tx: DbOrTx, excludePermitId: string | null) {
  return tx
    .select(memberReviewColumns(excludePermitId))
    .from(members)
    .innerJoin(memberTypes, eq(memberTypes.id, members.memberTypeId))
    .leftJoin(zones, eq(zones.id, members.zoneId))
    .leftJoin(schemes, eq(schemes.id, members.schemeId));
}

/** The members in a permit's scope (not removed), by tag. */
export async function listPermitMembers({ permitId }: { permitId: string }, tx: DbOrTx = db): Promise<ReviewMember[]> {
  const rows = await reviewQuery(tx, permitId)
    .innerJoin(permitMembers, eq(permitMembers.memberId, members.id))
    .where(and(eq(permitMembers.permitId, permitId), isNull(permitMembers.removedAt)))
    .orderBy(asc(members.tag));
  return rows as ReviewMember[];
}

/** Members of a site by id (only those on the site are returned). */
export async function getSiteMembersForPermit({ siteId, memberIds }: { siteId: string; memberIds: string[] }, tx: DbOrTx = db): Promise<ReviewMember[]> {
  if (memberIds.length === 0) return [];
  const rows = await reviewQuery(tx, null)
    .where(and(eq(members.siteId, siteId), inArray(members.id, memberIds)))
    .orderBy(asc(members.tag));
  return rows as ReviewMember[];
}

/** Members of a scheme in a zone, in the given states. */
export async function listSchemeZoneMembers(
  { siteId, schemeId, zoneId, statuses }: { siteId: string; schemeId: string; zoneId: string; statuses: MemberStatus[] },
  tx: DbOrTx = db,
): Promise<ReviewMember[]> {
  const rows = await reviewQuery(tx, null)
    .where(and(eq(members.siteId, siteId), eq(members.schemeId, schemeId), eq(members.zoneId, zoneId), inArray(members.status, statuses)))
    .orderBy(asc(members.tag));
  return rows as ReviewMember[];
}

/** The site's members a request may name, for the request form (at most `limit`). */
export async function listPermitCandidates(
  { siteId, statuses, limit = 2000 }: { siteId: string; statuses: MemberStatus[]; limit?: number },
  tx: DbOrTx = db,
): Promise<ReviewMember[]> {
  const rows = await reviewQuery(tx, null)
    .where(and(eq(members.siteId, siteId), inArray(members.status, statuses)))
    .orderBy(asc(members.tag))
    .limit(limit);
  return rows as ReviewMember[];
}

/** Locks members (in id order, so two issues never deadlock) while their state is decided. */
export async function lockMembers({ memberIds }: { memberIds: string[] }, tx: DbOrTx) {
  if (memberIds.length === 0) return;
  await tx.select({ id: members.id }).from(members).where(inArray(members.id, memberIds)).orderBy(asc(members.id)).for("update");
}

/** Moves members from one of `from` to `to`; returns the tags that changed with their old state. */
export async function setMembersStatus(
  { memberIds, from, to }: { memberIds: string[]; from: MemberStatus[]; to: MemberStatus },
  tx: DbOrTx = db,
) {
  if (memberIds.length === 0) return [] as { id: string; tag: string }[];
  return tx
    .update(members)
    .set({ status: to, updatedAt: new Date(), version: sql`${members.version} + 1` })
    .where(and(inArray(members.id, memberIds), inArray(members.status, from)))
    .returning({ id: members.id, tag: members.tag });
}

/** Members in `memberIds` still covered by an issued permit of `kind` other than `excludePermitId`. */
export async function membersCoveredByOtherIssued(
  { memberIds, kind, excludePermitId }: { memberIds: string[]; kind: "load" | "strike"; excludePermitId: string },
  tx: DbOrTx = db,
) {
  if (memberIds.length === 0) return new Set<string>();
  const rows = await tx
    .select({ memberId: permitMembers.memberId })
    .from(permitMembers)
    .innerJoin(permits, eq(permits.id, permitMembers.permitId))
    .where(
      and(
        inArray(permitMembers.memberId, memberIds),
        isNull(permitMembers.removedAt),
        eq(permits.kind, kind),
        eq(permits.status, "issued"),
        ne(permits.id, excludePermitId),
      ),
    );
  return new Set(rows.map((r) => r.memberId));
}

// ------------------------------------------------------------ delegations
export async function insertDelegation(values: typeof permitDelegations.$inferInsert, tx: DbOrTx = db) {
  const [row] = await tx.insert(permitDelegations).values(values).returning();
  return row!;
}

const grantor = alias(users, "grantor");

export async function listDelegations({ siteId }: { siteId: string }, tx: DbOrTx = db) {
  return tx
    .select({
      id: permitDelegations.id,
      userId: permitDelegations.userId,
      userName: users.name,
      userEmail: users.email,
      zoneIds: permitDelegations.zoneIds,
      validUntil: permitDelegations.validUntil,
      grantedByName: grantor.name,
      createdAt: permitDelegations.createdAt,
      revokedAt: permitDelegations.revokedAt,
    })
    .from(permitDelegations)
    .innerJoin(users, eq(users.id, permitDelegations.userId))
    .innerJoin(grantor, eq(grantor.id, permitDelegations.grantedBy))
    .where(eq(permitDelegations.siteId, siteId))
    .orderBy(desc(permitDelegations.createdAt));
}

/** A user's delegations on a site that are in date and not revoked. */
export async function listActiveDelegations({ siteId, userId, now }: { siteId: string; userId: string; now: Date }, tx: DbOrTx = db) {
  return tx
    .select({ id: permitDelegations.id, zoneIds: permitDelegations.zoneIds, validUntil: permitDelegations.validUntil })
    .from(permitDelegations)
    .where(
      and(
        eq(permitDelegations.siteId, siteId),
        eq(permitDelegations.userId, userId),
        isNull(permitDelegations.revokedAt),
        gt(permitDelegations.validUntil, now),
      ),
    );
}

export async function getDelegationForUser({ delegationId, organisationId }: { delegationId: string; organisationId: string }, tx: DbOrTx = db) {
  const [row] = await tx
    .select({ d: permitDelegations })
    .from(permitDelegations)
    .innerJoin(sites, eq(sites.id, permitDelegations.siteId))
    .where(and(eq(permitDelegations.id, delegationId), eq(sites.organisationId, organisationId)))
    .limit(1);
  return row?.d ?? null;
}

export async function revokeDelegation({ delegationId, at }: { delegationId: string; at: Date }, tx: DbOrTx = db) {
  const [row] = await tx
    .update(permitDelegations)
    .set({ revokedAt: at })
    .where(and(eq(permitDelegations.id, delegationId), isNull(permitDelegations.revokedAt)))
    .returning();
  return row ?? null;
}

export type { SiteRole };

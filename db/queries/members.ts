import "server-only";
import { and, eq, inArray, sql } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import { db, type DbOrTx } from "@/db";
import { members, memberTypes, schemes, sites, users, zones, type Member, type NewMember } from "@/db/schema";

const memberColumns = {
  id: members.id,
  siteId: members.siteId,
  tag: members.tag,
  schemeId: members.schemeId,
  zoneId: members.zoneId,
  memberTypeId: members.memberTypeId,
  extensionMm: members.extensionMm,
  endConditions: members.endConditions,
  spacingXMm: members.spacingXMm,
  spacingYMm: members.spacingYMm,
  loadSource: members.loadSource,
  level: members.level,
  loadN: members.loadN,
  status: members.status,
  latestCheckId: members.latestCheckId,
  capacityN: members.capacityN,
  utilisation: members.utilisation,
  checkPass: members.checkPass,
  planX: members.planX,
  planY: members.planY,
  notes: members.notes,
  outOfPlumbDeg: members.outOfPlumbDeg,
  base: members.base,
  installedBy: members.installedBy,
  installedAt: members.installedAt,
  createdBy: members.createdBy,
  clientId: members.clientId,
  version: members.version,
  createdAt: members.createdAt,
  updatedAt: members.updatedAt,
};

const creator = alias(users, "creator");

/** The member row with the names a screen shows beside it. */
const viewColumns = {
  ...memberColumns,
  zoneName: zones.name,
  schemeReference: schemes.reference,
  schemeTitle: schemes.title,
  memberTypeName: memberTypes.name,
  memberTypeKind: memberTypes.kind,
  createdByName: creator.name,
};

export type MemberRow = Member;
export type MemberView = Member & {
  zoneName: string | null;
  schemeReference: string | null;
  schemeTitle: string | null;
  memberTypeName: string;
  memberTypeKind: (typeof memberTypes.$inferSelect)["kind"];
  createdByName: string | null;
};

function viewQuery(tx: DbOrTx) {
  return tx
    .select(viewColumns)
    .from(members)
    .innerJoin(sites, eq(sites.id, members.siteId))
    .innerJoin(memberTypes, eq(memberTypes.id, members.memberTypeId))
    .leftJoin(zones, eq(zones.id, members.zoneId))
    .leftJoin(schemes, eq(schemes.id, members.schemeId))
    .leftJoin(creator, eq(creator.id, members.createdBy));
}

/** A member only when its site belongs to the user's organisation; site access is checked by the caller. */
export async function getMemberForUser({ memberId, organisationId }: { memberId: string; organisationId: string }, tx: DbOrTx = db): Promise<MemberView | null> {
  const [row] = await viewQuery(tx).where(and(eq(members.id, memberId), eq(sites.organisationId, organisationId))).limit(1);
  return (row as MemberView | undefined) ?? null;
}

export async function getMemberView({ memberId }: { memberId: string }, tx: DbOrTx = db): Promise<MemberView | null> {
  const [row] = await viewQuery(tx).where(eq(members.id, memberId)).limit(1);
  return (row as MemberView | undefined) ?? null;
}

/** Locks the row for an edit so two edits of the same member cannot interleave. */
export async function getMemberForUpdate({ memberId }: { memberId: string }, tx: DbOrTx) {
  const [row] = await tx.select(memberColumns).from(members).where(eq(members.id, memberId)).for("update").limit(1);
  return (row as Member | undefined) ?? null;
}

export async function getMemberIdByTag({ siteId, tag }: { siteId: string; tag: string }, tx: DbOrTx = db) {
  const [row] = await tx
    .select({ id: members.id })
    .from(members)
    .where(and(eq(members.siteId, siteId), sql`lower(${members.tag}) = lower(${tag})`))
    .limit(1);
  return row?.id ?? null;
}

export async function insertMember(values: NewMember, tx: DbOrTx = db): Promise<Member> {
  const [row] = await tx.insert(members).values(values).returning(memberColumns);
  return row as Member;
}

export async function updateMemberRow({ memberId, values }: { memberId: string; values: Partial<NewMember> }, tx: DbOrTx = db): Promise<Member> {
  const [row] = await tx
    .update(members)
    .set({ ...values, updatedAt: new Date(), version: sql`${members.version} + 1` })
    .where(eq(members.id, memberId))
    .returning(memberColumns);
  return row as Member;
}

/** The member a phone already created with this clientId on this site (a retried create), if any. */
export async function getMemberIdByClientId({ siteId, clientId }: { siteId: string; clientId: string }, tx: DbOrTx = db) {
  const [row] = await tx
    .select({ id: members.id })
    .from(members)
    .where(and(eq(members.siteId, siteId), eq(members.clientId, clientId)))
    .limit(1);
  return row?.id ?? null;
}

/** Every member of a type, with what its check needs from its site (for re-checking after a type edit). */
export async function listMembersOfTypeForCheck({ memberTypeId }: { memberTypeId: string }, tx: DbOrTx = db) {
  return tx
    .select({
      ...memberColumns,
      siteOrganisationId: sites.organisationId,
      siteDesignCode: sites.designCode,
      siteUnitSystem: sites.unitSystem,
    })
    .from(members)
    .innerJoin(sites, eq(sites.id, members.siteId))
    .where(eq(members.memberTypeId, memberTypeId))
    .for("update", { of: members });
}

/** Members of a scheme whose load is derived from it (its slab or its back-propping), locked for a re-check. */
export async function listMembersOfSchemeForCheck({ schemeId, loadSources }: { schemeId: string; loadSources: Member["loadSource"][] }, tx: DbOrTx) {
  return tx
    .select(memberColumns)
    .from(members)
    .where(and(eq(members.schemeId, schemeId), inArray(members.loadSource, loadSources)))
    .orderBy(members.tag)
    .for("update");
}

/** Stores the denormalised result of many re-checks at once. */
export async function setLatestChecks(
  rows: { memberId: string; checkId: string; capacityN: number | null; utilisation: number | null; pass: boolean }[],
  tx: DbOrTx = db,
) {
  for (let i = 0; i < rows.length; i += 1000) {
    const chunk = rows.slice(i, i + 1000);
    const values = sql.join(
      chunk.map((r) => sql`(${r.memberId}::uuid, ${r.checkId}::uuid, ${r.capacityN}::float8, ${r.utilisation}::float8, ${r.pass}::boolean)`),
      sql`, `,
    );
    await tx.execute(sql`
      update ${members} as m set
        latest_check_id = v.check_id, capacity_n = v.capacity_n, utilisation = v.utilisation, check_pass = v.pass, updated_at = now(), version = m.version + 1
      from (values ${values}) as v(member_id, check_id, capacity_n, utilisation, pass)
      where m.id = v.member_id`);
  }
}

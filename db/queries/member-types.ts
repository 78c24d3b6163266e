import "server-only";
import { and, asc, count, eq, isNull } from "drizzle-orm";
import { db, type DbOrTx } from "@/db";
import { members, memberTypes } from "@/db/schema";

const typeColumns = {
  id: memberTypes.id,
  organisationId: memberTypes.organisationId,
  name: memberTypes.name,
  kind: memberTypes.kind,
  supplier: memberTypes.supplier,
  params: memberTypes.params,
  minExtensionMm: memberTypes.minExtensionMm,
  maxExtensionMm: memberTypes.maxExtensionMm,
  notes: memberTypes.notes,
  revision: memberTypes.revision,
  archivedAt: memberTypes.archivedAt,
  createdAt: memberTypes.createdAt,
  updatedAt: memberTypes.updatedAt,
};

export type MemberTypeView = typeof memberTypes.$inferSelect;

/** The organisation's library (not archived), with how many members use each type. */
export async function listMemberTypes({ organisationId }: { organisationId: string }, tx: DbOrTx = db) {
  const rows = await tx
    .select(typeColumns)
    .from(memberTypes)
    .where(and(eq(memberTypes.organisationId, organisationId), isNull(memberTypes.archivedAt)))
    .orderBy(asc(memberTypes.kind), asc(memberTypes.name));
  const counts = await tx
    .select({ typeId: members.memberTypeId, n: count() })
    .from(members)
    .innerJoin(memberTypes, eq(memberTypes.id, members.memberTypeId))
    .where(eq(memberTypes.organisationId, organisationId))
    .groupBy(members.memberTypeId);
  const by = new Map(counts.map((c) => [c.typeId, c.n]));
  return rows.map((r) => ({ ...r, memberCount: by.get(r.id) ?? 0 }));
}

/** A type only when it belongs to the organisation (archived types are not offered for new members). */
export async function getMemberType(
  { organisationId, memberTypeId, includeArchived = false }: { organisationId: string; memberTypeId: string; includeArchived?: boolean },
  tx: DbOrTx = db,
) {
  const [row] = await tx
    .select(typeColumns)
    .from(memberTypes)
    .where(and(eq(memberTypes.id, memberTypeId), eq(memberTypes.organisationId, organisationId), includeArchived ? undefined : isNull(memberTypes.archivedAt)))
    .limit(1);
  return row ?? null;
}

export async function getMemberTypeByName({ organisationId, name }: { organisationId: string; name: string }, tx: DbOrTx = db) {
  const [row] = await tx
    .select(typeColumns)
    .from(memberTypes)
    .where(and(eq(memberTypes.organisationId, organisationId), eq(memberTypes.name, name)))
    .limit(1);
  return row ?? null;
}

export async function countMembersOfType({ memberTypeId }: { memberTypeId: string }, tx: DbOrTx = db) {
  const [row] = await tx.select({ n: count() }).from(members).where(eq(members.memberTypeId, memberTypeId));
  return row?.n ?? 0;
}

export type MemberTypeValues = {
  name: string;
  kind: (typeof memberTypes.$inferInsert)["kind"];
  supplier: string | null;
  params: Record<string, unknown>;
  minExtensionMm: number | null;
  maxExtensionMm: number | null;
  notes: string | null;
};

export async function insertMemberType(values: MemberTypeValues & { organisationId: string }, tx: DbOrTx = db) {
  const [row] = await tx.insert(memberTypes).values(values).returning(typeColumns);
  return row!;
}

export async function updateMemberTypeRow(
  { organisationId, memberTypeId, values }: { organisationId: string; memberTypeId: string; values: MemberTypeValues & { revision: number } },
  tx: DbOrTx = db,
) {
  const [row] = await tx
    .update(memberTypes)
    .set({ ...values, updatedAt: new Date() })
    .where(and(eq(memberTypes.id, memberTypeId), eq(memberTypes.organisationId, organisationId)))
    .returning(typeColumns);
  return row ?? null;
}

export async function deleteMemberTypeRow({ organisationId, memberTypeId }: { organisationId: string; memberTypeId: string }, tx: DbOrTx = db) {
  const rows = await tx
    .delete(memberTypes)
    .where(and(eq(memberTypes.id, memberTypeId), eq(memberTypes.organisationId, organisationId)))
    .returning({ id: memberTypes.id });
  return rows.length > 0;
}

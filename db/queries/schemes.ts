import "server-only";
import { and, asc, count, eq } from "drizzle-orm";
import { db, type DbOrTx } from "@/db";
import { members, schemes } from "@/db/schema";

const schemeColumns = {
  id: schemes.id,
  siteId: schemes.siteId,
  reference: schemes.reference,
  title: schemes.title,
  designerName: schemes.designerName,
  designerUserId: schemes.designerUserId,
  category: schemes.category,
  designLoadN: schemes.designLoadN,
  designSpacingXMm: schemes.designSpacingXMm,
  designSpacingYMm: schemes.designSpacingYMm,
  slabThicknessMm: schemes.slabThicknessMm,
  concreteDensityKnM3: schemes.concreteDensityKnM3,
  formworkKnM2: schemes.formworkKnM2,
  constructionKnM2: schemes.constructionKnM2,
  backprop: schemes.backprop,
  validFrom: schemes.validFrom,
  validUntil: schemes.validUntil,
  drawingKey: schemes.drawingKey,
  certificateKey: schemes.certificateKey,
  createdAt: schemes.createdAt,
  updatedAt: schemes.updatedAt,
};


export async function listSchemes({ siteId }: { siteId: string }, tx: DbOrTx = db) {
  const rows = await tx.select(schemeColumns).from(schemes).where(eq(schemes.siteId, siteId)).orderBy(asc(schemes.reference));
  const counts = await tx.select({ schemeId: members.schemeId, n: count() }).from(members).where(eq(members.siteId, siteId)).groupBy(members.schemeId);
  const by = new Map(counts.map((c) => [c.schemeId, c.n]));
  return rows.map((r) => ({ ...r, memberCount: by.get(r.id) ?? 0 }));
}

/** A scheme only when it belongs to the given site. */
export async function getScheme({ siteId, schemeId }: { siteId: string; schemeId: string }, tx: DbOrTx = db) {
  const [row] = await tx.select(schemeColumns).from(schemes).where(and(eq(schemes.id, schemeId), eq(schemes.siteId, siteId))).limit(1);
  return row ?? null;
}

export async function getSchemeByReference({ siteId, reference }: { siteId: string; reference: string }, tx: DbOrTx = db) {
  const [row] = await tx.select(schemeColumns).from(schemes).where(and(eq(schemes.siteId, siteId), eq(schemes.reference, reference))).limit(1);
  return row ?? null;
}

export type SchemeValues = Omit<typeof schemes.$inferInsert, "id" | "siteId" | "createdAt" | "updatedAt" | "createdBy">;

export async function insertScheme(values: SchemeValues & { siteId: string; createdBy: string }, tx: DbOrTx = db) {
  const [row] = await tx.insert(schemes).values(values).returning(schemeColumns);
  return row!;
}

export async function updateScheme({ siteId, schemeId, values }: { siteId: string; schemeId: string; values: Partial<SchemeValues> }, tx: DbOrTx = db) {
  const [row] = await tx
    .update(schemes)
    .set({ ...values, updatedAt: new Date() })
    .where(and(eq(schemes.id, schemeId), eq(schemes.siteId, siteId)))
    .returning(schemeColumns);
  return row ?? null;
}

export type SchemeView = NonNullable<Awaited<ReturnType<typeof getScheme>>>;

import "server-only";
import { and, desc, eq } from "drizzle-orm";
import { db, type DbOrTx } from "@/db";
import { schemeDocuments, users } from "@/db/schema";

export async function insertSchemeDocument(values: typeof schemeDocuments.$inferInsert, tx: DbOrTx = db) {
  const [row] = await tx.insert(schemeDocuments).values(values).returning();
  return row!;
}

/** A scheme's documents of one kind (or all), newest first, with who uploaded each. */
export async function listSchemeDocuments({ schemeId, kind }: { schemeId: string; kind?: "drawing" | "certificate" }, tx: DbOrTx = db) {
  return tx
    .select({
      id: schemeDocuments.id,
      kind: schemeDocuments.kind,
      objectKey: schemeDocuments.objectKey,
      contentType: schemeDocuments.contentType,
      sizeBytes: schemeDocuments.sizeBytes,
      drawingNumber: schemeDocuments.drawingNumber,
      revision: schemeDocuments.revision,
      checkerName: schemeDocuments.checkerName,
      checkCategory: schemeDocuments.checkCategory,
      documentDate: schemeDocuments.documentDate,
      signedImageConfirmed: schemeDocuments.signedImageConfirmed,
      uploadedByName: users.name,
      createdAt: schemeDocuments.createdAt,
    })
    .from(schemeDocuments)
    .leftJoin(users, eq(users.id, schemeDocuments.uploadedBy))
    .where(kind ? and(eq(schemeDocuments.schemeId, schemeId), eq(schemeDocuments.kind, kind)) : eq(schemeDocuments.schemeId, schemeId))
    .orderBy(desc(schemeDocuments.createdAt), desc(schemeDocuments.id));
}
export type SchemeDocumentRow = Awaited<ReturnType<typeof listSchemeDocuments>>[number];

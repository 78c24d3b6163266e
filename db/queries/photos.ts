import "server-only";
import { and, asc, eq, inArray, isNull } from "drizzle-orm";
import { db, type DbOrTx } from "@/db";
import { photos, sites, users, type Photo } from "@/db/schema";

export type NewPhoto = typeof photos.$inferInsert;

export async function insertPhoto(values: NewPhoto, tx: DbOrTx = db): Promise<Photo> {
  const [row] = await tx.insert(photos).values(values).returning();
  return row!;
}

/**
 * Records a pending photo once per (site, clientId): a retried start (even at the same moment)
 * gets the photo recorded first. `created` says whether this call made it.
 */
export async function insertPhotoOnce(values: NewPhoto & { clientId: string }, tx: DbOrTx = db): Promise<{ photo: Photo; created: boolean }> {
  const [row] = await tx.insert(photos).values(values).onConflictDoNothing({ target: [photos.siteId, photos.clientId] }).returning();
  if (row) return { photo: row, created: true };
  const [first] = await tx.select().from(photos).where(and(eq(photos.siteId, values.siteId), eq(photos.clientId, values.clientId))).limit(1);
  return { photo: first!, created: false };
}

/** Marks a pending photo ready; null when another request finished (or refused) it first. */
export async function finishPendingPhoto({ photoId, values }: { photoId: string; values: Partial<NewPhoto> }, tx: DbOrTx = db): Promise<Photo | null> {
  const [row] = await tx.update(photos).set(values).where(and(eq(photos.id, photoId), eq(photos.status, "pending"))).returning();
  return row ?? null;
}

export async function getPhoto({ photoId }: { photoId: string }, tx: DbOrTx = db): Promise<Photo | null> {
  const [row] = await tx.select().from(photos).where(eq(photos.id, photoId)).limit(1);
  return row ?? null;
}

/** A photo only when its site belongs to the user's organisation; site access is checked by the caller. */
export async function getPhotoForUser({ photoId, organisationId }: { photoId: string; organisationId: string }, tx: DbOrTx = db): Promise<Photo | null> {
  const [row] = await tx
    .select({ photo: photos })
    .from(photos)
    .innerJoin(sites, eq(sites.id, photos.siteId))
    .where(and(eq(photos.id, photoId), eq(sites.organisationId, organisationId)))
    .limit(1);
  return row?.photo ?? null;
}

export async function updatePhoto({ photoId, values }: { photoId: string; values: Partial<NewPhoto> }, tx: DbOrTx = db): Promise<Photo> {
  const [row] = await tx.update(photos).set(values).where(eq(photos.id, photoId)).returning();
  return row!;
}

/** The ready photos of a member, oldest first, with who took them. */
export async function listPhotos({ memberId }: { memberId: string }, tx: DbOrTx = db) {
  return tx
    .select({
      id: photos.id,
      thumbnailKey: photos.thumbnailKey,
      displayKey: photos.displayKey,
      contentType: photos.contentType,
      sizeBytes: photos.sizeBytes,
      width: photos.width,
      height: photos.height,
      takenAt: photos.takenAt,
      createdAt: photos.createdAt,
      sha256: photos.sha256,
      uploadedByName: users.name,
    })
    .from(photos)
    .leftJoin(users, eq(users.id, photos.uploadedBy))
    .where(and(eq(photos.memberId, memberId), eq(photos.status, "ready")))
    .orderBy(asc(photos.createdAt));
}

/** Photos by id on a site (for attaching uploads made before the member existed). */
export async function getPhotosByIds({ siteId, photoIds }: { siteId: string; photoIds: string[] }, tx: DbOrTx = db) {
  if (photoIds.length === 0) return [];
  return tx
    .select({ id: photos.id, memberId: photos.memberId, status: photos.status, inspectionId: photos.inspectionId })
    .from(photos)
    .where(and(eq(photos.siteId, siteId), inArray(photos.id, photoIds)));
}

export async function attachPhotos({ siteId, memberId, photoIds }: { siteId: string; memberId: string; photoIds: string[] }, tx: DbOrTx = db) {
  if (photoIds.length === 0) return 0;
  const rows = await tx
    .update(photos)
    .set({ memberId })
    .where(and(eq(photos.siteId, siteId), inArray(photos.id, photoIds), isNull(photos.memberId)))
    .returning({ id: photos.id });
  return rows.length;
}

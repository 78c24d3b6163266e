// The photo pipeline: a presigned PUT straight to the store, then a confirm step that checks
// the object, makes the copies and records the photo. The app server never carries the upload.
import "server-only";
import { randomUUID } from "node:crypto";
import { transaction } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { finishPendingPhoto, getPhoto, insertPhoto, insertPhotoOnce, updatePhoto } from "@/db/queries/photos";
import type { SessionUser } from "@/db/queries/users";
import type { Photo } from "@/db/schema";
import { ValidationError } from "@/lib/errors";
import { deleteObject, getObject, headObject, presignGet, presignPut, putObject } from "@/lib/storage";
import { MAX_PHOTO_BYTES, type PhotoPresignInput } from "@/lib/validations/member";
import { processPhoto } from "./process";

export { MAX_PHOTO_BYTES };

export type PhotoView = {
  id: string;
  status: Photo["status"];
  memberId: string | null;
  contentType: string | null;
  sizeBytes: number | null;
  width: number | null;
  height: number | null;
  takenAt: Date | null;
  sha256: string | null;
  rejectReason: string | null;
  thumbnailUrl: string | null;
  displayUrl: string | null;
  createdAt: Date;
};

export async function photoView(p: Pick<Photo, "id" | "status" | "memberId" | "contentType" | "sizeBytes" | "width" | "height" | "takenAt" | "sha256" | "rejectReason" | "thumbnailKey" | "displayKey" | "createdAt">): Promise<PhotoView> {
  return {
    id: p.id,
    status: p.status,
    memberId: p.memberId,
    contentType: p.contentType,
    sizeBytes: p.sizeBytes,
    width: p.width,
    height: p.height,
    takenAt: p.takenAt,
    sha256: p.sha256,
    rejectReason: p.rejectReason,
    thumbnailUrl: p.thumbnailKey ? await presignGet(p.thumbnailKey) : null,
    displayUrl: p.displayKey ? await presignGet(p.displayKey) : null,
    createdAt: p.createdAt,
  };
}

/**
 * Starts an upload: records a pending photo and returns the URL the browser PUTs the bytes to.
 * The caller (a route on the seam in lib/api/route.ts) has already found the site and checked the role.
 */
export async function presignPhoto(args: { user: SessionUser; site: { id: string }; memberId?: string | null; input: PhotoPresignInput }) {
  const { contentType, size, clientId } = args.input;
  const photoId = randomUUID();
  const objectKey = `sites/${args.site.id}/photos/${photoId}/original`;
  const values = {
    id: photoId,
    siteId: args.site.id,
    memberId: args.memberId ?? null,
    uploadedBy: args.user.id,
    objectKey,
    declaredContentType: contentType,
    sizeBytes: size,
    status: "pending" as const,
  };
  // With a clientId, a start retried after a lost answer gets the photo recorded first (and a fresh URL).
  const { photo, created } = clientId ? await insertPhotoOnce({ ...values, clientId }) : { photo: await insertPhoto(values), created: true };
  const type = photo.declaredContentType ?? contentType;
  const uploadUrl = await presignPut(photo.objectKey, type);
  return {
    photoId: photo.id,
    uploadUrl,
    method: "PUT" as const,
    headers: { "content-type": type },
    maxBytes: MAX_PHOTO_BYTES,
    status: photo.status,
    replayed: !created,
  };
}

async function reject(photo: Photo, reason: string): Promise<never> {
  await updatePhoto({ photoId: photo.id, values: { status: "rejected", rejectReason: reason } });
  await deleteObject(photo.objectKey).catch(() => undefined);
  throw new ValidationError({ photo: reason }, reason);
}

/** Confirms an upload: checks size and type from the stored bytes, makes the copies, records it. */
export async function completePhoto(args: { user: SessionUser; photo: Photo }): Promise<PhotoView> {
  const { user, photo } = args;
  const photoId = photo.id;
  if (photo.status === "ready") return photoView(photo);
  if (photo.status === "rejected") throw new ValidationError({ photo: photo.rejectReason ?? "This photo was refused." }, photo.rejectReason ?? "This photo was refused.");

  const head = await headObject(photo.objectKey);
  if (!head) throw new ValidationError({ photo: "The photo has not arrived in the store yet; upload it again (the form keeps everything else)." });
  const declared = photo.sizeBytes ?? 0;
  if (head.size > MAX_PHOTO_BYTES) await reject(photo, `The uploaded file is ${(head.size / 1048576).toFixed(1)} MB; photos may be at most 15 MB.`);
  if (head.size > declared) await reject(photo, `The uploaded file is ${head.size} bytes, larger than the ${declared} bytes declared when the upload started; upload it again.`);
  if (head.size < declared) await reject(photo, `The upload is incomplete (${head.size} of ${declared} bytes arrived); retry it.`);

  const bytes = await getObject(photo.objectKey);
  const out = await processPhoto(bytes);
  if (!out.ok) return reject(photo, out.reason);
  const p = out.photo;
  const base = photo.objectKey.replace(/\/original$/, "");
  const displayKey = `${base}/display.jpg`;
  const thumbnailKey = `${base}/thumb.jpg`;
  await Promise.all([
    putObject(photo.objectKey, p.original, "image/jpeg"),
    putObject(displayKey, p.display, "image/jpeg"),
    putObject(thumbnailKey, p.thumbnail, "image/jpeg"),
  ]);
  const updated = await transaction(async (tx) => {
    // Only a still-pending photo is finished here: a completion sent twice at once records one photo and one audit row.
    const row = await finishPendingPhoto({
    photoId,
    values: {
      status: "ready",
      contentType: p.contentType,
      sha256: p.sha256,
      width: p.width,
      height: p.height,
      takenAt: p.takenAt,
      displayKey,
      thumbnailKey,
      sizeBytes: head.size,
    },
  }, tx);
    if (!row) return null;
    // A photo added to an existing member is a change to that member's record.
    if (row.memberId) {
      await recordAudit(
        { organisationId: user.organisationId, siteId: row.siteId, actorId: user.id, action: "member.photo_added", entityType: "member", entityId: row.memberId, after: { photoId: row.id, sha256: row.sha256, takenAt: row.takenAt } },
        tx,
      );
    }
    return row;
  });
  if (updated) return photoView(updated);
  const now = (await getPhoto({ photoId }))!;
  if (now.status === "rejected") throw new ValidationError({ photo: now.rejectReason ?? "This photo was refused." }, now.rejectReason ?? "This photo was refused.");
  return photoView(now);
}

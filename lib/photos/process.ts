// What happens to a photo's bytes once they are in the store: the type is read from the bytes
// (never from the name or the declared type), then a thumbnail and a display copy are made with
// every metadata block (location included) dropped, and the time the photo was taken is kept.
import { createHash } from "node:crypto";
import exifReader from "exif-reader";
import sharp from "sharp";

export const THUMBNAIL_PX = 320;
export const DISPLAY_PX = 1600;

const ACCEPTED: Record<string, string> = { jpeg: "image/jpeg", png: "image/png", webp: "image/webp", heif: "image/heif", avif: "image/avif" };

export type ProcessedPhoto = {
  contentType: string;
  width: number;
  height: number;
  sha256: string;
  takenAt: Date | null;
  /** Full-size copy, re-encoded without metadata; replaces the upload so no location survives in the store. */
  original: Buffer;
  display: Buffer;
  thumbnail: Buffer;
};

export type ProcessOutcome = { ok: true; photo: ProcessedPhoto } | { ok: false; reason: string };

/** Reads DateTimeOriginal (or DateTime) from an EXIF block; null when absent or unreadable. */
export function exifTakenAt(exif: Buffer | undefined): Date | null {
  if (!exif) return null;
  try {
    const tags = exifReader(exif);
    const d = tags.Photo?.DateTimeOriginal ?? tags.Photo?.DateTimeDigitized ?? tags.Image?.DateTime;
    return d instanceof Date && Number.isFinite(d.getTime()) ? d : null;
  } catch {
    return null;
  }
}

export async function processPhoto(bytes: Buffer): Promise<ProcessOutcome> {
  let meta: Awaited<ReturnType<ReturnType<typeof sharp>["metadata"]>>;
  try {
    meta = await sharp(bytes).metadata();
  } catch {
    return { ok: false, reason: "The file is not an image: its contents are not a JPEG, PNG, WebP or HEIF photo, whatever its name or declared type says." };
  }
  const contentType = meta.format ? ACCEPTED[meta.format] : undefined;
  if (!contentType) {
    return { ok: false, reason: `The file is a ${String(meta.format ?? "unknown").toUpperCase()} image; only JPEG, PNG, WebP or HEIF photos are accepted.` };
  }
  if (!meta.width || !meta.height) return { ok: false, reason: "The image has no readable size; take the photo again." };
  try {
    // rotate() applies the EXIF orientation; sharp writes no metadata unless asked, so GPS and
    // every other EXIF tag are left behind in all three copies.
    const base = sharp(bytes, { failOn: "error" }).rotate();
    const [original, display, thumbnail] = await Promise.all([
      base.clone().flatten({ background: "#ffffff" }).jpeg({ quality: 90 }).toBuffer(),
      base.clone().resize(DISPLAY_PX, DISPLAY_PX, { fit: "inside", withoutEnlargement: true }).flatten({ background: "#ffffff" }).jpeg({ quality: 82 }).toBuffer(),
      base.clone().resize(THUMBNAIL_PX, THUMBNAIL_PX, { fit: "cover" }).flatten({ background: "#ffffff" }).jpeg({ quality: 75 }).toBuffer(),
    ]);
    const rotated = (meta.orientation ?? 1) >= 5;
    return {
      ok: true,
      photo: {
        contentType,
        width: rotated ? meta.height : meta.width,
        height: rotated ? meta.width : meta.height,
        sha256: createHash("sha256").update(bytes).digest("hex"),
        takenAt: exifTakenAt(meta.exif),
        original,
        display,
        thumbnail,
      },
    };
  } catch {
    return { ok: false, reason: `The ${contentType.replace("image/", "").toUpperCase()} file is damaged or cut short and cannot be read; take or upload it again.` };
  }
}

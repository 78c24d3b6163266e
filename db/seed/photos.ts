// Demo photos: generated images (a coloured canvas with a drawn prop and its tag), never real
// photographs, put in the store with their thumbnail and display copies like an upload would be.
import { randomUUID } from "node:crypto";
import sharp from "sharp";
import { ne } from "drizzle-orm";
import * as schema from "@/db/schema";
import type { Tx } from "@/db";
import { processPhoto } from "@/lib/photos/process";
import { putObject } from "@/lib/storage";

/** The member left without a photo, so a permit request can show the "no photo" refusal. */
export const MEMBER_WITHOUT_PHOTO = "WXW-L2-P05";

const COLOURS = ["#6d7b8d", "#7f6f5f", "#5f7f6f", "#8d7b6d", "#6f6f8f"];

function escapeXml(s: string) {
  return s.replace(/[<>&"']/g, (c) => ({ "<": "&lt;", ">": "&gt;", "&": "&amp;", '"': "&quot;", "'": "&apos;" })[c]!);
}

export async function demoPhotoJpeg(tag: string, n: number): Promise<Buffer> {
  const w = 800;
  const h = 600;
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${w}" height="${h}">
    <rect x="0" y="0" width="${w}" height="70" fill="#d9d6cf"/>
    <rect x="0" y="${h - 60}" width="${w}" height="60" fill="#9a958b"/>
    <rect x="${380 + (n % 3) * 10}" y="70" width="26" height="230" fill="#e8a317" stroke="#333" stroke-width="3"/>
    <rect x="${386 + (n % 3) * 10}" y="300" width="14" height="240" fill="#c0c4c9" stroke="#333" stroke-width="3"/>
    <rect x="330" y="532" width="140" height="12" fill="#444"/>
    <rect x="330" y="64" width="140" height="12" fill="#444"/>
    <rect x="40" y="440" width="300" height="80" rx="8" fill="#ffffff" stroke="#14161a" stroke-width="4"/>
    <text x="190" y="493" font-family="sans-serif" font-size="40" font-weight="700" text-anchor="middle" fill="#14161a">${escapeXml(tag)}</text>
    <text x="${w - 20}" y="40" font-family="sans-serif" font-size="20" text-anchor="end" fill="#14161a">demo image — generated</text>
  </svg>`;
  return sharp({ create: { width: w, height: h, channels: 3, background: COLOURS[n % COLOURS.length]! } })
    .composite([{ input: Buffer.from(svg), top: 0, left: 0 }])
    .jpeg({ quality: 80 })
    .toBuffer();
}

export async function seedPhotos(tx: Tx, { uploadedBy, now }: { uploadedBy: string; now: number }) {
  const rows = await tx
    .select({ id: schema.members.id, tag: schema.members.tag, siteId: schema.members.siteId, installedAt: schema.members.installedAt })
    .from(schema.members)
    .where(ne(schema.members.tag, MEMBER_WITHOUT_PHOTO));
  let count = 0;
  // A few at a time: the seed must stay fast, and the store is on loopback.
  for (let i = 0; i < rows.length; i += 8) {
    const batch = rows.slice(i, i + 8);
    const values = await Promise.all(
      batch.map(async (m, j) => {
        const bytes = await demoPhotoJpeg(m.tag, i + j);
        const out = await processPhoto(bytes);
        if (!out.ok) throw new Error(`demo photo for ${m.tag}: ${out.reason}`);
        const id = randomUUID();
        const base = `sites/${m.siteId}/photos/${id}`;
        await Promise.all([
          putObject(`${base}/original`, out.photo.original, "image/jpeg"),
          putObject(`${base}/display.jpg`, out.photo.display, "image/jpeg"),
          putObject(`${base}/thumb.jpg`, out.photo.thumbnail, "image/jpeg"),
        ]);
        return {
          id,
          siteId: m.siteId,
          memberId: m.id,
          uploadedBy,
          objectKey: `${base}/original`,
          displayKey: `${base}/display.jpg`,
          thumbnailKey: `${base}/thumb.jpg`,
          contentType: out.photo.contentType,
          declaredContentType: "image/jpeg",
          sizeBytes: bytes.length,
          sha256: out.photo.sha256,
          width: out.photo.width,
          height: out.photo.height,
          takenAt: m.installedAt ?? new Date(now),
          status: "ready" as const,
        };
      }),
    );
    await tx.insert(schema.photos).values(values);
    count += values.length;
  }
  return count;
}



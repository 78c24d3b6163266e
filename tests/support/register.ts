// Shared look-ups for the register's integration tests: demo sites, zones, schemes and types by name.
import sharp from "sharp";
import { signInAs, type Client } from "./http";

export const WHARF = "Wexcombe Wharf — Block B";
export const ORCHARD = "Orchard Row Basement";
export const ROLES = ["engineer", "coordinator", "supervisor", "designer", "manager", "admin"] as const;
export type Role = (typeof ROLES)[number];

const clients = new Map<string, Client>();
export async function as(who: Role | "other"): Promise<Client> {
  const email = who === "other" ? "admin@other.example" : `${who}@demo.example`;
  if (!clients.has(email)) clients.set(email, await signInAs(email));
  return clients.get(email)!;
}

export async function siteId(name = WHARF): Promise<string> {
  const c = await as("manager");
  const r = await c.json<{ items: { id: string; name: string }[] }>("/api/v1/sites");
  const s = r.body.items.find((x) => x.name === name);
  if (!s) throw new Error(`demo site ${name} not found`);
  return s.id;
}

export async function lookups(site: string) {
  const c = await as("manager");
  const [zones, schemes, types] = await Promise.all([
    c.json<{ items: { id: string; name: string }[] }>(`/api/v1/sites/${site}/zones`),
    c.json<{ items: { id: string; reference: string; slabThicknessMm: number | null }[] }>(`/api/v1/sites/${site}/schemes`),
    c.json<{ items: { id: string; name: string; kind: string }[] }>(`/api/v1/sites/${site}/member-types`),
  ]);
  const type = (prefix: string) => types.body.items.find((t) => t.name.startsWith(prefix))!.id;
  return {
    zone: (name: string) => zones.body.items.find((z) => z.name === name)!.id,
    scheme: (ref: string) => schemes.body.items.find((s) => s.reference === ref)!.id,
    type,
    propD: type("EN 1065 class D"),
    zones: zones.body.items,
    types: types.body.items,
  };
}

let n = 0;
export function uniqueTag(prefix = "IT") {
  n += 1;
  return `${prefix}-${Date.now().toString(36).toUpperCase()}-${n}`;
}

/** A small generated JPEG, optionally with EXIF that includes a taken-at time and GPS position. */
export async function jpeg({ exif = false, size = 64 }: { exif?: boolean; size?: number } = {}): Promise<Buffer> {
  let img = sharp({ create: { width: size, height: size, channels: 3, background: "#3366aa" } }).jpeg();
  if (exif) {
    img = img.withExif({
      IFD0: { Make: "TestCam" },
      IFD2: { DateTimeOriginal: "2024:05:06 07:08:09" },
      IFD3: { GPSLatitudeRef: "N", GPSLatitude: "51/1 30/1 0/1", GPSLongitudeRef: "W", GPSLongitude: "0/1 7/1 0/1" },
    });
  }
  return img.toBuffer();
}

/** Presign → PUT → complete, as the phone does. */
export async function uploadPhoto(c: Client, presignPath: string, bytes: Buffer, contentType = "image/jpeg", declaredSize = bytes.length) {
  const start = await c.json<{ photoId: string; uploadUrl: string }>(presignPath, { method: "POST", body: { contentType, size: declaredSize } });
  if (start.status !== 201) return { start, put: null, complete: null };
  const put = await fetch(start.body.uploadUrl, { method: "PUT", headers: { "content-type": contentType }, body: new Uint8Array(bytes) });
  const complete = await c.json<{ photo: { id: string; thumbnailUrl: string; displayUrl: string; takenAt: string | null; status: string }; error?: { message: string; fields?: Record<string, string> } }>(
    `/api/v1/photos/${start.body.photoId}/complete`,
    { method: "POST" },
  );
  return { start, put, complete };
}

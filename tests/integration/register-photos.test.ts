// Photos: presigned PUT straight to the store, then a confirm step that reads the bytes. Not an
// image, too large or larger than declared is refused with the reason; location data is removed.
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql } from "@/db";
import { anonymous } from "../support/http";
import { as, jpeg, lookups, ROLES, siteId, uniqueTag, uploadPhoto } from "../support/fixtures";

afterAll(async () => {
  await sql.end({ timeout: 5 });
});

let site: string;
let L: Awaited<ReturnType<typeof lookups>>;
beforeAll(async () => {
  site = await siteId();
  L = await lookups(site);
});

const memberBody = (photoIds: string[]) => ({
  tag: uniqueTag("PH"), zoneId: L.zone("Level 1 slab, bays 1–4"), memberTypeId: L.propD, extensionMm: 2500, loadN: 7000, photoIds,
});

describe("photo uploads", () => {
  it("takes a JPEG through presign, PUT and confirm; makes a thumbnail and display copy without location data; keeps the taken-at time", async () => {
    const engineer = await as("engineer");
    const original = await jpeg({ exif: true, size: 400 });
    expect((await sharp(original).metadata()).exif).toBeDefined(); // the fixture really carries EXIF
    const { start, put, complete } = await uploadPhoto({ by: engineer, presignPath: `/api/v1/sites/${site}/photos`, bytes: original });
    expect(start.status).toBe(201);
    expect(put!.status).toBe(200);
    expect(complete!.status).toBe(200);
    const photo = complete!.body.photo;
    expect(photo.status).toBe("ready");
    expect(new Date(photo.takenAt!).toISOString()).toBe("2024-05-06T07:08:09.000Z");
    for (const url of [photo.thumbnailUrl, photo.displayUrl]) {
      const res = await fetch(url);
      expect(res.status).toBe(200);
      const meta = await sharp(Buffer.from(await res.arrayBuffer())).metadata();
      expect(meta.format).toBe("jpeg");
      expect(meta.exif).toBeUndefined();
    }
    const [row] = await sql<{ object_key: string; sha256: string; width: number }[]>`select object_key, sha256, width from photos where id = ${photo.id}`;
    expect(row!.sha256).toMatch(/^[0-9a-f]{64}$/);
    expect(row!.width).toBe(400);

    // The photo is attached when the member is logged, and shows on the member.
    const created = await engineer.json<{ member: { id: string } }>(`/api/v1/sites/${site}/members`, { method: "POST", body: memberBody([photo.id]) });
    expect(created.status).toBe(201);
    const read = await engineer.json<{ photos: { id: string; thumbnailUrl: string }[] }>(`/api/v1/members/${created.body.member.id}`);
    expect(read.body.photos.map((p) => p.id)).toEqual([photo.id]);
    // …and cannot be attached to a second member.
    const again = await engineer.json<{ error: { fields: Record<string, string> } }>(`/api/v1/sites/${site}/members`, { method: "POST", body: memberBody([photo.id]) });
    expect(again.status).toBe(422);
    expect(again.body.error.fields.photoIds).toMatch(/already belongs to another member/);
  });

  it("refuses a file that is not an image, whatever type it was declared as", async () => {
    const { start, complete } = await uploadPhoto({ by: await as("engineer"), presignPath: `/api/v1/sites/${site}/photos`, bytes: Buffer.from("these are not the bytes of a photograph"), contentType: "image/jpeg" });
    expect(complete!.status).toBe(422);
    expect(complete!.body.error?.fields?.photo).toMatch(/not an image/);
    const [row] = await sql<{ status: string; reject_reason: string }[]>`select status, reject_reason from photos where id = ${start.body.photoId}`;
    expect(row!.status).toBe("rejected");
    expect(row!.reject_reason).toMatch(/not an image/);
  });

  it("refuses a photo declared over 15 MB at presign, and one larger than declared at confirm", async () => {
    const engineer = await as("engineer");
    const big = await engineer.json<{ error: { fields: Record<string, string> } }>(`/api/v1/sites/${site}/photos`, { method: "POST", body: { contentType: "image/jpeg", size: 16 * 1024 * 1024 } });
    expect(big.status).toBe(422);
    expect(big.body.error.fields.size).toMatch(/larger than 15 MB/);
    const bytes = await jpeg({ size: 200 });
    const { complete } = await uploadPhoto({ by: engineer, presignPath: `/api/v1/sites/${site}/photos`, bytes, contentType: "image/jpeg", declaredSize: 100 });
    expect(complete!.status).toBe(422);
    expect(complete!.body.error?.fields?.photo).toMatch(/larger than the 100 bytes declared/);
    const notPhoto = await engineer.json<{ error: { fields: Record<string, string> } }>(`/api/v1/sites/${site}/photos`, { method: "POST", body: { contentType: "application/pdf", size: 100 } });
    expect(notPhoto.status).toBe(422);
    expect(notPhoto.body.error.fields.contentType).toMatch(/Only photos/);
  });

  it("role matrix: site photos for those who log members; member photos for those who edit them; 404 across organisations", async () => {
    for (const role of ROLES) {
      const r = await (await as(role)).json(`/api/v1/sites/${site}/photos`, { method: "POST", body: { contentType: "image/jpeg", size: 1000 } });
      expect(r.status, role).toBe(["engineer", "coordinator", "supervisor"].includes(role) ? 201 : 403);
    }
    expect((await anonymous().json(`/api/v1/sites/${site}/photos`, { method: "POST", body: { contentType: "image/jpeg", size: 1000 } })).status).toBe(401);
    expect((await (await as("other")).json(`/api/v1/sites/${site}/photos`, { method: "POST", body: { contentType: "image/jpeg", size: 1000 } })).status).toBe(404);

    const engineer = await as("engineer");
    const created = await engineer.json<{ member: { id: string } }>(`/api/v1/sites/${site}/members`, { method: "POST", body: memberBody([]) });
    const memberPath = `/api/v1/members/${created.body.member.id}/photos`;
    for (const role of ROLES) {
      const r = await (await as(role)).json(memberPath, { method: "POST", body: { contentType: "image/jpeg", size: 1000 } });
      expect(r.status, role).toBe(["engineer", "coordinator", "supervisor"].includes(role) ? 201 : 403);
    }
    expect((await (await as("other")).json(memberPath, { method: "POST", body: { contentType: "image/jpeg", size: 1000 } })).status).toBe(404);

    // A photo added to an existing member is confirmed, attached and audited.
    const { complete } = await uploadPhoto({ by: await as("supervisor"), presignPath: memberPath, bytes: await jpeg() });
    expect(complete!.status).toBe(200);
    expect((await (await as("other")).json(`/api/v1/photos/${complete!.body.photo.id}/complete`, { method: "POST" })).status).toBe(404);
    const read = await engineer.json<{ photos: { id: string }[] }>(`/api/v1/members/${created.body.member.id}`);
    expect(read.body.photos).toHaveLength(1);
    const audit = await sql<{ action: string }[]>`select action from audit_events where entity_id = ${created.body.member.id} order by id`;
    expect(audit.map((a) => a.action)).toEqual(["member.created", "member.photo_added"]);
  });
});


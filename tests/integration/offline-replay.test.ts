// Replay-safe writes for a phone that lost its answer: a create carrying a clientId the server has
// already stored returns the record made the first time (200) and creates nothing — whether the
// retry comes after the first answer or at the same moment. An edit based on an old version is
// refused with the member as it is now. Counts are read back through the API, as a phone would.
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql } from "@/db";
import type { Client } from "../support/http";
import { as, jpeg, lookups, siteId, uniqueTag } from "../support/fixtures";

afterAll(async () => {
  await sql.end({ timeout: 5 });
});

let site: string;
let L: Awaited<ReturnType<typeof lookups>>;
let engineer: Client;
beforeAll(async () => {
  site = await siteId();
  L = await lookups(site);
  engineer = await as("engineer");
});

type MemberAnswer = { member: { id: string; tag: string; version: number; clientId: string | null }; check: { id: string; pass: boolean } | null };
type ErrorAnswer = { error: { code: string; message: string; fields?: Record<string, string>; current?: { member: { id: string; version: number; notes: string | null } } } };

const memberBody = (tag: string, clientId?: string) => ({
  tag, zoneId: L.zone("Level 1 slab, bays 1–4"), memberTypeId: L.propD, extensionMm: 2500, loadN: 7000, ...(clientId ? { clientId } : {}),
});
const logMember = (body: unknown) => engineer.json<MemberAnswer & ErrorAnswer>(`/api/v1/sites/${site}/members`, { method: "POST", body });
/** How many members with this tag the register lists (the register search, not the database). */
async function registerCount(tag: string) {
  const r = await engineer.json<{ items: { id: string; tag: string }[] }>(`/api/v1/sites/${site}/members?q=${encodeURIComponent(tag)}`);
  expect(r.status).toBe(200);
  return r.body.items.filter((m) => m.tag === tag).length;
}
const inspect = (memberId: string, body: unknown) =>
  engineer.json<{ inspection: { id: string; result: string; notes: string | null; photoIds: string[] }; member: { status: string } } & ErrorAnswer>(
    `/api/v1/members/${memberId}/inspections`,
    { method: "POST", body },
  );
const inspectionCount = async (memberId: string) =>
  (await engineer.json<{ items: unknown[] }>(`/api/v1/members/${memberId}/inspections`)).body.items.length;

describe("POST /api/v1/sites/{siteId}/members with a clientId", () => {
  it("a retry after the first answer returns the same member (200) and the register lists it once", async () => {
    const tag = uniqueTag("RP");
    const clientId = randomUUID();
    const first = await logMember(memberBody(tag, clientId));
    expect(first.status).toBe(201);
    expect(first.body.member.clientId).toBe(clientId);
    const again = await logMember(memberBody(tag, clientId));
    expect(again.status).toBe(200);
    expect(again.body.member.id).toBe(first.body.member.id);
    expect(again.body.check?.id).toBe(first.body.check?.id);
    expect(await registerCount(tag)).toBe(1);
  });

  it("two identical requests at the same moment make one member; both get it", async () => {
    const tag = uniqueTag("RC");
    const clientId = randomUUID();
    const [a, b] = await Promise.all([logMember(memberBody(tag, clientId)), logMember(memberBody(tag, clientId))]);
    expect([a.status, b.status].sort()).toEqual([200, 201]);
    expect(a.body.member.id).toBe(b.body.member.id);
    expect(await registerCount(tag)).toBe(1);
  });

  it("a different clientId with a taken tag is still refused with the reason (422 on tag), nothing stored", async () => {
    const tag = uniqueTag("RT");
    expect((await logMember(memberBody(tag, randomUUID()))).status).toBe(201);
    const other = await logMember(memberBody(tag, randomUUID()));
    expect(other.status).toBe(422);
    expect(other.body.error.fields?.tag).toMatch(/already on this site's register/);
    expect(await registerCount(tag)).toBe(1);
  });

  it("a clientId that is not a UUID is a 422 on clientId", async () => {
    const r = await logMember(memberBody(uniqueTag("RB"), "phone-123"));
    expect(r.status).toBe(422);
    expect(r.body.error.fields?.clientId).toMatch(/UUID/);
  });
});

describe("POST /api/v1/members/{memberId}/inspections with a clientId", () => {
  it("a retry returns the inspection recorded first (200), and two at once record one", async () => {
    const m = await logMember(memberBody(uniqueTag("RI")));
    const memberId = m.body.member.id;
    const clientId = randomUUID();
    const body = { result: "pass", notes: "Checked in the basement, no signal", clientId };
    const first = await inspect(memberId, body);
    expect(first.status).toBe(201);
    const again = await inspect(memberId, body);
    expect(again.status).toBe(200);
    expect(again.body.inspection.id).toBe(first.body.inspection.id);
    expect(again.body.inspection.notes).toBe("Checked in the basement, no signal");
    expect(await inspectionCount(memberId)).toBe(1);

    const twin = { result: "pass", clientId: randomUUID() };
    const [a, b] = await Promise.all([inspect(memberId, twin), inspect(memberId, twin)]);
    expect([a.status, b.status].sort()).toEqual([200, 201]);
    expect(a.body.inspection.id).toBe(b.body.inspection.id);
    expect(await inspectionCount(memberId)).toBe(2);
  });
});

describe("photo upload with a clientId, and completion replayed", () => {
  it("a retried start returns the same photo; completion twice (and twice at once) gives one ready photo with its thumbnail", async () => {
    const bytes = await jpeg({ size: 120 });
    const clientId = randomUUID();
    const start = () =>
      engineer.json<{ photoId: string; uploadUrl: string; status: string }>(`/api/v1/sites/${site}/photos`, {
        method: "POST",
        body: { contentType: "image/jpeg", size: bytes.length, clientId },
      });
    const s1 = await start();
    expect(s1.status).toBe(201);
    const s2 = await start();
    expect(s2.status).toBe(200);
    expect(s2.body.photoId).toBe(s1.body.photoId);
    expect(s2.body.status).toBe("pending");
    const put = await fetch(s2.body.uploadUrl, { method: "PUT", headers: { "content-type": "image/jpeg" }, body: new Uint8Array(bytes) });
    expect(put.status).toBe(200);

    const complete = () =>
      engineer.json<{ photo: { id: string; status: string; thumbnailUrl: string | null } }>(`/api/v1/photos/${s1.body.photoId}/complete`, { method: "POST" });
    const [c1, c2] = await Promise.all([complete(), complete()]);
    expect([c1.status, c2.status]).toEqual([200, 200]);
    expect(c1.body.photo.status).toBe("ready");
    expect(c2.body.photo.id).toBe(c1.body.photo.id);
    const c3 = await complete();
    expect(c3.status).toBe(200);
    expect(c3.body.photo.status).toBe("ready");
    const thumb = await fetch(c3.body.photo.thumbnailUrl!);
    expect(thumb.status).toBe(200);

    // Once ready, starting again with the same clientId still answers with that photo, not a new upload.
    const s3 = await start();
    expect(s3.status).toBe(200);
    expect(s3.body.photoId).toBe(s1.body.photoId);
    expect(s3.body.status).toBe("ready");

    // The member logged with it (and logged again by a retry) shows it exactly once.
    const tag = uniqueTag("RPH");
    const memberClientId = randomUUID();
    const body = { ...memberBody(tag, memberClientId), photoIds: [s1.body.photoId] };
    const m1 = await logMember(body);
    expect(m1.status).toBe(201);
    const m2 = await logMember(body);
    expect(m2.status).toBe(200);
    const detail = await engineer.json<{ photos: { id: string; thumbnailUrl: string | null }[] }>(`/api/v1/members/${m1.body.member.id}`);
    expect(detail.body.photos.map((p) => p.id)).toEqual([s1.body.photoId]);
    expect(detail.body.photos[0]!.thumbnailUrl).toBeTruthy();
  });
});

describe("PATCH /api/v1/members/{memberId} with baseVersion", () => {
  it("an edit based on the current version saves and moves the version on; one based on an older version is a 409 with the member as it is now, nothing saved", async () => {
    const m = await logMember(memberBody(uniqueTag("RV")));
    const id = m.body.member.id;
    const v0 = m.body.member.version;
    const desk = await engineer.json<MemberAnswer>(`/api/v1/members/${id}`, { method: "PATCH", body: { notes: "Edited at the desk", baseVersion: v0 } });
    expect(desk.status).toBe(200);
    expect(desk.body.member.version).toBeGreaterThan(v0);

    // The phone edited the copy it loaded before the desk edit.
    const phone = await engineer.json<ErrorAnswer>(`/api/v1/members/${id}`, { method: "PATCH", body: { notes: "Edited on the phone", baseVersion: v0 } });
    expect(phone.status).toBe(409);
    expect(phone.body.error.code).toBe("conflict");
    expect(phone.body.error.message).toMatch(/changed by someone else/);
    expect(phone.body.error.current?.member.id).toBe(id);
    expect(phone.body.error.current?.member.notes).toBe("Edited at the desk");
    expect(phone.body.error.current?.member.version).toBe(desk.body.member.version);

    const read = await engineer.json<{ member: { notes: string | null; version: number } }>(`/api/v1/members/${id}`);
    expect(read.body.member.notes).toBe("Edited at the desk");
    expect(read.body.member.version).toBe(desk.body.member.version);
  });

  it("a member whose status changed on the server (an inspection took it out of service) refuses the old-version edit too", async () => {
    const m = await logMember(memberBody(uniqueTag("RS")));
    const id = m.body.member.id;
    const v0 = m.body.member.version;
    const failed = await inspect(id, { result: "fail", items: [{ check: "plumb", result: "fail", note: "Leaning" }] });
    expect(failed.status).toBe(201);
    const r = await engineer.json<ErrorAnswer>(`/api/v1/members/${id}`, { method: "PATCH", body: { extensionMm: 2600, baseVersion: v0 } });
    expect(r.status).toBe(409);
    expect((r.body.error.current as unknown as { member: { status: string } }).member.status).toBe("out_of_service");
  });

  it("a baseVersion that is not a whole number is a 422 on baseVersion", async () => {
    const m = await logMember(memberBody(uniqueTag("RW")));
    const r = await engineer.json<ErrorAnswer>(`/api/v1/members/${m.body.member.id}`, { method: "PATCH", body: { notes: "x", baseVersion: "latest" } });
    expect(r.status).toBe(422);
    expect(r.body.error.fields?.baseVersion).toBeTruthy();
  });
});

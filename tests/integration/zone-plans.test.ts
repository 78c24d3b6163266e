// Zone plans: upload through the presigned path (type read from the bytes, size limits, a one-page
// PDF rendered on the server, non-images refused), members placed on the plan (fractions 0–1,
// validated; another site's or organisation's member is not found), and the plan's pins carrying
// each member's current check.
import { createElement as h } from "react";
import { Document, Page, Text, View, renderToBuffer } from "@react-pdf/renderer";
import { and, eq } from "drizzle-orm";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db, sql } from "@/db";
import { auditEvents } from "@/db/schema";
import { CAUTION_TEXT } from "@/lib/caution";
import { as, makeMember, pdfText, personWithRole, post, siteId, uniqueTag, ORCHARD, type ApiErr } from "../support/fixtures";
import type { Client } from "../support/http";

afterAll(async () => {
  await sql.end({ timeout: 5 });
});

type Pin = { memberId: string; tag: string; x: number; y: number; status: string; pass: boolean | null; utilisation: number | null; word: string };
type Plan = { imageUrl: string | null; width: number | null; height: number | null; sourceType: string | null; scale: unknown; pins: Pin[]; unpinned: Omit<Pin, "x" | "y">[]; total: number };

let site: string;
let zone: { id: string; name: string };
let bareZone: { id: string; name: string };

async function makeZone(label: string) {
  const coordinator = await as("coordinator");
  const name = uniqueTag(`Plan zone ${label}`);
  const res = await post<{ zone: { id: string; name: string } }>(coordinator, `/api/v1/sites/${site}/zones`, { name, level: "L9" });
  expect(res.status).toBe(201);
  return res.body.zone;
}

/** A drawing of our own: a white sheet with grid lines, as PNG (or another format). */
function drawing({ width = 1200, height = 800, format = "png" }: { width?: number; height?: number; format?: "png" | "jpeg" | "webp" | "gif" } = {}) {
  const lines = [0.25, 0.5, 0.75].map((f) => `<line x1="${f * width}" y1="0" x2="${f * width}" y2="${height}" stroke="#333" stroke-width="4"/>`).join("");
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}"><rect width="100%" height="100%" fill="#fff"/>${lines}</svg>`;
  return sharp(Buffer.from(svg)).toFormat(format).toBuffer();
}

function pdf(pages: number) {
  const doc = h(Document, null, ...Array.from({ length: pages }, (_, i) => h(Page, { key: i, size: "A4", orientation: "landscape" }, h(View, { style: { margin: 40, borderWidth: 2, height: 300 } }, h(Text, null, `Plan sheet ${i + 1}`)))));
  return renderToBuffer(doc);
}

async function upload({ by, zoneId = zone.id, bytes, contentType, declaredSize = bytes.length, scale }: { by: Client; zoneId?: string; bytes: Buffer; contentType: string; declaredSize?: number; scale?: unknown }) {
  const start = await post<{ key: string; uploadUrl: string; headers: Record<string, string> } & ApiErr>(by, `/api/v1/sites/${site}/zones/${zoneId}/plan`, { contentType, size: declaredSize });
  if (start.status !== 200) return { start, complete: null };
  const put = await fetch(start.body.uploadUrl, { method: "PUT", headers: start.body.headers, body: new Uint8Array(bytes) });
  expect(put.status).toBe(200);
  const complete = await post<Plan & ApiErr>(by, `/api/v1/sites/${site}/zones/${zoneId}/plan/complete`, { key: start.body.key, ...(scale === undefined ? {} : { scale }) });
  return { start, complete };
}

beforeAll(async () => {
  site = await siteId();
  zone = await makeZone("A");
  bareZone = await makeZone("bare");
});

describe("plan upload", () => {
  it("takes a PNG declared as a JPEG: the type is read from the bytes, the image is served back at its size, and the upload is audited", async () => {
    const designer = await as("designer");
    const bytes = await drawing({ width: 1200, height: 800 });
    const scale = { x1: 0.25, y1: 0.1, x2: 0.75, y2: 0.1, distanceMm: 6000 };
    const { start, complete } = await upload({ by: designer, bytes, contentType: "image/jpeg", scale });
    expect(start.status).toBe(200);
    expect(complete!.status).toBe(200);
    expect(complete!.body).toMatchObject({ width: 1200, height: 800, sourceType: "image/png", scale });
    const img = await fetch(complete!.body.imageUrl!);
    expect(img.status).toBe(200);
    const meta = await sharp(Buffer.from(await img.arrayBuffer())).metadata();
    expect([meta.format, meta.width, meta.height]).toEqual(["png", 1200, 800]);

    const manager = await as("manager");
    const seen = await manager.json<Plan>(`/api/v1/sites/${site}/zones/${zone.id}/plan`);
    expect(seen.status).toBe(200);
    expect(seen.body.width).toBe(1200);

    const audit = await db.select().from(auditEvents).where(and(eq(auditEvents.entityId, zone.id), eq(auditEvents.action, "zone.plan_uploaded")));
    expect(audit.length).toBeGreaterThanOrEqual(1);
    expect(audit.at(-1)!.after).toMatchObject({ planSourceType: "image/png", planWidth: 1200 });
  });

  it("scales a large image down so its longest side is at most 4000 px, keeping its proportions", async () => {
    const other = await makeZone("big");
    const { complete } = await upload({ by: await as("coordinator"), zoneId: other.id, bytes: await drawing({ width: 6000, height: 3000, format: "jpeg" }), contentType: "image/jpeg" });
    expect(complete!.status).toBe(200);
    expect(complete!.body).toMatchObject({ width: 4000, height: 2000, sourceType: "image/jpeg" });
  });

  it("renders a one-page PDF to an image on the server", async () => {
    const other = await makeZone("pdf");
    const { complete } = await upload({ by: await as("designer"), zoneId: other.id, bytes: await pdf(1), contentType: "application/pdf" });
    expect(complete!.status).toBe(200);
    expect(complete!.body.sourceType).toBe("application/pdf");
    // A4 landscape is 842 × 595 pt (ISO 216: 297 × 210 mm); the render keeps that shape.
    expect(complete!.body.width! / complete!.body.height!).toBeCloseTo(297 / 210, 1);
    expect(Math.max(complete!.body.width!, complete!.body.height!)).toBeLessThanOrEqual(4000);
    const img = await fetch(complete!.body.imageUrl!);
    expect((await sharp(Buffer.from(await img.arrayBuffer())).metadata()).format).toBe("png");
  });

  it("refuses a PDF of more than one page, a file that is not an image and an image of another kind, with the reason; the zone's plan is unchanged", async () => {
    const designer = await as("designer");
    const two = await upload({ by: designer, bytes: await pdf(2), contentType: "application/pdf" });
    expect(two.complete!.status).toBe(422);
    expect(two.complete!.body.error.fields!.file).toMatch(/2 pages/);

    const text = await upload({ by: designer, bytes: Buffer.from("grid A-D, bays 1-4\n".repeat(50)), contentType: "image/png" });
    expect(text.complete!.status).toBe(422);
    expect(text.complete!.body.error.fields!.file).toMatch(/neither an image nor a PDF/);

    const gif = await upload({ by: designer, bytes: await drawing({ format: "gif" }), contentType: "image/gif" });
    expect(gif.complete!.status).toBe(422);
    expect(gif.complete!.body.error.fields!.file).toMatch(/GIF/);

    const now = await designer.json<Plan>(`/api/v1/sites/${site}/zones/${zone.id}/plan`);
    expect(now.body).toMatchObject({ width: 1200, height: 800, sourceType: "image/png" });
  });

  it("refuses a declared size over 20 MB, a file over 20 MB once stored, and a content type that is neither image nor PDF", async () => {
    const designer = await as("designer");
    const tooBig = await post<ApiErr>(designer, `/api/v1/sites/${site}/zones/${zone.id}/plan`, { contentType: "image/png", size: 20 * 1024 * 1024 + 1 });
    expect(tooBig.status).toBe(422);
    expect(tooBig.body.error.fields!.size).toMatch(/20 MB/);
    const word = await post<ApiErr>(designer, `/api/v1/sites/${site}/zones/${zone.id}/plan`, { contentType: "application/msword", size: 1000 });
    expect(word.status).toBe(422);
    expect(word.body.error.fields!.contentType).toMatch(/image .* or a one-page PDF/);

    // Declared small, but 21 MB arrive: the stored object is what counts.
    const big = Buffer.alloc(21 * 1024 * 1024, 0x20);
    const { complete } = await upload({ by: designer, bytes: big, contentType: "image/png", declaredSize: 1000 });
    expect(complete!.status).toBe(422);
    expect(complete!.body.error.fields!.file).toMatch(/21\.0 MB; a plan may be at most 20 MB/);
  });

  it("lets designers, coordinators and admins upload; engineers, supervisors and managers get 403; another organisation gets 404", async () => {
    for (const role of ["engineer", "supervisor", "manager"] as const) {
      const res = await post<ApiErr>(await as(role), `/api/v1/sites/${site}/zones/${zone.id}/plan`, { contentType: "image/png", size: 100 });
      expect(res.status, role).toBe(403);
    }
    const admin = await post(await as("admin"), `/api/v1/sites/${site}/zones/${zone.id}/plan`, { contentType: "image/png", size: 100 });
    expect(admin.status).toBe(200);
    const other = await (await as("other")).json(`/api/v1/sites/${site}/zones/${zone.id}/plan`);
    expect(other.status).toBe(404);
  });

  it("refuses a key started for another zone", async () => {
    const designer = await as("designer");
    const start = await post<{ key: string }>(designer, `/api/v1/sites/${site}/zones/${bareZone.id}/plan`, { contentType: "image/png", size: 100 });
    const res = await post<ApiErr>(designer, `/api/v1/sites/${site}/zones/${zone.id}/plan/complete`, { key: start.body.key });
    expect(res.status).toBe(422);
    expect(res.body.error.fields!.key).toMatch(/does not belong to this zone/);
  });
});

describe("placing members on the plan", () => {
  it("stores a place given as fractions, lists it as a pin with the member's current check, and takes it off with null", async () => {
    const engineer = await as("engineer");
    const m = await makeMember({ zone: zone.name, loadN: 6000 });
    const res = await engineer.json<{ member: { planX: number; planY: number } }>(`/api/v1/members/${m.id}`, { method: "PATCH", body: { planPosition: { x: 0.4, y: 0.25 } } });
    expect(res.status).toBe(200);
    expect(res.body.member).toMatchObject({ planX: 0.4, planY: 0.25 });

    // The fixture's load makes the edit below re-check it: EN 1065 class B props carry tens of kN
    // at most (value to be confirmed against EN 1065 Table 2), so 200 kN is far over capacity.
    const over = await engineer.json<{ check: { pass: boolean; utilisation: number } }>(`/api/v1/members/${m.id}`, { method: "PATCH", body: { loadN: 200_000 } });
    expect(over.status).toBe(200);
    expect(over.body.check.pass).toBe(false);

    const plan = await engineer.json<Plan>(`/api/v1/sites/${site}/zones/${zone.id}/plan`);
    const pin = plan.body.pins.find((p) => p.memberId === m.id)!;
    expect(pin).toMatchObject({ tag: m.tag, x: 0.4, y: 0.25, status: "submitted", pass: false, word: "Fail" });
    expect(pin.utilisation).toBeCloseTo(over.body.check.utilisation, 6);
    expect(pin.utilisation).toBeGreaterThan(1);
    expect(plan.body.unpinned.some((u) => u.memberId === m.id)).toBe(false);

    const failing = await engineer.json<Plan>(`/api/v1/sites/${site}/zones/${zone.id}/plan?check=pass`);
    expect(failing.body.pins.some((p) => p.memberId === m.id)).toBe(false);

    const off = await engineer.json(`/api/v1/members/${m.id}`, { method: "PATCH", body: { planPosition: null } });
    expect(off.status).toBe(200);
    const after = await engineer.json<Plan>(`/api/v1/sites/${site}/zones/${zone.id}/plan`);
    expect(after.body.pins.some((p) => p.memberId === m.id)).toBe(false);
    expect(after.body.unpinned.find((u) => u.memberId === m.id)).toMatchObject({ tag: m.tag, pass: false });

    const record = await engineer.json<{ history: { summary: string; details: string[] }[] }>(`/api/v1/members/${m.id}`);
    expect(JSON.stringify(record.body.history)).toMatch(/Place on the zone plan changed from none to 40 % across, 25 % down/);
  });

  it("refuses a place outside 0–1 or of the wrong shape with a 422 naming the field, and stores nothing", async () => {
    const engineer = await as("engineer");
    const m = await makeMember({ zone: zone.name });
    for (const [body, field] of [
      [{ planPosition: { x: 1.2, y: 0.5 } }, "planPosition.x"],
      [{ planPosition: { x: 0.5, y: -0.01 } }, "planPosition.y"],
      [{ planPosition: { x: "0.5", y: 0.5 } }, "planPosition.x"],
      [{ planPosition: [0.5, 0.5] }, "planPosition"],
      [{ planPosition: { x: 0.5 } }, "planPosition.y"],
    ] as const) {
      const res = await engineer.json<ApiErr>(`/api/v1/members/${m.id}`, { method: "PATCH", body });
      expect(res.status, JSON.stringify(body)).toBe(422);
      expect(res.body.error.fields![field], JSON.stringify(res.body)).toBeTruthy();
    }
    const rec = await engineer.json<{ member: { planX: number | null } }>(`/api/v1/members/${m.id}`);
    expect(rec.body.member.planX).toBeNull();
  });

  it("refuses a place in a zone that has no plan, and takes a member off the plan when it moves to another zone", async () => {
    const engineer = await as("engineer");
    const bare = await makeMember({ zone: bareZone.name });
    const res = await engineer.json<ApiErr>(`/api/v1/members/${bare.id}`, { method: "PATCH", body: { planPosition: { x: 0.5, y: 0.5 } } });
    expect(res.status).toBe(422);
    expect(res.body.error.fields!.planPosition).toMatch(/has no plan yet/);

    const m = await makeMember({ zone: zone.name });
    await engineer.json(`/api/v1/members/${m.id}`, { method: "PATCH", body: { planPosition: { x: 0.1, y: 0.9 } } });
    const moved = await engineer.json<{ member: { planX: number | null; planY: number | null } }>(`/api/v1/members/${m.id}`, { method: "PATCH", body: { zoneId: bareZone.id } });
    expect(moved.status).toBe(200);
    expect(moved.body.member).toMatchObject({ planX: null, planY: null });
  });

  it("answers 404 for a member of a site the person holds no role on, and for another organisation's member", async () => {
    const m = await makeMember({ zone: zone.name });
    const { client: orchardOnly } = await personWithRole({ role: "engineer", siteName: ORCHARD });
    const res = await orchardOnly.json<ApiErr>(`/api/v1/members/${m.id}`, { method: "PATCH", body: { planPosition: { x: 0.5, y: 0.5 } } });
    expect(res.status).toBe(404);
    const other = await (await as("other")).json(`/api/v1/members/${m.id}`, { method: "PATCH", body: { planPosition: { x: 0.5, y: 0.5 } } });
    expect(other.status).toBe(404);
  });

  it("places a member when it is logged", async () => {
    const engineer = await as("engineer");
    const types = await engineer.json<{ items: { id: string; name: string }[] }>(`/api/v1/sites/${site}/member-types`);
    const propD = types.body.items.find((t) => t.name.startsWith("EN 1065 class D"))!.id;
    const tag = uniqueTag("PLN");
    const res = await post<{ member: { id: string; planX: number; planY: number } }>(engineer, `/api/v1/sites/${site}/members`, {
      tag, zoneId: zone.id, memberTypeId: propD, extensionMm: 2500, loadN: 7000, planPosition: { x: 0.6, y: 0.7 },
    });
    expect(res.status).toBe(201);
    const plan = await engineer.json<Plan>(`/api/v1/sites/${site}/zones/${zone.id}/plan`);
    expect(plan.body.pins.find((p) => p.tag === tag)).toMatchObject({ x: 0.6, y: 0.7, status: "draft" });

    const bad = await post<ApiErr>(engineer, `/api/v1/sites/${site}/members`, { tag: uniqueTag("PLN"), zoneId: bareZone.id, memberTypeId: propD, extensionMm: 2500, loadN: 7000, planPosition: { x: 0.6, y: 0.7 } });
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields!.planPosition).toMatch(/no plan yet/);
  });
});

describe("printed plan", () => {
  it("prints the plan with its pins (tag and word), the legend and the caution on A3 or A4; another paper is a 422", async () => {
    const manager = await as("manager");
    const plan = await manager.json<Plan>(`/api/v1/sites/${site}/zones/${zone.id}/plan`);
    const pinned = plan.body.pins[0]!;
    for (const paper of ["a3", "a4"]) {
      const res = await manager.fetch(`/api/v1/sites/${site}/zones/${zone.id}/plan/pdf?paper=${paper}`);
      expect(res.status).toBe(200);
      expect(res.headers.get("content-type")).toBe("application/pdf");
      const text = (await pdfText(await res.arrayBuffer())).replace(/\s+/g, " ");
      expect(text).toContain(zone.name);
      expect(text).toContain(`${pinned.tag} ${pinned.word}`);
      expect(text).toContain("Legend");
      expect(text).toContain(CAUTION_TEXT.slice(0, 60));
    }
    const bad = await manager.json<ApiErr>(`/api/v1/sites/${site}/zones/${zone.id}/plan/pdf?paper=a5`);
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields!.paper).toMatch(/a3 or a4/);
  });
});

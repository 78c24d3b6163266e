// Issuing: one permit from two simultaneous clicks, numbers without gaps, the PDF shows the scope,
// and every supervisor and the requester receive it by e-mail.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import { db, sql } from "@/db";
import { memberships, permits, sites, users } from "@/db/schema";
import { inbox, waitFor } from "../support/http";
import { drainOutbox } from "../support/outbox-drain";
import {
  type ApiErr, as, makeMember, memberStates, permitRow, personWithRole, post, recheckWithLoad, pdfText, requestLoad, site, WHARF,
} from "../support/fixtures";

let wharfId: string;
beforeAll(async () => {
  wharfId = (await site()).id;
});
afterAll(async () => {
  await sql.end({ timeout: 5 });
});

const counter = async () => (await db.select({ n: sites.permitCounter }).from(sites).where(eq(sites.id, wharfId)))[0]!.n;

type Issued = { permit: { id: string; number: number; numberLabel: string; status: string; pdfUrl: string | null; recipients: string[] }; pdfReady: boolean };

describe("issuing a permit to load", () => {
  it("two coordinators pressing issue at the same moment produce one permit: one 200, one 409, one number used", async () => {
    const { client: second } = await personWithRole({ role: "coordinator", siteName: WHARF });
    const m = await makeMember();
    const id = await requestLoad({ memberIds: [m.id], siteId: wharfId });
    const before = await counter();
    const [a, b] = await Promise.all([
      post<Issued & ApiErr>(await as("coordinator"), `/api/v1/permits/${id}/issue`, { conditions: "First" }),
      post<Issued & ApiErr>(second, `/api/v1/permits/${id}/issue`, { conditions: "Second" }),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const loser = a.status === 409 ? a : b;
    expect(loser.body.error.message).toMatch(/already been issued as PTL-\d{4} by .+; nothing was changed/);
    expect(await counter()).toBe(before + 1);
    const p = await permitRow(id);
    expect(p.number).toBe(before + 1);
    const sameNumber = await db.select({ id: permits.id }).from(permits).where(and(eq(permits.siteId, wharfId), eq(permits.number, before + 1)));
    expect(sameNumber).toHaveLength(1);
    // The winner's conditions are the ones kept.
    expect(p.conditions).toBe((a.status === 200 ? "First" : "Second"));
  });

  it("numbers follow one another with no gaps, even when an issue in between is refused", async () => {
    const start = await counter();
    const numbers: number[] = [];
    for (let i = 0; i < 3; i++) {
      const m = await makeMember();
      const id = await requestLoad({ memberIds: [m.id], siteId: wharfId });
      if (i === 1) {
        // A permit that fails its preconditions consumes no number.
        const bad = await makeMember();
        const badId = await requestLoad({ memberIds: [bad.id], siteId: wharfId });
        await recheckWithLoad({ memberId: bad.id, loadN: 30_000 });
        expect((await post(await as("coordinator"), `/api/v1/permits/${badId}/issue`, {})).status).toBe(422);
      }
      const r = await post<Issued>(await as("coordinator"), `/api/v1/permits/${id}/issue`, {});
      expect(r.status).toBe(200);
      numbers.push(r.body.permit.number);
      expect(r.body.permit.numberLabel).toBe(`PTL-${String(r.body.permit.number).padStart(4, "0")}`);
    }
    expect(numbers).toEqual([start + 1, start + 2, start + 3]);
  });

  it("marks the members loaded, stores the PDF whose text shows the scope, and e-mails it to every supervisor and the requester", async () => {
    const ms = [await makeMember(), await makeMember({ loadN: 7000 })];
    const id = await requestLoad({ memberIds: ms.map((m) => m.id), siteId: wharfId });
    const conditions = `Pour bay 1 before bay 2 (${Date.now()})`;
    const r = await post<Issued>(await as("coordinator"), `/api/v1/permits/${id}/issue`, { conditions });
    expect(r.status).toBe(200);
    expect(r.body.pdfReady).toBe(true);
    expect(Object.values(await memberStates(ms.map((m) => m.id)))).toEqual(["loaded", "loaded"]);
    const label = r.body.permit.numberLabel;

    const pdf = await (await as("coordinator")).fetch(`/api/v1/permits/${id}/pdf`);
    expect(pdf.status).toBe(200);
    expect(pdf.headers.get("content-type")).toBe("application/pdf");
    const text = await pdfText(await pdf.arrayBuffer());
    expect(text).toContain(label);
    expect(text).toContain("PERMIT TO LOAD");
    expect(text).toContain(WHARF);
    expect(text).toContain("Level 2 slab, bays 1–4");
    expect(text).toContain("TW-WXW-014");
    expect(text).toContain("design check category 2");
    for (const m of ms) expect(text).toContain(m.tag);
    expect(text).toContain(conditions);
    expect(text).toContain("Priya Natarajan");
    expect(text).toContain("competent temporary works designer");

    const letter = await (await as("coordinator")).fetch(`/api/v1/permits/${id}/pdf?size=letter`);
    expect(letter.status).toBe(200);
    expect(await pdfText(await letter.arrayBuffer())).toContain(ms[0]!.tag);
    expect((await (await as("coordinator")).fetch(`/api/v1/permits/${id}/pdf?size=a3`)).status).toBe(422);

    // Every supervisor of the site (whoever holds the role now) and the requester.
    const sups = await db
      .selectDistinct({ email: users.email })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(and(eq(memberships.siteId, wharfId), eq(memberships.role, "supervisor")));
    const expected = [...new Set([...sups.map((s) => s.email), "engineer@demo.example"])].sort();
    expect([...r.body.permit.recipients].sort()).toEqual(expected);

    await drainOutbox("test-permits");
    const mails = await waitFor(async () => {
      const got = (await inbox()).filter((e) => e.subject.startsWith(`${label} issued`));
      return got.length >= expected.length ? got : null;
    }, `${expected.length} e-mails for ${label}`);
    expect(mails.flatMap((e) => e.to).sort()).toEqual(expected);
    for (const e of mails) {
      expect(e.attachments).toEqual([expect.objectContaining({ filename: `${label}.pdf`, contentType: "application/pdf" })]);
      expect(e.attachments[0]!.size).toBeGreaterThan(1000);
      expect(e.text).toContain(conditions);
      expect(e.text).toContain("competent temporary works designer");
    }
    // The permit page's delivery status says they were sent.
    const detail = await (await as("coordinator")).json<{ permit: { emails: { to: string; status: string }[] } }>(`/api/v1/permits/${id}`);
    expect(detail.body.permit.emails.map((e) => e.status)).toEqual(expected.map(() => "sent"));
  });

  it("a permit already issued cannot be issued again, refused or re-requested", async () => {
    const m = await makeMember();
    const id = await requestLoad({ memberIds: [m.id], siteId: wharfId });
    expect((await post(await as("coordinator"), `/api/v1/permits/${id}/issue`, {})).status).toBe(200);
    const again = await post<ApiErr>(await as("coordinator"), `/api/v1/permits/${id}/issue`, {});
    expect(again.status).toBe(409);
    const refuse = await post<ApiErr>(await as("coordinator"), `/api/v1/permits/${id}/refuse`, { reason: "too late" });
    expect(refuse.status).toBe(409);
    const list = await (await as("engineer")).json<{ permits: { id: string; status: string; numberLabel: string }[] }>(`/api/v1/sites/${wharfId}/permits?status=issued&sort=number&dir=desc`);
    expect(list.status).toBe(200);
    expect(list.body.permits.every((p) => p.status === "issued")).toBe(true);
    expect(list.body.permits.some((p) => p.id === id)).toBe(true);
    const bad = await (await as("engineer")).json(`/api/v1/sites/${wharfId}/permits?status=sideways`);
    expect(bad.status).toBe(422);
  });
});

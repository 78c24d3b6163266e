// One voice on permits: a request has its own reference (its number on the site, who asked and
// when) in the list, on the permit, on the PDF and in e-mails; validity is said in days and hours ("1 day 6 hours"), never "30 hours",
// on the permit page's data, the PDF and the e-mails.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql } from "@/db";
import { inbox, waitFor } from "../support/http";
import { drainOutbox } from "../support/outbox-drain";
import { type ApiErr, as, makeMember, makeRegisterSite, pdfText, post, requestLoad, site } from "../support/fixtures";

let wharfId: string;
beforeAll(async () => {
  wharfId = (await site()).id;
});
afterAll(async () => {
  await sql.end({ timeout: 5 });
});

// "2 Dec 2026, 09:30 GMT": day, short month, year, 24-hour time and the zone's short name.
const WHEN = String.raw`\d{1,2} [A-Z][a-z]{2,3} \d{4}, \d{2}:\d{2} [A-Z]{2,4}(?:[+-]\d{1,2})?`;
const REFERENCE = new RegExp(String.raw`^Request \d+ by Tomasz Wilk, ${WHEN}$`);

type Detail = { permit: { requestReference: string; requestNumber: number; numberLabel: string | null; validUntil: string | null } };
type List = { permits: { id: string; requestReference: string; requestNumber: number }[] };

describe("a permit request's own reference", () => {
  it("names the requester and the time in the list, the permit and the refusal e-mail", async () => {
    const m = await makeMember();
    const id = await requestLoad({ memberIds: [m.id], siteId: wharfId }); // as the engineer, Tomasz Wilk
    const detail = await (await as("coordinator")).json<Detail>(`/api/v1/permits/${id}`);
    expect(detail.status).toBe(200);
    expect(detail.body.permit.numberLabel).toBeNull();
    expect(detail.body.permit.requestReference).toMatch(REFERENCE);

    const list = await (await as("coordinator")).json<List>(`/api/v1/sites/${wharfId}/permits?status=requested`);
    expect(list.body.permits.find((p) => p.id === id)?.requestReference).toBe(detail.body.permit.requestReference);

    // The permit page leads with the reference instead of a bare "request".
    const page = await (await as("coordinator")).fetch(`/sites/${wharfId}/permits/${id}`);
    expect(await page.text()).toContain(detail.body.permit.requestReference.replace(/&/g, "&amp;"));

    const reason = `Scheme drawing out of date (${Date.now()})`;
    expect((await post(await as("coordinator"), `/api/v1/permits/${id}/refuse`, { reason })).status).toBe(200);
    await drainOutbox("test-voice-refused");
    const mail = await waitFor(async () => (await inbox()).find((e) => e.text.includes(reason)), "the refusal e-mail");
    expect(mail.text).toContain(`Request: ${detail.body.permit.requestReference}`);
  });
});

describe("a permit request's number", () => {
  it("tells apart two requests by one person in the same minute; numbers are per site and never reused", async () => {
    // A site of its own, so no other test's requests take numbers on it.
    const S = await makeRegisterSite({ members: 12, label: "Request numbers" });
    try {
      const requestable = S.members.filter((m) => m.pass === true && (m.status === "draft" || m.status === "submitted"));
      expect(requestable.length).toBeGreaterThanOrEqual(3);
      const engineer = await as("engineer");
      const first = await requestLoad({ memberIds: [requestable[0]!.id], siteId: S.id, by: engineer });
      const second = await requestLoad({ memberIds: [requestable[1]!.id], siteId: S.id, by: engineer });
      // The same person at the same moment: only the number tells them apart.
      await sql`update permits set requested_at = date_trunc('minute', now()) where id in (${first}, ${second})`;
      const c = await as("coordinator");
      const a = (await c.json<Detail>(`/api/v1/permits/${first}`)).body.permit;
      const b = (await c.json<Detail>(`/api/v1/permits/${second}`)).body.permit;
      expect(a.requestReference).toMatch(REFERENCE);
      expect(b.requestReference).toMatch(REFERENCE);
      expect(a.requestReference).not.toBe(b.requestReference);
      expect(a.requestReference.replace(/^Request \d+ /, "")).toBe(b.requestReference.replace(/^Request \d+ /, ""));
      // Per site: this site's first requests are 1 and 2, whatever the demo sites have reached.
      expect([a.requestNumber, b.requestNumber]).toEqual([1, 2]);
      expect(a.requestReference).toMatch(/^Request 1 by /);
      expect(b.requestReference).toMatch(/^Request 2 by /);
      // The list shows the same references and numbers.
      const list = await c.json<List>(`/api/v1/sites/${S.id}/permits`);
      expect(list.body.permits.map((p) => [p.requestNumber, p.requestReference]).sort()).toEqual([[1, a.requestReference], [2, b.requestReference]]);

      // Never reused: a refused request keeps its number and the next request gets a new one.
      expect((await post(c, `/api/v1/permits/${first}/refuse`, { reason: "Wrong scheme revision" })).status).toBe(200);
      const third = await requestLoad({ memberIds: [requestable[0]!.id], siteId: S.id, by: engineer });
      expect((await c.json<Detail>(`/api/v1/permits/${third}`)).body.permit.requestNumber).toBe(3);
      expect((await c.json<Detail>(`/api/v1/permits/${first}`)).body.permit.requestReference).toBe(a.requestReference);

      // Another site counts on its own.
      const wharfRequest = await requestLoad({ memberIds: [(await makeMember()).id], siteId: wharfId });
      const w = (await c.json<Detail>(`/api/v1/permits/${wharfRequest}`)).body.permit;
      const [{ n }] = await sql<{ n: number }[]>`select count(*)::int as n from permits where site_id = ${wharfId} and request_number = ${w.requestNumber}`;
      expect(n).toBe(1);
      expect((await c.json<Detail>(`/api/v1/permits/${third}`)).body.permit.requestNumber).toBe(3);
    } finally {
      await S.drop();
    }
  });
});

describe("validity in days and hours", () => {
  it("an issue valid for 30 hours reads '1 day 6 hours' on the permit PDF and in the e-mails", async () => {
    const m = await makeMember();
    const id = await requestLoad({ memberIds: [m.id], siteId: wharfId });
    const validUntil = new Date(Date.now() + 30 * 3600_000).toISOString();
    const conditions = `Voice check ${Date.now()}`;
    const r = await post<{ permit: { numberLabel: string } } & ApiErr>(await as("coordinator"), `/api/v1/permits/${id}/issue`, { validUntil, conditions });
    expect(r.status).toBe(200);
    const label = r.body.permit.numberLabel;

    const pdf = await (await as("coordinator")).fetch(`/api/v1/permits/${id}/pdf`);
    const text = await pdfText(await pdf.arrayBuffer());
    expect(text).toContain("(1 day 6 hours)");
    // The request it was issued from, by its number.
    const detail = await (await as("coordinator")).json<Detail>(`/api/v1/permits/${id}`);
    expect(text.replace(/\s+/g, " ")).toContain(detail.body.permit.requestReference);
    expect(text).not.toMatch(/\b30 hours\b/);

    await drainOutbox("test-voice-issued");
    const mails = await waitFor(async () => {
      const got = (await inbox()).filter((e) => e.subject.startsWith(`${label} issued`));
      return got.length ? got : null;
    }, `e-mails for ${label}`);
    for (const e of mails) {
      expect(e.text).toMatch(new RegExp(String.raw`Valid until: ${WHEN} \(1 day 6 hours\)`));
      expect(e.text).toMatch(/Request: Request \d+ by Tomasz Wilk, /);
    }
  });

  it("a validity beyond the limit is refused in days, with nothing issued", async () => {
    const m = await makeMember();
    const id = await requestLoad({ memberIds: [m.id], siteId: wharfId });
    const r = await post<ApiErr>(await as("coordinator"), `/api/v1/permits/${id}/issue`, { validUntil: new Date(Date.now() + 40 * 86_400_000).toISOString() });
    expect(r.status).toBe(422);
    expect(r.body.error.fields?.validUntil).toMatch(/at most \d+ days/);
    const after = await (await as("coordinator")).json<Detail>(`/api/v1/permits/${id}`);
    expect(after.body.permit.numberLabel).toBeNull();
  });
});

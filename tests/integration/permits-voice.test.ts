// One voice on permits: a request has its own reference (who asked and when) in the list, on the
// permit and in e-mails; validity is said in days and hours ("1 day 6 hours"), never "30 hours",
// on the permit page's data, the PDF and the e-mails.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql } from "@/db";
import { inbox, waitFor } from "../support/http";
import { drainOutbox } from "../support/outbox-drain";
import { type ApiErr, as, makeMember, pdfText, post, requestLoad, site } from "../support/fixtures";

let wharfId: string;
beforeAll(async () => {
  wharfId = (await site()).id;
});
afterAll(async () => {
  await sql.end({ timeout: 5 });
});

// "2 Dec 2026, 09:30 GMT": day, short month, year, 24-hour time and the zone's short name.
const WHEN = String.raw`\d{1,2} [A-Z][a-z]{2,3} \d{4}, \d{2}:\d{2} [A-Z]{2,4}(?:[+-]\d{1,2})?`;
const REFERENCE = new RegExp(String.raw`^Request by Tomasz Wilk, ${WHEN}$`);

type Detail = { permit: { requestReference: string; numberLabel: string | null; validUntil: string | null } };
type List = { permits: { id: string; requestReference: string }[] };

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
    expect(text).not.toMatch(/\b30 hours\b/);

    await drainOutbox("test-voice-issued");
    const mails = await waitFor(async () => {
      const got = (await inbox()).filter((e) => e.subject.startsWith(`${label} issued`));
      return got.length ? got : null;
    }, `e-mails for ${label}`);
    for (const e of mails) {
      expect(e.text).toMatch(new RegExp(String.raw`Valid until: ${WHEN} \(1 day 6 hours\)`));
      expect(e.text).toMatch(/Request: Request by Tomasz Wilk, /);
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

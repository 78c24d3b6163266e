// Issue is refused, with every reason in words, until every member in scope is ready.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql } from "@/db";
import { type ApiErr, as, makeMember, makeScheme, memberStates, permitRow, post, recheckWithLoad, requestLoad, site } from "../support/fixtures";

let wharfId: string;
beforeAll(async () => {
  wharfId = (await site()).id;
});
afterAll(async () => {
  await sql.end({ timeout: 5 });
});

const pct = (u: number) => `${Math.round(u * 100)} %`;

describe("requesting a permit to load", () => {
  it("refuses a failing member with 422 naming it and its utilisation, and stores nothing", async () => {
    const ok = await makeMember();
    // 30 kN at 3.0 m is more than an EN 1065 class B prop carries at that extension; the engine must say so first.
    const bad = await makeMember({ loadN: 30_000, extensionMm: 3000 });
    expect(bad.checkPass).toBe(false);
    const r = await post<ApiErr>(await as("engineer"), `/api/v1/sites/${wharfId}/permits`, { kind: "load", scope: "members", memberIds: [ok.id, bad.id] });
    expect(r.status).toBe(422);
    expect(r.body.error.fields?.memberIds).toContain(bad.tag);
    expect(r.body.error.fields?.memberIds).toContain(pct(bad.utilisation!));
    expect(r.body.error.fields?.memberIds).not.toContain(ok.tag);
    // No request was stored with these members.
    const [{ n }] = (await sql`select count(*)::int as n from permit_members where member_id in (${ok.id}, ${bad.id})`) as unknown as [{ n: number }];
    expect(n).toBe(0);
  });

  it("refuses a member already loaded under an issued permit, saying which", async () => {
    const m = await makeMember();
    const first = await requestLoad({ memberIds: [m.id], siteId: wharfId });
    const issued = await post<{ permit: { numberLabel: string } }>(await as("coordinator"), `/api/v1/permits/${first}/issue`, {});
    expect(issued.status).toBe(200);
    const again = await post<ApiErr>(await as("engineer"), `/api/v1/sites/${wharfId}/permits`, { kind: "load", scope: "members", memberIds: [m.id] });
    expect(again.status).toBe(422);
    expect(again.body.error.fields?.memberIds).toContain(`${m.tag} is already loaded under issued permit ${issued.body.permit.numberLabel}`);
  });

  it("rejects bad input field by field", async () => {
    const r = await post<ApiErr>(await as("engineer"), `/api/v1/sites/${wharfId}/permits`, { kind: "strike", scope: "scheme-zone" });
    expect(r.status).toBe(422);
    expect(Object.keys(r.body.error.fields ?? {})).toEqual(expect.arrayContaining(["schemeId", "zoneId", "evidence"]));
  });
});

describe("issuing a permit to load", () => {
  it("a member that fails its check after the request blocks the issue, named with its utilisation", async () => {
    const a = await makeMember();
    const b = await makeMember();
    const id = await requestLoad({ memberIds: [a.id, b.id], siteId: wharfId });
    const failing = await recheckWithLoad({ memberId: b.id, loadN: 30_000 });
    expect(failing.pass).toBe(false);
    const r = await post<ApiErr>(await as("coordinator"), `/api/v1/permits/${id}/issue`, {});
    expect(r.status).toBe(422);
    expect(r.body.error.code).toBe("preconditions_failed");
    expect(r.body.error.fields?.[b.tag]).toContain("Fails its capacity check");
    expect(r.body.error.fields?.[b.tag]).toContain(pct(failing.utilisation!));
    expect(r.body.error.fields?.[a.tag]).toBeUndefined();
    // Nothing changed: still requested, no number, members not loaded.
    const p = await permitRow(id);
    expect(p.status).toBe("requested");
    expect(p.number).toBeNull();
    expect(Object.values(await memberStates([a.id, b.id]))).toEqual(["submitted", "submitted"]);
  });

  it("lists every missing precondition at once: no photo, overdue and failed inspections, photo still processing", async () => {
    const noPhoto = await makeMember({ photo: false });
    const pending = await makeMember({ photo: "pending" });
    const overdue = await makeMember({ inspection: "overdue" });
    const failedInsp = await makeMember({ inspection: "fail" });
    const never = await makeMember({ inspection: false });
    const id = await requestLoad({ memberIds: [noPhoto.id, pending.id, overdue.id, failedInsp.id, never.id], siteId: wharfId });
    const r = await post<ApiErr>(await as("coordinator"), `/api/v1/permits/${id}/issue`, {});
    expect(r.status).toBe(422);
    const f = r.body.error.fields!;
    expect(f[noPhoto.tag]).toBe("Has no photo");
    expect(f[pending.tag]).toContain("no processed photo yet");
    expect(f[overdue.tag]).toContain("Inspection overdue since");
    expect(f[failedInsp.tag]).toContain("failed");
    expect(f[never.tag]).toBe("Has no inspection recorded");
    for (const m of [noPhoto, pending, overdue, failedInsp, never]) expect(r.body.error.message).toContain(m.tag);
  });

  it("a scheme of category 1 or above without its check certificate blocks the issue; category 0 does not need one", async () => {
    const s = await site();
    const cat2 = await makeScheme({ siteId: s.id, category: 2 });
    const cat0 = await makeScheme({ siteId: s.id, category: 0 });
    const m2 = await makeMember({ schemeIdOverride: cat2.id });
    const m0 = await makeMember({ schemeIdOverride: cat0.id });
    const blocked = await requestLoad({ memberIds: [m2.id], siteId: wharfId });
    const r = await post<ApiErr>(await as("coordinator"), `/api/v1/permits/${blocked}/issue`, {});
    expect(r.status).toBe(422);
    expect(r.body.error.fields?.certificate).toBe(`Scheme ${cat2.reference} (design check category 2) has no design check certificate`);
    const fine = await requestLoad({ memberIds: [m0.id], siteId: wharfId });
    const ok = await post(await as("coordinator"), `/api/v1/permits/${fine}/issue`, {});
    expect(ok.status).toBe(200);
  });

  it("the permit page API shows the same findings per member before issuing", async () => {
    const good = await makeMember();
    const noPhoto = await makeMember({ photo: false });
    const id = await requestLoad({ memberIds: [good.id, noPhoto.id], siteId: wharfId });
    const r = await (await as("coordinator")).json<{
      permit: { preconditions: { canIssue: boolean; members: { tag: string; ready: boolean; findings: { key: string; ok: boolean; text: string }[] }[] }; may: { issue: boolean } };
    }>(`/api/v1/permits/${id}`);
    expect(r.status).toBe(200);
    const pc = r.body.permit.preconditions;
    expect(pc.canIssue).toBe(false);
    expect(pc.members.find((m) => m.tag === good.tag)?.ready).toBe(true);
    const bad = pc.members.find((m) => m.tag === noPhoto.tag)!;
    expect(bad.ready).toBe(false);
    expect(bad.findings.find((f) => f.key === "photos")).toEqual({ key: "photos", ok: false, text: "Has no photo" });
    expect(r.body.permit.may.issue).toBe(true);
  });

  it("validity must be in the future and at most 28 days away", async () => {
    const m = await makeMember();
    const id = await requestLoad({ memberIds: [m.id], siteId: wharfId });
    const past = await post<ApiErr>(await as("coordinator"), `/api/v1/permits/${id}/issue`, { validUntil: new Date(Date.now() - 60_000).toISOString() });
    expect(past.status).toBe(422);
    expect(past.body.error.fields?.validUntil).toContain("future");
    const far = await post<ApiErr>(await as("coordinator"), `/api/v1/permits/${id}/issue`, { validUntil: new Date(Date.now() + 29 * 86_400_000).toISOString() });
    expect(far.status).toBe(422);
    expect(far.body.error.fields?.validUntil).toContain("28 days");
    const garbage = await post<ApiErr>(await as("coordinator"), `/api/v1/permits/${id}/issue`, { validUntil: "next tuesday" });
    expect(garbage.status).toBe(422);
    expect((await permitRow(id)).status).toBe("requested");
  });
});

// The permit safety points: separation of duties, permits that follow their members, striking
// member by member or by zone, amendable striking evidence, and certificates that are documents.
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql } from "@/db";
import { inbox, waitFor, type Client } from "../support/http";
import { drainOutbox } from "../support/outbox-drain";
import {
  type ApiErr, as, client, L2, makeMember, memberStates, permitRow, personWithRole, post, requestLoad, site, WHARF, zoneId,
} from "../support/fixtures";

const L1 = "Level 1 slab, bays 1–4";
let wharfId: string;
beforeAll(async () => {
  wharfId = (await site()).id;
});
afterAll(async () => {
  await sql.end({ timeout: 5 });
});

type PermitBody = {
  permit: {
    id: string;
    status: string;
    numberLabel: string | null;
    approvedBy: string | null;
    closedBy: string | null;
    struckConfirmedBy: string | null;
    evidence: { results?: { strengthMpa: number }[] } | null;
    evidenceHistory: { evidence: { results: { strengthMpa: number }[] }; replacedByName: string }[];
    issueBlockedBy: string | null;
    may: { issue: boolean; refuse: boolean; amendEvidence: boolean };
    members: { id: string; tag: string; status: string }[];
    preconditions: { canIssue: boolean; permit: { key: string; ok: boolean; text: string }[] };
  };
};

async function auditActions(entityId: string) {
  return sql<{ action: string; after: Record<string, unknown> | null }[]>`select action, after from audit_events where entity_id = ${entityId} order by at, id`;
}

const strength = (results: number[], required = 20) => ({
  basis: "strength",
  concreteAgeDays: 7,
  requiredStrengthMpa: required,
  results: results.map((strengthMpa) => ({ specimen: "cube", strengthMpa })),
});

async function requestStrike(memberIds: string[], evidence: unknown = strength([26, 27])) {
  const r = await post<{ permit: { id: string } } & ApiErr>(await as("engineer"), `/api/v1/sites/${wharfId}/permits`, { kind: "strike", scope: "members", memberIds, evidence });
  expect(r.status).toBe(201);
  return r.body.permit.id;
}

async function delegatedSupervisor(zoneIds: string[]) {
  const sup = await personWithRole({ role: "supervisor", siteName: WHARF });
  const grant = await post(await as("coordinator"), `/api/v1/sites/${wharfId}/permit-delegations`, {
    userId: sup.user.id,
    zoneIds,
    validUntil: new Date(Date.now() + 2 * 86_400_000).toISOString(),
  });
  expect(grant.status).toBe(201);
  return sup;
}

describe("separation of duties", () => {
  it("the coordinator who requested a permit cannot issue it; another coordinator can, and the review says why", async () => {
    const m = await makeMember();
    const id = await requestLoad({ memberIds: [m.id], siteId: wharfId, by: await as("coordinator") });
    const own = await post<ApiErr>(await as("coordinator"), `/api/v1/permits/${id}/issue`, {});
    expect(own.status).toBe(403);
    expect(own.body.error.message).toContain("You requested this permit");
    expect((await permitRow(id)).status).toBe("requested");
    // The review page's data: may not issue, may still refuse (a requester can drop their own request), with the reason.
    const view = await (await as("coordinator")).json<PermitBody>(`/api/v1/permits/${id}`);
    expect(view.body.permit.may.issue).toBe(false);
    expect(view.body.permit.may.refuse).toBe(true);
    expect(view.body.permit.issueBlockedBy).toContain("separation of duties");

    const second = await personWithRole({ role: "coordinator", siteName: WHARF });
    const ok = await post<PermitBody>(second.client, `/api/v1/permits/${id}/issue`, {});
    expect(ok.status).toBe(200);
    expect(ok.body.permit.approvedBy).toBe(second.user.name);
  });

  it("a coordinator still issues a supervisor's request", async () => {
    const m = await makeMember();
    const id = await requestLoad({ memberIds: [m.id], siteId: wharfId, by: await as("supervisor") });
    const r = await post<PermitBody>(await as("coordinator"), `/api/v1/permits/${id}/issue`, {});
    expect(r.status).toBe(200);
    expect(r.body.permit.status).toBe("issued");
  });

  it("a supervisor issuing under delegated scope e-mails the site's coordinators at once, and cannot issue their own request", async () => {
    const l2 = await zoneId({ siteId: wharfId, name: L2 });
    const sup = await delegatedSupervisor([l2]);
    // The coordinator's own request is issued by the delegated supervisor.
    const m = await makeMember();
    const id = await requestLoad({ memberIds: [m.id], siteId: wharfId, by: await as("coordinator") });
    const r = await post<PermitBody>(sup.client, `/api/v1/permits/${id}/issue`, {});
    expect(r.status).toBe(200);
    const label = r.body.permit.numberLabel!;
    // Written to the outbox in the same transaction, not held back for the PDF.
    const notices = await sql<{ to_email: string; wait_for: string | null }[]>`
      select to_email, wait_for from outbox where related_id = ${id} and kind = 'permit.issued_under_scope'`;
    expect(notices.map((n) => n.to_email)).toContain("coordinator@demo.example");
    expect(notices.every((n) => n.wait_for === null)).toBe(true);
    await drainOutbox("test-permits-safety");
    const mail = await waitFor(
      async () => (await inbox()).find((e) => e.subject.includes(`${label} issued by ${sup.user.name} under delegated scope`) && e.to.includes("coordinator@demo.example")),
      "the coordinator's e-mail",
    );
    expect(mail.text).toContain("under the issuing scope you gave");

    // The supervisor's own request needs someone else.
    const m2 = await makeMember();
    const ownId = await requestLoad({ memberIds: [m2.id], siteId: wharfId, by: sup.client });
    const own = await post<ApiErr>(sup.client, `/api/v1/permits/${ownId}/issue`, {});
    expect(own.status).toBe(403);
    expect(own.body.error.message).toContain("separation of duties");
    // A coordinator's issue sends no such notice.
    expect((await post(await as("coordinator"), `/api/v1/permits/${ownId}/issue`, {})).status).toBe(200);
    const none = await sql`select 1 from outbox where related_id = ${ownId} and kind = 'permit.issued_under_scope'`;
    expect(none.length).toBe(0);
  });
});

async function failInspection(c: Client, memberId: string) {
  const r = await post(c, `/api/v1/members/${memberId}/inspections`, { result: "fail", items: [{ check: "damage", result: "fail", note: "Inner tube bent" }] });
  expect(r.status).toBe(201);
}

describe("permit states follow their members", () => {
  it("a permit to load closes itself (audited) once every member has been taken out of it after failed inspections", async () => {
    const ms = [await makeMember(), await makeMember()];
    const id = await requestLoad({ memberIds: ms.map((m) => m.id), siteId: wharfId });
    expect((await post(await as("coordinator"), `/api/v1/permits/${id}/issue`, {})).status).toBe(200);
    await failInspection(await as("engineer"), ms[0]!.id);
    expect((await permitRow(id)).status).toBe("issued");
    await failInspection(await as("engineer"), ms[1]!.id);
    const row = await permitRow(id);
    expect(row.status).toBe("closed");
    expect(row.closedAt).toBeInstanceOf(Date);
    const closed = (await auditActions(id)).find((a) => a.action === "permit.closed");
    expect(closed?.after).toMatchObject({ status: "closed", automatic: true });
  });

  it("striking the members of a permit to load closes that permit to load", async () => {
    const ms = [await makeMember(), await makeMember()];
    const ptl = await requestLoad({ memberIds: ms.map((m) => m.id), siteId: wharfId });
    expect((await post(await as("coordinator"), `/api/v1/permits/${ptl}/issue`, {})).status).toBe(200);
    const pts = await requestStrike(ms.map((m) => m.id));
    expect((await post(await as("coordinator"), `/api/v1/permits/${pts}/issue`, {})).status).toBe(200);
    expect((await post(await as("supervisor"), `/api/v1/permits/${pts}/confirm-struck`, { memberIds: [ms[0]!.id] })).status).toBe(200);
    expect((await permitRow(ptl)).status).toBe("issued");
    expect((await post(await as("supervisor"), `/api/v1/permits/${pts}/confirm-struck`, { memberIds: [ms[1]!.id] })).status).toBe(200);
    expect((await permitRow(ptl)).status).toBe("closed");
    expect((await auditActions(ptl)).some((a) => a.action === "permit.closed" && a.after?.automatic === true)).toBe(true);
  });
});

describe("striking member by member or by zone", () => {
  it("confirms chosen members, then a zone, then the rest; the permit closes with the last", async () => {
    const a = await makeMember({ status: "loaded" });
    const b = await makeMember({ status: "loaded" });
    const c = await makeMember({ status: "loaded", zone: L1 });
    const id = await requestStrike([a.id, b.id, c.id]);
    expect((await post(await as("coordinator"), `/api/v1/permits/${id}/issue`, {})).status).toBe(200);
    const sup = await as("supervisor");

    const notMine = await post<ApiErr>(sup, `/api/v1/permits/${id}/confirm-struck`, { memberIds: ["00000000-0000-4000-8000-000000000000"] });
    expect(notMine.status).toBe(422);
    expect(notMine.body.error.fields?.memberIds).toContain("not in this permit");
    const both = await post<ApiErr>(sup, `/api/v1/permits/${id}/confirm-struck`, { memberIds: [a.id], zoneId: await zoneId({ siteId: wharfId, name: L1 }) });
    expect(both.status).toBe(422);
    expect(Object.values(await memberStates([a.id, b.id, c.id]))).toEqual(["loaded", "loaded", "loaded"]);

    const first = await post<PermitBody & { struck: string[]; stillStanding: number }>(sup, `/api/v1/permits/${id}/confirm-struck`, { memberIds: [a.id] });
    expect(first.status).toBe(200);
    expect(first.body.struck).toEqual([a.tag]);
    expect(first.body.stillStanding).toBe(2);
    expect(first.body.permit.status).toBe("issued");
    expect((await memberStates([a.id, b.id, c.id]))).toEqual({ [a.id]: "struck", [b.id]: "loaded", [c.id]: "loaded" });
    const again = await post<ApiErr>(sup, `/api/v1/permits/${id}/confirm-struck`, { memberIds: [a.id] });
    expect(again.status).toBe(422);
    expect(again.body.error.fields?.memberIds).toContain(`${a.tag} has already been struck`);

    const zone = await post<PermitBody & { struck: string[] }>(sup, `/api/v1/permits/${id}/confirm-struck`, { zoneId: await zoneId({ siteId: wharfId, name: L1 }) });
    expect(zone.status).toBe(200);
    expect(zone.body.struck).toEqual([c.tag]);
    expect((await permitRow(id)).status).toBe("issued");

    const rest = await post<PermitBody>(sup, `/api/v1/permits/${id}/confirm-struck`);
    expect(rest.status).toBe(200);
    expect(rest.body.permit).toMatchObject({ status: "closed", struckConfirmedBy: "Grace Okafor" });
    expect(Object.values(await memberStates([a.id, b.id, c.id]))).toEqual(["struck", "struck", "struck"]);
    expect((await auditActions(id)).filter((x) => x.action === "permit.struck_partly").length).toBe(2);
  });
});

describe("amending striking evidence", () => {
  it("new cube results replace the old while the request is open; the old stay in the history", async () => {
    const m = await makeMember({ status: "loaded" });
    const id = await requestStrike([m.id], strength([24.5, 17.5]));
    expect((await post(await as("coordinator"), `/api/v1/permits/${id}/issue`, {})).status).toBe(422);

    const eng = await as("engineer");
    const bad = await eng.json<ApiErr>(`/api/v1/permits/${id}/evidence`, { method: "PATCH", body: { evidence: strength([-1]) } });
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields?.["evidence.results.0.strengthMpa"]).toContain("more than 0");
    const designer = await client("designer@demo.example");
    expect((await designer.json(`/api/v1/permits/${id}/evidence`, { method: "PATCH", body: { evidence: strength([25, 26]) } })).status).toBe(403);

    const amended = await eng.json<PermitBody>(`/api/v1/permits/${id}/evidence`, { method: "PATCH", body: { evidence: strength([24.5, 23]) } });
    expect(amended.status).toBe(200);
    expect(amended.body.permit.evidence?.results?.map((r) => r.strengthMpa)).toEqual([24.5, 23]);
    expect(amended.body.permit.evidenceHistory).toHaveLength(1);
    expect(amended.body.permit.evidenceHistory[0]!.evidence.results.map((r) => r.strengthMpa)).toEqual([24.5, 17.5]);
    expect(amended.body.permit.evidenceHistory[0]!.replacedByName).toBe("Tomasz Wilk");
    expect((await auditActions(id)).some((a) => a.action === "permit.evidence_amended")).toBe(true);

    expect((await post(await as("coordinator"), `/api/v1/permits/${id}/issue`, {})).status).toBe(200);
    const late = await eng.json<ApiErr>(`/api/v1/permits/${id}/evidence`, { method: "PATCH", body: { evidence: strength([30]) } });
    expect(late.status).toBe(409);
    expect(late.body.error.message).toContain("only while the request is open");
  });

  it("a permit to load has no striking evidence to amend (409)", async () => {
    const m = await makeMember();
    const id = await requestLoad({ memberIds: [m.id], siteId: wharfId });
    const r = await (await as("engineer")).json<ApiErr>(`/api/v1/permits/${id}/evidence`, { method: "PATCH", body: { evidence: strength([30]) } });
    expect(r.status).toBe(409);
  });
});

describe("certificates and drawings are documents", () => {
  const pdf = Buffer.from("%PDF-1.4\n1 0 obj<<>>endobj\ntrailer<<>>\n%%EOF\n");

  async function upload(c: Client, schemeId: string, kind: "drawing" | "certificate", bytes: Buffer, contentType: string, extra: Record<string, unknown> = {}) {
    const files = `/api/v1/sites/${wharfId}/schemes/${schemeId}/files`;
    const start = await c.json<{ key: string; uploadUrl: string }>(files, { method: "POST", body: { kind, contentType, size: bytes.length } });
    expect(start.status).toBe(200);
    await fetch(start.body.uploadUrl, { method: "PUT", headers: { "content-type": contentType }, body: new Uint8Array(bytes) });
    return c.json<ApiErr & { document: Record<string, unknown> }>(`${files}/complete`, { method: "POST", body: { kind, key: start.body.key, ...extra } });
  }

  it("a check certificate needs its checker, category and date; an image only as a confirmed signed page; then the permit can be issued", async () => {
    const designer = await client("designer@demo.example");
    const created = await designer.json<{ scheme: { id: string; reference: string } }>(`/api/v1/sites/${wharfId}/schemes`, {
      method: "POST",
      body: { reference: `TW-CERT-${Date.now().toString(36)}`, title: "Back-propping check", designerName: "A. Designer", category: 2 },
    });
    expect(created.status).toBe(201);
    const scheme = created.body.scheme;

    const bare = await upload(designer, scheme.id, "certificate", pdf, "application/pdf");
    expect(bare.status).toBe(422);
    expect(Object.keys(bare.body.error.fields ?? {}).sort()).toEqual(["checkCategory", "checkerName", "documentDate"]);
    const lowCategory = await upload(designer, scheme.id, "certificate", pdf, "application/pdf", { checkerName: "R. Checker", checkCategory: 1, documentDate: "2026-11-20" });
    expect(lowCategory.status).toBe(422);
    expect(lowCategory.body.error.fields?.checkCategory).toContain("category 2");

    const png = await sharp({ create: { width: 40, height: 40, channels: 3, background: "#ffffff" } }).png().toBuffer();
    const unconfirmed = await upload(designer, scheme.id, "certificate", png, "image/png", { checkerName: "R. Checker", checkCategory: 2, documentDate: "2026-11-20" });
    expect(unconfirmed.status).toBe(422);
    expect(unconfirmed.body.error.fields?.signedImageConfirmed).toContain("signed");

    // Nothing was recorded by the refused uploads: the permit is still blocked.
    const m = await makeMember({ schemeIdOverride: scheme.id });
    const id = await requestLoad({ memberIds: [m.id], siteId: wharfId });
    const blocked = await post<ApiErr>(await as("coordinator"), `/api/v1/permits/${id}/issue`, {});
    expect(blocked.status).toBe(422);
    expect(blocked.body.error.fields?.certificate).toContain("has no design check certificate");

    const ok = await upload(designer, scheme.id, "certificate", png, "image/png", { checkerName: "R. Checker", checkCategory: 2, documentDate: "2026-11-20", signedImageConfirmed: true });
    expect(ok.status).toBe(200);
    expect(ok.body.document).toMatchObject({ kind: "certificate", checkerName: "R. Checker", checkCategory: 2, documentDate: "2026-11-20", signedImageConfirmed: true, contentType: "image/png" });

    const view = await (await as("coordinator")).json<PermitBody>(`/api/v1/permits/${id}`);
    const cert = view.body.permit.preconditions.permit.find((f) => f.key === "certificate");
    expect(cert).toMatchObject({ ok: true });
    expect(cert!.text).toContain("checked by R. Checker");
    expect((await post(await as("coordinator"), `/api/v1/permits/${id}/issue`, {})).status).toBe(200);
  });

  it("drawings keep every revision: letters follow on, a repeated revision is refused, the list keeps them all", async () => {
    const designer = await client("designer@demo.example");
    const created = await designer.json<{ scheme: { id: string } }>(`/api/v1/sites/${wharfId}/schemes`, {
      method: "POST",
      body: { reference: `TW-DRG-${Date.now().toString(36)}`, title: "Drawing revisions", designerName: "A. Designer", category: 0 },
    });
    const sid = created.body.scheme.id;
    const a = await upload(designer, sid, "drawing", pdf, "application/pdf", { drawingNumber: "TW-014-101", documentDate: "2026-11-02" });
    expect(a.status).toBe(200);
    expect(a.body.document).toMatchObject({ drawingNumber: "TW-014-101", revision: "A", documentDate: "2026-11-02" });
    const b = await upload(designer, sid, "drawing", pdf, "application/pdf", { drawingNumber: "TW-014-101" });
    expect(b.body.document).toMatchObject({ revision: "B" });
    const dup = await upload(designer, sid, "drawing", pdf, "application/pdf", { drawingNumber: "TW-014-101", revision: "b" });
    expect(dup.status).toBe(422);
    expect(dup.body.error.fields?.revision).toContain("already recorded");
    const list = await designer.json<{ documents: { revision: string; current: boolean }[] }>(`/api/v1/sites/${wharfId}/schemes/${sid}/files`);
    expect(list.status).toBe(200);
    expect(list.body.documents.map((d) => [d.revision, d.current])).toEqual([
      ["B", true],
      ["A", false],
    ]);
    // Another organisation sees nothing of it.
    expect((await (await client("admin@other.example")).json(`/api/v1/sites/${wharfId}/schemes/${sid}/files`)).status).toBe(404);
  });
});

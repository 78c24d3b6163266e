// After the request: refuse (requester told why), withdraw (everyone who received it told, members
// leave "loaded"), close, and the permit to strike with its evidence and the supervisor's confirmation.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql } from "@/db";
import { inbox, waitFor } from "../support/http";
import { drainOutbox } from "../support/outbox-drain";
import { type ApiErr, as, makeMember, memberStates, permitRow, post, requestLoad, site } from "../support/fixtures";

let wharfId: string;
beforeAll(async () => {
  wharfId = (await site()).id;
});
afterAll(async () => {
  await sql.end({ timeout: 5 });
});

async function mailsWith(text: string, n: number) {
  await drainOutbox("test-permits-lifecycle");
  return waitFor(async () => {
    const got = (await inbox()).filter((e) => e.text.includes(text));
    return got.length >= n ? got : null;
  }, `${n} e-mails containing "${text}"`);
}

describe("refusing, withdrawing and closing", () => {
  it("refusing needs a reason, e-mails the requester with it, and leaves the members as they were", async () => {
    const m = await makeMember();
    const id = await requestLoad({ memberIds: [m.id], siteId: wharfId });
    const empty = await post<ApiErr>(await as("coordinator"), `/api/v1/permits/${id}/refuse`, { reason: " " });
    expect(empty.status).toBe(422);
    expect(empty.body.error.fields?.reason).toBeTruthy();
    const reason = `Back-props in bay 3 not yet wedged (${m.tag})`;
    const r = await post<{ permit: { status: string; refusedReason: string; closedBy: string } }>(await as("coordinator"), `/api/v1/permits/${id}/refuse`, { reason });
    expect(r.status).toBe(200);
    expect(r.body.permit).toMatchObject({ status: "refused", refusedReason: reason, closedBy: "Priya Natarajan" });
    expect((await memberStates([m.id]))[m.id]).toBe("submitted");
    const [mail] = await mailsWith(reason, 1);
    expect(mail!.to).toEqual(["engineer@demo.example"]);
    expect(mail!.subject).toContain("refused");
    // A refused request cannot then be issued.
    const late = await post<ApiErr>(await as("coordinator"), `/api/v1/permits/${id}/issue`, {});
    expect(late.status).toBe(409);
    expect(late.body.error.message).toContain("refused by Priya Natarajan");
  });

  it("withdrawing an issued permit e-mails everyone who received it and takes its members out of 'loaded'", async () => {
    const ms = [await makeMember(), await makeMember()];
    const id = await requestLoad({ memberIds: ms.map((m) => m.id), siteId: wharfId });
    const issued = await post<{ permit: { recipients: string[]; numberLabel: string } }>(await as("coordinator"), `/api/v1/permits/${id}/issue`, {});
    expect(issued.status).toBe(200);
    expect(Object.values(await memberStates(ms.map((m) => m.id)))).toEqual(["loaded", "loaded"]);
    // Only an issued permit can be withdrawn; an engineer cannot withdraw.
    expect((await post(await as("engineer"), `/api/v1/permits/${id}/withdraw`, { reason: "nope" })).status).toBe(403);
    const reason = `Crane collision with prop line, ${ms[0]!.tag}`;
    const r = await post<{ permit: { status: string; withdrawnReason: string } }>(await as("coordinator"), `/api/v1/permits/${id}/withdraw`, { reason });
    expect(r.status).toBe(200);
    expect(r.body.permit).toMatchObject({ status: "withdrawn", withdrawnReason: reason });
    expect(Object.values(await memberStates(ms.map((m) => m.id)))).toEqual(["submitted", "submitted"]);
    const mails = await mailsWith(reason, issued.body.permit.recipients.length);
    expect(mails.flatMap((e) => e.to).sort()).toEqual([...issued.body.permit.recipients].sort());
    expect(mails[0]!.subject).toContain(`${issued.body.permit.numberLabel} WITHDRAWN`);
    // Withdrawn once is final.
    expect((await post(await as("coordinator"), `/api/v1/permits/${id}/withdraw`, { reason: "again" })).status).toBe(409);
    // The members can be put in a new request.
    await requestLoad({ memberIds: ms.map((m) => m.id), siteId: wharfId });
  });

  it("closing an issued permit records who closed it", async () => {
    const m = await makeMember();
    const id = await requestLoad({ memberIds: [m.id], siteId: wharfId });
    expect((await post(await as("coordinator"), `/api/v1/permits/${id}/close`)).status).toBe(409);
    await post(await as("coordinator"), `/api/v1/permits/${id}/issue`, {});
    const r = await post<{ permit: { status: string; closedBy: string } }>(await as("coordinator"), `/api/v1/permits/${id}/close`);
    expect(r.status).toBe(200);
    expect(r.body.permit).toMatchObject({ status: "closed", closedBy: "Priya Natarajan" });
  });
});

describe("permit to strike", () => {
  const strength = (results: number[], required = 20) => ({
    basis: "strength",
    concreteAgeDays: 10,
    requiredStrengthMpa: required,
    results: results.map((strengthMpa) => ({ specimen: "cube", strengthMpa })),
  });

  it("needs evidence; a result below the required striking strength blocks the issue, naming the result", async () => {
    const m = await makeMember({ status: "loaded" });
    const noEvidence = await post<ApiErr>(await as("engineer"), `/api/v1/sites/${wharfId}/permits`, { kind: "strike", scope: "members", memberIds: [m.id] });
    expect(noEvidence.status).toBe(422);
    expect(noEvidence.body.error.fields?.evidence).toContain("evidence");
    const badNumber = await post<ApiErr>(await as("engineer"), `/api/v1/sites/${wharfId}/permits`, { kind: "strike", scope: "members", memberIds: [m.id], evidence: strength([-3]) });
    expect(badNumber.status).toBe(422);
    expect(badNumber.body.error.fields?.["evidence.results.0.strengthMpa"]).toContain("more than 0");

    const r = await post<{ permit: { id: string } }>(await as("engineer"), `/api/v1/sites/${wharfId}/permits`, { kind: "strike", scope: "members", memberIds: [m.id], evidence: strength([24.5, 17.5]) });
    expect(r.status).toBe(201);
    const issue = await post<ApiErr>(await as("coordinator"), `/api/v1/permits/${r.body.permit.id}/issue`, {});
    expect(issue.status).toBe(422);
    expect(issue.body.error.fields?.evidence).toBe("Cube result 17.5 MPa is below the required striking strength of 20.0 MPa (concrete 10 days old)");
  });

  it("issued with passing results (PDF, e-mail); members become struck only when a supervisor confirms", async () => {
    const ms = [await makeMember({ status: "loaded" }), await makeMember({ status: "loaded" })];
    const r = await post<{ permit: { id: string } }>(await as("engineer"), `/api/v1/sites/${wharfId}/permits`, {
      kind: "strike",
      scope: "members",
      memberIds: ms.map((m) => m.id),
      evidence: strength([27.5, 26], 20),
    });
    expect(r.status).toBe(201);
    const id = r.body.permit.id;
    const issued = await post<{ permit: { numberLabel: string; status: string }; pdfReady: boolean }>(await as("coordinator"), `/api/v1/permits/${id}/issue`, {});
    expect(issued.status).toBe(200);
    expect(issued.body.permit.numberLabel).toMatch(/^PTS-\d{4}$/);
    expect(issued.body.pdfReady).toBe(true);
    // Issuing does not strike anything by itself.
    expect(Object.values(await memberStates(ms.map((m) => m.id)))).toEqual(["loaded", "loaded"]);
    const mails = await mailsWith(`${issued.body.permit.numberLabel}`, 2);
    expect(mails.every((e) => e.attachments.some((a) => a.filename === `${issued.body.permit.numberLabel}.pdf`))).toBe(true);

    expect((await post(await as("engineer"), `/api/v1/permits/${id}/confirm-struck`)).status).toBe(403);
    const done = await post<{ permit: { status: string; struckConfirmedBy: string; struckConfirmedAt: string } }>(await as("supervisor"), `/api/v1/permits/${id}/confirm-struck`);
    expect(done.status).toBe(200);
    expect(done.body.permit).toMatchObject({ status: "closed", struckConfirmedBy: "Grace Okafor" });
    expect(Object.values(await memberStates(ms.map((m) => m.id)))).toEqual(["struck", "struck"]);
    expect((await permitRow(id)).struckConfirmedAt).toBeInstanceOf(Date);
    expect((await post(await as("supervisor"), `/api/v1/permits/${id}/confirm-struck`)).status).toBe(409);
  });

  it("a designer's instruction is accepted as evidence", async () => {
    const m = await makeMember({ status: "loaded" });
    const r = await post<{ permit: { id: string } }>(await as("engineer"), `/api/v1/sites/${wharfId}/permits`, {
      kind: "strike",
      scope: "members",
      memberIds: [m.id],
      evidence: { basis: "designer", instruction: "Props to L2 bays 1–2 may be struck once the L3 pour has reached 7 days.", reference: "E-mail 14 Mar" },
    });
    expect(r.status).toBe(201);
    expect((await post(await as("coordinator"), `/api/v1/permits/${r.body.permit.id}/issue`, {})).status).toBe(200);
  });
});

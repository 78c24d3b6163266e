// The member record: states the lifecycle owns cannot be talked round by editing, a failing member
// alerts whatever its status, the overview's two failing counts agree, and GET /api/v1/members/{id}
// tells the state, the inspections, the permits and the history in words.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import { db, sql } from "@/db";
import { alerts, auditEvents, checks, members } from "@/db/schema";
import { sweepOverloads } from "@/lib/alerts/scans";
import { INSPECTION_CHECKS } from "@/lib/inspections/checklist";
import { type AlertsOrg, makeAlertsOrg, removeAlertsOrgs } from "../support/fixtures";
import { signInAs, type Client } from "../support/http";
import { drainOutbox } from "../support/outbox-drain";

afterAll(async () => {
  await drainOutbox("member-record-cleanup");
  await removeAlertsOrgs();
  await sql.end({ timeout: 5 });
});

type ErrorBody = { error: { code: string; message: string; fields?: Record<string, string> } };
const allPass = INSPECTION_CHECKS.map((c) => ({ check: c.key, result: "pass" }));
const damaged = INSPECTION_CHECKS.map((c) => (c.key === INSPECTION_CHECKS[0]!.key ? { check: c.key, result: "fail", note: "Base plate cracked" } : { check: c.key, result: "pass" }));

let fx: AlertsOrg;
let engineer: Client;
let coordinator: Client;
beforeAll(async () => {
  fx = await makeAlertsOrg({ label: "record" });
  engineer = await signInAs(fx.people.engineer.email);
  coordinator = await signInAs(fx.people.coordinator.email);
});

const patch = (c: Client, id: string, body: unknown) => c.json<ErrorBody & { member: { status: string } }>(`/api/v1/members/${id}`, { method: "PATCH", body });
const inspect = (c: Client, id: string, body: unknown) => c.json<{ member: { status: string } }>(`/api/v1/members/${id}/inspections`, { method: "POST", body });
const statusOf = async (id: string) => (await db.select({ status: members.status }).from(members).where(eq(members.id, id)))[0]!.status;
const auditCount = async (id: string) => (await db.select().from(auditEvents).where(eq(auditEvents.entityId, id))).length;

describe("a state the lifecycle owns cannot be set or left by editing", () => {
  it("a member out of service after a failed inspection returns to service only through a passing re-inspection (409 for an edit)", async () => {
    const m = await fx.addMember({ tag: "REC-FAIL" });
    const failed = await inspect(engineer, m.id, { result: "fail", items: damaged });
    expect(failed.status).toBe(201);
    expect(failed.body.member.status).toBe("out_of_service");
    const audits = await auditCount(m.id);

    for (const [client, status] of [[engineer, "submitted"], [coordinator, "submitted"], [engineer, "draft"]] as const) {
      const r = await patch(client, m.id, { status });
      expect(r.status, status).toBe(409);
      expect(r.body.error.code).toBe("conflict");
      // The reason names the failed inspection, who made it, and the only way back.
      expect(r.body.error.message).toMatch(/out of service after a failed inspection on .* by Engineer /);
      expect(r.body.error.message).toMatch(/returns to service only through a passing inspection/);
      expect(r.body.error.fields?.status).toBe(r.body.error.message);
    }
    // Refused whole: the notes sent alongside the status are not saved either, and nothing is audited.
    const mixed = await patch(engineer, m.id, { status: "submitted", notes: "repaired" });
    expect(mixed.status).toBe(409);
    expect(await statusOf(m.id)).toBe("out_of_service");
    const [row] = await db.select({ notes: members.notes }).from(members).where(eq(members.id, m.id));
    expect(row!.notes).toBeNull();
    expect(await auditCount(m.id)).toBe(audits);

    // Other fields can still be corrected while it is out of service.
    expect((await patch(engineer, m.id, { notes: "Base plate to be replaced" })).status).toBe(200);
    expect(await statusOf(m.id)).toBe("out_of_service");

    const pass = await inspect(engineer, m.id, { result: "pass", items: allPass });
    expect(pass.status).toBe(201);
    expect(pass.body.member.status).toBe("submitted");
  });

  it("a person may take a member out of service by editing (reporting damage), but only a passing inspection brings it back", async () => {
    const m = await fx.addMember({ tag: "REC-DMG" });
    const out = await patch(engineer, m.id, { status: "out_of_service" });
    expect(out.status).toBe(200);
    expect(out.body.member.status).toBe("out_of_service");
    const back = await patch(coordinator, m.id, { status: "submitted" });
    expect(back.status).toBe(409);
    expect(back.body.error.message).toMatch(/REC-DMG is out of service\. It returns to service only through a passing inspection/);
    expect(await statusOf(m.id)).toBe("out_of_service");
    const pass = await inspect(engineer, m.id, { result: "pass", items: allPass });
    expect(pass.body.member.status).toBe("submitted");
    expect(await statusOf(m.id)).toBe("submitted");
  });

  it("loaded and struck members cannot be moved by editing (409), and nothing changes", async () => {
    const loaded = await fx.addMember({ tag: "REC-LOADED", status: "loaded" });
    const struck = await fx.addMember({ tag: "REC-STRUCK", status: "struck" });
    for (const status of ["draft", "submitted", "out_of_service"]) {
      const a = await patch(engineer, loaded.id, { status });
      expect(a.status, status).toBe(409);
      expect(a.body.error.message).toMatch(/loaded under an issued permit to load/);
      const b = await patch(engineer, struck.id, { status });
      expect(b.status, status).toBe(409);
      expect(b.body.error.message).toMatch(/struck under a permit to strike/);
    }
    expect(await statusOf(loaded.id)).toBe("loaded");
    expect(await statusOf(struck.id)).toBe("struck");
    // Setting a permit's state on a draft stays a 422 naming the field (the value is never valid here).
    const draft = await fx.addMember({ tag: "REC-DRAFT", status: "draft" });
    for (const status of ["loaded", "struck"]) {
      const r = await patch(engineer, draft.id, { status });
      expect(r.status, status).toBe(422);
      expect(r.body.error.fields?.status).toMatch(/set by a permit/);
    }
    expect(await statusOf(draft.id)).toBe("draft");
  });
});

describe("a failing member alerts whatever its status", () => {
  it("a failing draft and a failing out-of-service member raise the overload alert; a struck one does not", async () => {
    const f = await makeAlertsOrg({ label: "record-ovl" });
    // Invented table (tests/support/alerts-fixture.ts): 35 kN safe at 2.0 m, so 36 kN fails.
    const draft = await f.addMember({ tag: "OVL-DRAFT", status: "draft", loadN: 36_000 });
    const oos = await f.addMember({ tag: "OVL-OOS", status: "out_of_service", loadN: 36_000 });
    const struck = await f.addMember({ tag: "OVL-STRUCK", status: "struck", loadN: 36_000 });
    for (const m of [draft, oos, struck]) expect(m.pass).toBe(false);
    expect(await sweepOverloads({ siteIds: [f.site.id] })).toBe(2);
    const raised = await db.select({ subjectId: alerts.subjectId }).from(alerts).where(and(eq(alerts.kind, "member_overloaded"), eq(alerts.siteId, f.site.id)));
    expect(raised.map((a) => a.subjectId).sort()).toEqual([draft.id, oos.id].sort());
  });

  it("a draft made to fail by an edit raises the alert like a submitted member", async () => {
    const f = await makeAlertsOrg({ label: "record-ovl-edit" });
    const m = await f.addMember({ tag: "OVL-EDIT", status: "draft", loadN: 20_000 });
    const eng = await signInAs(f.people.engineer.email);
    const r = await eng.json<{ member: { checkPass: boolean } }>(`/api/v1/members/${m.id}`, { method: "PATCH", body: { loadN: 36_000 } });
    expect(r.status).toBe(200);
    expect(r.body.member.checkPass).toBe(false);
    expect(await sweepOverloads({ siteIds: [f.site.id] })).toBe(1);
  });

  it("the overview's 'overloaded now' and 'failing the check' counts agree", async () => {
    const f = await makeAlertsOrg({ label: "record-counts" });
    await f.addMember({ tag: "CNT-DRAFT", status: "draft", loadN: 36_000 });
    await f.addMember({ tag: "CNT-SUB", status: "submitted", loadN: 36_000 });
    await f.addMember({ tag: "CNT-OOS", status: "out_of_service", loadN: 36_000 });
    await f.addMember({ tag: "CNT-STRUCK", status: "struck", loadN: 36_000 });
    await f.addMember({ tag: "CNT-OK", status: "submitted", loadN: 10_000 });
    const mgr = await signInAs(f.people.manager.email);
    const res = await mgr.fetch(`/sites/${f.site.id}`);
    expect(res.status).toBe(200);
    const html = (await res.text()).replace(/<!-- -->/g, "");
    expect(html).toContain("Overloaded now: 3 members");
    expect(html).toContain("3 members failing the capacity check");
  });
});

describe("GET /api/v1/members/{id}: the record in words", () => {
  it("leads with the state after a failed inspection, lists inspections and permits, and tells the history as sentences", async () => {
    const m = await fx.addMember({ tag: "REC-READ" });
    const permit = await fx.addPermit({ memberIds: [m.id], validUntil: new Date(Date.now() + 3 * 86_400_000), number: 41 });
    expect((await inspect(engineer, m.id, { result: "fail", items: damaged, notes: "Do not use" })).status).toBe(201);
    const manager = await signInAs(fx.people.manager.email);
    const r = await manager.json<{
      member: { id: string; status: string };
      check: { id: string } | null;
      checks: { reason: string; steps: unknown[] }[];
      photos: unknown[];
      state: { status: string; tone: string; headline: string; details: string[]; nextStep: string };
      inspections: { result: string; inspectorName: string; failedItems: string[] }[];
      permits: { id: string; label: string; covers: boolean; removedReason: string | null }[];
      history: { summary: string; details: string[]; actorName: string | null }[];
    }>(`/api/v1/members/${m.id}`);
    expect(r.status).toBe(200);
    expect(r.body.member).toMatchObject({ id: m.id, status: "out_of_service" });
    expect(r.body.check).not.toBeNull();
    expect(r.body.checks[0]!.steps.length).toBeGreaterThan(0);
    expect(r.body.state).toMatchObject({ status: "out_of_service", tone: "bad" });
    expect(r.body.state.headline).toMatch(new RegExp(`^Out of service: failed inspection on .* by ${fx.people.engineer.name}$`));
    expect(r.body.state.details.join(" ")).toMatch(/Base plate cracked/);
    expect(r.body.state.nextStep).toMatch(/passing re-inspection/);
    expect(r.body.inspections).toMatchObject([{ result: "fail", inspectorName: fx.people.engineer.name }]);
    expect(r.body.inspections[0]!.failedItems[0]).toMatch(/Base plate cracked/);
    expect(r.body.permits).toMatchObject([{ id: permit.id, label: "Permit to load No. 41", covers: false }]);
    expect(r.body.permits[0]!.removedReason).toMatch(/Failed inspection/);
    const status = r.body.history.find((h) => h.summary.startsWith("Status changed"));
    expect(status?.summary).toMatch(/^Status changed from Submitted to Out of service after the failed inspection on \d{1,2} [A-Z][a-z]{2} \d{4}\.$/);
    // No raw key, hash or id anywhere in the history.
    const text = JSON.stringify(r.body.history);
    expect(text).not.toMatch(/[0-9a-f]{8}-[0-9a-f]{4}-/);
    expect(text).not.toMatch(/inspectionId|out_of_service|status_changed/);
  });

  it("an edit's history names what changed in the site's units, never field keys or ids", async () => {
    const m = await fx.addMember({ tag: "REC-HIST", extensionMm: 2000, loadN: 20_000 });
    expect((await patch(engineer, m.id, { extensionMm: 2100, loadN: 22_000, zoneId: fx.zoneB.id })).status).toBe(200);
    const r = await engineer.json<{ history: { summary: string; details: string[] }[] }>(`/api/v1/members/${m.id}`);
    const edit = r.body.history.find((h) => h.summary === "Edited and re-checked.");
    expect(edit?.details).toEqual(
      expect.arrayContaining(["Zone changed from Zone A to Zone B.", "Measured extension changed from 2000 mm to 2100 mm.", "Working load changed from 20.00 kN to 22.00 kN."]),
    );
    expect(edit?.details.some((d) => /^The re-check passes \(utilisation \d+ %\)\.$/.test(d))).toBe(true);
    const n = await db.select().from(checks).where(eq(checks.memberId, m.id));
    expect(n).toHaveLength(2);
  });
});

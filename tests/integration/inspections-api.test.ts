// Recording inspections over the API: who may, what is refused, and what a failed inspection
// does — out of service, out of the permit, recipients told, alert raised — and a pass after it.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, count, eq } from "drizzle-orm";
import { db, sql } from "@/db";
import { alerts, auditEvents, inspections, members, outbox, permitMembers } from "@/db/schema";
import { scanInspections } from "@/lib/alerts/scans";
import { INSPECTION_CHECKS } from "@/lib/inspections/checklist";
import { type AlertsOrg, makeAlertsOrg, removeAlertsOrgs } from "../support/fixtures";
import { anonymous, inbox, signInAs, type Client } from "../support/http";
import { drainOutbox } from "../support/outbox-drain";

afterAll(async () => {
  await drainOutbox("inspections-cleanup");
  await removeAlertsOrgs();
  await sql.end({ timeout: 5 });
});

const allPass = INSPECTION_CHECKS.map((c) => ({ check: c.key, result: "pass" }));
const post = (c: Client, memberId: string, body: unknown) =>
  c.json<Record<string, unknown> & { error?: { fields?: Record<string, string> } }>(`/api/v1/members/${memberId}/inspections`, {
    method: "POST",
    body: JSON.stringify(body),
  });
const countInspections = async (memberId: string) => (await db.select({ n: count() }).from(inspections).where(eq(inspections.memberId, memberId)))[0]!.n;

let fx: AlertsOrg;
let clients: Record<string, Client>;
beforeAll(async () => {
  fx = await makeAlertsOrg({ label: "insp" });
  clients = {};
  for (const role of ["engineer", "supervisor", "coordinator", "manager", "designer", "admin"] as const)
    clients[role] = await signInAs(fx.people[role].email);
  clients.other = await signInAs("admin@other.example");
});

describe("POST /api/v1/members/{id}/inspections — who may", () => {
  it("engineer, supervisor and coordinator record (201); manager, designer and admin get 403; another organisation 404; signed out 401", async () => {
    const m = await fx.addMember({ tag: "ROLE-1" });
    for (const role of ["engineer", "supervisor", "coordinator"]) {
      const r = await post(clients[role]!, m.id, { result: "pass", items: allPass });
      expect(r.status, role).toBe(201);
      expect(r.body).toMatchObject({ inspection: { result: "pass", memberId: m.id }, member: { status: "submitted" } });
    }
    for (const role of ["manager", "designer", "admin"]) {
      const r = await post(clients[role]!, m.id, { result: "pass" });
      expect(r.status, role).toBe(403);
      expect(r.body).toMatchObject({ error: { code: "forbidden" } });
    }
    expect((await post(clients.other!, m.id, { result: "pass" })).status).toBe(404);
    expect((await post(clients.engineer!, "not-a-uuid", { result: "pass" })).status).toBe(404);
    expect((await post(clients.engineer!, "00000000-0000-4000-8000-000000000000", { result: "pass" })).status).toBe(404);
    expect((await post(anonymous(), m.id, { result: "pass" })).status).toBe(401);
    expect(await countInspections(m.id)).toBe(3);

    // History: anyone on the site may read it, newest first, with the inspector.
    const h = await clients.manager!.json<{ items: { result: string; inspectorName: string; nextDueAt: string }[] }>(`/api/v1/members/${m.id}/inspections`);
    expect(h.status).toBe(200);
    expect(h.body.items).toHaveLength(3);
    expect(h.body.items[0]!.inspectorName).toBe(fx.people.coordinator.name);
    const due = new Date(h.body.items[0]!.nextDueAt).getTime() - Date.now();
    expect(due).toBeGreaterThan(6.9 * 86_400_000); // the site's 7-day interval
    expect(due).toBeLessThanOrEqual(7 * 86_400_000);
    expect((await clients.other!.json(`/api/v1/members/${m.id}/inspections`)).status).toBe(404);
  });

  it("bad input is 422 with the field and reason, and stores nothing", async () => {
    const m = await fx.addMember({ tag: "BAD-1" });
    const cases: [unknown, string, RegExp][] = [
      [{ result: "maybe" }, "result", /pass" or "fail/],
      [{}, "result", /pass" or "fail/],
      [{ result: "pass", items: [{ check: "plumb", result: "fail", note: "22 mm out" }] }, "result", /cannot pass/],
      [{ result: "fail", items: [{ check: "head", result: "fail" }] }, "items.0.note", /what is wrong/],
      [{ result: "fail", items: [{ check: "", result: "fail", note: "x" }] }, "items.0.check", /check/],
      [{ result: "pass", items: [{ check: "plumb", result: "ok" }] }, "items.0.result", /pass" or "fail/],
      [{ result: "pass", items: "all good" }, "items", /list/],
      [{ result: "pass", notes: "x".repeat(2001) }, "notes", /2,000/],
      [{ result: "pass", photoIds: ["nope"] }, "photoIds.0", /photo/],
      [{ result: "pass", photoIds: ["00000000-0000-4000-8000-000000000000"] }, "photoIds", /not found/],
    ];
    for (const [body, field, reason] of cases) {
      const r = await post(clients.engineer!, m.id, body);
      expect(r.status, JSON.stringify(body)).toBe(422);
      expect(r.body.error?.fields?.[field], JSON.stringify(r.body)).toMatch(reason);
    }
    const r = await clients.engineer!.fetch(`/api/v1/members/${m.id}/inspections`, { method: "POST", body: "not json", headers: { "content-type": "application/json" } });
    expect(r.status).toBe(422);
    expect(await countInspections(m.id)).toBe(0);
  });
});

describe("a failed inspection", () => {
  it("takes the member out of service and out of its permit, tells the recipients and alerts once; a pass returns it to service but not to the permit", async () => {
    const m = await fx.addMember({ tag: "FAIL-1", status: "loaded" });
    const other = await fx.addMember({ tag: "FAIL-2", status: "loaded" });
    const permit = await fx.addPermit({ memberIds: [m.id, other.id], validUntil: new Date(Date.now() + 3 * 86_400_000), number: 11 });
    const items = allPass.map((i) => (i.check === "bearing" ? { check: "bearing", result: "fail", note: "Sole plate split, prop base sinking" } : i));
    const r = await post(clients.supervisor!, m.id, { result: "fail", items, notes: "Barrier put round it" });
    expect(r.status).toBe(201);
    expect(r.body).toMatchObject({ member: { status: "out_of_service" }, removedFromPermits: [{ id: permit.id, label: "permit to load No. 11" }] });

    const scope = await db.select().from(permitMembers).where(eq(permitMembers.permitId, permit.id));
    const mine = scope.find((s) => s.memberId === m.id)!;
    expect(mine.removedAt).not.toBeNull();
    expect(mine.removedReason).toMatch(/Failed inspection .*Bearing and base or sole plate sound \(Sole plate split/);
    expect(scope.find((s) => s.memberId === other.id)!.removedAt).toBeNull();
    expect((await db.select({ status: members.status }).from(members).where(eq(members.id, other.id)))[0]!.status).toBe("loaded");

    const actions = (await db.select({ action: auditEvents.action, entityId: auditEvents.entityId }).from(auditEvents).where(eq(auditEvents.siteId, fx.site.id))).map((a) => `${a.action}:${a.entityId}`);
    expect(actions).toEqual(expect.arrayContaining([`member.status_changed:${m.id}`, `permit.member_removed:${permit.id}`, expect.stringMatching(/^inspection\.recorded:/)]));

    const failedAlerts = await db.select().from(alerts).where(and(eq(alerts.kind, "inspection_failed"), eq(alerts.subjectId, m.id)));
    expect(failedAlerts).toHaveLength(1);

    await drainOutbox();
    const mails = await inbox();
    for (const to of [fx.people.supervisor.email, fx.people.engineer.email]) {
      const got = mails.filter((x) => x.to.includes(to) && x.subject === "FAIL-1 removed from Permit to load No. 11 — failed inspection");
      expect(got, to).toHaveLength(1);
      expect(got[0]!.text).toContain("Sole plate split");
      expect(got[0]!.text).toContain(`/sites/${fx.site.id}/permits/${permit.id}`);
    }
    for (const to of [fx.people.manager.email, fx.people.coordinator.email]) {
      expect(mails.filter((x) => x.to.includes(to) && x.subject === "FAIL-1 failed its inspection"), to).toHaveLength(1);
    }

    // Failing again while out of service: already out of the permit, one more alert for the new inspection.
    const again = await post(clients.engineer!, m.id, { result: "fail", items: [{ check: "bearing", result: "fail", note: "Still split" }] });
    expect(again.status).toBe(201);
    expect(again.body).toMatchObject({ member: { status: "out_of_service" }, removedFromPermits: [] });
    expect(await db.select().from(alerts).where(and(eq(alerts.kind, "inspection_failed"), eq(alerts.subjectId, m.id)))).toHaveLength(2);
    expect(await db.select().from(outbox).where(and(eq(outbox.kind, "permit:member_removed"), eq(outbox.relatedId, permit.id)))).toHaveLength(2);

    // A passing re-inspection: back to submitted, still not in the permit.
    const pass = await post(clients.engineer!, m.id, { result: "pass", items: allPass });
    expect(pass.status).toBe(201);
    expect(pass.body).toMatchObject({ member: { status: "submitted" } });
    const after = await db.select().from(permitMembers).where(and(eq(permitMembers.permitId, permit.id), eq(permitMembers.memberId, m.id)));
    expect(after[0]!.removedAt).not.toBeNull();
  });
});

describe("inspect-now triggers and the alerts API", () => {
  it("a coordinator's trigger for a zone makes its members due now; others may not trigger", async () => {
    const a = await fx.addMember({ tag: "TRIG-A", zone: "A" });
    const b = await fx.addMember({ tag: "TRIG-B", zone: "B" });
    for (const id of [a.id, b.id]) expect((await post(clients.engineer!, id, { result: "pass", items: allPass })).status).toBe(201);
    const path = `/api/v1/sites/${fx.site.id}/inspection-triggers`;
    expect((await clients.engineer!.json(path, { method: "POST", body: JSON.stringify({ reason: "Wind" }) })).status).toBe(403);
    const bad = await clients.coordinator!.json<{ error: { fields: Record<string, string> } }>(path, { method: "POST", body: JSON.stringify({ zoneId: fx.zoneA.id, reason: "" }) });
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields.reason).toMatch(/Say why/);
    const wrongZone = await clients.coordinator!.json<{ error: { fields: Record<string, string> } }>(path, { method: "POST", body: JSON.stringify({ zoneId: "00000000-0000-4000-8000-000000000000", reason: "Wind" }) });
    expect(wrongZone.body.error.fields.zoneId).toMatch(/not on this site/);
    const ok = await clients.coordinator!.json(path, { method: "POST", body: JSON.stringify({ zoneId: fx.zoneA.id, reason: "Gusts over 60 km/h overnight" }) });
    expect(ok.status).toBe(201);
    expect(ok.body).toMatchObject({ trigger: { zoneName: "Zone A", reason: "Gusts over 60 km/h overnight" } });

    await scanInspections({ siteIds: [fx.site.id], now: new Date(Date.now() + 1000) });
    const due = await db.select().from(alerts).where(and(eq(alerts.siteId, fx.site.id), eq(alerts.kind, "inspection_overdue")));
    expect(due.map((x) => x.subjectId)).toContain(a.id);
    expect(due.map((x) => x.subjectId)).not.toContain(b.id);
  });

  it("lists a site's alerts with read/unread per person and marks them read", async () => {
    const m = await fx.addMember({ tag: "READ-1" });
    expect((await post(clients.engineer!, m.id, { result: "fail", items: [{ check: "head", result: "fail", note: "Fork head loose" }] })).status).toBe(201);
    const path = `/api/v1/sites/${fx.site.id}/alerts`;
    type List = { items: { id: string; title: string; read: boolean; link: string }[]; unread: number };
    const before = await clients.manager!.json<List>(path);
    expect(before.status).toBe(200);
    const alert = before.body.items.find((x) => x.title === "READ-1 failed its inspection")!;
    expect(alert).toMatchObject({ read: false, link: `/sites/${fx.site.id}/members/${m.id}/inspect` });
    expect((await clients.other!.json(`/api/v1/alerts/${alert.id}/read`, { method: "POST", body: "{}" })).status).toBe(404);
    expect((await clients.other!.json(path)).status).toBe(404);
    expect((await clients.manager!.json(`/api/v1/alerts/${alert.id}/read`, { method: "POST", body: "{}" })).status).toBe(200);
    const afterRead = await clients.manager!.json<List>(path);
    expect(afterRead.body.unread).toBe(before.body.unread - 1);
    expect(afterRead.body.items.find((x) => x.id === alert.id)!.read).toBe(true);
    // Read state is per person: the coordinator still has it unread.
    expect((await clients.coordinator!.json<List>(`${path}?unread=true`)).body.items.map((x) => x.id)).toContain(alert.id);
    expect((await clients.manager!.json(`${path}?unread=maybe`)).status).toBe(422);
    await clients.manager!.json(`${path}/read`, { method: "POST", body: "{}" });
    expect((await clients.manager!.json<List>(path)).body.unread).toBe(0);
  });

  it("alert preferences: GET the defaults, PUT a change, 422 for an unknown kind", async () => {
    const c = clients.coordinator!;
    type Prefs = { preferences: { kind: string; delivery: string }[] };
    const g = await c.json<Prefs>("/api/v1/me/alert-preferences");
    expect(g.body.preferences.every((p) => p.delivery === "immediate")).toBe(true);
    const put = await c.json<Prefs>("/api/v1/me/alert-preferences", { method: "PUT", body: JSON.stringify({ preferences: [{ kind: "inspection_due_soon", delivery: "digest" }] }) });
    expect(put.status).toBe(200);
    expect(put.body.preferences.find((p) => p.kind === "inspection_due_soon")!.delivery).toBe("digest");
    const bad = await c.json<{ error: { fields: Record<string, string> } }>("/api/v1/me/alert-preferences", { method: "PUT", body: JSON.stringify({ preferences: [{ kind: "weather", delivery: "sms" }] }) });
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.error.fields)).toEqual(expect.arrayContaining(["preferences.0.kind", "preferences.0.delivery"]));
  });
});

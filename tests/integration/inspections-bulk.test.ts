// "All satisfactory" for members chosen in the register: POST /api/v1/sites/{siteId}/inspections/bulk.
// Each member gets its own passing inspection (audit, next due date, alerts as for one), all or
// nothing: a member of another site answers 404 and one that cannot be inspected 422, with a
// reason per member, and nothing is recorded. A retry with the same clientId records nothing new.
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, count, eq, inArray } from "drizzle-orm";
import { db, sql } from "@/db";
import { alerts, auditEvents, inspections, members } from "@/db/schema";
import { scanInspections } from "@/lib/alerts/scans";
import { INSPECTION_CHECKS } from "@/lib/inspections/checklist";
import { type AlertsOrg, makeAlertsOrg, removeAlertsOrgs, siteId as demoSiteId, ORCHARD } from "../support/fixtures";
import { anonymous, signInAs, type Client } from "../support/http";

afterAll(async () => {
  await removeAlertsOrgs();
  await sql.end({ timeout: 5 });
});

type Body = {
  recorded?: number;
  items?: { memberId: string; tag: string; status: string; inspectionId: string; nextDueAt: string; replayed: boolean }[];
  error?: { code: string; message: string; fields?: Record<string, string> };
};
const bulk = (c: Client, siteId: string, body: unknown) =>
  c.json<Body>(`/api/v1/sites/${siteId}/inspections/bulk`, { method: "POST", body: JSON.stringify(body) });
const countFor = async (ids: string[]) => (await db.select({ n: count() }).from(inspections).where(inArray(inspections.memberId, ids)))[0]!.n;
const DAY = 86_400_000;

let fx: AlertsOrg;
let other: AlertsOrg;
let clients: Record<string, Client>;
beforeAll(async () => {
  fx = await makeAlertsOrg({ label: "bulk" });
  other = await makeAlertsOrg({ label: "bulk-other" });
  clients = {};
  for (const role of ["engineer", "supervisor", "coordinator", "manager", "designer", "admin"] as const) clients[role] = await signInAs(fx.people[role].email);
  clients.otherOrg = await signInAs(other.people.engineer.email);
});

describe("POST /api/v1/sites/{siteId}/inspections/bulk", () => {
  it("records each chosen member as its own satisfactory inspection, with its audit row and next due date, and clears it from the overdue round", async () => {
    const a = await fx.addMember({ tag: "BULK-A1" });
    const b = await fx.addMember({ tag: "BULK-A2", status: "loaded", zone: "B" });
    const c = await fx.addMember({ tag: "BULK-A3" });
    // A was last inspected 9 days ago on the site's 7-day interval: overdue before the round.
    await fx.addInspection({ memberId: a.id, at: new Date(Date.now() - 9 * DAY) });

    const before = Date.now();
    const r = await bulk(clients.supervisor!, fx.site.id, { memberIds: [c.id, a.id, b.id], result: "pass" });
    expect(r.status, JSON.stringify(r.body)).toBe(201);
    expect(r.body.recorded).toBe(3);
    expect(r.body.items!.map((i) => i.tag)).toEqual(["BULK-A1", "BULK-A2", "BULK-A3"]);
    // Loaded stays loaded, submitted stays submitted: a pass changes no state.
    expect(r.body.items!.map((i) => i.status)).toEqual(["submitted", "loaded", "submitted"]);

    const rows = await db.select().from(inspections).where(and(inArray(inspections.memberId, [a.id, b.id, c.id]), eq(inspections.inspectorId, fx.people.supervisor.id)));
    expect(rows).toHaveLength(3);
    expect(new Set(rows.map((x) => x.id)).size).toBe(3);
    for (const row of rows) {
      expect(row.result).toBe("pass");
      // Every checklist item satisfactory, as the checklist's "All satisfactory" would answer.
      expect(row.items).toEqual(INSPECTION_CHECKS.map((k) => ({ check: k.key, result: "pass" })));
      // Next due: the site's 7-day interval from now.
      const due = row.nextDueAt!.getTime() - before;
      expect(due).toBeGreaterThan(7 * DAY - 60_000);
      expect(due).toBeLessThanOrEqual(7 * DAY + 60_000);
    }
    const audits = await db
      .select({ entityId: auditEvents.entityId, actorId: auditEvents.actorId })
      .from(auditEvents)
      .where(and(eq(auditEvents.siteId, fx.site.id), eq(auditEvents.action, "inspection.recorded"), inArray(auditEvents.entityId, rows.map((x) => x.id))));
    expect(audits).toHaveLength(3);
    expect(audits.every((x) => x.actorId === fx.people.supervisor.id)).toBe(true);

    // The overdue scan no longer alerts for A: it is in date after the round.
    await scanInspections({ siteIds: [fx.site.id], now: new Date(Date.now() + 1000) });
    const overdue = await db.select().from(alerts).where(and(eq(alerts.siteId, fx.site.id), eq(alerts.kind, "inspection_overdue"), eq(alerts.subjectId, a.id)));
    expect(overdue).toHaveLength(0);
  });

  it("is all or nothing: a member of another site is 404 and one that cannot be inspected is 422, with a reason per member, and nothing is recorded", async () => {
    const ok = await fx.addMember({ tag: "BULK-B1" });
    const draft = await fx.addMember({ tag: "BULK-B2", status: "draft" });
    const struck = await fx.addMember({ tag: "BULK-B3", status: "struck" });
    const oos = await fx.addMember({ tag: "BULK-B4", status: "out_of_service" });
    const elsewhere = await other.addMember({ tag: "BULK-B5" });

    const nf = await bulk(clients.engineer!, fx.site.id, { memberIds: [ok.id, elsewhere.id, randomUUID()], result: "pass" });
    expect(nf.status).toBe(404);
    expect(nf.body.error).toMatchObject({ code: "not_found", fields: { "memberIds.1": expect.stringMatching(/not on this site|No member/), "memberIds.2": expect.any(String) } });
    expect(nf.body.error!.fields!["memberIds.0"]).toBeUndefined();
    // Nothing about the other organisation's member is revealed.
    expect(JSON.stringify(nf.body)).not.toContain("BULK-B5");

    const bad = await bulk(clients.engineer!, fx.site.id, { memberIds: [ok.id, draft.id, struck.id, oos.id], result: "pass" });
    expect(bad.status).toBe(422);
    expect(bad.body.error!.fields).toEqual({
      "memberIds.1": expect.stringMatching(/^BULK-B2 is a draft, not installed yet/),
      "memberIds.2": expect.stringMatching(/^BULK-B3 has been struck/),
      "memberIds.3": expect.stringMatching(/^BULK-B4 is out of service: re-inspect it on its own checklist/),
    });
    expect(bad.body.error!.message).toMatch(/3 of the chosen members cannot be recorded as satisfactory; nothing was recorded/);
    expect(await countFor([ok.id, draft.id, struck.id, oos.id, elsewhere.id])).toBe(0);
    expect((await db.select({ status: members.status }).from(members).where(eq(members.id, oos.id)))[0]!.status).toBe("out_of_service");

    // Bad input: 422 with the field and reason, nothing stored.
    const cases: [unknown, string, RegExp][] = [
      [{ memberIds: [], result: "pass" }, "memberIds", /at least one/],
      [{ memberIds: [ok.id], result: "fail" }, "result", /only satisfactory/],
      [{ memberIds: [ok.id] }, "result", /must be "pass"/],
      [{ memberIds: ["nope"], result: "pass" }, "memberIds.0", /id of a member/],
      [{ memberIds: [ok.id, ok.id], result: "pass" }, "memberIds.1", /listed twice/],
      [{ memberIds: Array.from({ length: 201 }, () => randomUUID()), result: "pass" }, "memberIds", /At most 200/],
    ];
    for (const [body, field, reason] of cases) {
      const r = await bulk(clients.engineer!, fx.site.id, body);
      expect(r.status, JSON.stringify(body)).toBe(422);
      expect(r.body.error?.fields?.[field], JSON.stringify(r.body)).toMatch(reason);
    }
    expect(await countFor([ok.id])).toBe(0);
  });

  it("a demo member of the organisation's other site is 404 on this site", async () => {
    const engineer = await signInAs("engineer@demo.example");
    const orchard = await demoSiteId(ORCHARD);
    const wharf = await demoSiteId();
    const [m] = await db.select({ id: members.id }).from(members).where(and(eq(members.siteId, orchard), eq(members.status, "submitted"))).limit(1);
    const before = await countFor([m!.id]);
    const r = await bulk(engineer, wharf, { memberIds: [m!.id], result: "pass" });
    expect(r.status).toBe(404);
    expect(r.body.error!.fields).toEqual({ "memberIds.0": "No member with this id is on this site." });
    expect(await countFor([m!.id])).toBe(before);
  });

  it("is for those who record inspections: manager, designer and admin 403, another organisation 404, signed out 401 — nothing recorded", async () => {
    const m = await fx.addMember({ tag: "BULK-C1" });
    for (const role of ["manager", "designer", "admin"]) {
      const r = await bulk(clients[role]!, fx.site.id, { memberIds: [m.id], result: "pass" });
      expect(r.status, role).toBe(403);
      expect(r.body.error).toMatchObject({ code: "forbidden", message: expect.stringMatching(/site engineers, supervisors and coordinators/) });
    }
    expect((await bulk(clients.otherOrg!, fx.site.id, { memberIds: [m.id], result: "pass" })).status).toBe(404);
    expect((await bulk(anonymous(), fx.site.id, { memberIds: [m.id], result: "pass" })).status).toBe(401);
    expect(await countFor([m.id])).toBe(0);
    for (const role of ["engineer", "coordinator"]) expect((await bulk(clients[role]!, fx.site.id, { memberIds: [m.id], result: "pass" })).status, role).toBe(201);
    expect(await countFor([m.id])).toBe(2);
  });

  it("a retry with the same clientId (an answer lost on a weak signal) records nothing new and answers with the first inspections", async () => {
    const a = await fx.addMember({ tag: "BULK-D1" });
    const b = await fx.addMember({ tag: "BULK-D2" });
    const clientId = randomUUID();
    const first = await bulk(clients.engineer!, fx.site.id, { memberIds: [a.id, b.id], result: "pass", clientId });
    expect(first.status).toBe(201);
    const again = await bulk(clients.engineer!, fx.site.id, { memberIds: [a.id, b.id], result: "pass", clientId });
    expect(again.status).toBe(200);
    expect(again.body.recorded).toBe(0);
    expect(again.body.items!.map((i) => i.replayed)).toEqual([true, true]);
    expect(again.body.items!.map((i) => i.inspectionId).sort()).toEqual(first.body.items!.map((i) => i.inspectionId).sort());
    // Sent twice at once: the member row locks serialise them, still one inspection each.
    const twin = randomUUID();
    const [x, y] = await Promise.all([
      bulk(clients.engineer!, fx.site.id, { memberIds: [a.id, b.id], result: "pass", clientId: twin }),
      bulk(clients.engineer!, fx.site.id, { memberIds: [b.id, a.id], result: "pass", clientId: twin }),
    ]);
    expect([x.status, y.status].sort()).toEqual([200, 201]);
    expect(await countFor([a.id, b.id])).toBe(4);
  });
});

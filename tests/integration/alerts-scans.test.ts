// Each kind of alert fires once and only once per subject and threshold, however often the
// scans run and however many workers run them; the clock is moved through `now`.
import { afterAll, describe, expect, it } from "vitest";
import { and, eq, inArray, like } from "drizzle-orm";
import { db, sql } from "@/db";
import { alertPreferences, alerts, auditEvents, members, outbox, permits } from "@/db/schema";
import { enqueueEmails } from "@/db/queries/outbox";
import { sendDailyDigests } from "@/lib/alerts/digest";
import { runAlertScans, scanFailingEmails, scanInspections, scanPermitExpiry, sweepOverloads } from "@/lib/alerts/scans";
import { type AlertsOrg, makeAlertsOrg, removeAlertsOrgs } from "../support/fixtures";
import { inbox } from "../support/http";
import { drainOutbox } from "../support/outbox-drain";

afterAll(async () => {
  await drainOutbox("alerts-scans-cleanup");
  await removeAlertsOrgs();
  await sql.end({ timeout: 5 });
});

const HOUR = 3600_000;
const DAY = 24 * HOUR;
const T0 = new Date(Math.floor(Date.now() / 1000) * 1000);
const at = (ms: number) => new Date(T0.getTime() + ms);

async function alertsOf(fx: AlertsOrg, kind: string) {
  return db.select().from(alerts).where(and(eq(alerts.siteId, fx.site.id), eq(alerts.kind, kind)));
}
async function alertMailsTo(email: string, kind: string) {
  return db.select().from(outbox).where(and(eq(outbox.toEmail, email), eq(outbox.kind, `alert:${kind}`)));
}

describe("permit expiry", () => {
  it("warns once within the warning time, then expires the permit once, unloading its members", async () => {
    const fx = await makeAlertsOrg({ label: "expiry" });
    const a = await fx.addMember({ tag: "EXP-1", status: "loaded" });
    const b = await fx.addMember({ tag: "EXP-2", status: "loaded" });
    const permit = await fx.addPermit({ memberIds: [a.id, b.id], validUntil: at(48 * HOUR), number: 1 });
    const scope = { siteIds: [fx.site.id] };

    expect(await scanPermitExpiry({ ...scope, now: at(0) })).toBe(0); // 48 h left: no warning yet
    expect(await scanPermitExpiry({ ...scope, now: at(25 * HOUR) })).toBe(1); // 23 h left (warning 24 h)
    expect(await scanPermitExpiry({ ...scope, now: at(26 * HOUR) })).toBe(0);
    expect(await scanPermitExpiry({ ...scope, now: at(47 * HOUR) })).toBe(0);
    expect(await alertsOf(fx, "permit_expiring")).toHaveLength(1);
    expect((await db.select().from(permits).where(eq(permits.id, permit.id)))[0]!.status).toBe("issued");

    expect(await scanPermitExpiry({ ...scope, now: at(48 * HOUR + 1000) })).toBe(1);
    expect(await scanPermitExpiry({ ...scope, now: at(50 * HOUR) })).toBe(0);
    expect(await alertsOf(fx, "permit_expired")).toHaveLength(1);
    expect((await db.select().from(permits).where(eq(permits.id, permit.id)))[0]!.status).toBe("expired");
    const ms = await db.select({ status: members.status }).from(members).where(inArray(members.id, [a.id, b.id]));
    expect(ms.map((m) => m.status)).toEqual(["submitted", "submitted"]);
    const audit = await db.select().from(auditEvents).where(and(eq(auditEvents.siteId, fx.site.id), eq(auditEvents.entityId, permit.id)));
    expect(audit.map((e) => e.action)).toContain("permit.expired");

    // The manager and the coordinator each got one e-mail per alert.
    for (const who of [fx.people.manager.email, fx.people.coordinator.email]) {
      expect(await alertMailsTo(who, "permit_expiring")).toHaveLength(1);
      expect(await alertMailsTo(who, "permit_expired")).toHaveLength(1);
    }
    expect(await alertMailsTo(fx.people.engineer.email, "permit_expired")).toHaveLength(0);
    await drainOutbox();
    const mails = (await inbox()).filter((m) => m.to.includes(fx.people.manager.email));
    expect(mails).toHaveLength(2);
    expect(mails.filter((m) => m.subject.startsWith("Permit to load No. 1 expires "))).toHaveLength(1);
    expect(mails.filter((m) => m.subject === "Permit to load No. 1 has expired")).toHaveLength(1);
    expect(mails.find((m) => m.subject.includes("has expired"))!.text).toContain(`/sites/${fx.site.id}/permits/${permit.id}`);
  });

  it("a permit renewed to a later time warns again for the new time", async () => {
    const fx = await makeAlertsOrg({ label: "renew" });
    const a = await fx.addMember({ tag: "REN-1", status: "loaded" });
    const permit = await fx.addPermit({ memberIds: [a.id], validUntil: at(10 * HOUR), number: 3 });
    const scope = { siteIds: [fx.site.id] };
    expect(await scanPermitExpiry({ ...scope, now: at(0) })).toBe(1);
    await db.update(permits).set({ validUntil: at(5 * DAY) }).where(eq(permits.id, permit.id));
    expect(await scanPermitExpiry({ ...scope, now: at(1 * HOUR) })).toBe(0);
    expect(await scanPermitExpiry({ ...scope, now: at(4.5 * DAY) })).toBe(1);
    expect(await alertsOf(fx, "permit_expiring")).toHaveLength(2);
  });
});

describe("inspections due", () => {
  it("fires 'due soon' once in the last 24 h before the due time and 'overdue' once after it; a new inspection starts again", async () => {
    const fx = await makeAlertsOrg({ label: "due" });
    const m = await fx.addMember({ tag: "DUE-1" });
    await fx.addMember({ tag: "DUE-NEVER" }); // never inspected: waits for its first inspection, no alert
    const d = await fx.addMember({ tag: "DUE-DRAFT", status: "draft" });
    await fx.addInspection({ memberId: d.id, at: at(-20 * DAY) }); // drafts are not on site yet
    await fx.addInspection({ memberId: m.id, at: at(-5 * DAY) }); // 7-day interval: due at T0 + 2 days
    const scope = { siteIds: [fx.site.id] };

    expect(await scanInspections({ ...scope, now: at(0) })).toBe(0);
    expect(await scanInspections({ ...scope, now: at(1.5 * DAY) })).toBe(1);
    expect(await scanInspections({ ...scope, now: at(1.6 * DAY) })).toBe(0);
    expect(await scanInspections({ ...scope, now: at(2 * DAY + 1000) })).toBe(1);
    expect(await scanInspections({ ...scope, now: at(3 * DAY) })).toBe(0);
    expect(await scanInspections({ ...scope, now: at(4 * DAY) })).toBe(0);
    const soon = await alertsOf(fx, "inspection_due_soon");
    const overdue = await alertsOf(fx, "inspection_overdue");
    expect(soon.map((a) => a.subjectId)).toEqual([m.id]);
    expect(overdue.map((a) => a.subjectId)).toEqual([m.id]);
    expect(overdue[0]!.title).toContain("DUE-1: inspection overdue");
    expect(overdue[0]!.link).toBe(`/sites/${fx.site.id}/members/${m.id}/inspect`);

    // Inspected again on day 4: due on day 11, and overdue after that — a new threshold, a new alert.
    await fx.addInspection({ memberId: m.id, at: at(4 * DAY) });
    expect(await scanInspections({ ...scope, now: at(5 * DAY) })).toBe(0);
    expect(await scanInspections({ ...scope, now: at(11 * DAY + 1000) })).toBe(1); // no scan ran in the 24 h before: straight to overdue
    expect(await scanInspections({ ...scope, now: at(12 * DAY) })).toBe(0);
    expect(await alertsOf(fx, "inspection_overdue")).toHaveLength(2);
  });

  it("a coordinator's trigger makes the members it covers due now, once", async () => {
    const fx = await makeAlertsOrg({ label: "trigger" });
    const a = await fx.addMember({ tag: "TRG-A", zone: "A" });
    const b = await fx.addMember({ tag: "TRG-B", zone: "B" });
    await fx.addInspection({ memberId: a.id, at: at(-1 * DAY) });
    await fx.addInspection({ memberId: b.id, at: at(-1 * DAY) });
    const { insertInspectionTrigger } = await import("@/db/queries/inspections");
    await insertInspectionTrigger({ siteId: fx.site.id, zoneId: fx.zoneA.id, reason: "Storm overnight", triggeredBy: fx.people.coordinator.id, triggeredAt: at(0) });
    const scope = { siteIds: [fx.site.id] };
    expect(await scanInspections({ ...scope, now: at(60_000) })).toBe(1);
    expect(await scanInspections({ ...scope, now: at(120_000) })).toBe(0);
    const [alert] = await alertsOf(fx, "inspection_overdue");
    expect(alert).toMatchObject({ subjectId: a.id });
    expect(alert!.title).toContain("due now — Storm overnight");

    // A later whole-site trigger reaches zone B; zone A is still due from the first one.
    await insertInspectionTrigger({ siteId: fx.site.id, zoneId: null, reason: "Vehicle struck props", triggeredBy: fx.people.coordinator.id, triggeredAt: at(2 * HOUR) });
    expect(await scanInspections({ ...scope, now: at(3 * HOUR) })).toBe(1);
    expect((await alertsOf(fx, "inspection_overdue")).map((x) => x.subjectId).sort()).toEqual([a.id, b.id].sort());
  });
});

describe("overload, failing e-mail and digest", () => {
  it("an overloaded member alerts once per failing check", async () => {
    const fx = await makeAlertsOrg({ label: "overload" });
    const m = await fx.addMember({ tag: "OVL-1", loadN: 36_000 }); // 36 kN on 35 kN at 2.0 m
    expect(m.pass).toBe(false);
    await fx.addMember({ tag: "OVL-OK", loadN: 20_000 });
    const scope = { siteIds: [fx.site.id] };
    expect(await sweepOverloads({ ...scope, now: at(0) })).toBe(1);
    expect(await sweepOverloads({ ...scope, now: at(10_000) })).toBe(0);
    const [alert] = await alertsOf(fx, "member_overloaded");
    expect(alert!.title).toBe("OVL-1 is overloaded: utilisation 103 %");
    expect(await alertMailsTo(fx.people.manager.email, "member_overloaded")).toHaveLength(1);
    expect(await alertMailsTo(fx.people.coordinator.email, "member_overloaded")).toHaveLength(1);
  });

  it("e-mail that keeps failing alerts the coordinator and admin once per message", async () => {
    const fx = await makeAlertsOrg({ label: "mailfail" });
    const rows = await enqueueEmails([
      { siteId: fx.site.id, kind: "test", toEmail: "nobody@fixture.example", subject: `Stuck A ${fx.tag}`, text: "x" },
      { siteId: fx.site.id, kind: "test", toEmail: "nobody@fixture.example", subject: `Stuck B ${fx.tag}`, text: "x" },
      { siteId: fx.site.id, kind: "test", toEmail: "nobody@fixture.example", subject: `Fine C ${fx.tag}`, text: "x" },
    ]);
    const later = at(365 * DAY); // keep them out of delivery in this test
    await db.update(outbox).set({ attempts: 3, lastError: "connect ECONNREFUSED", nextAttemptAt: later }).where(eq(outbox.id, rows[0]!.id));
    await db.update(outbox).set({ attempts: 10, status: "failed", lastError: "550 mailbox unavailable", nextAttemptAt: later }).where(eq(outbox.id, rows[1]!.id));
    await db.update(outbox).set({ attempts: 1, lastError: "timeout", nextAttemptAt: later }).where(eq(outbox.id, rows[2]!.id));
    const scope = { siteIds: [fx.site.id] };
    expect(await scanFailingEmails({ ...scope, now: at(0) })).toBe(2);
    expect(await scanFailingEmails({ ...scope, now: at(60_000) })).toBe(0);
    expect((await alertsOf(fx, "email_failing")).map((a) => a.subjectId).sort()).toEqual([rows[0]!.id, rows[1]!.id].sort());
    // Two alerts of one kind from one scan make one e-mail each for the coordinator and the admin.
    expect(await alertMailsTo(fx.people.coordinator.email, "email_failing")).toHaveLength(1);
    expect(await alertMailsTo(fx.people.admin.email, "email_failing")).toHaveLength(1);
    expect(await alertMailsTo(fx.people.manager.email, "email_failing")).toHaveLength(0);
    await db.delete(outbox).where(inArray(outbox.id, rows.map((r) => r.id)));
  });

  it("preferences: in-app only sends nothing, digest sends one e-mail a day, and overload always e-mails the manager", async () => {
    const fx = await makeAlertsOrg({ label: "prefs" });
    await db.insert(alertPreferences).values([
      { userId: fx.people.manager.id, kind: "inspection_overdue", delivery: "digest" },
      { userId: fx.people.manager.id, kind: "member_overloaded", delivery: "in_app" },
      { userId: fx.people.coordinator.id, kind: "inspection_overdue", delivery: "in_app" },
      { userId: fx.people.coordinator.id, kind: "member_overloaded", delivery: "in_app" },
    ]);
    const m = await fx.addMember({ tag: "PRF-1" });
    await fx.addInspection({ memberId: m.id, at: at(-8 * DAY) });
    await fx.addMember({ tag: "PRF-OVL", loadN: 50_000 });
    const scope = { siteIds: [fx.site.id] };
    const now = at(60_000);
    const r = await runAlertScans({ ...scope, now });
    expect(r).toMatchObject({ overloads: 1, inspections: 1 });
    expect(await alertMailsTo(fx.people.manager.email, "inspection_overdue")).toHaveLength(0);
    expect(await alertMailsTo(fx.people.coordinator.email, "inspection_overdue")).toHaveLength(0);
    expect(await alertMailsTo(fx.people.manager.email, "member_overloaded")).toHaveLength(1);
    expect(await alertMailsTo(fx.people.coordinator.email, "member_overloaded")).toHaveLength(0);

    const users = [fx.people.manager.id, fx.people.coordinator.id];
    const digestAt = at(2 * HOUR);
    const [one, two] = await Promise.all([sendDailyDigests({ now: digestAt, userIds: users }), sendDailyDigests({ now: digestAt, userIds: users })]);
    expect(one + two).toBe(1); // the manager only: the coordinator chose in-app, not digest
    // Later the same (UTC) day: an hour on, but never past midnight, whatever time of day the suite runs.
    const endOfDigestDay = Date.UTC(digestAt.getUTCFullYear(), digestAt.getUTCMonth(), digestAt.getUTCDate(), 23, 59, 59, 999);
    const sameDayLater = new Date(Math.min(at(3 * HOUR).getTime(), endOfDigestDay));
    expect(await sendDailyDigests({ now: sameDayLater, userIds: users })).toBe(0); // same day
    const digests = await db.select().from(outbox).where(and(eq(outbox.toUserId, fx.people.manager.id), like(outbox.kind, "alert:digest:%")));
    expect(digests).toHaveLength(1);
    expect(digests[0]!.text).toContain("PRF-1: inspection overdue");
    expect(digests[0]!.text).not.toContain("PRF-OVL"); // overload was e-mailed at once, not digested
  });
});

describe("two workers at once", () => {
  it("scanning and delivering in parallel sends each alert e-mail exactly once", async () => {
    const fx = await makeAlertsOrg({ label: "parallel" });
    const loaded = await fx.addMember({ tag: "PAR-L", status: "loaded" });
    await fx.addPermit({ memberIds: [loaded.id], validUntil: at(-60_000), number: 7 });
    for (let i = 1; i <= 4; i++) await fx.addMember({ tag: `PAR-OVL-${i}`, loadN: 40_000 + i * 1000 });
    const due = await fx.addMember({ tag: "PAR-DUE" });
    await fx.addInspection({ memberId: due.id, at: at(-9 * DAY) });
    const scope = { siteIds: [fx.site.id], now: at(0) };
    const reports = await Promise.all([runAlertScans(scope), runAlertScans(scope), runAlertScans(scope), runAlertScans(scope)]);
    expect(reports.reduce((n, r) => n + r.overloads, 0)).toBe(4);
    expect(reports.reduce((n, r) => n + r.permits, 0)).toBe(1);
    expect(reports.reduce((n, r) => n + r.inspections, 0)).toBe(1);
    await Promise.all([drainOutbox("worker-1"), drainOutbox("worker-2"), drainOutbox("worker-1b")]);
    const got = (await inbox()).filter((m) => m.to.includes(fx.people.manager.email));
    // One e-mail per kind: 4 overloads grouped in one, the expiry, the overdue inspection.
    expect(got).toHaveLength(3);
    expect(new Set(got.map((m) => m.subject)).size).toBe(3);
    expect(got.map((m) => m.subject)).toContain("4 alerts: Member overloaded (fails its capacity check) — " + fx.site.name);
  });
});

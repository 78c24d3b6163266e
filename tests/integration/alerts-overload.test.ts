// Overload: any change that makes a member fail its check — longer extension, higher load, wider
// as-built spacing, another member type, or a changed supplier table — raises one alert, made
// through the register's own API and picked up by the worker's sweep (called here directly).
import { afterAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import { db, sql } from "@/db";
import { alerts, members, outbox } from "@/db/schema";
import { sweepOverloads } from "@/lib/alerts/scans";
import { type AlertsOrg, makeAlertsOrg, removeAlertsOrgs, TABLE_STRONG } from "../support/fixtures";
import { signInAs } from "../support/http";
import { drainOutbox } from "../support/outbox-drain";

afterAll(async () => {
  await drainOutbox("alerts-overload-cleanup");
  await removeAlertsOrgs();
  await sql.end({ timeout: 5 });
});

type Patched = { member: { checkPass: boolean | null; latestCheckId: string | null; loadN: number } };

async function overloadAlerts(fx: AlertsOrg, memberId: string) {
  return db.select().from(alerts).where(and(eq(alerts.kind, "member_overloaded"), eq(alerts.subjectId, memberId), eq(alerts.siteId, fx.site.id)));
}

async function expectOneAlertFor(fx: AlertsOrg, memberId: string) {
  const [row] = await db.select({ latestCheckId: members.latestCheckId, checkPass: members.checkPass }).from(members).where(eq(members.id, memberId));
  expect(row!.checkPass).toBe(false);
  expect(await sweepOverloads({ siteIds: [fx.site.id] })).toBe(1);
  expect(await sweepOverloads({ siteIds: [fx.site.id] })).toBe(0);
  const list = await overloadAlerts(fx, memberId);
  expect(list).toHaveLength(1);
  expect(list[0]!.threshold).toBe(row!.latestCheckId);
  const mails = await db.select().from(outbox).where(and(eq(outbox.kind, "alert:member_overloaded"), eq(outbox.toEmail, fx.people.manager.email), eq(outbox.relatedId, list[0]!.id)));
  expect(mails).toHaveLength(1);
}

describe("overload alerts on each kind of change", () => {
  it("extension, load, spacing and member type changes made through PATCH /api/v1/members/{id}", async () => {
    const fx = await makeAlertsOrg({ label: "ovl-api" });
    const ext = await fx.addMember({ tag: "OV-EXT", extensionMm: 2000, loadN: 25_000 });
    const load = await fx.addMember({ tag: "OV-LOAD", extensionMm: 2000, loadN: 25_000 });
    const spacing = await fx.addMember({ tag: "OV-SPC", extensionMm: 2000, slab: { spacingMm: 1200 } });
    const type = await fx.addMember({ tag: "OV-TYPE", extensionMm: 2000, loadN: 25_000 });
    for (const m of [ext, load, spacing, type]) expect(m.pass).toBe(true);
    expect(await sweepOverloads({ siteIds: [fx.site.id] })).toBe(0);
    const engineer = await signInAs(fx.people.engineer.email);
    const patch = (id: string, body: unknown) => engineer.json<Patched>(`/api/v1/members/${id}`, { method: "PATCH", body: JSON.stringify(body) });

    // Table: 30 kN at 2.5 m, 20 kN at 3.5 m → 23 kN at 3.2 m, under the 25 kN it carries.
    const r1 = await patch(ext.id, { extensionMm: 3200 });
    expect(r1.status).toBe(200);
    expect(r1.body.member.checkPass).toBe(false);
    await expectOneAlertFor(fx, ext.id);

    // 36 kN against 35 kN at 2.0 m.
    const r2 = await patch(load.id, { loadN: 36_000 });
    expect(r2.status).toBe(200);
    await expectOneAlertFor(fx, load.id);

    // Slab load over a 2.4 m × 2.4 m bay (5.76 m² × 8.25 kN/m² ≈ 47.5 kN) instead of 1.2 m × 1.2 m (≈ 11.9 kN).
    const r3 = await patch(spacing.id, { spacingXMm: 2400, spacingYMm: 2400 });
    expect(r3.status).toBe(200);
    expect(r3.body.member.loadN).toBeGreaterThan(45_000);
    await expectOneAlertFor(fx, spacing.id);

    // The light shore: 17.5 kN at 2.0 m.
    const r4 = await patch(type.id, { memberTypeId: fx.types.weak.id });
    expect(r4.status).toBe(200);
    await expectOneAlertFor(fx, type.id);

    // Made worse again: a new failing check is a new threshold, so one more alert.
    const r5 = await patch(load.id, { loadN: 39_000 });
    expect(r5.status).toBe(200);
    expect(await sweepOverloads({ siteIds: [fx.site.id] })).toBe(1);
    expect(await overloadAlerts(fx, load.id)).toHaveLength(2);
  });

  it("a supplier table lowered in the library (PATCH the member type) overloads its members", async () => {
    const fx = await makeAlertsOrg({ label: "ovl-table" });
    const a = await fx.addMember({ tag: "OV-TBL-1", extensionMm: 2000, loadN: 25_000 });
    const b = await fx.addMember({ tag: "OV-TBL-2", extensionMm: 2000, loadN: 12_000 });
    const designer = await signInAs(fx.people.designer.email);
    const lowered = TABLE_STRONG.map((r) => ({ ...r, safeLoadN: r.safeLoadN * 0.6 })); // 21 kN at 2.0 m
    const r = await designer.json(`/api/v1/sites/${fx.site.id}/member-types/${fx.types.strong.id}`, {
      method: "PATCH",
      body: JSON.stringify({ name: fx.types.strong.name, kind: "supplier-table", supplier: null, params: { table: lowered } }),
    });
    expect(r.status).toBe(200);
    await expectOneAlertFor(fx, a.id);
    // 12 kN still passes at 21 kN: no alert for it.
    expect(await overloadAlerts(fx, b.id)).toHaveLength(0);
  });
});

// An inspection's plumb reading feeds the member's check: the member is re-checked out of plumb at
// the angle read, the stored check and the member record show it, and a member that now fails
// fails the inspection and raises an overload alert like any failing member.
//
// Expected values, from outside the project:
// - EN 1065:1998 Table 2: class D nominal characteristic strength R_y,k = 34 kN over its whole range;
//   safe working load R_y,k / 1.65 (γF 1.5 × γM 1.1, EN 1065 / EN 12812) — both values to be
//   confirmed against EN 1065 Table 2 and clause 8 (see README).
// - Statics of a prop standing at θ from vertical under a vertical load N: axial force N / cos θ.
// - Tolerance within which a class rating applies: 1.5° out of plumb (common practice in UK
//   temporary works guidance; value to be confirmed against BS 5975 and EN 12812).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import { db, sql } from "@/db";
import { alerts, checks, inspections, members, memberTypes } from "@/db/schema";
import { sweepOverloads } from "@/lib/alerts/scans";
import { INSPECTION_CHECKS } from "@/lib/inspections/checklist";
import { type AlertsOrg, makeAlertsOrg, removeAlertsOrgs } from "../support/fixtures";
import { signInAs, type Client } from "../support/http";
import { drainOutbox } from "../support/outbox-drain";

const SWL_D = 34_000 / 1.65; // EN 1065 Table 2 class D, ÷ 1.65 (to be confirmed, see above)
const rad = (deg: number) => (deg * Math.PI) / 180;

afterAll(async () => {
  await drainOutbox("inspection-plumb-cleanup");
  await removeAlertsOrgs();
  await sql.end({ timeout: 5 });
});

const allPass = INSPECTION_CHECKS.map((c) => ({ check: c.key, result: "pass" }));

type InspectionAnswer = {
  inspection: { result: string; plumbDeg: number | null; items: { check: string; result: string; note?: string }[] };
  member: { status: string };
  recheck: { outOfPlumbDeg: number; check: { pass: boolean; utilisation: number; method: string; warnings: string[] } } | null;
  error?: { code: string; fields?: Record<string, string> };
};

let fx: AlertsOrg;
let engineer: Client;
let propTypeId: string;

async function logProp(tag: string, loadN: number) {
  const r = await engineer.json<{ member: { id: string; utilisation: number; checkPass: boolean } }>(`/api/v1/sites/${fx.site.id}/members`, {
    method: "POST",
    body: { tag, zoneId: fx.zoneA.id, memberTypeId: propTypeId, extensionMm: 3000, loadN, submit: true },
  });
  expect(r.status).toBe(201);
  return r.body.member;
}

const inspect = (memberId: string, body: Record<string, unknown>) =>
  engineer.json<InspectionAnswer>(`/api/v1/members/${memberId}/inspections`, { method: "POST", body: { result: "pass", items: allPass, ...body } });

beforeAll(async () => {
  fx = await makeAlertsOrg({ label: "plumb" });
  engineer = await signInAs(fx.people.engineer.email);
  const [t] = await db
    .insert(memberTypes)
    .values({ organisationId: fx.org.id, name: `Prop D35 ${fx.tag}`, kind: "en1065-prop", params: { propClass: "D" }, minExtensionMm: 1980, maxExtensionMm: 3500 })
    .returning();
  propTypeId = t!.id;
});

describe("a plumb reading at an inspection re-checks the member", () => {
  it("1° out: checked on the axial force N/cos θ against the safe working load; the utilisation rises and the member still passes", async () => {
    const m = await logProp("PLB-1", 10_000);
    // Plumb: 10 kN against 34/1.65 = 20.61 kN.
    expect(m.utilisation).toBeCloseTo(10_000 / SWL_D, 4);
    const r = await inspect(m.id, { plumbDeg: 1 });
    expect(r.status).toBe(201);
    expect(r.body.inspection).toMatchObject({ result: "pass", plumbDeg: 1 });
    expect(r.body.recheck!.outOfPlumbDeg).toBe(1);
    expect(r.body.recheck!.check.method).toBe("out-of-plumb");
    expect(r.body.recheck!.check.pass).toBe(true);
    expect(r.body.recheck!.check.utilisation).toBeCloseTo(10_000 / Math.cos(rad(1)) / SWL_D, 4);
    expect(r.body.recheck!.check.utilisation).toBeGreaterThan(m.utilisation);
    const [row] = await db.select().from(members).where(eq(members.id, m.id));
    expect(row!.outOfPlumbDeg).toBe(1);
    expect(row!.utilisation).toBeCloseTo(10_000 / Math.cos(rad(1)) / SWL_D, 4);
    expect(row!.status).toBe("submitted");
    const [check] = await db.select().from(checks).where(eq(checks.id, row!.latestCheckId!));
    expect(check).toMatchObject({ method: "out-of-plumb", reason: "plumb reading", pass: true });
    expect(check!.inputs).toMatchObject({ outOfPlumbDeg: 1 });
    expect(await sweepOverloads({ siteIds: [fx.site.id] })).toBe(0);
  });

  it("3° out: beyond the 1.5° a class rating covers, so the member fails, the inspection fails on its plumb item and an overload alert is raised", async () => {
    const m = await logProp("PLB-3", 10_000);
    const before = m.utilisation;
    const r = await inspect(m.id, { plumbDeg: 3 });
    expect(r.status).toBe(201);
    expect(r.body.recheck!.check.pass).toBe(false);
    // At least the axial force N/cos 3° over the safe working load, and over 1 since the rating no longer applies.
    expect(r.body.recheck!.check.utilisation).toBeGreaterThan(Math.max(1, 10_000 / Math.cos(rad(3)) / SWL_D));
    expect(r.body.recheck!.check.utilisation).toBeGreaterThan(before);
    expect(r.body.recheck!.check.warnings.join(" ")).toContain("3° out of plumb");
    // The inspector pressed "pass"; the result reflects the re-check.
    expect(r.body.inspection.result).toBe("fail");
    const plumb = r.body.inspection.items.find((i) => i.check === "plumb")!;
    expect(plumb.result).toBe("fail");
    expect(plumb.note).toContain("Re-checked 3° out of plumb");
    expect(r.body.member.status).toBe("out_of_service");
    const [row] = await db.select().from(members).where(eq(members.id, m.id));
    expect(row).toMatchObject({ outOfPlumbDeg: 3, checkPass: false, status: "out_of_service" });
    // The overload alert exists at once (the worker's sweep finds nothing more to raise), naming the lean.
    const list = await db.select().from(alerts).where(and(eq(alerts.kind, "member_overloaded"), eq(alerts.subjectId, m.id)));
    expect(list).toHaveLength(1);
    expect(list[0]!.threshold).toBe(row!.latestCheckId);
    expect(list[0]!.body).toContain("3° out of plumb");
    expect(await sweepOverloads({ siteIds: [fx.site.id] })).toBe(0);
    const failed = await db.select().from(alerts).where(and(eq(alerts.kind, "inspection_failed"), eq(alerts.subjectId, m.id)));
    expect(failed).toHaveLength(1);

    // The member record says it: the reading on the inspection, the lean in the details, the check's method.
    const detail = await engineer.json<{ member: { outOfPlumbDeg: number }; check: { method: string; pass: boolean }; inspections: { plumbDeg: number }[]; history: { summary: string }[] }>(
      `/api/v1/members/${m.id}`,
    );
    expect(detail.status).toBe(200);
    expect(detail.body.member.outOfPlumbDeg).toBe(3);
    expect(detail.body.check).toMatchObject({ method: "out-of-plumb", pass: false });
    expect(detail.body.inspections[0]!.plumbDeg).toBe(3);
    expect(detail.body.history.map((h) => h.summary)).toContain("Re-checked 3° out of plumb, as read at an inspection.");

    // Re-plumbed: a reading of 0° re-checks it standing plumb, and a pass returns it to service.
    const back = await inspect(m.id, { plumbDeg: 0 });
    expect(back.status).toBe(201);
    expect(back.body.inspection.result).toBe("pass");
    expect(back.body.recheck!.check).toMatchObject({ method: "en1065", pass: true });
    expect(back.body.recheck!.check.utilisation).toBeCloseTo(10_000 / SWL_D, 4);
    expect(back.body.member.status).toBe("submitted");
  });

  it("an offset over a level's height gives θ = atan(Δ/h); an offset of the head over the base gives θ = asin(Δ/L)", async () => {
    const m = await logProp("PLB-OFF", 8_000);
    // 17.5 mm over a 1000 mm level: atan(0.0175) = 1.0025°.
    const level = await inspect(m.id, { plumbOffsetMm: 17.5, plumbOverMm: 1000 });
    expect(level.status).toBe(201);
    expect(level.body.inspection.plumbDeg).toBeCloseTo((Math.atan(17.5 / 1000) * 180) / Math.PI, 6);
    expect(level.body.recheck!.check.utilisation).toBeCloseTo(8_000 / Math.cos(Math.atan(17.5 / 1000)) / SWL_D, 4);
    // 52 mm over the prop's 3000 mm: asin(0.01733) = 0.993°.
    const head = await inspect(m.id, { plumbOffsetMm: 52 });
    expect(head.status).toBe(201);
    expect(head.body.inspection.plumbDeg).toBeCloseTo((Math.asin(52 / 3000) * 180) / Math.PI, 6);
    const [stored] = await db.select().from(inspections).where(eq(inspections.id, (head.body.inspection as unknown as { id: string }).id));
    expect(stored).toMatchObject({ plumbOffsetMm: 52, plumbOverMm: null });
  });

  it("a bad reading is a 422 naming the field and the reason, and nothing is stored", async () => {
    const m = await logProp("PLB-BAD", 8_000);
    const cases: [Record<string, unknown>, string, RegExp][] = [
      [{ plumbDeg: -2 }, "plumbDeg", /cannot be negative/],
      [{ plumbDeg: 60 }, "plumbDeg", /at most 45 degrees/],
      [{ plumbDeg: "three" }, "plumbDeg", /number in degrees/],
      [{ plumbDeg: 2, plumbOffsetMm: 30 }, "plumbOffsetMm", /either as an angle or as an offset/],
      [{ plumbOverMm: 1000 }, "plumbOffsetMm", /offset \(mm\)/],
      [{ plumbOffsetMm: 3000 }, "plumbOffsetMm", /cannot be as large as the member's length of 3000 mm/],
      [{ plumbOffsetMm: 20, plumbOverMm: 0 }, "plumbOverMm", /more than 0 mm/],
    ];
    for (const [body, field, reason] of cases) {
      const r = await inspect(m.id, body);
      expect(r.status, JSON.stringify(body)).toBe(422);
      expect(r.body.error!.fields![field], JSON.stringify(body)).toMatch(reason);
    }
    expect(await db.select().from(inspections).where(eq(inspections.memberId, m.id))).toHaveLength(0);
    const [row] = await db.select().from(members).where(eq(members.id, m.id));
    expect(row!.outOfPlumbDeg).toBeNull();
    expect(await db.select().from(checks).where(eq(checks.memberId, m.id))).toHaveLength(1);
  });

  it("a supplier-rated member's lean is said in the check's warnings (the out-of-plumb method covers props and steel sections)", async () => {
    const s = await fx.addMember({ tag: "PLB-SUP", loadN: 20_000 });
    const r = await inspect(s.id, { plumbDeg: 2 });
    expect(r.status).toBe(201);
    expect(r.body.recheck!.check.method).toBe("supplier-table");
    expect(r.body.recheck!.check.warnings.join(" ")).toContain("Measured 2° out of plumb");
  });
});

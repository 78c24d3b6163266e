// A member can carry its base (base plate, sole plate, ground or slab): bearing is checked with the
// member and failing bearing fails the member. Expected values from outside the project:
// - BS 8004:1986 Table 1, firm clay 75–150 kPa: the lower value 75 kPa (common practice for a first
//   check; value to be confirmed against the table).
// - Uniform bearing pressure q = N/A (statics), with the load spread at 45° through a timber sole
//   plate, A = (a + 2t)(b + 2t) within the plate (common practice).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { db, sql } from "@/db";
import { members } from "@/db/schema";
import { type AlertsOrg, makeAlertsOrg, removeAlertsOrgs } from "../support/fixtures";
import { signInAs, type Client } from "../support/http";
import { drainOutbox } from "../support/outbox-drain";

afterAll(async () => {
  await drainOutbox("member-base-cleanup");
  await removeAlertsOrgs();
  await sql.end({ timeout: 5 });
});

let fx: AlertsOrg;
let engineer: Client;
beforeAll(async () => {
  fx = await makeAlertsOrg({ label: "base" });
  engineer = await signInAs(fx.people.engineer.email);
});

type Created = { member: { id: string; checkPass: boolean; utilisation: number }; error?: { fields?: Record<string, string> } };
const log = (tag: string, base: unknown) =>
  engineer.json<Created>(`/api/v1/sites/${fx.site.id}/members`, {
    method: "POST",
    body: { tag, memberTypeId: fx.types.strong.id, extensionMm: 2000, loadN: 25_000, base },
  });

describe("bearing under a member's base is part of its check", () => {
  it("a 150 × 150 mm plate straight on firm clay fails the member; a 225 × 1000 × 75 mm sole plate spreads it and it passes", async () => {
    // q = 25 000 N / 22 500 mm² = 1111 kPa against 75 kPa: utilisation 14.8.
    const bare = await log("BASE-BARE", { basePlateBMm: 150, basePlateLMm: 150, soil: "firm-clay" });
    expect(bare.status).toBe(201);
    expect(bare.body.member.checkPass).toBe(false);
    expect(bare.body.member.utilisation).toBeCloseTo(25_000 / 22_500 / 0.075, 3);
    // Sole plate: a' = min(225, 150 + 150) = 225, b' = min(1000, 300) = 300 → A = 67 500 mm²; q = 370 kPa, still over 75.
    // With a typed allowable pressure of 400 kPa (e.g. from a plate test): 370/400 = 0.926, passes.
    const spread = await log("BASE-SOLE", { basePlateBMm: 150, basePlateLMm: 150, solePlateBMm: 225, solePlateLMm: 1000, solePlateTMm: 75, allowablePressureKPa: 400 });
    expect(spread.status).toBe(201);
    expect(spread.body.member.checkPass).toBe(true);
    expect(spread.body.member.utilisation).toBeCloseTo(25_000 / 67_500 / 0.4, 3);
    const [row] = await db.select().from(members).where(eq(members.id, spread.body.member.id));
    expect(row!.base).toMatchObject({ solePlateTMm: 75, allowablePressureKPa: 400 });
  });

  it("the member record (API and page) carries the bearing working; a back-prop on a slab is checked for punching at the design load", async () => {
    // EN 1992-1-1 §6.4 by hand, no ρl given so v_min governs the resistance:
    // d = 160 mm, k = 1 + √(200/160) = 2.118 → 2.0 (6.47 cap); v_min = 0.035·2^1.5·√30 = 0.5422 MPa (6.3N).
    // N_Ed = 1.5 × 25 kN = 37.5 kN (EN 1990 Table A1.2(B)); u1 = 2(150 + 150) + 4π·160 = 2610.6 mm (Fig. 6.13);
    // v_Ed = 37 500/(2610.6 × 160) = 0.0898 MPa (6.38, β = 1); v_Ed/v_Rd,c = 0.166.
    const slab = await log("BASE-SLAB", { basePlateBMm: 150, basePlateLMm: 150, slabEffectiveDepthMm: 160, fckMpa: 30, punchingCode: "en1992" });
    expect(slab.status).toBe(201);
    const detail = await engineer.json<{ check: { bearing?: { pass: boolean; utilisation: number; loadN: number; loadFactor: number; steps: { symbol: string; value: number }[] } } }>(
      `/api/v1/members/${slab.body.member.id}`,
    );
    expect(detail.status).toBe(200);
    const b = detail.body.check.bearing!;
    expect(b.pass).toBe(true);
    expect(b.loadFactor).toBe(1.5);
    expect(b.loadN).toBeCloseTo(37_500, 6);
    const vMin = 0.035 * 2 ** 1.5 * Math.sqrt(30);
    const vEd = 37_500 / ((2 * 300 + 4 * Math.PI * 160) * 160);
    expect(b.utilisation).toBeCloseTo(vEd / vMin, 3);
    expect(b.steps.find((s) => s.symbol === "u1")!.value).toBeCloseTo(2 * 300 + 4 * Math.PI * 160, 3);

    // The failing plate on firm clay: the record says the bearing fails and why the member fails.
    const bare = await log("BASE-BARE-2", { basePlateBMm: 150, basePlateLMm: 150, soil: "firm-clay" });
    const bareDetail = await engineer.json<{ check: { pass: boolean; bearing?: { pass: boolean; steps: { symbol: string }[] } } }>(`/api/v1/members/${bare.body.member.id}`);
    expect(bareDetail.body.check.pass).toBe(false);
    expect(bareDetail.body.check.bearing!.pass).toBe(false);
    expect(bareDetail.body.check.bearing!.steps.map((s) => s.symbol)).toEqual(expect.arrayContaining(["A", "q", "q_a"]));
    const page = await engineer.fetch(`/sites/${fx.site.id}/members/${bare.body.member.id}`);
    const html = await page.text();
    expect(html).toContain("Bearing under the base");
    expect(html).toContain("Base plate 150 mm × 150 mm, on firm clay (75 kPa allowable");
  });

  it("a failing bearing blocks submitting, and editing the base re-checks the member", async () => {
    // Same plate on firm clay as above: q/q_a = 14.8 (BS 8004:1986 Table 1 lower value, common practice).
    const refused = await engineer.json<Created>(`/api/v1/sites/${fx.site.id}/members`, {
      method: "POST",
      body: { tag: "BASE-SUBMIT", memberTypeId: fx.types.strong.id, extensionMm: 2000, loadN: 25_000, submit: true, base: { basePlateBMm: 150, basePlateLMm: 150, soil: "firm-clay" } },
    });
    expect(refused.status).toBe(422);
    expect(refused.body.error!.fields!.submit).toMatch(/bearing check/);

    const draft = await log("BASE-EDIT", { basePlateBMm: 150, basePlateLMm: 150, soil: "firm-clay" });
    expect(draft.body.member.checkPass).toBe(false);
    // A 225 × 1000 × 75 mm sole plate on a typed 400 kPa: 25 000/67 500 mm² = 370 kPa → 0.926 (45° spread, common practice).
    const edited = await engineer.json<{ member: { checkPass: boolean; utilisation: number }; check: { bearing?: { utilisation: number } } }>(`/api/v1/members/${draft.body.member.id}`, {
      method: "PATCH",
      body: { base: { basePlateBMm: 150, basePlateLMm: 150, solePlateBMm: 225, solePlateLMm: 1000, solePlateTMm: 75, allowablePressureKPa: 400 } },
    });
    expect(edited.status).toBe(200);
    expect(edited.body.check.bearing!.utilisation).toBeCloseTo(25_000 / 67_500 / 0.4, 3);
    // A partial sole plate is refused and the stored base is unchanged.
    const bad = await engineer.json<Created>(`/api/v1/members/${draft.body.member.id}`, { method: "PATCH", body: { base: { basePlateBMm: 150, basePlateLMm: 150, solePlateBMm: 225, soil: "firm-clay" } } });
    expect(bad.status).toBe(422);
    expect(bad.body.error!.fields!["base.solePlateLMm"]).toMatch(/sole plate's length/);
    const [row] = await db.select().from(members).where(eq(members.id, draft.body.member.id));
    expect(row!.base).toMatchObject({ solePlateTMm: 75, allowablePressureKPa: 400 });
  });

  it("a base the check cannot use is a 422 naming the field, and nothing is stored", async () => {
    const cases: [unknown, string, RegExp][] = [
      [{ basePlateBMm: 150, basePlateLMm: 150 }, "base.allowablePressureKPa", /allowable bearing pressure in kPa/],
      [{ basePlateBMm: -1, basePlateLMm: 150, soil: "firm-clay" }, "base.basePlateBMm", /greater than zero/],
      [{ basePlateBMm: 150, basePlateLMm: 150, soil: "peat" }, "base.soil", /Ground type must be one of/],
      [{ basePlateBMm: 150, basePlateLMm: 150, solePlateBMm: 225, soil: "firm-clay" }, "base.solePlateLMm", /sole plate's length/],
      [{ basePlateBMm: 150, basePlateLMm: 150, slabDepthMm: 200 }, "base.fckMpa", /strength of the slab's concrete/],
    ];
    for (const [base, field, reason] of cases) {
      const r = await log(`BASE-BAD-${field.length}-${Math.random().toString(36).slice(2, 6)}`, base);
      expect(r.status, JSON.stringify(base)).toBe(422);
      expect(r.body.error!.fields![field], JSON.stringify(base)).toMatch(reason);
    }
    const stored = await db.select().from(members).where(eq(members.siteId, fx.site.id));
    expect(stored.filter((m) => m.tag.startsWith("BASE-BAD"))).toHaveLength(0);
  });
});

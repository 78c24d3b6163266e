// Back-propping in a scheme sets the working load of each member from its level of props
// (Grundy & Kabaila 1963, simplified method), and a change to the scheme re-checks those members.
// Expected loads are worked by hand from the method's own assumptions (ACI Journal 60(12), 1963):
// the props under a fresh slab carry its whole weight, formwork and construction load (a fresh slab
// has no stiffness), and the ground under the first level of props is rigid, so while every level
// still stands on the ground the level below carries everything above it.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, count, eq } from "drizzle-orm";
import { db, sql } from "@/db";
import { alerts, checks, members, schemes } from "@/db/schema";
import { sweepOverloads } from "@/lib/alerts/scans";
import { type AlertsOrg, makeAlertsOrg, removeAlertsOrgs } from "../support/fixtures";
import { signInAs, type Client } from "../support/http";
import { drainOutbox } from "../support/outbox-drain";

afterAll(async () => {
  await drainOutbox("backprop-members-cleanup");
  await removeAlertsOrgs();
  await sql.end({ timeout: 5 });
});

type ErrorBody = { error: { code: string; message: string; fields?: Record<string, string> } };
type Created = { member: { id: string; loadN: number; level: number | null; loadSource: string; checkPass: boolean | null; utilisation: number | null } };
type Step = { label: string; symbol: string; value: unknown; unit: string; source: string };
type Detail = {
  member: { loadN: number; level: number | null; loadSource: string; utilisation: number | null; checkPass: boolean | null };
  checks: { reason: string; steps: Step[]; warnings?: string[] }[];
  history: { summary: string; details: string[] }[];
};

let fx: AlertsOrg;
let designer: Client;
let engineer: Client;
// The fixture's slab: 250 mm at 25 kN/m³ → w = 6.25 kN/m².
const W = 6.25;
const BP = { shoredLevels: 2, formworkKPa: 0.5, constructionKPa: 1.5 };

const schemeBody = (over: Record<string, unknown>) => ({
  reference: fx.scheme.reference, title: fx.scheme.title, designerName: fx.scheme.designerName, category: fx.scheme.category, ...over,
});
const patchScheme = (body: unknown) => designer.json<ErrorBody & { rechecked: number; scheme: { backprop: unknown } }>(`/api/v1/sites/${fx.site.id}/schemes/${fx.scheme.id}`, { method: "PATCH", body });
const logMember = (body: Record<string, unknown>) =>
  engineer.json<Created & ErrorBody>(`/api/v1/sites/${fx.site.id}/members`, {
    method: "POST",
    body: { schemeId: fx.scheme.id, memberTypeId: fx.types.strong.id, extensionMm: 2000, loadSource: "backprop", spacingXMm: 1200, spacingYMm: 1200, ...body },
  });
const detail = async (id: string) => (await engineer.json<Detail>(`/api/v1/members/${id}`)).body;
const memberCount = async () => (await db.select({ n: count() }).from(members).where(eq(members.siteId, fx.site.id)))[0]!.n;

beforeAll(async () => {
  fx = await makeAlertsOrg({ label: "backprop" });
  designer = await signInAs(fx.people.designer.email);
  engineer = await signInAs(fx.people.engineer.email);
  const r = await patchScheme(schemeBody({ backprop: BP }));
  expect(r.status).toBe(200);
  expect(r.body.scheme.backprop).toEqual(BP);
});

describe("a member's load from the scheme's back-propping, by level", () => {
  it("level 1 carries the wet slab, its formwork and the construction load; level 2 also the slab below and its formwork (rigid ground)", async () => {
    // Level 1, under the fresh slab: w + f + q = 6.25 + 0.5 + 1.5 = 8.25 kN/m² (Grundy & Kabaila 1963, assumptions: a fresh slab has no stiffness).
    const l1 = await logMember({ tag: "BP-L1", level: 1 });
    expect(l1.status).toBe(201);
    expect(l1.body.member.loadN).toBeCloseTo(8.25 * 1.44 * 1000, 0); // 11.88 kN over 1.2 m × 1.2 m
    expect(l1.body.member.level).toBe(1);

    // Level 2: in the second cycle both slabs stand on props down to the rigid ground, so the lower level carries
    // slab 1 with its formwork and slab 2 with its formwork and construction load: 2w + 2f + q = 12.5 + 1.0 + 1.5 = 15 kN/m².
    const l2 = await logMember({ tag: "BP-L2", level: 2 });
    expect(l2.status).toBe(201);
    expect(l2.body.member.loadN).toBeCloseTo(15 * 1.44 * 1000, 0); // 21.6 kN
    // The strong shore's table: 35 kN at 2.0 m, a working-load table (utilisation = load / safe load).
    expect(l2.body.member.utilisation).toBeCloseTo(21_600 / 35_000, 3);

    const d = await detail(l2.body.member.id);
    expect(d.member.loadSource).toBe("backprop");
    const steps = d.checks[0]!.steps;
    expect(steps.find((s) => s.symbol === "w")?.value).toBeCloseTo(W, 6);
    const ratio = steps.find((s) => s.symbol === "P/w")!;
    expect(ratio.value).toBeCloseTo(15 / W, 6); // 2.4
    expect(ratio.label).toContain("Cycle 2: slab 2 cast");
    expect(ratio.source).toContain("Grundy & Kabaila 1963");
    expect(steps.find((s) => s.symbol === "N_k")?.value).toBeCloseTo(21_600, 0);
  });

  it("bad input is refused with the field and the reason, and nothing is stored", async () => {
    const before = await memberCount();
    const high = await logMember({ tag: "BP-BAD-1", level: 3 });
    expect(high.status).toBe(422);
    expect(high.body.error.fields?.level).toMatch(/has 2 levels of props; choose a level from 1 .* to 2/);
    const none = await logMember({ tag: "BP-BAD-2" });
    expect(none.status).toBe(422);
    expect(none.body.error.fields?.level).toMatch(/Choose the member's level of props/);
    const direct = await logMember({ tag: "BP-BAD-3", loadSource: "direct", loadN: 10_000, level: 1 });
    expect(direct.status).toBe(422);
    expect(direct.body.error.fields?.level).toMatch(/applies only to a load from the scheme's back-propping/);
    const noSpacing = await logMember({ tag: "BP-BAD-4", level: 1, spacingXMm: null });
    expect(noSpacing.status).toBe(422);
    expect(noSpacing.body.error.fields?.spacingXMm).toMatch(/spacing X/);

    // A scheme with a slab and no back-propping.
    const plain = await designer.json<{ scheme: { id: string } }>(`/api/v1/sites/${fx.site.id}/schemes`, {
      method: "POST", body: { reference: `${fx.scheme.reference}-P`, title: "Plain slab", designerName: "D", category: 1, slabThicknessMm: 200 },
    });
    expect(plain.status).toBe(201);
    const noBp = await logMember({ tag: "BP-BAD-5", level: 1, schemeId: plain.body.scheme.id });
    expect(noBp.status).toBe(422);
    expect(noBp.body.error.fields?.loadSource).toMatch(/has no back-propping/);
    expect(await memberCount()).toBe(before);

    // Back-propping without a slab, or with too many levels, is refused on the scheme.
    const schemesBefore = (await db.select({ n: count() }).from(schemes).where(eq(schemes.siteId, fx.site.id)))[0]!.n;
    const noSlab = await designer.json<ErrorBody>(`/api/v1/sites/${fx.site.id}/schemes`, {
      method: "POST", body: { reference: `${fx.scheme.reference}-Q`, title: "No slab", designerName: "D", category: 1, backprop: { shoredLevels: 2 } },
    });
    expect(noSlab.status).toBe(422);
    expect(noSlab.body.error.fields?.backprop).toMatch(/give the slab thickness/);
    const seven = await patchScheme(schemeBody({ backprop: { shoredLevels: 7 } }));
    expect(seven.status).toBe(422);
    expect(seven.body.error.fields?.["backprop.shoredLevels"]).toMatch(/1 to 6/);
    expect((await db.select({ n: count() }).from(schemes).where(eq(schemes.siteId, fx.site.id)))[0]!.n).toBe(schemesBefore);
  });

  it("a change of the back-propping re-checks its members: new load, history says why, an overload raises the alert", async () => {
    // 1.5 m × 1.5 m at level 2: 2.25 m² × 15 kN/m² = 33.75 kN, under the 35 kN the table gives at 2.0 m.
    const wide = await logMember({ tag: "BP-WIDE", level: 2, spacingXMm: 1500, spacingYMm: 1500 });
    expect(wide.status).toBe(201);
    expect(wide.body.member.checkPass).toBe(true);
    expect(await sweepOverloads({ siteIds: [fx.site.id] })).toBe(0);
    // A member on the same scheme whose load comes from its slab: the back-propping is not its load.
    const slabMember = await fx.addMember({ tag: "BP-SLAB", slab: { spacingMm: 1000 } });
    const slabChecks = async () => (await db.select({ n: count() }).from(checks).where(eq(checks.memberId, slabMember.id)))[0]!.n;
    const slabChecksBefore = await slabChecks();

    // Formwork 1.0 kN/m²: level 2 = 2w + 2f + q = 12.5 + 2.0 + 1.5 = 16 kN/m² → 36 kN over 2.25 m²: it now fails.
    const r = await patchScheme(schemeBody({ backprop: { ...BP, formworkKPa: 1.0 } }));
    expect(r.status).toBe(200);
    expect(r.body.rechecked).toBe(3);
    expect(await slabChecks()).toBe(slabChecksBefore);
    const d = await detail(wide.body.member.id);
    expect(d.member.loadN).toBeCloseTo(36_000, 0);
    expect(d.member.checkPass).toBe(false);
    expect(d.checks[0]!.reason).toBe("scheme changed");
    expect(d.history[0]!.summary).toBe(`Re-checked because scheme ${fx.scheme.reference} was changed (back-propping).`);
    expect(d.history[0]!.details.join(" ")).toMatch(/Working load changed from 33\.75 kN to 36\.00 kN.*re-check fails/);
    expect(await sweepOverloads({ siteIds: [fx.site.id] })).toBe(1);
    expect(await db.select().from(alerts).where(and(eq(alerts.kind, "member_overloaded"), eq(alerts.subjectId, wide.body.member.id)))).toHaveLength(1);

    // The slab itself changes the back-propped loads too: 300 mm → w = 7.5; level 1 = 7.5 + 1.0 + 1.5 = 10 kN/m² → 14.4 kN.
    const [l1] = await db.select({ id: members.id }).from(members).where(and(eq(members.siteId, fx.site.id), eq(members.tag, "BP-L1")));
    const s = await patchScheme(schemeBody({ backprop: { ...BP, formworkKPa: 1.0 }, slabThicknessMm: 300 }));
    expect(s.status).toBe(200);
    expect((await detail(l1!.id)).member.loadN).toBeCloseTo(14_400, 0);
    // …and the slab member's: 1 m² × (7.5 + 0.5 + 1.5) = 9.5 kN (the fixture slab's own formwork and construction load).
    expect(s.body.rechecked).toBe(4);
    expect((await detail(slabMember.id)).member.loadN).toBeCloseTo(9_500, 0);
  });

  it("fewer levels than a member stands at, or no back-propping, is refused while members use it; nothing changes", async () => {
    const [s0] = await db.select().from(schemes).where(eq(schemes.id, fx.scheme.id));
    const one = await patchScheme(schemeBody({ backprop: { shoredLevels: 1 } }));
    expect(one.status).toBe(422);
    expect(one.body.error.fields?.["backprop.shoredLevels"]).toMatch(/BP-L2.*levels up to 2/);
    const off = await patchScheme(schemeBody({ backprop: null }));
    expect(off.status).toBe(422);
    expect(off.body.error.fields?.backprop).toMatch(/take their load from this scheme's back-propping/);
    const [s1] = await db.select().from(schemes).where(eq(schemes.id, fx.scheme.id));
    expect(s1!.backprop).toEqual(s0!.backprop);
  });

  it("an edit to a direct load leaves the level behind", async () => {
    const [m] = await db.select({ id: members.id }).from(members).where(and(eq(members.siteId, fx.site.id), eq(members.tag, "BP-L1")));
    const r = await engineer.json<Created>(`/api/v1/members/${m!.id}`, { method: "PATCH", body: { loadSource: "direct", loadN: 12_000 } });
    expect(r.status).toBe(200);
    expect(r.body.member.level).toBeNull();
    expect(r.body.member.loadN).toBe(12_000);
  });
});

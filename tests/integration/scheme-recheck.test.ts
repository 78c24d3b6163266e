// A scheme change re-checks the members whose load comes from it: editing the slab (thickness,
// density, formwork, construction load) re-derives every slab-derived member's load in the same
// transaction, stores a new check with the reason, tells it in the member's history and, when a
// member now fails, the overload sweep raises its alert. Loads are worked by hand below.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import { db, sql } from "@/db";
import { alerts, checks, members, schemes } from "@/db/schema";
import { sweepOverloads } from "@/lib/alerts/scans";
import { type AlertsOrg, makeAlertsOrg, removeAlertsOrgs } from "../support/fixtures";
import { signInAs, type Client } from "../support/http";
import { drainOutbox } from "../support/outbox-drain";

afterAll(async () => {
  await drainOutbox("scheme-recheck-cleanup");
  await removeAlertsOrgs();
  await sql.end({ timeout: 5 });
});

type ErrorBody = { error: { code: string; message: string; fields?: Record<string, string> } };
type Detail = {
  member: { loadN: number; utilisation: number | null; checkPass: boolean | null };
  checks: { reason: string; steps: { symbol: string; value: unknown }[] }[];
  history: { summary: string; details: string[] }[];
};

let fx: AlertsOrg;
let designer: Client;
let engineer: Client;
beforeAll(async () => {
  fx = await makeAlertsOrg({ label: "scheme-recheck" });
  designer = await signInAs(fx.people.designer.email);
  engineer = await signInAs(fx.people.engineer.email);
});

const schemeBody = (over: Record<string, unknown>) => ({
  reference: fx.scheme.reference, title: fx.scheme.title, designerName: fx.scheme.designerName, category: fx.scheme.category, ...over,
});
const patchScheme = (body: unknown) => designer.json<ErrorBody & { rechecked: number }>(`/api/v1/sites/${fx.site.id}/schemes/${fx.scheme.id}`, { method: "PATCH", body });
const detail = async (id: string) => (await engineer.json<Detail>(`/api/v1/members/${id}`)).body;

describe("editing a scheme's slab re-checks the members whose load is derived from it", () => {
  it("new load and utilisation through the API, a check with the reason, history says why; an overload raises the alert", async () => {
    // The fixture scheme's slab: 250 mm × 25 kN/m³ + 0.5 formwork + 1.5 construction = 8.25 kN/m².
    const small = await fx.addMember({ tag: "SR-1200", slab: { spacingMm: 1200 } });
    const wide = await fx.addMember({ tag: "SR-2000", slab: { spacingMm: 2000 } });
    const direct = await fx.addMember({ tag: "SR-DIRECT", loadN: 25_000 });
    for (const m of [small, wide, direct]) expect(m.pass).toBe(true);
    expect(await sweepOverloads({ siteIds: [fx.site.id] })).toBe(0);
    const before = await detail(small.id);
    expect(before.member.loadN).toBeCloseTo(1.44 * 8.25 * 1000, 0); // 11.88 kN over 1.2 m × 1.2 m

    // 300 mm slab: 0.3 × 25 + 0.5 + 1.5 = 9.5 kN/m² (EN 1991-1-6 §4.11: self-weight + formwork + construction operations).
    const r = await patchScheme(schemeBody({ slabThicknessMm: 300 }));
    expect(r.status).toBe(200);
    expect(r.body.rechecked).toBe(2);

    const a = await detail(small.id);
    expect(a.member.loadN).toBeCloseTo(1.44 * 9.5 * 1000, 0); // 13.68 kN
    // The strong shore's table gives 35 kN at 2.0 m (a working-load table: utilisation = load / safe load).
    expect(a.member.utilisation).toBeCloseTo(13_680 / 35_000, 3);
    expect(a.member.checkPass).toBe(true);
    expect(a.checks[0]!.reason).toBe("scheme changed");
    // The stored working is the new slab's: its thickness step says 300 mm.
    expect(a.checks[0]!.steps.find((s) => s.symbol === "t")?.value).toBe(300);
    expect(a.history[0]!.summary).toBe(`Re-checked because scheme ${fx.scheme.reference} was changed (slab thickness).`);
    expect(a.history[0]!.details.join(" ")).toMatch(/Working load changed from 11\.88 kN to 13\.68 kN/);

    // 2.0 m × 2.0 m: 4 m² × 9.5 = 38 kN against 35 kN — it now fails, and the sweep alerts once.
    const w = await detail(wide.id);
    expect(w.member.loadN).toBeCloseTo(38_000, 0);
    expect(w.member.checkPass).toBe(false);
    expect(w.history[0]!.details.join(" ")).toMatch(/re-check fails/);
    expect(await sweepOverloads({ siteIds: [fx.site.id] })).toBe(1);
    const raised = await db.select().from(alerts).where(and(eq(alerts.kind, "member_overloaded"), eq(alerts.subjectId, wide.id)));
    expect(raised).toHaveLength(1);
    expect(raised[0]!.title).toContain("SR-2000");

    // A member whose load is given directly is not touched.
    const d = await db.select({ loadN: members.loadN }).from(members).where(eq(members.id, direct.id));
    expect(d[0]!.loadN).toBe(25_000);
    expect((await db.select().from(checks).where(eq(checks.memberId, direct.id))).length).toBe(1);
  });

  it("formwork and construction load changes re-check too; a change elsewhere in the scheme does not", async () => {
    const m = await fx.addMember({ tag: "SR-FW", slab: { spacingMm: 1000 } });
    const nChecks = async () => (await db.select().from(checks).where(eq(checks.memberId, m.id))).length;
    const start = await nChecks();
    const t = await patchScheme(schemeBody({ title: "Renamed scheme" }));
    expect(t.status).toBe(200);
    expect(await nChecks()).toBe(start);
    // 1 m² × (slab as it now stands: 0.3 × 25 = 7.5) + 1.0 formwork + 2.0 construction = 10.5 kN.
    const r = await patchScheme(schemeBody({ title: "Renamed scheme", formworkKnM2: 1.0, constructionKnM2: 2.0 }));
    expect(r.status).toBe(200);
    expect(await nChecks()).toBe(start + 1);
    const dm = await detail(m.id);
    expect(dm.member.loadN).toBeCloseTo(10_500, 0);
    expect(dm.history[0]!.summary).toBe(`Re-checked because scheme ${fx.scheme.reference} was changed (formwork self-weight, construction operations load).`);
  });

  it("removing the slab while members take their load from it is refused with the reason, and nothing changes", async () => {
    const [s0] = await db.select().from(schemes).where(eq(schemes.id, fx.scheme.id));
    const r = await patchScheme(schemeBody({ slabThicknessMm: null }));
    expect(r.status).toBe(422);
    expect(r.body.error.fields?.slabThicknessMm).toMatch(/SR-1200.*take their load from this scheme's slab/);
    const [s1] = await db.select().from(schemes).where(eq(schemes.id, fx.scheme.id));
    expect(s1!.slabThicknessMm).toBe(s0!.slabThicknessMm);
  });
});

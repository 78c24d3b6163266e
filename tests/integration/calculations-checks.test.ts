// POST /api/v1/calculations for the checks around a member: same contract as the capacity methods
// (200 with the working, 422 with field and reason). Expected values are worked by hand from the clause named.
import { describe, expect, it } from "vitest";
import { signInAs } from "../support/http";

type Ok = { ok: true; method: string; utilisation?: number; capacityN?: number; checks?: { name: string; utilisation: number }[]; stages?: unknown[]; maxSlabLoadRatio?: number; steps: { source: string }[] };
type Bad = { error: { code: string; fields: Record<string, string> } };

describe("POST /api/v1/calculations — checks around a member", () => {
  it("back-propping sequence: two levels of props peak at 2.25 × the slab weight (Grundy & Kabaila 1963)", async () => {
    const c = await signInAs("engineer@demo.example");
    const r = await c.json<Ok>("/api/v1/calculations", { method: "POST", body: { method: "backprop-sequence", shoredLevels: 2, slabSelfWeightKPa: 6 } });
    expect(r.status).toBe(200);
    expect(r.body.maxSlabLoadRatio).toBeCloseTo(2.25, 6);
    expect(r.body.stages?.length).toBeGreaterThan(4);
  });

  it("base bearing with punching: EN 1992-1-1 §6.4 v_min governs a 160 mm slab (hand value 0.2649)", async () => {
    const c = await signInAs("engineer@demo.example");
    const r = await c.json<Ok>("/api/v1/calculations", {
      method: "POST",
      body: { method: "base-bearing", loadN: 60000, basePlateBMm: 150, basePlateLMm: 150, slabEffectiveDepthMm: 160, fckMpa: 30 },
    });
    expect(r.status).toBe(200);
    expect(r.body.utilisation).toBeCloseTo(0.2649, 3);
    expect(r.body.steps.map((s) => s.source).join(" ")).toContain("EN 1992-1-1 §6.4");
  });

  it("out of plumb: an EN 1065 prop found 3° out fails; raking shore combined answers with its checks", async () => {
    const c = await signInAs("engineer@demo.example");
    const prop = await c.json<Ok & { pass: boolean }>("/api/v1/calculations", {
      method: "POST",
      body: { method: "out-of-plumb", lengthMm: 3000, propClass: "D", maxExtensionMm: 3500, minExtensionMm: 1980, loadN: 10000, outOfPlumbDeg: 3 },
    });
    expect(prop.status).toBe(200);
    expect(prop.body.pass).toBe(false);
    const raker = await c.json<Ok>("/api/v1/calculations", {
      method: "POST",
      body: { method: "raking-combined", lengthMm: 6000, angleDeg: 60, section: { shape: "chs", dMm: 168.3, tMm: 6.3 }, fyMpa: 355, formed: "hot-finished", loadN: 150000 },
    });
    expect(raker.status).toBe(200);
    // EN 1993-1-1 §6.3.3 Eq. 6.62 with Annex A k_zz, worked by hand in tests/unit/engineering/new-checks.test.ts: 0.31879.
    expect(raker.body.utilisation).toBeCloseTo(0.3188, 3);
    expect(raker.body.checks?.map((x) => x.name)).toContain("Combined N + M");
  });

  it("bad input is a 422 with the field and a sentence, never a 500", async () => {
    const c = await signInAs("engineer@demo.example");
    const r = await c.json<Bad>("/api/v1/calculations", { method: "POST", body: { method: "backprop-sequence", shoredLevels: 9, slabSelfWeightKPa: 6 } });
    expect(r.status).toBe(422);
    expect(r.body.error.fields.shoredLevels).toMatch(/up to 6/);
    const b = await c.json<Bad>("/api/v1/calculations", { method: "POST", body: { method: "base-bearing", loadN: 1000, basePlateBMm: 150 } });
    expect(b.status).toBe(422);
    expect(Object.keys(b.body.error.fields)).toEqual(expect.arrayContaining(["basePlateLMm", "allowablePressureKPa"]));
    const o = await c.json<Bad>("/api/v1/calculations", { method: "POST", body: { method: "out-of-plumb", lengthMm: 3000, section: { shape: "chs", dMm: 114.3, tMm: 5 }, fyMpa: 355, loadN: 1e6, eccentricityMm: 5 } });
    expect(o.status).toBe(422);
    expect(o.body.error.fields.loadN).toMatch(/critical load/);
  });
});

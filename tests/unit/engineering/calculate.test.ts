import { describe, expect, it } from "vitest";
import { calculate, capacityCurve, ENGINE_VERSION, METHOD_IDS, METHODS, type CapacityResult } from "@/lib/engineering";

function ok(r: ReturnType<typeof calculate>): CapacityResult {
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  if (r.capacityN === undefined) throw new Error("The result has no capacity.");
  return r as CapacityResult;
}

const chs = { shape: "chs", dMm: 114.3, tMm: 5 };
const requests: Record<string, Record<string, unknown>> = {
  euler: { method: "euler", lengthMm: 3000, section: chs, loadN: 50000 },
  en1993: { method: "en1993", lengthMm: 3000, section: chs, fyMpa: 355, loadN: 50000 },
  "aisc360-lrfd": { method: "aisc360-lrfd", lengthMm: 3000, section: chs, fyMpa: 345, loadN: 50000 },
  "aisc360-asd": { method: "aisc360-asd", lengthMm: 3000, section: chs, fyMpa: 345, loadN: 50000 },
  en1065: { method: "en1065", lengthMm: 3000, propClass: "D", maxExtensionMm: 3500, loadN: 15000 },
  "supplier-table": { method: "supplier-table", lengthMm: 3000, table: [{ lengthMm: 2000, safeLoadN: 30000 }, { lengthMm: 4000, safeLoadN: 15000 }], loadN: 15000 },
  en1995: { method: "en1995", lengthMm: 2400, section: { shape: "rect", bMm: 100, hMm: 100 }, strengthClass: "C24", loadN: 20000 },
  nds: { method: "nds", lengthMm: 2400, section: { shape: "rect", bMm: 89, hMm: 89 }, fcStarMpa: 10, eMinMpa: 4000, loadN: 20000 },
  "point-brace": { method: "point-brace", lengthMm: 6000, section: chs, braces: 2, loadN: 100000 },
};

describe("result contract", () => {
  it.each(METHOD_IDS)("%s returns the documented envelope", (m) => {
    const r = ok(calculate(requests[m]));
    expect(r.method).toBe(m);
    expect(r.engineVersion).toBe(ENGINE_VERSION);
    expect(ENGINE_VERSION).toBe("1.2.0"); // 1.1.0: the corrections of issue 10 (supplier tables in 1/L², RHS corner radii, AISC design wall, safe defaults); 1.2.0: the audit's fixes (lean at the base, f_y by nominal wall, EN 1993-1-1 Annex A k_yy)
    expect(r.capacityN).toBeGreaterThan(0);
    expect(["elastic-critical", "design-resistance", "available-strength", "allowable-strength", "safe-working-load"]).toContain(r.basis);
    expect(r.basis).toBe(METHODS.find((x) => x.id === m)?.basis);
    expect(r.loadBasis.length).toBeGreaterThan(20);
    expect(r.steps.length).toBeGreaterThan(2);
    for (const s of r.steps) {
      // toConfirm and note appear only on a step that has them (issue #16: never inside the source).
      expect(Object.keys(s).filter((k) => k !== "toConfirm" && k !== "note").sort()).toEqual(["label", "source", "symbol", "unit", "value"]);
      expect(s.source.length).toBeGreaterThan(3);
      if (typeof s.value === "number") expect(Number.isFinite(s.value)).toBe(true);
    }
    expect(Array.isArray(r.warnings)).toBe(true);
    // utilisation = loadN / capacityN, pass = utilisation ≤ 1
    expect(r.utilisation).toBeCloseTo((requests[m].loadN as number) / (r.capacityN as number), 12);
    expect(r.pass).toBe((r.utilisation as number) <= 1);
    // The last capacity step of the sheet is the number reported.
    expect(r.steps.some((s) => s.value === r.capacityN)).toBe(true);
  });

  it("no utilisation without a load", () => {
    const { loadN: _l, ...rest } = requests.en1993;
    const r = ok(calculate(rest));
    expect(r.utilisation).toBeUndefined();
    expect(r.pass).toBeUndefined();
  });

  it("a failing load is reported as pass = false", () => {
    const r = ok(calculate({ ...requests.en1065, loadN: 25000 }));
    // 25 kN against 34/1.65 = 20.6 kN
    expect(r.pass).toBe(false);
    expect(r.utilisation).toBeGreaterThan(1);
  });

  it("pass is utilisation ≤ 1 exactly", () => {
    // Class D safe working load = 34 000/1.65 = 20 606.06 N: 20 606 N passes, 20 607 N does not.
    expect(ok(calculate({ ...requests.en1065, loadN: 20606 })).pass).toBe(true);
    expect(ok(calculate({ ...requests.en1065, loadN: 20607 })).pass).toBe(false);
    const over = ok(calculate({ ...requests.en1065, loadN: 21636 }));
    expect(over.pass).toBe(false);
    // 21 636/20 606.06 = 1.04998
    expect(over.utilisation).toBeCloseTo(1.04998, 4);
  });

  it("warns when the length looks like metres", () => {
    const r = ok(calculate({ ...requests.euler, lengthMm: 3.5 }));
    expect(r.warnings.join(" ")).toContain("millimetres");
  });
});

describe("method list", () => {
  it("covers every method with a label and its inputs", () => {
    expect(METHODS.map((m) => m.id).sort()).toEqual([...METHOD_IDS].sort());
    for (const m of METHODS) {
      expect(m.label.length).toBeGreaterThan(5);
      expect(m.required).toContain("lengthMm");
    }
  });
  it("the required fields are what the engine asks for", () => {
    for (const m of METHODS) {
      const r = calculate({ method: m.id, lengthMm: 3000 });
      expect(r.ok).toBe(false);
      if (r.ok) continue;
      const asked = r.errors.map((e) => e.field);
      for (const req of m.required.filter((f) => f !== "lengthMm")) {
        const options = req.split("|").flatMap((o) => o.split("+"));
        expect(options.some((o) => asked.includes(o))).toBe(true);
      }
    }
  });
});

describe("capacityCurve", () => {
  it("EN 1065 class B: omits lengths outside the prop's range", () => {
    const pts = capacityCurve({ method: "en1065", propClass: "B", maxExtensionMm: 3500, minExtensionMm: 1750 }, 1000, 4000, 7);
    // lengths 1000, 1500, …, 4000; the prop covers 1750–3500 → 2000, 2500, 3000, 3500
    expect(pts.map((p) => p.lengthMm)).toEqual([2000, 2500, 3000, 3500]);
    // class B at 2.0 m: 68 × 3.5/4 = 59.5 kN → /1.65 = 36.06 kN
    expect(pts[0].capacityN).toBeCloseTo(36060.6, 1);
  });
  it("steel: gives Euler alongside and never rises", () => {
    const pts = capacityCurve({ method: "en1993", section: chs, fyMpa: 355 }, 500, 8000, 40);
    expect(pts).toHaveLength(40);
    for (let i = 1; i < pts.length; i++) {
      expect(pts[i].capacityN).toBeLessThanOrEqual(pts[i - 1].capacityN);
      expect(pts[i].eulerN).toBeGreaterThan(pts[i].capacityN);
    }
  });
  it("returns [] for bad arguments instead of throwing", () => {
    expect(capacityCurve(null, 0, 1, 5)).toEqual([]);
    expect(capacityCurve({ method: "euler", section: chs }, Number.NaN, 1000, 5)).toEqual([]);
    expect(capacityCurve({ method: "euler", section: chs }, -10, 0, 5)).toEqual([]);
    expect(capacityCurve({ method: "en1993", section: chs }, 1000, 2000, 5)).toEqual([]);
  });
});

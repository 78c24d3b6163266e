import { describe, expect, it } from "vitest";
import { calculate, interpolateTable, type CapacityResult } from "@/lib/engineering";

function ok(r: ReturnType<typeof calculate>): CapacityResult {
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  if (r.capacityN === undefined) throw new Error("The result has no capacity.");
  return r as CapacityResult;
}

const table = [
  { lengthMm: 1750, safeLoadN: 35000 },
  { lengthMm: 2500, safeLoadN: 27000 },
  { lengthMm: 3000, safeLoadN: 22000 },
  { lengthMm: 3500, safeLoadN: 17000 },
];

describe("supplier table interpolation", () => {
  it("interpolation linear in 1/L² by hand, below the straight line", () => {
    // Between 2500 mm (27 000 N) and 3000 mm (22 000 N) at 2800 mm. A straight line would give
    // 27 000 + (2800 − 2500)/(3000 − 2500) × (22 000 − 27 000) = 24 000 N, which overstates a capacity that
    // falls with 1/L² (Euler; Timoshenko & Gere §2.2). Linear in u = 1/L²:
    // u₁ = 1/2500² = 1.6e-7, u₂ = 1/3000² = 1.11111e-7, u = 1/2800² = 1.27551e-7
    // t = (1.6 − 1.27551)/(1.6 − 1.11111) = 0.663730; 27 000 − 0.663730 × 5000 = 23 681.4 N
    const r = ok(calculate({ method: "supplier-table", lengthMm: 2800, table }));
    expect(r.capacityN).toBeCloseTo(23681.35, 1);
    expect(r.capacityN).toBeLessThan(24000);
    expect(r.steps.map((s) => s.label).join(" ")).toContain("1/L²");
    expect(r.basis).toBe("safe-working-load");
    expect(r.warnings).toEqual([]);
  });

  it("reads a row exactly", () => {
    expect(ok(calculate({ method: "supplier-table", lengthMm: 3000, table })).capacityN).toBe(22000);
  });

  it("sorts rows given out of order", () => {
    const shuffled = [table[2], table[0], table[3], table[1]];
    const r = ok(calculate({ method: "supplier-table", lengthMm: 2800, table: shuffled }));
    expect(r.capacityN).toBeCloseTo(23681.35, 1);
    expect(String(r.steps[0].label)).toContain("sorted");
  });

  it("a table that follows the Euler curve exactly is read exactly between rows", () => {
    // P = C/L² with C = 1e11 N·mm²: rows 2000 mm → 25 000 N and 4000 mm → 6250 N; at 3000 mm the curve gives 11 111.1 N.
    const euler = [{ lengthMm: 2000, safeLoadN: 25000 }, { lengthMm: 4000, safeLoadN: 6250 }];
    expect(ok(calculate({ method: "supplier-table", lengthMm: 3000, table: euler })).capacityN).toBeCloseTo(1e11 / 9e6, 6);
  });

  it("lower-row option takes the lower of the two rows", () => {
    const r = ok(calculate({ method: "supplier-table", lengthMm: 2800, table, supplierInterpolation: "lower-row" }));
    expect(r.capacityN).toBe(22000);
  });

  it("core returns NaN outside so callers must range-check", () => {
    expect(interpolateTable([1, 2], [10, 5], 0.5)).toBeNaN();
    // Midpoint by hand: (10 + 5)/2 = 7.5
    expect(interpolateTable([1, 2], [10, 5], 1.5)).toBe(7.5);
  });

  it("refuses lengths outside the table", () => {
    const r = calculate({ method: "supplier-table", lengthMm: 3600, table });
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.errors[0].field).toBe("lengthMm");
      expect(r.errors[0].message).toContain("1750–3500 mm");
    }
    expect(calculate({ method: "supplier-table", lengthMm: 1700, table }).ok).toBe(false);
  });

  it("warns at the end of the table (exactly, or within 2 % of the last length)", () => {
    expect(ok(calculate({ method: "supplier-table", lengthMm: 3500, table })).warnings.join(" ")).toContain("end of the supplier table");
    // 2 % of 3500 = 70 mm: 3440 is within, 3420 is not
    expect(ok(calculate({ method: "supplier-table", lengthMm: 3440, table })).warnings.join(" ")).toContain("end of the supplier table");
    expect(ok(calculate({ method: "supplier-table", lengthMm: 3420, table })).warnings).toEqual([]);
    expect(ok(calculate({ method: "supplier-table", lengthMm: 1750, table })).warnings.join(" ")).toContain("start of the supplier table");
  });

  it("warns when the safe load rises with length", () => {
    const r = ok(calculate({ method: "supplier-table", lengthMm: 2000, table: [{ lengthMm: 1500, safeLoadN: 10000 }, { lengthMm: 2500, safeLoadN: 20000 }] }));
    expect(r.warnings.join(" ")).toContain("rises");
  });

  it("table problems", () => {
    const one = calculate({ method: "supplier-table", lengthMm: 2000, table: [table[0]] });
    expect(!one.ok && one.errors[0].field).toBe("table");
    const missing = calculate({ method: "supplier-table", lengthMm: 2000 });
    expect(!missing.ok && missing.errors[0].field).toBe("table");
    const dup = calculate({ method: "supplier-table", lengthMm: 2000, table: [...table, { lengthMm: 2500, safeLoadN: 1 }] });
    expect(dup.ok).toBe(false);
    if (!dup.ok) {
      expect(dup.errors[0].field).toBe("table.4.lengthMm");
      expect(dup.errors[0].message).toBe("Rows 2 and 5 both give a length of 2500 mm; each length may appear only once.");
    }
    const negative = calculate({ method: "supplier-table", lengthMm: 2000, table: [table[0], { lengthMm: 2500, safeLoadN: -5 }] });
    expect(!negative.ok && negative.errors[0]).toEqual({ field: "table.1.safeLoadN", message: "Row 2: safe load must be greater than zero (got -5 N)." });
    const text = calculate({ method: "supplier-table", lengthMm: 2000, table: [table[0], { lengthMm: "2500", safeLoadN: 5 }] });
    expect(!text.ok && text.errors[0].field).toBe("table.1.lengthMm");
    const notList = calculate({ method: "supplier-table", lengthMm: 2000, table: "1750:35000" });
    expect(!notList.ok && notList.errors[0].field).toBe("table");
    const badRow = calculate({ method: "supplier-table", lengthMm: 2000, table: [table[0], 7] });
    expect(!badRow.ok && badRow.errors[0].field).toBe("table.1");
  });
});

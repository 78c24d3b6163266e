// The check a phone runs with no signal uses the same engine and request as the server, from the
// library and schemes the page was loaded with; it is provisional (the server's is stored).
import { describe, expect, it } from "vitest";
import { provisionalCheck, type OfflineCheckData } from "@/lib/register/provisional-check";
import { runCheck } from "@/lib/register/run-check";

const prop = { id: "t-prop", kind: "en1065-prop" as const, params: { propClass: "D" }, minExtensionMm: 1980, maxExtensionMm: 3350 };
const data: OfflineCheckData = {
  site: { designCode: "en1993", unitSystem: "si" },
  types: [prop],
  // Normal-weight reinforced concrete 25 kN/m³ (EN 1991-1-1 Table A.1); formwork and construction
  // loads as entered on the scheme.
  schemes: [{ id: "s-1", reference: "SCH-1", slabThicknessMm: 250, concreteDensityKnM3: 25, formworkKnM2: 0.5, constructionKnM2: 1.5 }],
};

describe("provisional check on the phone", () => {
  it("gives the same result the server's check gives for the same member", () => {
    const input = { memberTypeId: "t-prop", extensionMm: 3000, endConditions: "pinned-pinned", loadSource: "direct", loadN: 20000 };
    const mine = provisionalCheck(input, data);
    const server = runCheck(prop, { extensionMm: 3000, endConditions: "pinned-pinned", loadN: 20000 }, data.site);
    expect(mine).not.toBeNull();
    expect(mine?.check.capacityN).toBe(server.capacityN);
    expect(mine?.check.utilisation).toBe(server.utilisation);
    expect(mine?.check.pass).toBe(server.pass);
    expect(mine?.check.method).toBe("en1065");
  });

  it("derives the load from the scheme's slab and the spacing when the member takes its load from the slab", () => {
    // Tributary area statics: (0.25 m × 25 kN/m³ + 0.5 + 1.5 kN/m²) × 1.2 m × 1.2 m = 8.25 × 1.44 = 11.88 kN per member.
    const r = provisionalCheck({ memberTypeId: "t-prop", extensionMm: 2500, loadSource: "slab", schemeId: "s-1", spacingXMm: 1200, spacingYMm: 1200 }, data);
    expect(r?.loadN).toBeCloseTo(11880, 0);
  });

  it("a prop extended beyond its range fails on the phone too", () => {
    const r = provisionalCheck({ memberTypeId: "t-prop", extensionMm: 3600, loadSource: "direct", loadN: 5000 }, data);
    expect(r?.check.pass).toBe(false);
  });

  it("says it cannot check when the type or the scheme was not loaded on the phone", () => {
    expect(provisionalCheck({ memberTypeId: "elsewhere", extensionMm: 3000, loadN: 20000 }, data)).toBeNull();
    expect(provisionalCheck({ memberTypeId: "t-prop", extensionMm: 3000, loadSource: "slab", schemeId: "gone", spacingXMm: 1200, spacingYMm: 1200 }, data)).toBeNull();
  });
});

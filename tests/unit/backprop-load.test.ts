// A member's load from its scheme's back-propping, and the form's conversion for it. Expected values
// are worked by hand from the assumptions of Grundy & Kabaila's simplified method (ACI Journal 60(12),
// 1963): props under a fresh slab carry all of it (a fresh slab has no stiffness), and the ground is
// rigid, so while all levels stand on the ground each level carries everything above it.
import { describe, expect, it } from "vitest";
import { EMPTY_MEMBER_FORM, toMemberInput } from "@/components/register/member-form-values";
import { backpropTable, deriveBackpropLoad } from "@/lib/register/backprop-load";
import { memberCreateSchema } from "@/lib/validations/member";
import { schemeSchema } from "@/lib/validations/scheme";

const TYPE = "7b0c1f5e-8a51-4d0e-9c55-0d4a9f0a1b2c";
const SCHEME = "7b0c1f5e-8a51-4d0e-9c55-0d4a9f0a1b2d";
// 200 mm at 25 kN/m³: w = 5 kN/m².
const scheme = (backprop: { shoredLevels: number; formworkKPa?: number; constructionKPa?: number } | null, slabThicknessMm: number | null = 200) => ({
  reference: "TW-1", slabThicknessMm, concreteDensityKnM3: 25, backprop,
});

describe("load per level of props", () => {
  it("one level: the props carry the whole wet slab, its formwork and the construction load (Grundy & Kabaila 1963, assumptions)", () => {
    const r = deriveBackpropLoad(scheme({ shoredLevels: 1, formworkKPa: 0.5, constructionKPa: 1.5 }), 1, 1500, 1200);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.info.levelKPa).toBeCloseTo(5 + 0.5 + 1.5, 9);
    expect(r.info.tributaryAreaM2).toBeCloseTo(1.8, 9);
    expect(r.info.loadPerMemberN).toBeCloseTo(7 * 1.8 * 1000, 6);
    expect(r.info.steps.find((s) => s.symbol === "P/w")?.source).toContain("Grundy & Kabaila 1963");
  });

  it("two levels, no formwork or construction load: level 1 carries one slab, level 2 two (both on the rigid ground in cycle 2)", () => {
    const t = backpropTable(scheme({ shoredLevels: 2 }));
    expect(t.ok).toBe(true);
    if (!t.ok) return;
    expect(t.table.levels.map((l) => l.ratio)).toEqual([expect.closeTo(1, 9), expect.closeTo(2, 9)]);
    expect(t.table.levels[1]!.stage).toBe("Cycle 2: slab 2 cast");
    // Grundy & Kabaila's table for two levels of shores: largest slab load 2.25 w (from memory).
    expect(t.table.maxSlabLoadRatio).toBeCloseTo(2.25, 9);
  });

  it("a level outside the scheme's, a scheme without back-propping or without a slab is refused with the field and reason", () => {
    const high = deriveBackpropLoad(scheme({ shoredLevels: 2 }), 3, 1000, 1000);
    expect(high.ok === false && high.fields.level).toMatch(/has 2 levels of props/);
    const none = deriveBackpropLoad(scheme(null), 1, 1000, 1000);
    expect(none.ok === false && none.fields.loadSource).toMatch(/has no back-propping/);
    const noSlab = deriveBackpropLoad(scheme({ shoredLevels: 2 }, null), 1, 1000, 1000);
    expect(noSlab.ok === false && noSlab.fields.backprop).toMatch(/no slab thickness/);
  });
});

describe("validation and the form", () => {
  it("a load from back-propping needs a level; a level needs that load source", () => {
    const noLevel = memberCreateSchema.safeParse({ tag: "P1", memberTypeId: TYPE, extensionMm: 2500, loadSource: "backprop", schemeId: SCHEME, spacingXMm: 1000, spacingYMm: 1000 });
    expect(noLevel.error!.issues.map((i) => i.path.join("."))).toEqual(["level"]);
    const stray = memberCreateSchema.safeParse({ tag: "P1", memberTypeId: TYPE, extensionMm: 2500, loadN: 10_000, level: 1 });
    expect(stray.error!.issues.map((i) => i.path.join("."))).toEqual(["level"]);
    const seven = schemeSchema.safeParse({ reference: "R", title: "T", designerName: "D", category: 1, backprop: { shoredLevels: 7 } });
    expect(seven.error!.issues.map((i) => i.path.join("."))).toEqual(["backprop.shoredLevels"]);
  });

  it("the form sends the level with both spacings", () => {
    const { input, errors } = toMemberInput({ ...EMPTY_MEMBER_FORM, tag: "A", schemeId: SCHEME, memberTypeId: TYPE, extension: "2000", loadSource: "backprop", level: "2", spacingX: "1000", spacingY: "1.2 m" }, "si");
    expect(errors).toEqual({});
    expect(input).toMatchObject({ loadSource: "backprop", level: 2, spacingXMm: 1000 });
    expect(input.spacingYMm).toBeCloseTo(1200, 9);
    expect(memberCreateSchema.safeParse(input).success).toBe(true);
  });
});

import { describe, expect, it } from "vitest";
import { END_CONDITIONS, effectiveLength, sectionProperties } from "@/lib/engineering";
import { checkSectionGeometry } from "@/lib/engineering/sections";

describe("section properties", () => {
  it("CHS 48.3 × 4.0 scaffold tube matches tube tables", () => {
    const p = sectionProperties({ shape: "chs", dMm: 48.3, tMm: 4.0 });
    // By hand: A = π/4·(48.3² − 40.3²) = 0.785398 × (2332.89 − 1624.09) = 0.785398 × 708.80 = 556.69 mm²
    expect(p.areaMm2).toBeCloseTo(556.69, 1);
    // By hand: I = π/64·(48.3⁴ − 40.3⁴) = 0.0490874 × (5 442 375.7 − 2 637 668.3) = 0.0490874 × 2 804 707.4 = 137 676 mm⁴
    expect(p.iMinMm4).toBeCloseTo(137676, -1);
    // EN 39 / EN 10219-2 tables (from memory): A = 5.57 cm², I = 13.8 cm⁴, i = 1.57 cm.
    expect(p.areaMm2 / 557).toBeCloseTo(1, 2);
    expect(p.iMinMm4 / 138000).toBeCloseTo(1, 2);
    expect(p.rMinMm / 15.7).toBeCloseTo(1, 2);
    expect(p.kind).toBe("hollow");
  });

  it("CHS 114.3 × 5.0 matches EN 10210-2 tabulated values", () => {
    const p = sectionProperties({ shape: "chs", dMm: 114.3, tMm: 5.0 });
    // EN 10210-2 (from memory): A = 17.2 cm², I = 257 cm⁴.
    expect(p.areaMm2 / 1720).toBeCloseTo(1, 2);
    expect(p.iMinMm4 / 2_570_000).toBeCloseTo(1, 2);
  });

  it("RHS with square corners (outside radius 0 given) and the least axis", () => {
    const p = sectionProperties({ shape: "rhs", bMm: 100, hMm: 50, tMm: 4, cornerRadiusMm: 0 });
    // By hand: A = 100·50 − 92·42 = 5000 − 3864 = 1136 mm²
    expect(p.areaMm2).toBeCloseTo(1136, 6);
    // Major: (50·100³ − 42·92³)/12 = (50 000 000 − 32 704 896)/12 = 1 441 258.7 mm⁴
    expect(p.iMaxMm4).toBeCloseTo(1441258.67, 1);
    // Minor: (100·50³ − 92·42³)/12 = (12 500 000 − 6 816 096)/12 = 473 658.7 mm⁴
    expect(p.iMinMm4).toBeCloseTo(473658.67, 1);
    expect(p.steps.some((s) => s.label.includes("Square-corner"))).toBe(true);
    // Square corners overstate the real (rounded-corner) section: EN 10219-2 100×50×4 has A ≈ 10.9 cm² (from memory).
    expect(p.areaMm2).toBeGreaterThan(1090);
    expect(p.areaMm2 / 1090).toBeLessThan(1.05);
  });

  it("RHS by default uses the EN 10219-2 corner radii (cold-formed) and matches the tabulated values", () => {
    // EN 10219-2 cold-formed SHS 100 × 100 × 5: A = 18.4 cm², I = 271 cm⁴ (product tables, from memory;
    // SCI/Tata "Blue Book" cold-formed SHS). r_o = 2t = 10 mm, r_i = t = 5 mm.
    // A = 2·5·(200 − 10) − (4 − π)(100 − 25) = 1900 − 64.38 = 1835.6 mm².
    const p = sectionProperties({ shape: "rhs", bMm: 100, hMm: 100, tMm: 5 });
    expect(p.areaMm2).toBeCloseTo(1835.6, 1);
    expect(p.areaMm2 / 1840).toBeCloseTo(1, 2);
    expect(p.iMinMm4 / 2_710_000).toBeCloseTo(1, 2);
    // Square corners would give A = 1900 mm² and I = (100⁴ − 90⁴)/12 = 2 865 833 mm⁴: 5.7 % too stiff.
    const square = sectionProperties({ shape: "rhs", bMm: 100, hMm: 100, tMm: 5, cornerRadiusMm: 0 });
    expect(square.iMinMm4 / p.iMinMm4).toBeGreaterThan(1.05);
    // EN 10219-2 cold-formed RHS 100 × 50 × 4: A = 10.9 cm² (from memory). r_o = 8, r_i = 4: 1136 − 0.8584 × 48 = 1094.8 mm².
    expect(sectionProperties({ shape: "rhs", bMm: 100, hMm: 50, tMm: 4 }).areaMm2).toBeCloseTo(1094.8, 1);
  });

  it("RHS hot-finished uses the EN 10210-2 radii (r_o = 1.5t, r_i = t)", () => {
    // EN 10210-2 hot-finished SHS 100 × 100 × 5: A = 18.7 cm², I = 279 cm⁴ (product tables, from memory).
    // A = 1900 − (4 − π)(56.25 − 25) = 1900 − 26.83 = 1873.2 mm²
    const p = sectionProperties({ shape: "rhs", bMm: 100, hMm: 100, tMm: 5 }, "hot-finished");
    expect(p.areaMm2).toBeCloseTo(1873.2, 1);
    expect(p.iMinMm4 / 2_790_000).toBeCloseTo(1, 2);
  });

  it("solid rectangle and round", () => {
    const r = sectionProperties({ shape: "rect", bMm: 100, hMm: 50 });
    // I_min = 100·50³/12 = 1 041 666.7 mm⁴; i = 50/√12 = 14.434 mm
    expect(r.areaMm2).toBe(5000);
    expect(r.iMinMm4).toBeCloseTo(1041666.67, 1);
    expect(r.rMinMm).toBeCloseTo(14.434, 3);
    expect(r.leastDimensionMm).toBe(50);
    const c = sectionProperties({ shape: "round", dMm: 100 });
    // A = π·100²/4 = 7853.98 mm²; I = π·100⁴/64 = 4 908 738.5 mm⁴; i = D/4 = 25 mm
    expect(c.areaMm2).toBeCloseTo(7853.98, 2);
    expect(c.iMinMm4).toBeCloseTo(4908738.5, 0);
    expect(c.rMinMm).toBeCloseTo(25, 10);
  });

  it("given section", () => {
    const g = sectionProperties({ shape: "given", areaMm2: 1000, iMinMm4: 250000 });
    expect(g.rMinMm).toBeCloseTo(Math.sqrt(250), 12);
    expect(g.kind).toBe("given");
  });

  it("geometry rules", () => {
    expect(checkSectionGeometry({ shape: "chs", dMm: 100, tMm: 60 })[0]).toEqual({
      field: "section.tMm",
      message: "Wall thickness must be less than half the outside diameter (got t = 60 mm for D = 100 mm).",
    });
    expect(checkSectionGeometry({ shape: "chs", dMm: 100, tMm: 50 })).toHaveLength(1);
    expect(checkSectionGeometry({ shape: "chs", dMm: 100, tMm: 49.9 })).toHaveLength(0);
    expect(checkSectionGeometry({ shape: "rhs", bMm: 100, hMm: 50, tMm: 25 })[0].field).toBe("section.tMm");
    expect(checkSectionGeometry({ shape: "rhs", bMm: 100, hMm: 50, tMm: 24 })).toHaveLength(0);
  });
});

describe("effective length", () => {
  // AISC 360-16 Commentary Table C-A-7.1: theoretical 0.5, 0.7, 1.0, 1.0, 2.0, 2.0; recommended 0.65, 0.80, 1.2, 1.0, 2.1, 2.0.
  it.each([
    ["fixed-fixed", 0.5, 0.65],
    ["fixed-pinned", 0.7, 0.8],
    ["fixed-sway", 1.0, 1.2],
    ["pinned-pinned", 1.0, 1.0],
    ["fixed-free", 2.0, 2.1],
    ["pinned-sway", 2.0, 2.0],
  ] as const)("%s: theoretical %f, design %f", (id, theory, design) => {
    const row = END_CONDITIONS.find((e) => e.id === id);
    expect(row?.theoreticalK).toBe(theory);
    expect(row?.designK).toBe(design);
    const eff = effectiveLength(3000, { ends: id });
    expect(eff.k).toBe(design);
    expect(eff.effectiveLengthMm).toBeCloseTo(3000 * design, 10);
    const values = eff.steps.map((s) => s.value);
    expect(values).toContain(theory);
    expect(values).toContain(design);
  });

  it("explicit k wins and is reported", () => {
    const eff = effectiveLength(3000, { k: 0.85, ends: "fixed-pinned" });
    expect(eff.k).toBe(0.85);
    expect(eff.effectiveLengthMm).toBeCloseTo(2550, 10);
    expect(eff.steps.find((s) => s.symbol === "K")?.source).toBe("User input");
  });

  it("defaults to pinned ends with a warning", () => {
    const eff = effectiveLength(3000, {});
    expect(eff.k).toBe(1);
    expect(eff.warnings.join(" ")).toContain("pinned");
  });

  it("warns when k is below the recommended value for the stated ends", () => {
    expect(effectiveLength(3000, { k: 0.5, ends: "fixed-fixed" }).warnings.join(" ")).toContain("lower than the recommended");
    expect(effectiveLength(3000, { k: 0.7, ends: "fixed-fixed" }).warnings.join(" ")).not.toContain("lower than the recommended");
  });
});

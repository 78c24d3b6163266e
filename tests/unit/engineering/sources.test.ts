// Issue #16: the working's source column names the standard and clause only. Words a checker needs
// beside it travel in their own fields: `toConfirm` ("value to be confirmed against EN 1065 Table 2")
// and `note` (a rule of thumb, the range a value was taken from). Over one sample request per way
// through every method, each step's source is a citation or one of the plain origins below.
import { describe, expect, it } from "vitest";
import { calculate, calculateRakingShore, calculateSlabLoad, type Step } from "@/lib/engineering";
import { ALL_METHOD_IDS } from "@/lib/engineering/types";

const chs = { shape: "chs", dMm: 48.3, tMm: 3.2 };
const table = [{ lengthMm: 1000, safeLoadN: 30000 }, { lengthMm: 3000, safeLoadN: 10000 }];
const SAMPLES: Record<string, unknown>[] = [
  { method: "euler", lengthMm: 3000, section: chs, loadN: 10000 },
  { method: "euler", lengthMm: 3000, section: { shape: "given", areaMm2: 450, iMinMm4: 110000 }, eMpa: 210000, ends: "fixed-pinned" },
  { method: "en1993", lengthMm: 3000, section: chs, steelGrade: "S355", loadN: 10000 },
  { method: "en1993", lengthMm: 3000, section: { shape: "rhs", bMm: 100, hMm: 100, tMm: 5 }, steelGrade: "S275", formed: "cold-formed", ends: "fixed-fixed", loadN: 10000 },
  { method: "en1993", lengthMm: 3000, section: chs, fyMpa: 355, fyFrom: "en1993-table-3.1", steelGrade: "S355", k: 1.2, loadN: 10000 },
  { method: "aisc360-lrfd", lengthMm: 3000, section: chs, steelGrade: "A500-C", loadN: 10000 },
  { method: "aisc360-asd", lengthMm: 3000, section: { shape: "rhs", bMm: 100, hMm: 100, tMm: 5 }, fyMpa: 345, loadN: 10000 },
  { method: "en1065", lengthMm: 3000, propClass: "D", maxExtensionMm: 3350, loadN: 10000 },
  { method: "en1065", lengthMm: 3000, propClass: "B", maxExtensionMm: 3500, minExtensionMm: 2000, gammaF: 1.5, loadN: 10000 },
  { method: "supplier-table", lengthMm: 2000, table, loadN: 10000 },
  { method: "supplier-table", lengthMm: 2000, table, loadN: 10000, supplierInterpolation: "lower-row" },
  { method: "en1995", lengthMm: 3000, section: { shape: "rect", bMm: 100, hMm: 100 }, strengthClass: "C24", loadN: 10000 },
  { method: "en1995", lengthMm: 3000, section: { shape: "round", dMm: 150 }, strengthClass: "GL24h", timberType: "glulam", serviceClass: 2, loadDuration: "short-term", loadN: 10000 },
  { method: "nds", lengthMm: 3000, section: { shape: "rect", bMm: 89, hMm: 89 }, fcStarMpa: 8, eMinMpa: 4000, loadN: 10000 },
  { method: "nds", lengthMm: 3000, section: { shape: "round", dMm: 150 }, fcStarMpa: 8, eMinMpa: 4000, timberType: "round", loadN: 10000 },
  { method: "point-brace", lengthMm: 6000, braces: 2, loadN: 50000, section: chs },
  { method: "out-of-plumb", lengthMm: 3000, loadN: 10000, outOfPlumbDeg: 2, section: chs, steelGrade: "S355" },
  { method: "out-of-plumb", lengthMm: 3000, loadN: 10000, outOfPlumbDeg: 1, propClass: "D", maxExtensionMm: 3350 },
  { method: "out-of-plumb", lengthMm: 3000, loadN: 10000, outOfPlumbDeg: 2, eccentricityMm: 10, section: chs, steelGrade: "S355", plumbCode: "aisc360" },
  { method: "base-bearing", loadN: 20000, basePlateBMm: 150, basePlateLMm: 150, soil: "firm-clay", solePlateBMm: 225, solePlateLMm: 450, solePlateTMm: 50 },
  { method: "base-bearing", loadN: 20000, basePlateBMm: 150, basePlateLMm: 150, soil: "hardcore" },
  { method: "base-bearing", loadN: 20000, basePlateBMm: 150, basePlateLMm: 150, soil: "dense-gravel", outOfPlumbMm: 80, lengthMm: 3000, frictionCoefficient: 0.4 },
  { method: "base-bearing", loadN: 20000, basePlateBMm: 150, basePlateLMm: 150, slabDepthMm: 200, fckMpa: 30 },
  { method: "base-bearing", loadN: 20000, basePlateBMm: 150, basePlateLMm: 150, slabDepthMm: 200, fckMpa: 30, punchingCode: "aci318" },
  { method: "backprop-sequence", shoredLevels: 2, slabSelfWeightKPa: 5 },
  { method: "raking-combined", lengthMm: 4000, angleDeg: 60, loadN: 10000, section: chs, steelGrade: "S355" },
  { method: "raking-combined", lengthMm: 4000, angleDeg: 60, loadN: 10000, section: chs, steelGrade: "S355", plumbCode: "aisc360" },
];

/** Where a value comes from when no standard is cited: the person, arithmetic, or a named rule of thumb. */
const PLAIN = new Set(["User input", "Definition", "Geometry", "Section geometry", "Statics", "Sum", "Comparison", "Common practice", "Supplier's load table"]);
/** A standard or a published reference, then its clause (§, table, equation, appendix…). */
const CITATION = /^(?:(?:EN|BS|AISC|ACI|NDS) [0-9A-Z][\w.:\-/ ]*|Timoshenko & Gere|Grundy & Kabaila 1963|Winter 1960)/;
const CLAUSE = /§|Table|Eq\.|Appendix|Annex|clause|Fig\.|Part \d|Commentary|ACI Journal|Engineering Journal/;
/** Brackets only as a paragraph or table-part number fixed to its clause, "§6.3.1.2(4)" or "Table A1.2(B)". */
const WORDS_IN_BRACKETS = /\((?![0-9A-Za-z]+\))|(?<![0-9A-Za-z])\(/;

function stepsOf(request: Record<string, unknown>): Step[] {
  const r = calculate(request);
  if (!r.ok) throw new Error(`${String(request.method)} sample refused: ${r.errors.map((e) => e.message).join(" ")}`);
  return r.steps;
}

function problems(s: Step): string[] {
  const out: string[] = [];
  if (s.source.includes(";")) out.push("a semicolon");
  if (WORDS_IN_BRACKETS.test(s.source)) out.push("words in brackets");
  if (/confirm|memory|common practice/i.test(s.source) && s.source !== "Common practice") out.push("flag words inside the source");
  if (!PLAIN.has(s.source)) {
    if (!CITATION.test(s.source)) out.push("neither a citation nor a plain origin");
    else if (!CLAUSE.test(s.source) && !s.toConfirm) out.push("a standard without its clause, and not flagged to be confirmed");
  }
  if (s.toConfirm !== undefined && !/^(value|clause|clause numbers?|treatment .*) to be confirmed against \S/.test(s.toConfirm)) out.push(`toConfirm "${s.toConfirm}"`);
  return out.map((p) => `${s.label} [${s.source}]: ${p}`);
}

describe("the working's source names the standard and clause only", () => {
  it("covers every method", () => {
    expect(new Set(SAMPLES.map((r) => r.method))).toEqual(new Set(ALL_METHOD_IDS));
  });

  it.each(SAMPLES.map((r, i) => [`${String(r.method)} #${i}`, r] as const))("%s: every step's source is a citation or a plain origin", (_, request) => {
    const steps = stepsOf(request);
    expect(steps.length).toBeGreaterThan(2);
    expect(steps.flatMap(problems)).toEqual([]);
  });

  it("the raking-shore forces and the slab load per member follow the same rule", () => {
    const rs = calculateRakingShore({ thrustN: 10000, headHeightMm: 3000, angleDeg: 60 });
    const sl = calculateSlabLoad({ slabThicknessMm: 250, spacingXMm: 1200, spacingYMm: 1200 });
    expect(rs.ok && sl.ok).toBe(true);
    const steps = [...(rs.ok ? rs.steps : []), ...(sl.ok ? sl.steps : [])];
    expect(steps.flatMap(problems)).toEqual([]);
  });

  it("the EN 1065 class strength cites EN 1065:1998 Table 2 and carries its to-be-confirmed flag", () => {
    // EN 1065:1998 Table 2 gives the nominal characteristic strengths of classes A–E (value to be
    // confirmed against EN 1065 Table 2, as the engine's materials note says).
    const steps = stepsOf(SAMPLES.find((r) => r.method === "en1065")!);
    const rk = steps.find((s) => s.symbol === "R_k");
    expect(rk?.source).toBe("EN 1065:1998 Table 2");
    expect(rk?.toConfirm).toBe("value to be confirmed against EN 1065 Table 2");
  });

  it("a rule of thumb says so in its note, and a preset strength class its table to confirm", () => {
    const bearing = stepsOf(SAMPLES.find((r) => r.method === "base-bearing" && r.soil === "firm-clay")!);
    const spread = bearing.find((s) => s.symbol === "a'");
    expect(spread).toMatchObject({ source: "Common practice" });
    expect(spread?.note).toMatch(/45°/);
    const allow = bearing.find((s) => s.symbol === "q_a");
    expect(allow).toMatchObject({ source: "BS 8004:1986 Table 1", toConfirm: "value to be confirmed against BS 8004:1986 Table 1" });
    const timber = stepsOf(SAMPLES.find((r) => r.method === "en1995")!).find((s) => s.symbol === "class");
    expect(timber).toMatchObject({ source: "EN 338:2016 Table 1", toConfirm: "value to be confirmed against EN 338:2016 Table 1" });
  });

  it("steps without a flag carry no empty toConfirm or note fields", () => {
    for (const request of SAMPLES) {
      for (const s of stepsOf(request)) {
        if ("toConfirm" in s) expect(s.toConfirm).toBeTruthy();
        if ("note" in s) expect(s.note).toBeTruthy();
      }
    }
  });
});

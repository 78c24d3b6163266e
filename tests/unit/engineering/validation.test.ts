import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { calculate, METHOD_IDS, type CalculationFailure } from "@/lib/engineering";

function failure(request: unknown): CalculationFailure {
  const r = calculate(request);
  if (r.ok) throw new Error(`expected refusal for ${JSON.stringify(request)}`);
  return r;
}

/** A sentence a person reads: starts with a capital or a quote, ends with a full stop, and carries no programmer noise. */
function expectSentence(message: string) {
  expect(message).toMatch(/^["A-ZλÀ-Ý]/u);
  expect(message).toMatch(/[.)]$/);
  expect(message).not.toMatch(/undefined|\[object|Invalid input|expected (number|string)/);
}

const chs = { shape: "chs", dMm: 114.3, tMm: 5 };
const VALID: Record<(typeof METHOD_IDS)[number], Record<string, unknown>> = {
  euler: { method: "euler", lengthMm: 3000, section: chs },
  en1993: { method: "en1993", lengthMm: 3000, section: chs, fyMpa: 355 },
  "aisc360-lrfd": { method: "aisc360-lrfd", lengthMm: 3000, section: chs, fyMpa: 345 },
  "aisc360-asd": { method: "aisc360-asd", lengthMm: 3000, section: chs, fyMpa: 345 },
  en1065: { method: "en1065", lengthMm: 3000, propClass: "D", maxExtensionMm: 3500 },
  "supplier-table": {
    method: "supplier-table",
    lengthMm: 3000,
    table: [
      { lengthMm: 2000, safeLoadN: 30000 },
      { lengthMm: 4000, safeLoadN: 15000 },
    ],
  },
  en1995: { method: "en1995", lengthMm: 2400, section: { shape: "rect", bMm: 100, hMm: 100 }, strengthClass: "C24" },
  nds: { method: "nds", lengthMm: 2400, section: { shape: "rect", bMm: 89, hMm: 89 }, fcStarMpa: 10, eMinMpa: 4000 },
  "point-brace": { method: "point-brace", lengthMm: 6000, section: chs, braces: 2, loadN: 100000 },
};

describe("valid baselines", () => {
  it.each(METHOD_IDS)("%s baseline is accepted", (m) => {
    expect(calculate(VALID[m]).ok).toBe(true);
  });
});

describe("the request as a whole", () => {
  it.each([null, undefined, [], "x", 5, true, [VALID.euler]])("refuses %j with field \"\"", (request) => {
    const r = failure(request);
    expect(r.errors).toHaveLength(1);
    expect(r.errors[0].field).toBe("");
    expectSentence(r.errors[0].message);
  });
  it("missing and unknown method", () => {
    expect(failure({ lengthMm: 3000 }).errors[0].field).toBe("method");
    const unknown = failure({ method: "rankine", lengthMm: 3000 });
    expect(unknown.errors[0]).toEqual({
      field: "method",
      message:
        'Unknown calculation method (got the text "rankine"); choose one of euler, en1993, aisc360-lrfd, aisc360-asd, en1065, supplier-table, en1995, nds, point-brace.',
    });
    expect(failure({ method: 7, lengthMm: 3000 }).errors[0].field).toBe("method");
  });
  it("ignores inherited and __proto__ keys", () => {
    const crafted = JSON.parse('{"method":"euler","section":{"shape":"chs","dMm":114.3,"tMm":5},"__proto__":{"lengthMm":3000}}');
    expect(failure(crafted).errors[0]).toEqual({ field: "lengthMm", message: "Length is required." });
  });
});

describe("numbers", () => {
  const cases: [string, unknown, string][] = [
    ["missing", undefined, "Length is required."],
    ["negative", -3000, "Length must be greater than zero (got -3000 mm)."],
    ["zero", 0, "Length must be greater than zero (got 0 mm)."],
    ["NaN", Number.NaN, "Length must be a number in mm (got NaN (not a number))."],
    ["a string", "3000", 'Length must be a number in mm (got the text "3000").'],
    ["Infinity", Number.POSITIVE_INFINITY, "Length must be a number in mm (got infinity)."],
    ["-Infinity", Number.NEGATIVE_INFINITY, "Length must be a number in mm (got minus infinity)."],
    ["null", null, "Length must be a number in mm (got an empty value (null))."],
    ["an object", { value: 3000 }, "Length must be a number in mm (got an object)."],
    ["out of range", 2e6, "Length of 2000000 mm is outside the range this calculator accepts (up to 100000 mm)."],
  ];
  it.each(cases)("lengthMm %s", (_name, lengthMm, message) => {
    const r = failure({ ...VALID.en1993, lengthMm });
    expect(r.errors).toContainEqual({ field: "lengthMm", message });
  });

  it.each([
    ["k", 0.3, "k"],
    ["k", "1", "k"],
    ["eMpa", -1, "eMpa"],
    ["fyMpa", 0, "fyMpa"],
    ["fyMpa", "355", "fyMpa"],
    ["gammaM1", 0.9, "gammaM1"],
    ["loadN", -10, "loadN"],
    ["loadN", "10 kN", "loadN"],
    ["ends", "hinged", "ends"],
    ["curve", "e", "curve"],
    ["formed", "welded", "formed"],
    ["steelGrade", 355, "steelGrade"],
  ])("%s = %j is refused on its own field", (key, value, field) => {
    const r = failure({ ...VALID.en1993, [key]: value });
    expect(r.errors.map((e) => e.field)).toContain(field);
    r.errors.forEach((e) => expectSentence(e.message));
  });

  it.each([
    ["en1995", "kmod", 1.5],
    ["en1995", "serviceClass", 4],
    ["en1995", "loadDuration", "forever"],
    ["en1995", "gammaM", 0.8],
    ["en1995", "betaC", -0.1],
    ["en1995", "timberType", "bamboo"],
    ["nds", "c", 1.2],
    ["nds", "fcStarMpa", Number.NaN],
    ["nds", "eMinMpa", Number.POSITIVE_INFINITY],
    ["en1065", "propClass", "F"],
    ["en1065", "maxExtensionMm", -3500],
    ["en1065", "gammaF", 0.5],
    ["point-brace", "braces", 0],
    ["point-brace", "designBasis", "lsd"],
  ] as const)("%s: %s = %j is refused", (method, key, value) => {
    const r = failure({ ...VALID[method], [key]: value });
    expect(r.errors.map((e) => e.field)).toContain(key);
    r.errors.forEach((e) => expectSentence(e.message));
  });
});

describe("sections", () => {
  it("wall thicker than the radius (chs)", () => {
    expect(failure({ ...VALID.euler, section: { shape: "chs", dMm: 100, tMm: 60 } }).errors).toEqual([
      { field: "section.tMm", message: "Wall thickness must be less than half the outside diameter (got t = 60 mm for D = 100 mm)." },
    ]);
  });
  it("wall thicker than half the smaller side (rhs)", () => {
    const r = failure({ ...VALID.euler, section: { shape: "rhs", bMm: 100, hMm: 60, tMm: 30 } });
    expect(r.errors[0].field).toBe("section.tMm");
    expectSentence(r.errors[0].message);
  });
  it.each([
    [{ shape: "chs", dMm: -100, tMm: 5 }, "section.dMm"],
    [{ shape: "chs", dMm: "100", tMm: 5 }, "section.dMm"],
    [{ shape: "chs", dMm: 100 }, "section.tMm"],
    [{ shape: "rhs", bMm: 100, hMm: 0, tMm: 5 }, "section.hMm"],
    [{ shape: "rect", bMm: Number.NaN, hMm: 100 }, "section.bMm"],
    [{ shape: "given", areaMm2: 1000 }, "section.iMinMm4"],
    [{ shape: "hexagon", dMm: 100 }, "section.shape"],
    [{ dMm: 100 }, "section.shape"],
    ["chs 100x5", "section"],
    [null, "section"],
  ])("%j → %s", (section, field) => {
    const r = failure({ ...VALID.euler, section });
    expect(r.errors[0].field).toBe(field);
    expectSentence(r.errors[0].message);
  });
  it("section missing where it is needed", () => {
    const { section: _omit, ...noSection } = VALID.en1993;
    const r = failure(noSection);
    expect(r.errors.map((e) => e.field)).toContain("section");
  });
  it("several problems are reported together", () => {
    const r = failure({ method: "en1993", lengthMm: -1, section: { shape: "chs", dMm: -5, tMm: "x" }, fyMpa: "355" });
    expect(r.errors.map((e) => e.field).sort()).toEqual(["fyMpa", "lengthMm", "section.dMm", "section.tMm"]);
  });
});

describe("material lookups", () => {
  it("unknown steel grade", () => {
    const { fyMpa: _f, ...rest } = VALID.en1993;
    const r = failure({ ...rest, steelGrade: "S999" });
    expect(r.errors[0].field).toBe("steelGrade");
    expect(r.errors[0].message).toContain("S355");
  });
  it("missing yield strength", () => {
    const { fyMpa: _f, ...rest } = VALID["aisc360-lrfd"];
    expect(failure(rest).errors[0].field).toBe("fyMpa");
  });
});

describe("random corruption of one field (property)", () => {
  const badValues = fc.constantFrom<unknown>(Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY, -1, 0, "12", null, {}, [], true);
  const numericFields: [(typeof METHOD_IDS)[number], string][] = [
    ["euler", "lengthMm"],
    ["en1993", "fyMpa"],
    ["aisc360-lrfd", "fyMpa"],
    ["aisc360-asd", "lengthMm"],
    ["en1065", "maxExtensionMm"],
    ["supplier-table", "lengthMm"],
    ["nds", "fcStarMpa"],
    ["nds", "eMinMpa"],
    ["point-brace", "braces"],
  ];
  it("is refused on exactly that field with a sentence, never NaN, never a throw", () => {
    fc.assert(
      fc.property(fc.constantFrom(...numericFields), badValues, ([method, field], bad) => {
        // 0 is a valid load; everything in badValues is invalid for these fields.
        const r = calculate({ ...VALID[method], [field]: bad });
        if (r.ok) return false;
        return r.errors.some((e) => e.field === field) && r.errors.every((e) => typeof e.message === "string" && e.message.length > 10);
      }),
    );
  });
  it("section dimensions", () => {
    fc.assert(
      fc.property(fc.constantFrom("dMm", "tMm"), badValues, (key, bad) => {
        const r = calculate({ ...VALID.en1993, section: { ...chs, [key]: bad } });
        return !r.ok && r.errors.some((e) => e.field === `section.${key}`);
      }),
    );
  });
});

// Issue #16: messages reach a person, so they are sentences with labels and never name a request
// key (eMpa, timberType, serviceClass…); the keys stay as the error's field path.
import { describe, expect, it } from "vitest";
import { calculate, calculateRakingShore, calculateSlabLoad } from "@/lib/engineering";
import { ALL_METHOD_IDS } from "@/lib/engineering/types";

const KEYS = [
  "lengthMm", "eMpa", "fyMpa", "steelGrade", "gammaM1", "fc0kMpa", "e005Mpa", "serviceClass", "loadDuration", "strengthClass",
  "timberType", "fcStarMpa", "eMinMpa", "propClass", "maxExtensionMm", "minExtensionMm", "designBasis", "loadN", "fyFrom", "hssWeld",
  "duringConstruction", "supplierInterpolation", "outOfPlumbDeg", "outOfPlumbMm", "eccentricityMm", "plumbCode", "basePlateBMm",
  "allowablePressureKPa", "slabDepthMm", "slabEffectiveDepthMm", "fckMpa", "punchingCode", "shoredLevels", "slabSelfWeightKPa",
  "angleDeg", "selfWeightNPerM", "frictionCoefficient", "safeLoadN", "dMm", "tMm", "areaMm2", "iMinMm4",
];
const CODE_WORD = new RegExp(`\\b(${KEYS.join("|")})\\b|\\([a-z]+[A-Z]\\w*\\)`);
/** Any camelCase word (thrustN, slabThicknessMm, concreteAsPermanent…); kN, kPa and kNm are units, not code. */
const CAMEL = /\b[a-z][a-z0-9]*[A-Z][A-Za-z0-9]*\b/g;
const camelWords = (m: string) => (m.match(CAMEL) ?? []).filter((w) => !["kN", "kPa", "kNm"].includes(w));

function messagesOf(request: Record<string, unknown>): string[] {
  const r = calculate(request);
  return r.ok ? r.warnings : r.errors.map((e) => e.message);
}

describe("engine messages name no request key", () => {
  const requests: Record<string, unknown>[] = [];
  for (const method of ALL_METHOD_IDS) {
    requests.push({ method, lengthMm: 2500 });
    requests.push({ method, lengthMm: 2500, section: { shape: "chs", dMm: 48.3, tMm: 3.2 }, loadN: 1000 });
    requests.push({ method, lengthMm: 2500, section: { shape: "chs", dMm: 48.3, tMm: 3.2 }, steelGrade: "S355", loadN: 1000, outOfPlumbDeg: 2, angleDeg: 60 });
    requests.push({ method, lengthMm: 2500, section: { shape: "rect", bMm: 100, hMm: 100 }, strengthClass: "C24", fcStarMpa: 8, eMinMpa: 4000, loadN: 1000 });
    requests.push({
      method, lengthMm: -1, eMpa: -1, fyMpa: "x", serviceClass: 7, timberType: "oak", hssWeld: "tig", formed: "bent", fyFrom: 3, duringConstruction: "yes",
      loadN: -5, table: [{ lengthMm: 1 }], section: { shape: "chs" }, outOfPlumbDeg: 1, outOfPlumbMm: 5, propClass: "Z",
    });
    requests.push({ method, lengthMm: 2500, propClass: "D", maxExtensionMm: 3350, basePlateBMm: 150, basePlateLMm: 150, slabDepthMm: 200, fckMpa: 30, loadN: 1000 });
  }
  const all = requests.flatMap(messagesOf);

  it("covers a broad spread of refusals and warnings", () => {
    expect(all.length).toBeGreaterThan(60);
  });

  it.each(ALL_METHOD_IDS)("%s: every message and warning is in words", (method) => {
    const msgs = requests.filter((r) => r.method === method).flatMap(messagesOf);
    const offenders = msgs.filter((m) => CODE_WORD.test(m));
    expect(offenders).toEqual([]);
  });

  it("a bad modulus is refused with its label and unit", () => {
    const r = calculate({ method: "euler", lengthMm: 2500, section: { shape: "chs", dMm: 48.3, tMm: 3.2 }, eMpa: -5 });
    expect(r.ok).toBe(false);
    const e = r.ok ? undefined : r.errors.find((x) => x.field === "eMpa");
    expect(e?.message).toMatch(/^Modulus of elasticity E must be greater than zero \(got -5 MPa\)/);
  });
});

describe("every validate path speaks words, not request keys (issue #16)", () => {
  const WRONG: unknown[] = [undefined, null, "x", -1, 0, 1e12, Number.NaN, true, [], {}, 1.5];
  const BASE = {
    lengthMm: 2500, section: { shape: "chs", dMm: 48.3, tMm: 3.2 }, steelGrade: "S355", loadN: 1000, outOfPlumbDeg: 2, angleDeg: 60, propClass: "D",
    maxExtensionMm: 3350, braces: 2, basePlateBMm: 150, basePlateLMm: 150, allowablePressureKPa: 100, shoredLevels: 2, slabSelfWeightKPa: 5,
    strengthClass: "C24", fcStarMpa: 8, eMinMpa: 4000, table: [{ lengthMm: 1000, safeLoadN: 30000 }, { lengthMm: 3000, safeLoadN: 10000 }],
  } as Record<string, unknown>;
  const FIELDS = [...Object.keys(BASE), "k", "ends", "eMpa", "fyMpa", "formed", "curve", "gammaM1", "fc0kMpa", "e005Mpa", "kmod", "serviceClass", "loadDuration",
    "gammaM", "betaC", "timberType", "c", "minExtensionMm", "gammaF", "designBasis", "fyFrom", "hssWeld", "duringConstruction", "supplierInterpolation",
    "outOfPlumbMm", "eccentricityMm", "plumbCode", "solePlateBMm", "solePlateLMm", "solePlateTMm", "soil", "slabDepthMm", "slabEffectiveDepthMm", "fckMpa",
    "rhoL", "punchingCode", "formworkKPa", "constructionKPa", "cycles", "selfWeightNPerM", "frictionCoefficient"];

  it.each(ALL_METHOD_IDS)("%s: each field given a wrong value is refused or warned about in words", (method) => {
    const offenders = new Set<string>();
    let seen = 0;
    for (const field of FIELDS) {
      for (const value of WRONG) {
        for (const msg of messagesOf({ method, ...BASE, [field]: value })) {
          seen++;
          if (camelWords(msg).length) offenders.add(msg);
        }
      }
    }
    expect(seen).toBeGreaterThan(50);
    expect([...offenders]).toEqual([]);
  });

  it("the raking-shore forces and the slab load per member refuse in words", () => {
    const msgs: string[] = [];
    for (const body of [null, 1, "x", [], {}, { thrustN: "x", headHeightMm: -1, angleDeg: 90 }, { thrustN: 1e12, headHeightMm: 0, angleDeg: 0 }]) {
      const r = calculateRakingShore(body);
      if (!r.ok) msgs.push(...r.errors.map((e) => e.message));
    }
    for (const body of [null, 1, {}, { slabThicknessMm: "x", spacingXMm: -1, spacingYMm: 1e9, concreteAsPermanent: "yes", constructionRule: "any", gammaG: 0 }]) {
      const r = calculateSlabLoad(body as never);
      if (!r.ok) msgs.push(...r.errors.map((e) => e.message));
    }
    expect(msgs.length).toBeGreaterThan(8);
    expect(msgs.filter((m) => camelWords(m).length)).toEqual([]);
    expect(msgs).toContain("Whether the wet concrete counts as a permanent load must be true or false.");
    expect(msgs.some((m) => /horizontal thrust at the head \(N\)/.test(m))).toBe(true);
  });
});

import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { calculate, calculateRakingShore, calculateSlabLoad, type CalculationResult } from "@/lib/engineering";

// Sections kept clear of the local-buckling limits (EN 1993-1-1 Table 5.2 Class 3 and AISC 360-16
// Table B4.1a) for fy up to 460 MPa, so every generated steel member is one the engine accepts.
const chsArb = fc
  .record({ d: fc.double({ min: 20, max: 500, noNaN: true }), ratio: fc.double({ min: 8, max: 40, noNaN: true }) })
  .map(({ d, ratio }) => ({ shape: "chs" as const, dMm: d, tMm: d / ratio }));
const rhsArb = fc
  .record({ b: fc.double({ min: 40, max: 400, noNaN: true }), aspect: fc.double({ min: 0.4, max: 1, noNaN: true }), ratio: fc.double({ min: 8, max: 27, noNaN: true }) })
  .map(({ b, aspect, ratio }) => ({ shape: "rhs" as const, bMm: b, hMm: b * aspect, tMm: b / ratio }));
const rectArb = fc
  .record({ b: fc.double({ min: 20, max: 400, noNaN: true }), h: fc.double({ min: 20, max: 400, noNaN: true }) })
  .map(({ b, h }) => ({ shape: "rect" as const, bMm: b, hMm: h }));
const roundArb = fc.double({ min: 20, max: 400, noNaN: true }).map((d) => ({ shape: "round" as const, dMm: d }));
const steelSection = fc.oneof(chsArb, rhsArb, rectArb, roundArb);
const timberSection = fc.oneof(rectArb, roundArb);
const ends = fc.constantFrom("pinned-pinned", "fixed-pinned", "fixed-fixed", "fixed-free", "fixed-sway", "pinned-sway");
const fy = fc.double({ min: 200, max: 460, noNaN: true });
const lengths = fc
  .tuple(fc.double({ min: 100, max: 20000, noNaN: true }), fc.double({ min: 100, max: 20000, noNaN: true }))
  .map(([a, b]) => (a <= b ? [a, b] : [b, a]) as [number, number]);

const memberArb = fc.oneof(
  fc.record({ method: fc.constantFrom("euler"), section: steelSection, ends, eMpa: fc.double({ min: 5000, max: 220000, noNaN: true }) }),
  fc.record({
    method: fc.constantFrom("en1993"),
    section: steelSection,
    ends,
    fyMpa: fy,
    formed: fc.constantFrom("hot-finished", "cold-formed"),
    gammaM1: fc.double({ min: 1, max: 1.2, noNaN: true }),
  }),
  fc.record({ method: fc.constantFrom("aisc360-lrfd", "aisc360-asd"), section: steelSection, ends, fyMpa: fy }),
  fc.record({
    method: fc.constantFrom("en1995"),
    section: timberSection,
    ends,
    strengthClass: fc.constantFrom("C16", "C24", "C30", "GL24h", "GL28h"),
    kmod: fc.double({ min: 0.5, max: 1.1, noNaN: true }),
  }),
  fc.record({
    method: fc.constantFrom("nds"),
    section: timberSection,
    ends,
    fcStarMpa: fc.double({ min: 3, max: 30, noNaN: true }),
    eMinMpa: fc.double({ min: 2000, max: 8000, noNaN: true }),
    timberType: fc.constantFrom("solid", "round", "glulam", "lvl"),
  }),
  fc.record({ method: fc.constantFrom("point-brace"), section: steelSection, braces: fc.integer({ min: 1, max: 6 }), loadN: fc.double({ min: 1, max: 1e6, noNaN: true }) }),
  fc.record({
    method: fc.constantFrom("en1065"),
    propClass: fc.constantFrom("A", "B", "C", "D", "E"),
    maxExtensionMm: fc.double({ min: 2000, max: 5500, noNaN: true }),
    minExtensionMm: fc.constant(500),
  }),
  fc
    .array(fc.record({ l: fc.double({ min: 500, max: 8000, noNaN: true }), p: fc.double({ min: 1000, max: 1e5, noNaN: true }) }), { minLength: 2, maxLength: 8 })
    .map((rows) => {
      // A realistic supplier table: distinct lengths and safe loads that do not rise with length.
      const ls = [...new Set(rows.map((r) => Math.round(r.l)))].sort((a, b) => a - b);
      const ps = rows.map((r) => r.p).sort((a, b) => b - a);
      const table = ls.map((l, i) => ({ lengthMm: l, safeLoadN: ps[Math.min(i, ps.length - 1)] }));
      return table.length >= 2 ? { method: "supplier-table", table } : { method: "supplier-table", table: [{ lengthMm: 500, safeLoadN: 2000 }, { lengthMm: 8000, safeLoadN: 1000 }] };
    }),
);

function capacity(r: CalculationResult): number | undefined {
  return r.ok ? r.capacityN : undefined;
}

const NUM_RUNS = 400;

describe("capacity never rises with length (every length-dependent method)", () => {
  it("holds for random members", () => {
    fc.assert(
      fc.property(memberArb, lengths, (member, [l1, l2]) => {
        const c1 = capacity(calculate({ ...member, lengthMm: l1 }));
        const c2 = capacity(calculate({ ...member, lengthMm: l2 }));
        if (c1 === undefined || c2 === undefined) return true; // one length refused (prop range, table range, l_e/d > 50)
        return c2 <= c1 * (1 + 1e-12);
      }),
      { numRuns: NUM_RUNS },
    );
  });
  it("the generator produces accepted members for most draws (so the property above is not vacuous)", () => {
    let accepted = 0;
    fc.assert(
      fc.property(memberArb, fc.double({ min: 500, max: 3000, noNaN: true }), (member, l) => {
        if (calculate({ ...member, lengthMm: l }).ok) accepted++;
        return true;
      }),
      { numRuns: 200 },
    );
    expect(accepted).toBeGreaterThan(120);
  });
});

describe("capacity never exceeds the squash load", () => {
  it("steel: EN 1993 N_b,Rd ≤ A·fy/γM1, AISC φPn ≤ 0.9·A·Fy and Pn/Ω ≤ A·Fy/1.67", () => {
    fc.assert(
      fc.property(
        fc.constantFrom("en1993", "aisc360-lrfd", "aisc360-asd"),
        steelSection,
        fy,
        fc.double({ min: 1, max: 30000, noNaN: true }),
        (method, section, fyMpa, lengthMm) => {
          const r = calculate({ method, section, fyMpa, lengthMm, formed: "hot-finished" });
          if (!r.ok) return false;
          const area = Number(r.steps.find((s) => s.symbol === "A")?.value);
          const factor = method === "en1993" ? 1 : method === "aisc360-lrfd" ? 0.9 : 1 / 1.67;
          return (r.capacityN ?? Infinity) <= area * fyMpa * factor * (1 + 1e-12);
        },
      ),
      { numRuns: NUM_RUNS },
    );
  });
  it("timber: EN 1995 N_c,Rd ≤ f_c,0,d·A and NDS P' ≤ F_c*·A", () => {
    fc.assert(
      fc.property(timberSection, fc.double({ min: 1, max: 10000, noNaN: true }), fc.double({ min: 0.5, max: 1.1, noNaN: true }), (section, lengthMm, kmod) => {
        const ec5 = calculate({ method: "en1995", section, lengthMm, strengthClass: "C24", kmod });
        const nds = calculate({ method: "nds", section, lengthMm, fcStarMpa: 10, eMinMpa: 4000 });
        if (!ec5.ok) return false;
        const area = Number(ec5.steps.find((s) => s.symbol === "A")?.value);
        const ec5Ok = (ec5.capacityN ?? Infinity) <= ((kmod * 21) / 1.3) * area * (1 + 1e-12);
        const ndsOk = !nds.ok || (nds.capacityN ?? Infinity) <= 10 * area * (1 + 1e-12);
        return ec5Ok && ndsOk;
      }),
      { numRuns: NUM_RUNS },
    );
  });
});

describe("design capacity never exceeds the Euler load of the same member", () => {
  it("EN 1993 (γM1 ≥ 1), AISC LRFD/ASD and NDS", () => {
    fc.assert(
      fc.property(
        fc.constantFrom("en1993", "aisc360-lrfd", "aisc360-asd"),
        steelSection,
        fy,
        ends,
        fc.double({ min: 100, max: 30000, noNaN: true }),
        (method, section, fyMpa, e, lengthMm) => {
          const r = calculate({ method, section, fyMpa, ends: e, lengthMm, curve: "a0" });
          return r.ok && r.eulerN !== undefined && (r.capacityN ?? Infinity) <= r.eulerN * (1 + 1e-12);
        },
      ),
      { numRuns: NUM_RUNS },
    );
    fc.assert(
      fc.property(timberSection, fc.double({ min: 100, max: 20000, noNaN: true }), (section, lengthMm) => {
        const r = calculate({ method: "nds", section, lengthMm, fcStarMpa: 12, eMinMpa: 4500 });
        return !r.ok || (r.eulerN !== undefined && (r.capacityN ?? Infinity) <= r.eulerN * (1 + 1e-12));
      }),
      { numRuns: NUM_RUNS },
    );
  });
});

function deepNumbers(v: unknown, out: number[] = []): number[] {
  if (typeof v === "number") out.push(v);
  else if (Array.isArray(v)) v.forEach((x) => deepNumbers(x, out));
  else if (v && typeof v === "object") Object.values(v).forEach((x) => deepNumbers(x, out));
  return out;
}

describe("any input at all", () => {
  it("calculate never throws and never returns NaN", () => {
    fc.assert(
      fc.property(fc.anything({ withObjectString: true, withNullPrototype: true, withBigInt: true, withDate: true, withMap: true, withSet: true, withTypedArray: true, withSparseArray: true }), (input) => {
        const r = calculate(input);
        if (r.ok) return deepNumbers(r).every(Number.isFinite);
        return r.errors.length > 0 && r.errors.every((e) => typeof e.field === "string" && typeof e.message === "string");
      }),
      { numRuns: 1000 },
    );
  });
  it("objects shaped like requests with random field values never throw or give NaN", () => {
    const anyValue = fc.oneof(fc.anything(), fc.double(), fc.integer(), fc.string());
    fc.assert(
      fc.property(
        fc.record(
          {
            method: fc.oneof(fc.constantFrom("euler", "en1993", "aisc360-lrfd", "aisc360-asd", "en1065", "supplier-table", "en1995", "nds", "point-brace"), anyValue),
            lengthMm: fc.oneof(fc.double(), anyValue),
            k: anyValue,
            ends: anyValue,
            section: fc.oneof(steelSection, anyValue, fc.record({ shape: fc.constantFrom("chs", "rhs", "rect", "round", "given"), dMm: fc.double(), tMm: fc.double(), bMm: fc.double(), hMm: fc.double(), areaMm2: fc.double(), iMinMm4: fc.double() })),
            fyMpa: fc.oneof(fc.double(), anyValue),
            table: fc.oneof(fc.array(fc.record({ lengthMm: fc.double(), safeLoadN: fc.double() })), anyValue),
            loadN: fc.oneof(fc.double(), anyValue),
            propClass: anyValue,
            maxExtensionMm: fc.oneof(fc.double(), anyValue),
            braces: anyValue,
            fcStarMpa: fc.oneof(fc.double(), anyValue),
            eMinMpa: fc.oneof(fc.double(), anyValue),
            strengthClass: anyValue,
          },
          { requiredKeys: [] },
        ),
        (input) => {
          const r = calculate(input);
          if (r.ok) return deepNumbers(r).every(Number.isFinite);
          return r.errors.length > 0;
        },
      ),
      { numRuns: 1000 },
    );
  });
  it("raking-shore and slab-load never throw", () => {
    fc.assert(
      fc.property(fc.anything(), (input) => {
        const a = calculateRakingShore(input);
        const b = calculateSlabLoad(input);
        return typeof a.ok === "boolean" && typeof b.ok === "boolean";
      }),
      { numRuns: 300 },
    );
  });
  it("extreme but valid numbers never overflow into the result", () => {
    fc.assert(
      fc.property(
        fc.constantFrom("euler", "en1993", "aisc360-lrfd", "point-brace"),
        fc.double({ min: 1e-6, max: 100000, noNaN: true }),
        fc.double({ min: 1e-6, max: 5000, noNaN: true }),
        fc.double({ min: 1e-6, max: 1e7, noNaN: true }),
        (method, lengthMm, d, area) => {
          const r = calculate({ method, lengthMm, section: { shape: "given", areaMm2: area, iMinMm4: d ** 4 }, fyMpa: 355, curve: "b", braces: 1, loadN: 1, eMpa: 1e6 });
          return r.ok ? deepNumbers(r).every(Number.isFinite) : r.errors.length > 0;
        },
      ),
      { numRuns: NUM_RUNS },
    );
  });
});

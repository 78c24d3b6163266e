import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  formatFeetInches,
  formatForce,
  formatLength,
  formatPressure,
  formatStress,
  fromKnPerM2,
  fromMm,
  fromMpa,
  fromN,
  parseForce,
  parseLength,
  parsePressure,
  parseStress,
  toKnPerM2,
  toMm,
  toMpa,
  toN,
  type ForceUnit,
  type LengthUnit,
  type PressureUnit,
  type StressUnit,
} from "@/lib/units";
import { KSI_TO_MPA } from "@/lib/engineering/materials";

function value(r: ReturnType<typeof parseLength>): number {
  if (!r.ok) throw new Error(`expected ok, got: ${r.message}`);
  return r.value;
}

describe("conversion factors against published definitions", () => {
  // NIST SP 811 (2008) Appendix B.8/B.9 conversion factors; the inch and pound are exact by the 1959 agreement.
  it("inch and foot", () => {
    expect(toMm(1, "in")).toBe(25.4);
    expect(toMm(1, "ft")).toBeCloseTo(304.8, 10);
  });
  it("pound-force and kip", () => {
    // NIST SP 811: 1 lbf = 4.448 222 N; lbf = 0.453 592 37 kg × 9.806 65 m/s² exactly.
    expect(toN(1, "lbf")).toBeCloseTo(4.4482216152605, 12);
    expect(toN(1, "kip")).toBeCloseTo(4448.2216152605, 9);
  });
  it("psi, ksi and psf", () => {
    // NIST SP 811: 1 psi = 6.894 757 kPa; 1 lbf/ft² = 47.880 26 Pa.
    expect(toMpa(1, "psi")).toBeCloseTo(0.006894757, 9);
    expect(toMpa(1, "ksi")).toBeCloseTo(6.894757, 6);
    expect(toKnPerM2(1, "psf")).toBeCloseTo(0.04788026, 8);
    // AISC 360-16 states E = 29 000 ksi as 200 000 MPa (rounded): check our factor reproduces that to 0.1 %.
    expect(toMpa(29000, "ksi") / 200000).toBeCloseTo(1, 3);
  });
  it("engine's own ksi constant agrees with the units module", () => {
    expect(KSI_TO_MPA).toBeCloseTo(toMpa(1, "ksi"), 12);
  });
  it("kPa and kN/m² are the same unit", () => {
    expect(toKnPerM2(2.5, "kPa")).toBe(2.5);
    expect(toMpa(1000, "kPa")).toBe(1);
  });
});

describe("round trips (property)", () => {
  const finite = fc.double({ min: -1e9, max: 1e9, noNaN: true, noDefaultInfinity: true });
  const rel = (a: number, b: number) => Math.abs(a - b) <= 1e-12 * Math.max(1, Math.abs(a));
  it("length", () => {
    fc.assert(
      fc.property(finite, fc.constantFrom<LengthUnit>("mm", "cm", "m", "in", "ft"), (v, u) => rel(fromMm(toMm(v, u), u), v)),
    );
  });
  it("force", () => {
    fc.assert(fc.property(finite, fc.constantFrom<ForceUnit>("N", "kN", "lbf", "kip"), (v, u) => rel(fromN(toN(v, u), u), v)));
  });
  it("stress", () => {
    fc.assert(
      fc.property(finite, fc.constantFrom<StressUnit>("MPa", "N/mm2", "kPa", "psi", "ksi"), (v, u) => rel(fromMpa(toMpa(v, u), u), v)),
    );
  });
  it("pressure", () => {
    fc.assert(
      fc.property(finite, fc.constantFrom<PressureUnit>("kN/m2", "kPa", "Pa", "psf"), (v, u) => rel(fromKnPerM2(toKnPerM2(v, u), u), v)),
    );
  });
  it("feet-and-inches text round-trips to the nearest 1/16 inch", () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 16 * 12 * 40 }), (sixteenths) => {
        const mm = (sixteenths / 16) * 25.4;
        const back = value(parseLength(formatFeetInches(mm)));
        return Math.abs(back - mm) < 1e-9;
      }),
    );
  });
});

describe("parseLength", () => {
  it.each([
    ["3500", 3500],
    ["3500 mm", 3500],
    ["3.5 m", 3500],
    ["3.5m", 3500],
    ["350 cm", 3500],
    ["114 in", 2895.6],
    ['114"', 2895.6],
    ["9.5 ft", 2895.6],
    [`9' 6"`, 2895.6],
    [`9'-6"`, 2895.6],
    [`9'6"`, 2895.6],
    ["9 ft 6 in", 2895.6],
    ["9 ft", 2743.2],
    ["9'", 2743.2],
    [`9' 6`, 2895.6],
    [`9' 6-1/2"`, 2908.3],
    [`9' 6 1/2"`, 2908.3],
    [`6 1/2"`, 165.1],
    [`1/2"`, 12.7],
    [`9\u2032 6\u2033`, 2895.6],
    [`9' 6''`, 2895.6],
  ])("%s → %f mm", (text, mm) => {
    // 1 ft = 304.8 mm, 1 in = 25.4 mm (exact): e.g. 9' 6" = 114 in = 114 × 25.4 = 2895.6 mm.
    expect(value(parseLength(text))).toBeCloseTo(mm, 9);
  });
  it("uses the default unit for a bare number", () => {
    expect(value(parseLength("3.5", "m"))).toBe(3500);
  });
  it.each([
    ["", "Enter a length"],
    ["abc", "not a length"],
    ["3,5 m", "comma"],
    ["12 parsecs", "not a length unit"],
    [`9' 14"`, "under 12"],
    [`9' x"`, "inches part"],
    [`1/0"`, "zero"],
    ["6 1/2", "needs a unit"],
  ])("refuses %j with a sentence", (text, fragment) => {
    const r = parseLength(text);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toContain(fragment);
  });
});

describe("parseForce, parseStress, parsePressure", () => {
  it("forces", () => {
    expect(value(parseForce("25 kN"))).toBe(25000);
    expect(value(parseForce("25kN"))).toBe(25000);
    // 5 kip × 4448.2216 N/kip = 22 241.1 N
    expect(value(parseForce("5 kips"))).toBeCloseTo(22241.108, 3);
    expect(value(parseForce("1000 lbf"))).toBeCloseTo(4448.2216, 4);
    expect(value(parseForce("1000 lb"))).toBeCloseTo(4448.2216, 4);
    expect(value(parseForce("250"))).toBe(250);
    expect(parseForce("25 kg").ok).toBe(false);
  });
  it("stresses", () => {
    expect(value(parseStress("355 MPa"))).toBe(355);
    expect(value(parseStress("355 N/mm²"))).toBe(355);
    expect(value(parseStress("355 N/mm2"))).toBe(355);
    // 50 ksi × 6.894757 = 344.74 MPa
    expect(value(parseStress("50 ksi"))).toBeCloseTo(344.738, 3);
    expect(value(parseStress("1000 psi"))).toBeCloseTo(6.894757, 6);
    expect(parseStress("355 bar").ok).toBe(false);
  });
  it("area loads", () => {
    expect(value(parsePressure("2.5 kN/m²"))).toBe(2.5);
    expect(value(parsePressure("2.5 kPa"))).toBe(2.5);
    // 50 psf × 0.04788026 = 2.394 kN/m²
    expect(value(parsePressure("50 psf"))).toBeCloseTo(2.394013, 6);
    expect(parsePressure("50 psi").ok).toBe(false);
  });
});

describe("format helpers", () => {
  it("lengths", () => {
    expect(formatLength(3500)).toBe("3500 mm");
    expect(formatLength(3500, "m")).toBe("3.500 m");
    expect(formatLength(2895.6, "ft")).toBe(`9' 6"`);
    expect(formatFeetInches(2908.3)).toBe(`9' 6 1/2"`);
    expect(formatFeetInches(-2895.6)).toBe(`-9' 6"`);
    expect(formatLength(Number.NaN)).toBe("—");
  });
  it("forces, stresses, pressures", () => {
    expect(formatForce(25000)).toBe("25.00 kN");
    expect(formatForce(4448.2216152605, "lbf", 0)).toBe("1000 lbf");
    expect(formatForce(-0.001, "kN")).toBe("0.00 kN");
    expect(formatStress(355)).toBe("355.0 MPa");
    expect(formatStress(344.7378, "ksi")).toBe("50.0 ksi");
    expect(formatStress(355, "N/mm2", 0)).toBe("355 N/mm²");
    expect(formatPressure(2.5)).toBe("2.50 kN/m²");
    expect(formatPressure(2.394013, "psf")).toBe("50.0 psf");
  });
});

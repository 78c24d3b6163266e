// The calculator turns what a person types (SI or US units) into the engine's SI request.
// Conversion factors: NIST SP 811 (2008) Appendix B — 1 in = 25.4 mm exactly, 1 ft = 0.3048 m
// exactly, 1 kip = 4.448 222 kN, 1 ksi = 6.894 757 MPa, 1 psi = 6.894 757 kPa.
import { describe, expect, it } from "vitest";
import { fieldForPath, formToRequest } from "@/lib/calculator/form-request";
import { calculate } from "@/lib/engineering";
import { CALCULATOR_DEFAULTS, type CalculatorForm } from "@/lib/validations/calculator";

const form = (over: Partial<CalculatorForm>): CalculatorForm => ({ ...CALCULATOR_DEFAULTS, ...over });

describe("formToRequest", () => {
  it("reads US feet-and-inches, inches, kips and ksi into mm, N and MPa", () => {
    const { request, fieldErrors } = formToRequest(
      form({ method: "aisc360-lrfd", units: "us", length: `9' 6"`, shape: "chs", d: "4.5", t: "0.237", fy: "35", load: "20" }),
    );
    expect(fieldErrors).toEqual({});
    expect(request.lengthMm).toBeCloseTo(9.5 * 304.8, 6); // 2895.6 mm
    expect(request.section).toEqual({ shape: "chs", dMm: expect.closeTo(114.3, 6), tMm: expect.closeTo(6.0198, 6) });
    expect(request.fyMpa).toBeCloseTo(35 * 6.894757, 3);
    expect(request.loadN).toBeCloseTo(20 * 4448.222, 0);
  });

  it("keeps SI values as typed, with kN converted to N", () => {
    const { request } = formToRequest(form({ method: "en1065", units: "si", length: "2850", propClass: "D", maxExtension: "3350", load: "12.5" }));
    expect(request).toMatchObject({ method: "en1065", lengthMm: 2850, propClass: "D", maxExtensionMm: 3350, loadN: 12500 });
  });

  it("reads a pasted supplier table, and names the line that is not two numbers", () => {
    const ok = formToRequest(form({ method: "supplier-table", length: "2000", table: "1500, 100\n2500; 85\n3500\t62" }));
    expect(ok.request.table).toEqual([
      { lengthMm: 1500, safeLoadN: 100000 },
      { lengthMm: 2500, safeLoadN: 85000 },
      { lengthMm: 3500, safeLoadN: 62000 },
    ]);
    const bad = formToRequest(form({ method: "supplier-table", length: "2000", table: "1500, 100\n2500 kN" }));
    expect(bad.fieldErrors.table).toMatch(/Line 2/);
  });

  it("leaves a missing dimension out so the engine names it, and maps the error back to the field", () => {
    const { request } = formToRequest(form({ method: "euler", length: "3000", shape: "chs", d: "48.3", t: "" }));
    const result = calculate(request);
    expect(result.ok).toBe(false);
    if (!result.ok) {
      const e = result.errors.find((x) => x.field === "section.tMm");
      expect(e?.message).toBeTruthy();
      expect(fieldForPath("section.tMm")).toBe("t");
    }
    expect(fieldForPath("table.2.lengthMm")).toBe("table");
    expect(fieldForPath("")).toBeNull();
  });

  it("reports an unreadable length instead of guessing", () => {
    const { fieldErrors } = formToRequest(form({ length: "two metres" }));
    expect(fieldErrors.length).toBeTruthy();
  });
});

describe("formToRequest for the checks around a member", () => {
  it("base bearing in US units: inches, kips, psf and psi", () => {
    // 1 psf = 0.047 880 26 kPa (NIST SP 811 B.8: 1 lbf/ft² = 47.880 26 Pa)
    const { request, fieldErrors } = formToRequest(
      form({ method: "base-bearing", units: "us", length: "", basePlateB: "6", basePlateL: "6", allowablePressure: "2000", load: "5" }),
    );
    expect(fieldErrors).toEqual({});
    expect(request).not.toHaveProperty("lengthMm");
    expect(request.basePlateBMm).toBeCloseTo(152.4, 9);
    expect(request.allowablePressureKPa).toBeCloseTo(95.76052, 4);
    expect(request.loadN).toBeCloseTo(5 * 4448.222, 0);
    expect(calculate(request).ok).toBe(true);
  });

  it("base bearing under a leaning prop in US units: the offset in inches over a length in feet, and a friction coefficient", () => {
    // 4 in = 101.6 mm; 10 ft = 3048 mm (NIST SP 811: 1 in = 25.4 mm, 1 ft = 0.3048 m exactly).
    const { request, fieldErrors } = formToRequest(
      form({ method: "base-bearing", units: "us", length: "10'", plumbOffset: "4", friction: "0.4", basePlateB: "6", basePlateL: "6", allowablePressure: "2000", load: "5" }),
    );
    expect(fieldErrors).toEqual({});
    expect(request.outOfPlumbMm).toBeCloseTo(101.6, 9);
    expect(request.lengthMm).toBeCloseTo(3048, 9);
    expect(request.frictionCoefficient).toBe(0.4);
    const r = calculate(request);
    // sin θ = 101.6/3048 = 1/30: H = 5 kip/30 = 0.1667 kip = 741.4 N
    expect(r.ok && r.steps.find((s) => s.symbol === "H")?.value).toBeCloseTo((5 * 4448.222) / 30, 0);
    expect(fieldForPath("frictionCoefficient")).toBe("friction");
  });

  it("back-propping sequence: levels and slab weight, no length and no load", () => {
    const { request, fieldErrors } = formToRequest(form({ method: "backprop-sequence", length: "", shoredLevels: "3", slabSelfWeight: "6", load: "12" }));
    expect(fieldErrors).toEqual({});
    expect(request).toEqual({ method: "backprop-sequence", shoredLevels: 3, slabSelfWeightKPa: 6 });
  });

  it("out of plumb for an EN 1065 prop leaves the section out; for a steel tube it keeps it", () => {
    const prop = formToRequest(form({ method: "out-of-plumb", plumbTarget: "prop", length: "3000", propClass: "D", maxExtension: "3350", minExtension: "1980", plumbDeg: "3", load: "10" }));
    expect(prop.request).toMatchObject({ method: "out-of-plumb", propClass: "D", outOfPlumbDeg: 3, loadN: 10000 });
    expect(prop.request).not.toHaveProperty("section");
    const steel = formToRequest(form({ method: "out-of-plumb", length: "3000", shape: "chs", d: "114.3", t: "5", steelGrade: "S355", plumbDeg: "1", eccentricity: "10", load: "100" }));
    expect(steel.request).toMatchObject({ section: { shape: "chs", dMm: 114.3, tMm: 5 }, steelGrade: "S355", plumbCode: "en1993", eccentricityMm: 10 });
    expect(calculate(steel.request).ok).toBe(true);
  });

  it("point braces with no section sizes typed send no section", () => {
    const { request } = formToRequest(form({ method: "point-brace", length: "6000", braces: "1", load: "100" }));
    expect(request).not.toHaveProperty("section");
    expect(calculate(request).ok).toBe(true);
  });
});

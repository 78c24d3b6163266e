// The register compares like with like: a working load with a safe working load, a factored
// load with a design resistance (EN 1990 Table A1.2(B) γQ = 1.5; ASCE 7 §2.3 LRFD 1.6).
import { describe, expect, it } from "vitest";
import { buildCheckRequest, methodFor } from "@/lib/register/check-request";

const steel = { kind: "steel-section" as const, params: { section: { shape: "chs", dMm: 168.3, tMm: 6.3 }, fyMpa: 355, formed: "hot-finished" }, minExtensionMm: null, maxExtensionMm: null };
const prop = { kind: "en1065-prop" as const, params: { propClass: "D" }, minExtensionMm: 1980, maxExtensionMm: 3350 };
const member = { extensionMm: 3000, endConditions: "pinned-pinned" as const, loadN: 10000 };

describe("buildCheckRequest", () => {
  it("factors the working load by 1.5 for an EN 1993 design resistance", () => {
    const r = buildCheckRequest(steel, member, { designCode: "en1993", unitSystem: "si" });
    expect(r.request).toMatchObject({ method: "en1993", lengthMm: 3000, loadN: 15000, fyMpa: 355, formed: "hot-finished" });
    expect(r.loadFactor).toBe(1.5);
  });

  it("factors by 1.6 for AISC LRFD and not at all for ASD", () => {
    expect(buildCheckRequest(steel, member, { designCode: "aisc360-lrfd", unitSystem: "us" }).request.loadN).toBe(16000);
    expect(buildCheckRequest(steel, member, { designCode: "aisc360-asd", unitSystem: "us" }).request.loadN).toBe(10000);
  });

  it("compares a prop's working load with its safe working load, within its range", () => {
    const r = buildCheckRequest(prop, member, { designCode: "en1993", unitSystem: "si" });
    expect(r.request).toMatchObject({ method: "en1065", propClass: "D", maxExtensionMm: 3350, minExtensionMm: 1980, loadN: 10000 });
    expect(r.request).not.toHaveProperty("ends");
  });

  it("checks timber to EN 1995 on SI sites and to the NDS on US sites", () => {
    const timber = { kind: "timber-section" as const, params: {}, minExtensionMm: null, maxExtensionMm: null };
    expect(methodFor(timber, { designCode: "en1993", unitSystem: "si" }).method).toBe("en1995");
    expect(methodFor(timber, { designCode: "aisc360-asd", unitSystem: "us" }).method).toBe("nds");
  });
});

describe("a member found out of plumb is re-checked, not just ticked", () => {
  // Statics: a prop leaning by Δ over its length L stands at θ = asin(Δ/L); 157 mm over 3000 mm is 3.0°,
  // beyond the 1.5° tolerance within which an EN 1065 class rating applies (common practice, to be confirmed against BS 5975).
  it("a prop with a measured lean goes to the out-of-plumb check and fails beyond the tolerance", async () => {
    const { runCheck } = await import("@/lib/register/run-check");
    const leaning = { ...member, outOfPlumbMm: 157 };
    const r = buildCheckRequest(prop, leaning, { designCode: "en1993", unitSystem: "si" });
    expect(r.request).toMatchObject({ method: "out-of-plumb", propClass: "D", outOfPlumbMm: 157, minExtensionMm: 1980, maxExtensionMm: 3350, loadN: 10000 });
    const outcome = runCheck(prop, leaning, { designCode: "en1993", unitSystem: "si" });
    expect(outcome.method).toBe("out-of-plumb");
    expect(outcome.pass).toBe(false);
    // Plumb (no reading, or zero) keeps the plain EN 1065 check.
    expect(buildCheckRequest(prop, { ...member, outOfPlumbMm: 0 }, { designCode: "en1993", unitSystem: "si" }).request.method).toBe("en1065");
  });

  it("a steel member with a measured lean is checked for axial force and the amplified moment in the site's code", () => {
    const r = buildCheckRequest(steel, { ...member, outOfPlumbMm: 30 }, { designCode: "aisc360-lrfd", unitSystem: "us" });
    expect(r.request).toMatchObject({ method: "out-of-plumb", plumbCode: "aisc360", designBasis: "lrfd", outOfPlumbMm: 30, loadN: 16000 });
    expect(buildCheckRequest(steel, { ...member, outOfPlumbMm: 30 }, { designCode: "en1993", unitSystem: "si" }).request).toMatchObject({ plumbCode: "en1993", loadN: 15000 });
  });
});

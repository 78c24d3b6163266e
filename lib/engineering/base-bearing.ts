// Bearing under the base of a prop or shore: the pressure under the base plate,
// or under a timber sole plate that spreads it, against an allowable bearing
// pressure (typed, or a presumptive value for a few common grounds); and, for a
// back-prop standing on a slab, punching of that slab (EN 1992-1-1 §6.4 or
// ACI 318-19 §22.6). A prop leaning by θ (measured, or from the offset of its
// head over its length) brings its axial force N to the base as V = N·cos θ
// down and H = N·sin θ sideways: H is shown and must be taken by the base's
// fixing or by friction (checked only with a friction coefficient the user
// gives; no coefficient is assumed).

import { fieldError, fmt, step } from "./steps";
import type { CalculationRequest, CheckPart, FieldError, MethodOutcome, SoilId, SourceRef, Step } from "./types";

/**
 * Presumptive allowable bearing pressures, the lower end of each range of
 * BS 8004:1986 Table 1 (common practice for a first check; values to be
 * confirmed against that table, and site investigation or plate tests govern).
 * Hardcore is a common-practice figure for well-compacted granular fill.
 */
const BS8004: Pick<SourceRef, "source" | "toConfirm"> = { source: "BS 8004:1986 Table 1", toConfirm: "value to be confirmed against BS 8004:1986 Table 1" };
export const SOILS: Record<SoilId, { label: string; kPa: number } & SourceRef> = {
  "soft-clay": { label: "Soft clay or silt", kPa: 40, source: "Common practice", note: "below BS 8004:1986 Table 1 'soft clays', < 75 kPa" },
  "firm-clay": { label: "Firm clay", kPa: 75, ...BS8004, note: "firm clay 75–150 kPa, lower value" },
  "stiff-clay": { label: "Stiff clay", kPa: 150, ...BS8004, note: "stiff clay 150–300 kPa, lower value" },
  "loose-sand": { label: "Loose sand", kPa: 50, source: "Common practice", note: "BS 8004:1986 Table 1 'loose sand', < 100 kPa" },
  "medium-sand": { label: "Medium dense sand", kPa: 100, ...BS8004, note: "medium dense sand 100–300 kPa, lower value" },
  // 200 kPa is not a value of the table (it gives more than 600 kPa for dense gravel), so it is cited as the rule of thumb it is.
  "dense-gravel": { label: "Dense gravel or dense sand and gravel", kPa: 200, source: "Common practice", note: "well below BS 8004:1986 Table 1 'dense gravel', > 600 kPa" },
  hardcore: { label: "Well-compacted hardcore", kPa: 100, source: "Common practice", note: "compacted granular fill" },
};

export const SOLE_PLATE_SPREAD = { source: "Common practice", note: "load spreads at 45° through the sole plate thickness, within the plate's plan size" };

/** EN 1992-1-1 §6.4.4 (6.47) and (6.3N): v_Rd,c = max(C·k·(100ρl·fck)^(1/3), 0.035·k^1.5·√fck), MPa. */
export function en1992PunchingStress(dMm: number, fckMpa: number, rhoL: number): { k: number; vRdc: number; vMin: number } {
  const k = Math.min(2, 1 + Math.sqrt(200 / dMm));
  const vMin = 0.035 * Math.pow(k, 1.5) * Math.sqrt(fckMpa);
  const v = (0.18 / 1.5) * k * Math.cbrt(100 * rhoL * fckMpa);
  return { k, vRdc: Math.max(v, vMin), vMin };
}

/** EN 1992-1-1 §6.4.2: basic control perimeter at 2d round a rectangular loaded area a × b. */
export const en1992U1 = (a: number, b: number, d: number): number => 2 * (a + b) + 4 * Math.PI * d;

/** ACI 318-19 Table 22.6.5.2 (SI, interior, normal-weight concrete): v_c in MPa, b0 at d/2 round a × b. */
export function aci318PunchingStress(a: number, b: number, dMm: number, fcMpa: number): { b0: number; vc: number; lambdaS: number } {
  const b0 = 2 * (a + b) + 4 * dMm;
  const beta = Math.max(a, b) / Math.min(a, b);
  const lambdaS = Math.min(1, Math.sqrt(2 / (1 + 0.004 * dMm)));
  const root = Math.sqrt(Math.min(fcMpa, 69)); // §22.6.3.1: √f'c not more than 8.3 MPa
  const vc = Math.min(0.33 * lambdaS * root, 0.17 * (1 + 2 / beta) * lambdaS * root, 0.083 * (2 + (40 * dMm) / b0) * lambdaS * root);
  return { b0, vc, lambdaS };
}

/**
 * The lean of a prop standing out of plumb, from a measured angle or from the offset of its head
 * over its base with its length. The load on the base is the prop's axial force N; leaning by θ it
 * has a vertical part V = N·cos θ and a horizontal part H = N·sin θ at the base.
 */
function leanOf(req: CalculationRequest): { ok: true; given: boolean; thetaRad: number; steps: Step[] } | { ok: false; errors: FieldError[] } {
  const N = req.loadN ?? 0;
  if (req.outOfPlumbDeg === undefined && req.outOfPlumbMm === undefined) {
    if (req.frictionCoefficient !== undefined) {
      return { ok: false, errors: [fieldError("frictionCoefficient", "A friction coefficient is used only for a prop out of plumb: give its lean (an angle, or the offset of its head over its base with its length), or leave the coefficient out.")] };
    }
    return { ok: true, given: false, thetaRad: 0, steps: [] };
  }
  if (req.outOfPlumbDeg !== undefined && req.outOfPlumbMm !== undefined) {
    return { ok: false, errors: [fieldError("outOfPlumbMm", "Give the lean either as an angle or as an offset of the head over the base, not both.")] };
  }
  const steps: Step[] = [];
  let theta: number;
  if (req.outOfPlumbMm !== undefined) {
    const L = (req as Partial<CalculationRequest>).lengthMm;
    if (L === undefined) {
      return { ok: false, errors: [fieldError("lengthMm", "Give the prop's length in mm: the offset of its head over its base is turned into an angle with it.")] };
    }
    if (req.outOfPlumbMm >= L) {
      return { ok: false, errors: [fieldError("outOfPlumbMm", `An offset of ${fmt(req.outOfPlumbMm)} mm cannot be as large as the prop's length ${fmt(L)} mm.`)] };
    }
    theta = Math.asin(req.outOfPlumbMm / L);
    steps.push(
      step("Prop length", "L", L, "mm", "User input"),
      step("Offset of the head over the base (measured)", "Δ", req.outOfPlumbMm, "mm", "User input"),
      step("Angle out of plumb θ = asin(Δ/L)", "θ", (theta * 180) / Math.PI, "°", "Geometry"),
    );
  } else {
    const deg = req.outOfPlumbDeg as number;
    theta = (deg * Math.PI) / 180;
    steps.push(step("Angle out of plumb (measured)", "θ", deg, "°", "User input"));
  }
  steps.push(
    step("Vertical part of the axial force at the base V = N·cos θ", "V", N * Math.cos(theta), "N", "Statics"),
    step("Horizontal part of the axial force at the base H = N·sin θ", "H", N * Math.sin(theta), "N", "Statics"),
  );
  return { ok: true, given: true, thetaRad: theta, steps };
}

export function runBaseBearing(req: CalculationRequest): MethodOutcome {
  const errors: FieldError[] = [];
  if (req.loadN === undefined) errors.push(fieldError("loadN", "Give the load on the base in N."));
  if (req.basePlateBMm === undefined) errors.push(fieldError("basePlateBMm", "Give the width of the base plate in mm."));
  if (req.basePlateLMm === undefined) errors.push(fieldError("basePlateLMm", "Give the length of the base plate in mm."));
  const onSlab = req.slabDepthMm !== undefined || req.slabEffectiveDepthMm !== undefined;
  const sole = [req.solePlateBMm, req.solePlateLMm, req.solePlateTMm];
  const someSole = sole.some((v) => v !== undefined);
  if (someSole) {
    if (req.solePlateBMm === undefined) errors.push(fieldError("solePlateBMm", "Give the sole plate's width in mm (or leave out all sole plate sizes)."));
    if (req.solePlateLMm === undefined) errors.push(fieldError("solePlateLMm", "Give the sole plate's length in mm (or leave out all sole plate sizes)."));
    if (req.solePlateTMm === undefined) errors.push(fieldError("solePlateTMm", "Give the sole plate's thickness in mm (or leave out all sole plate sizes)."));
  }
  if (!onSlab && req.allowablePressureKPa === undefined && req.soil === undefined) {
    errors.push(fieldError("allowablePressureKPa", "Give the allowable bearing pressure in kPa, or choose the ground type, or give the slab below for a back-prop."));
  }
  if (onSlab && req.fckMpa === undefined) errors.push(fieldError("fckMpa", "Give the strength of the slab's concrete (f_ck, or f'c for ACI 318) in MPa."));
  const lean = leanOf(req);
  if (!lean.ok) errors.push(...lean.errors);
  if (errors.length || !lean.ok || req.loadN === undefined || req.basePlateBMm === undefined || req.basePlateLMm === undefined) return { ok: false, errors };
  const N = req.loadN;
  const a = req.basePlateBMm;
  const b = req.basePlateLMm;
  const steps: Step[] = [
    step(req.outOfPlumbDeg !== undefined || req.outOfPlumbMm !== undefined ? "Axial force of the prop on its base" : "Load on the base", "N", N, "N", "User input"),
    step("Base plate", "a × b", `${fmt(a)} × ${fmt(b)}`, "mm", "User input"),
  ];
  const warnings: string[] = [];
  const checks: CheckPart[] = [];
  // Every check here is linear in N, so each has a load at which it reaches 1.
  const capacities: number[] = [];

  // Area that bears on the ground (or on the slab): base plate, or spread through the sole plate.
  let bearA = a;
  let bearB = b;
  if (someSole) {
    const sb = req.solePlateBMm as number;
    const sl = req.solePlateLMm as number;
    const st = req.solePlateTMm as number;
    if (sb < a || sl < b) {
      if (sb < Math.min(a, b) || sl < Math.min(a, b) || sb * sl < a * b) {
        return { ok: false, errors: [fieldError("solePlateBMm", `The sole plate (${fmt(sb)} × ${fmt(sl)} mm) is smaller than the base plate (${fmt(a)} × ${fmt(b)} mm); the base plate must sit wholly on it.`)] };
      }
    }
    bearA = Math.min(sb, a + 2 * st);
    bearB = Math.min(sl, b + 2 * st);
    steps.push(
      step("Timber sole plate, width × length × thickness", "B × L × t", `${fmt(sb)} × ${fmt(sl)} × ${fmt(st)}`, "mm", "User input"),
      step("Effective bearing width min(B, a + 2t)", "a'", bearA, "mm", SOLE_PLATE_SPREAD),
      step("Effective bearing length min(L, b + 2t)", "b'", bearB, "mm", SOLE_PLATE_SPREAD),
    );
    warnings.push("Crushing of the timber across the grain under the base plate (EN 1995-1-1 §6.1.5, NDS §3.10) is not checked here.");
  }
  const area = bearA * bearB;
  const pressureKPa = (N / area) * 1000; // N/mm² = MPa → ×1000 kPa
  steps.push(...lean.steps);
  steps.push(
    step("Bearing area", "A", area, "mm²", "Geometry"),
    step(
      lean.given ? "Bearing pressure q = N/A, with the whole axial force N (on the safe side of its vertical part N·cos θ)" : "Bearing pressure q = N/A",
      "q",
      pressureKPa,
      "kPa",
      { source: "Statics", note: lean.given ? "uniform pressure; the lean's horizontal part is taken by the base fixing or friction" : "uniform pressure, concentric load" },
    ),
  );

  if (req.allowablePressureKPa !== undefined || req.soil !== undefined) {
    let allow: number;
    let source: SourceRef;
    if (req.allowablePressureKPa !== undefined) {
      allow = req.allowablePressureKPa;
      source = { source: "User input" };
      if (req.soil !== undefined) warnings.push(`The allowable pressure you gave (${fmt(allow)} kPa) is used instead of the value for ${SOILS[req.soil].label.toLowerCase()}.`);
    } else {
      const soil = SOILS[req.soil as SoilId];
      allow = soil.kPa;
      source = { source: soil.source, toConfirm: soil.toConfirm, note: soil.note };
      warnings.push(`${fmt(allow)} kPa for ${soil.label.toLowerCase()} is a presumptive value for a first check (common practice); a site investigation or plate test governs, and wet or disturbed ground can carry far less.`);
    }
    steps.push(step("Allowable bearing pressure", "q_a", allow, "kPa", source), step("q/q_a", "q/q_a", pressureKPa / allow, "", "Comparison"));
    checks.push({ name: "Bearing pressure on the ground", demand: pressureKPa, resistance: allow, unit: "kPa", utilisation: pressureKPa / allow, source: source.source });
    capacities.push((allow / 1000) * area);
  }

  if (onSlab) {
    const fck = req.fckMpa as number;
    const code = req.punchingCode ?? "en1992";
    let d: number;
    if (req.slabEffectiveDepthMm !== undefined) {
      d = req.slabEffectiveDepthMm;
      if (req.slabDepthMm !== undefined && d >= req.slabDepthMm) {
        return { ok: false, errors: [fieldError("slabEffectiveDepthMm", `The effective depth ${fmt(d)} mm must be less than the slab depth ${fmt(req.slabDepthMm)} mm.`)] };
      }
      steps.push(step("Slab effective depth (given)", "d", d, "mm", "User input"));
    } else {
      const h = req.slabDepthMm as number;
      d = h - 40;
      if (!(d > 0)) return { ok: false, errors: [fieldError("slabDepthMm", `A slab ${fmt(h)} mm deep leaves no effective depth after 40 mm cover and bar allowance.`)] };
      steps.push(step("Slab depth", "h", h, "mm", "User input"), step("Effective depth d = h − 40 mm (cover and half a bar, common practice)", "d", d, "mm", "Common practice"));
      warnings.push(`The slab's effective depth was taken as ${fmt(d)} mm (depth − 40 mm); give the slab effective depth d from the slab drawings.`);
    }
    // A back-prop loads the slab from above or below through its (spread) base: the loaded area is the bearing area.
    if (code === "en1992") {
      const rho = req.rhoL ?? 0;
      const p = en1992PunchingStress(d, fck, rho);
      const u1 = en1992U1(bearA, bearB, d);
      const vEd = N / (u1 * d); // β = 1.0: concentric load, no moment transfer
      const u0 = 2 * (bearA + bearB);
      const nu = 0.6 * (1 - fck / 250);
      const vMax = 0.4 * nu * (fck / 1.5);
      const vEd0 = N / (u0 * d);
      steps.push(
        step("k = 1 + √(200/d) ≤ 2", "k", p.k, "", "EN 1992-1-1 §6.4.4(1) Eq. 6.47"),
        step(req.rhoL !== undefined ? "Reinforcement ratio ρl (given)" : "Reinforcement ratio ρl not given: the minimum v_min is used", "ρl", rho, "", req.rhoL !== undefined ? "User input" : "EN 1992-1-1 §6.4.4(1)"),
        step("v_min = 0.035·k^1.5·√f_ck", "v_min", p.vMin, "MPa", "EN 1992-1-1 §6.2.2 Eq. 6.3N"),
        step("Punching resistance v_Rd,c = max(0.12·k·(100ρl·f_ck)^(1/3), v_min)", "v_Rd,c", p.vRdc, "MPa", { source: "EN 1992-1-1 §6.4.4 Eq. 6.47", note: "C_Rd,c = 0.18/γc" }),
        step("Basic control perimeter at 2d, u1 = 2(a' + b') + 4πd", "u1", u1, "mm", "EN 1992-1-1 §6.4.2 Fig. 6.13"),
        step("Punching shear stress v_Ed = β·N/(u1·d), β = 1.0 (concentric)", "v_Ed", vEd, "MPa", "EN 1992-1-1 §6.4.3 Eq. 6.38"),
        step("Perimeter of the loaded area", "u0", u0, "mm", "EN 1992-1-1 §6.4.5(3)"),
        step("Shear stress at the loaded area v_Ed,0 = N/(u0·d)", "v_Ed,0", vEd0, "MPa", "EN 1992-1-1 §6.4.5(3)"),
        step("Maximum v_Rd,max = 0.4·ν·f_cd, ν = 0.6(1 − f_ck/250), f_cd = f_ck/1.5", "v_Rd,max", vMax, "MPa", "EN 1992-1-1 §6.4.5(3) Eq. 6.53 with Eq. 6.6N"),
      );
      checks.push(
        { name: "Punching at the basic control perimeter", demand: vEd, resistance: p.vRdc, unit: "MPa", utilisation: vEd / p.vRdc, source: "EN 1992-1-1 §6.4.4" },
        { name: "Crushing at the loaded area", demand: vEd0, resistance: vMax, unit: "MPa", utilisation: vEd0 / vMax, source: "EN 1992-1-1 §6.4.5(3)" },
      );
      capacities.push(p.vRdc * u1 * d, vMax * u0 * d);
      warnings.push("The slab's own loads and any punching from the floor above are not added here: N must be the whole design (ULS) load the prop brings to this slab.");
    } else {
      const p = aci318PunchingStress(bearA, bearB, d, fck);
      const vu = N / (p.b0 * d);
      const phiVc = 0.75 * p.vc;
      steps.push(
        step("Critical perimeter at d/2, b0 = 2(a' + b') + 4d", "b0", p.b0, "mm", "ACI 318-19 §22.6.4.1"),
        step("Size effect factor λs = √(2/(1 + 0.004d)) ≤ 1", "λs", p.lambdaS, "", "ACI 318-19 §22.5.5.1.3"),
        step("v_c = least of 0.33λs√f'c, 0.17(1 + 2/β)λs√f'c, 0.083(2 + αs·d/b0)λs√f'c (αs = 40)", "v_c", p.vc, "MPa", "ACI 318-19 Table 22.6.5.2"),
        step("Design strength φv_c, φ = 0.75", "φv_c", phiVc, "MPa", "ACI 318-19 Table 21.2.1"),
        step("Factored shear stress v_u = V_u/(b0·d)", "v_u", vu, "MPa", "ACI 318-19 §22.6.1"),
      );
      checks.push({ name: "Two-way (punching) shear", demand: vu, resistance: phiVc, unit: "MPa", utilisation: vu / phiVc, source: "ACI 318-19 §22.6" });
      capacities.push(phiVc * p.b0 * d);
    }
  }
  let gi = 0;
  capacities.forEach((c, i) => {
    if (c < capacities[gi]) gi = i;
  });
  const governing = checks[gi];
  const capacityN = capacities[gi];
  steps.push(step(`Load at which the governing check (${governing.name}) reaches 1`, "N_max", capacityN, "N", governing.source));
  let utilisation: number | undefined;
  if (lean.given && lean.thetaRad > 0) {
    const vertical = N * Math.cos(lean.thetaRad);
    const horizontal = N * Math.sin(lean.thetaRad);
    const tanTheta = Math.tan(lean.thetaRad);
    if (req.frictionCoefficient !== undefined) {
      const mu = req.frictionCoefficient;
      const sliding = tanTheta / mu;
      steps.push(
        step("Friction coefficient between the base and what it stands on (given)", "μ", mu, "", "User input"),
        step("Friction resistance μ·V", "μ·V", mu * vertical, "N", { source: "Statics", note: "Coulomb friction, no factor of safety" }),
        step("Sliding ratio H/(μ·V) = tan θ/μ, the same at every load", "H/(μ·V)", sliding, "", "Statics"),
      );
      checks.push({ name: "Sliding of the base on friction", demand: horizontal, resistance: mu * vertical, unit: "N", utilisation: sliding, source: "Statics" });
      utilisation = Math.max(N / capacityN, sliding);
      if (sliding > 1) {
        warnings.push(
          `At ${fmt((lean.thetaRad * 180) / Math.PI)}° out of plumb the base would slide on friction alone (tan θ = ${fmt(tanTheta)} is more than the friction coefficient ${fmt(mu)}) whatever the load: fix the base against sliding or re-plumb the prop.`,
        );
      }
      warnings.push(
        `The base must resist a horizontal force H = ${fmt(horizontal / 1000)} kN (N·sin θ) by its fixing or by friction; friction was checked with the coefficient you gave and no factor of safety, which a temporary works designer should confirm.`,
      );
    } else {
      warnings.push(
        `The base must resist a horizontal force H = ${fmt(horizontal / 1000)} kN (N·sin θ) by its fixing (pins, bolts, a cleat or a kicker) or by friction. Friction is not checked: give the friction coefficient between the base and what it stands on to check it, or fix the base.`,
      );
    }
  }
  return {
    ok: true,
    value: {
      basis: "bearing-resistance",
      capacityN,
      ...(utilisation !== undefined ? { utilisation } : {}),
      loadBasis: onSlab
        ? "The load is the design load on the slab (EN 1992-1-1: ULS N_Ed; ACI 318: factored V_u); the capacity is the load at which the governing check reaches 1."
        : "Working (unfactored) load compared with the allowable bearing pressure; the capacity is the load at which the pressure reaches it.",
      checks,
      steps,
      warnings,
    },
  };
}

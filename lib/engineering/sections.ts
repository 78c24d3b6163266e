// Gross cross-section properties of the shapes used for temporary compression
// members. Members are checked about their least-stiff axis: a prop, strut or
// post on site is rarely restrained differently about its two axes, and
// buckling about the weaker axis is the safe assumption.

import { fieldError, fmt, step } from "./steps";
import type { FieldError, Section, SourceRef, Step } from "./types";

const PI = Math.PI;

export const chsArea = (d: number, t: number): number => (PI / 4) * (d * d - (d - 2 * t) * (d - 2 * t));
export const chsSecondMoment = (d: number, t: number): number => {
  const di = d - 2 * t;
  return (PI / 64) * (d * d * d * d - di * di * di * di);
};
/** Second moment for bending that curves the `h` sides (axis parallel to `b`). */
export const rhsSecondMoment = (b: number, h: number, t: number): number => {
  const bi = b - 2 * t;
  const hi = h - 2 * t;
  return (b * h * h * h - bi * hi * hi * hi) / 12;
};
/** Corner "spandrel" (an r × r square less a quarter circle of radius r): area r²(1 − π/4), centroid r(10 − 3π)/(12 − 3π) from the outer edges. */
const SPANDREL_AREA = 1 - PI / 4;
const SPANDREL_CENTROID = (10 - 3 * PI) / (12 - 3 * PI);
/** Second moment of a spandrel about an axis through its centroid parallel to a straight edge: r⁴[(1 − 5π/16) − (1 − π/4)·c²]. */
const SPANDREL_OWN_I = 1 - (5 * PI) / 16 - SPANDREL_AREA * SPANDREL_CENTROID * SPANDREL_CENTROID;

/** Second moment of one spandrel of radius r about an axis at `edge` from its outer edges. */
function spandrelI(r: number, edge: number): number {
  if (r <= 0) return 0;
  const r2 = r * r;
  const d = edge - SPANDREL_CENTROID * r;
  return SPANDREL_OWN_I * r2 * r2 + SPANDREL_AREA * r2 * d * d;
}

/**
 * Area of a rectangular hollow section with rounded corners, EN 10219-2 / EN 10210-2
 * formula: A = 2t(B + H − 2t) − (4 − π)(r_o² − r_i²).
 */
export const rhsRoundedArea = (b: number, h: number, t: number, ro: number, ri: number): number =>
  2 * t * (b + h - 2 * t) - (4 - PI) * (ro * ro - ri * ri);

/**
 * Second moment for bending that curves the `h` sides, with rounded corners: the
 * square-corner value less the four outer spandrels (radius r_o, edge at h/2) plus
 * the four inner ones (radius r_i, edge at h/2 − t), each by the parallel-axis rule.
 */
export const rhsRoundedSecondMoment = (b: number, h: number, t: number, ro: number, ri: number): number =>
  rhsSecondMoment(b, h, t) - 4 * spandrelI(ro, h / 2) + 4 * spandrelI(ri, h / 2 - t);

/** How the corner radii of a hollow section are set when the user does not give them. */
export type CornerRule = "cold-formed" | "hot-finished" | "aisc";

/** Outside and inside corner radii by the product standard. */
export function cornerRadii(t: number, rule: CornerRule): { ro: number; ri: number; source: SourceRef } {
  if (rule === "hot-finished") return { ro: 1.5 * t, ri: t, source: { source: "EN 10210-2", toConfirm: "clause to be confirmed against EN 10210-2", note: "hot-finished: r_o = 1.5t, r_i = 1.0t for calculating properties" } };
  if (rule === "aisc") return { ro: 2 * t, ri: t, source: { source: "AISC Steel Construction Manual Part 1", note: "HSS outside corner radius 2.0·t_des" } };
  const ro = t <= 6 ? 2 * t : t <= 10 ? 2.5 * t : 3 * t;
  return { ro, ri: ro - t, source: { source: "EN 10219-2", toConfirm: "clause to be confirmed against EN 10219-2", note: "cold-formed: r_o = 2t (t ≤ 6 mm), 2.5t (6 < t ≤ 10 mm), 3t (t > 10 mm), r_i = r_o − t" } };
}

export const rectArea = (b: number, h: number): number => b * h;
export const rectSecondMoment = (b: number, h: number): number => (b * h * h * h) / 12;
export const roundArea = (d: number): number => (PI * d * d) / 4;
export const roundSecondMoment = (d: number): number => (PI * d * d * d * d) / 64;

export type SectionKind = "hollow" | "solid" | "given";

export interface SectionProperties {
  areaMm2: number;
  iMinMm4: number;
  iMaxMm4?: number;
  rMinMm: number;
  kind: SectionKind;
  /** Least outside dimension of a solid section (NDS d). */
  leastDimensionMm?: number;
  /** Wall or element thickness, for thickness-dependent yield strengths. */
  thicknessMm?: number;
  steps: Step[];
}

const SRC_GEOM = "Section geometry";

export function sectionProperties(section: Section, cornerRule: CornerRule = "cold-formed"): SectionProperties {
  const steps: Step[] = [];
  let areaMm2: number;
  let iMinMm4: number;
  let iMaxMm4: number | undefined;
  let kind: SectionKind;
  let leastDimensionMm: number | undefined;
  let thicknessMm: number | undefined;
  switch (section.shape) {
    case "chs": {
      const { dMm: d, tMm: t } = section;
      areaMm2 = chsArea(d, t);
      iMinMm4 = chsSecondMoment(d, t);
      iMaxMm4 = iMinMm4;
      kind = "hollow";
      thicknessMm = t;
      steps.push(step("Circular hollow section, outside diameter × wall", "D × t", `${fmt(d)} × ${fmt(t)}`, "mm", SRC_GEOM));
      steps.push(step("Area A = π/4·(D² − (D − 2t)²)", "A", areaMm2, "mm²", SRC_GEOM));
      steps.push(step("Second moment I = π/64·(D⁴ − (D − 2t)⁴)", "I", iMinMm4, "mm⁴", SRC_GEOM));
      break;
    }
    case "rhs": {
      const { bMm: b, hMm: h, tMm: t } = section;
      kind = "hollow";
      thicknessMm = t;
      steps.push(step("Rectangular hollow section, b × h × t", "b × h × t", `${fmt(b)} × ${fmt(h)} × ${fmt(t)}`, "mm", SRC_GEOM));
      let ro: number;
      let ri: number;
      if (section.cornerRadiusMm !== undefined) {
        ro = section.cornerRadiusMm;
        ri = Math.max(ro - t, 0);
        steps.push(step(ro === 0 ? "Square-corner geometry: outside corner radius 0 given" : "Outside corner radius (given)", "r_o", ro, "mm", "User input"));
        steps.push(step("Inside corner radius r_i = max(r_o − t, 0)", "r_i", ri, "mm", SRC_GEOM));
      } else {
        const r = cornerRadii(t, cornerRule);
        ro = r.ro;
        ri = r.ri;
        steps.push(step("Outside corner radius for calculating properties", "r_o", ro, "mm", r.source));
        steps.push(step("Inside corner radius", "r_i", ri, "mm", r.source));
      }
      areaMm2 = rhsRoundedArea(b, h, t, ro, ri);
      const ih = rhsRoundedSecondMoment(b, h, t, ro, ri);
      const ib = rhsRoundedSecondMoment(h, b, t, ro, ri);
      iMinMm4 = Math.min(ih, ib);
      iMaxMm4 = Math.max(ih, ib);
      const SRC_RHS = { source: "EN 10219-2 / EN 10210-2", toConfirm: "clause to be confirmed against EN 10219-2 and EN 10210-2", note: "sectional property formulae with rounded corners" };
      steps.push(step("Area A = 2t(b + h − 2t) − (4 − π)(r_o² − r_i²)", "A", areaMm2, "mm²", SRC_RHS));
      steps.push(step("Second moment, major axis (square-corner value less the corner spandrels)", "I_max", iMaxMm4, "mm⁴", SRC_RHS));
      steps.push(step("Second moment, minor axis", "I_min", iMinMm4, "mm⁴", SRC_RHS));
      break;
    }
    case "rect": {
      const { bMm: b, hMm: h } = section;
      areaMm2 = rectArea(b, h);
      const ih = rectSecondMoment(b, h);
      const ib = rectSecondMoment(h, b);
      iMinMm4 = Math.min(ih, ib);
      iMaxMm4 = Math.max(ih, ib);
      kind = "solid";
      leastDimensionMm = Math.min(b, h);
      thicknessMm = Math.min(b, h);
      steps.push(step("Solid rectangle, b × h", "b × h", `${fmt(b)} × ${fmt(h)}`, "mm", SRC_GEOM));
      steps.push(step("Area A = b·h", "A", areaMm2, "mm²", SRC_GEOM));
      steps.push(step("Second moment, major axis (larger side cubed)/12", "I_max", iMaxMm4, "mm⁴", SRC_GEOM));
      steps.push(step("Second moment, minor axis (smaller side cubed)/12", "I_min", iMinMm4, "mm⁴", SRC_GEOM));
      break;
    }
    case "round": {
      const { dMm: d } = section;
      areaMm2 = roundArea(d);
      iMinMm4 = roundSecondMoment(d);
      iMaxMm4 = iMinMm4;
      kind = "solid";
      leastDimensionMm = d;
      thicknessMm = d / 2;
      steps.push(step("Solid round, diameter", "D", d, "mm", SRC_GEOM));
      steps.push(step("Area A = π·D²/4", "A", areaMm2, "mm²", SRC_GEOM));
      steps.push(step("Second moment I = π·D⁴/64", "I", iMinMm4, "mm⁴", SRC_GEOM));
      break;
    }
    case "given": {
      areaMm2 = section.areaMm2;
      iMinMm4 = section.iMinMm4;
      kind = "given";
      steps.push(step("Area (given by the user)", "A", areaMm2, "mm²", "User input"));
      steps.push(step("Least second moment of area (given by the user)", "I_min", iMinMm4, "mm⁴", "User input"));
      break;
    }
  }
  const rMinMm = Math.sqrt(iMinMm4 / areaMm2);
  steps.push(
    step(
      "Least radius of gyration i = √(I_min/A); buckling is checked about this least-stiff axis",
      "i_min",
      rMinMm,
      "mm",
      SRC_GEOM,
    ),
  );
  return { areaMm2, iMinMm4, iMaxMm4, rMinMm, kind, leastDimensionMm, thicknessMm, steps };
}

/** Cross-field geometry rules; field types and positivity are checked by the request schema first. */
export function checkSectionGeometry(section: Section, path = "section"): FieldError[] {
  const errors: FieldError[] = [];
  if (section.shape === "chs" && section.tMm >= section.dMm / 2) {
    errors.push(
      fieldError(
        `${path}.tMm`,
        `Wall thickness must be less than half the outside diameter (got t = ${fmt(section.tMm)} mm for D = ${fmt(section.dMm)} mm).`,
      ),
    );
  }
  if (section.shape === "rhs") {
    const least = Math.min(section.bMm, section.hMm);
    if (section.cornerRadiusMm !== undefined && 2 * section.cornerRadiusMm > least) {
      errors.push(
        fieldError(
          `${path}.cornerRadiusMm`,
          `The outside corner radius must be at most half the smaller side (got r_o = ${fmt(section.cornerRadiusMm)} mm for a ${fmt(section.bMm)} × ${fmt(section.hMm)} mm section).`,
        ),
      );
    }
    if (2 * section.tMm >= least) {
      errors.push(
        fieldError(
          `${path}.tMm`,
          `Wall thickness must be less than half the smaller side (got t = ${fmt(section.tMm)} mm for a ${fmt(section.bMm)} × ${fmt(section.hMm)} mm section).`,
        ),
      );
    }
  }
  return errors;
}

// Gross cross-section properties of the shapes used for temporary compression
// members. Members are checked about their least-stiff axis: a prop, strut or
// post on site is rarely restrained differently about its two axes, and
// buckling about the weaker axis is the safe assumption.

import { fieldError, fmt, step } from "./steps";
import type { FieldError, Section, Step } from "./types";

const PI = Math.PI;

export const chsArea = (d: number, t: number): number => (PI / 4) * (d * d - (d - 2 * t) * (d - 2 * t));
export const chsSecondMoment = (d: number, t: number): number => {
  const di = d - 2 * t;
  return (PI / 64) * (d * d * d * d - di * di * di * di);
};
export const rhsArea = (b: number, h: number, t: number): number => b * h - (b - 2 * t) * (h - 2 * t);
/** Second moment for bending that curves the `h` sides (axis parallel to `b`). */
export const rhsSecondMoment = (b: number, h: number, t: number): number => {
  const bi = b - 2 * t;
  const hi = h - 2 * t;
  return (b * h * h * h - bi * hi * hi * hi) / 12;
};
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

const SRC_GEOM = "Section geometry (elementary mechanics)";

export function sectionProperties(section: Section): SectionProperties {
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
      areaMm2 = rhsArea(b, h, t);
      const ih = rhsSecondMoment(b, h, t);
      const ib = rhsSecondMoment(h, b, t);
      iMinMm4 = Math.min(ih, ib);
      iMaxMm4 = Math.max(ih, ib);
      kind = "hollow";
      thicknessMm = t;
      steps.push(step("Rectangular hollow section, b × h × t", "b × h × t", `${fmt(b)} × ${fmt(h)} × ${fmt(t)}`, "mm", SRC_GEOM));
      steps.push(
        step(
          "Square-corner geometry: corner radii are ignored, which slightly overstates A and I compared with EN 10219-2 / EN 10210-2 tabulated values",
          "—",
          "square corners",
          "",
          SRC_GEOM,
        ),
      );
      steps.push(step("Area A = b·h − (b − 2t)(h − 2t)", "A", areaMm2, "mm²", SRC_GEOM));
      steps.push(step("Second moment, major axis", "I_max", iMaxMm4, "mm⁴", SRC_GEOM));
      steps.push(step("Second moment, minor axis", "I_min", iMinMm4, "mm⁴", SRC_GEOM));
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

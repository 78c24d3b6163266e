// Pieces several methods share: fetching the section a method needs and the
// steel yield strength from a grade or an explicit value.

import { findSteelGrade, STEEL_GRADES } from "./materials";
import { checkSectionGeometry, sectionProperties, type CornerRule, type SectionProperties } from "./sections";
import { fieldError, fmt, step } from "./steps";
import type { CalculationRequest, FieldError, Section, Step } from "./types";

const SHAPE_WORDS: Record<Section["shape"], string> = {
  chs: "circular hollow (chs)",
  rhs: "rectangular hollow (rhs)",
  rect: "solid rectangle (rect)",
  round: "solid round (round)",
  given: "given area and I (given)",
};

export function requireSection(
  req: CalculationRequest,
  allowed: readonly Section["shape"][],
  methodLabel: string,
  cornerRule: CornerRule = "cold-formed",
): { ok: true; section: Section; props: SectionProperties } | { ok: false; errors: FieldError[] } {
  if (!req.section) {
    return {
      ok: false,
      errors: [
        fieldError(
          "section",
          `${methodLabel} needs the member's cross-section: ${allowed.map((s) => SHAPE_WORDS[s]).join(", ")}.`,
        ),
      ],
    };
  }
  if (!allowed.includes(req.section.shape)) {
    return {
      ok: false,
      errors: [
        fieldError(
          "section.shape",
          `${methodLabel} does not accept a ${SHAPE_WORDS[req.section.shape]} section; use ${allowed.map((s) => SHAPE_WORDS[s]).join(", ")}.`,
        ),
      ],
    };
  }
  const geometry = checkSectionGeometry(req.section);
  if (geometry.length) return { ok: false, errors: geometry };
  return { ok: true, section: req.section, props: sectionProperties(req.section, cornerRule) };
}

export interface ResolvedFy {
  fyMpa: number;
  steps: Step[];
  warnings: string[];
}

/** Explicit fyMpa wins over a grade, so a mill certificate or a supplier's value can always be used. */
export function resolveSteelFy(
  req: CalculationRequest,
  props: SectionProperties,
): { ok: true; value: ResolvedFy } | { ok: false; errors: FieldError[] } {
  const warnings: string[] = [];
  if (req.fyMpa !== undefined) {
    const steps = [step("Yield strength (given by the user)", "f_y", req.fyMpa, "MPa", "User input")];
    if (req.steelGrade !== undefined) warnings.push(`The yield strength you gave (${fmt(req.fyMpa)} MPa) is used instead of the value for grade ${req.steelGrade}.`);
    return { ok: true, value: { fyMpa: req.fyMpa, steps, warnings } };
  }
  if (req.steelGrade === undefined) {
    return {
      ok: false,
      errors: [
        fieldError(
          "fyMpa",
          `Give the steel's yield strength fy in MPa, or choose a steel grade (${STEEL_GRADES.map((g) => g.id).join(", ")}).`,
        ),
      ],
    };
  }
  const grade = findSteelGrade(req.steelGrade);
  if (!grade) {
    return {
      ok: false,
      errors: [
        fieldError(
          "steelGrade",
          `Steel grade "${req.steelGrade}" is not in the list (${STEEL_GRADES.map((g) => g.id).join(", ")}); give fy in MPa instead.`,
        ),
      ],
    };
  }
  const isRound = req.section?.shape === "chs" || req.section?.shape === "round";
  let fy = isRound && grade.fyRoundMpa !== undefined ? grade.fyRoundMpa : grade.fyMpa;
  let label = `Yield strength for ${grade.label}${isRound && grade.fyRoundMpa !== undefined ? " (round)" : ""}`;
  // The product standard's thickness steps refer to the nominal wall, not AISC's design wall 0.93t.
  const nominal = req.section?.shape === "chs" || req.section?.shape === "rhs" ? req.section.tMm : undefined;
  const t = nominal ?? props.thicknessMm;
  const fromProduct = (req.fyFrom ?? "product-standard") === "product-standard" && grade.productBands !== undefined && t !== undefined;
  if (fromProduct && grade.productBands && t !== undefined) {
    const band = grade.productBands.find(([tMax]) => t <= tMax);
    if (band) {
      const steps = [
        step(`Yield strength for ${grade.label}, nominal thickness ${fmt(t)} mm ≤ ${band[0]} mm, from the product standard (as UK and several other National Annexes to EN 1993-1-1 require)`, "f_y", band[1], "MPa", grade.productSource ?? grade.source),
      ];
      return { ok: true, value: { fyMpa: band[1], steps, warnings } };
    }
    warnings.push(`The section is ${fmt(t)} mm thick, beyond the product standard steps used here; confirm fy from the mill certificate.`);
  }
  if (grade.tLimitMm !== undefined && grade.fyThickMpa !== undefined && t !== undefined && t > grade.tLimitMm) {
    fy = grade.fyThickMpa;
    label += `, thickness ${fmt(t)} mm > ${grade.tLimitMm} mm`;
    if (t > 80) {
      warnings.push(`The section is ${fmt(t)} mm thick, beyond the 80 mm covered by EN 1993-1-1 Table 3.1; confirm fy from the product standard.`);
    }
  }
  if (props.kind === "given") {
    warnings.push(`The grade's nominal yield strength assumes elements no thicker than ${grade.tLimitMm ?? "the standard's lowest range"} mm; the thickness of a "given" section is not known, so confirm fy.`);
  }
  return { ok: true, value: { fyMpa: fy, steps: [step(label, "f_y", fy, "MPa", grade.source)], warnings } };
}

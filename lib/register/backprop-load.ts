// The working load on a back-propped member from its scheme's back-propping and the member's level
// and as-built spacing: the largest prop-load ratio its level reaches through the casting cycle
// (Grundy & Kabaila 1963, simplified method) × the slab's self-weight × the member's tributary
// area. Pure: the scheme page, the phone form and the server show the same numbers.
//
// Levels count down from the top: level 1 is the props right under the newest slab (the one being
// cast), level 2 the props under the slab below it, and so on to level n, the lowest.
import { calculate, ENGINE_VERSION, WET_REINFORCED_CONCRETE_KN_M3, type Step } from "@/lib/engineering";
import { GK_SOURCE } from "@/lib/engineering/backprop";
import { fmt, step } from "@/lib/engineering/steps";
import type { SchemeBackprop } from "@/db/schema";
import type { FieldErrors } from "@/lib/errors";

export type BackpropScheme = {
  reference: string;
  slabThicknessMm: number | null;
  concreteDensityKnM3: number | null;
  backprop: SchemeBackprop | null;
};

export type BackpropLevel = {
  level: number;
  /** Largest prop load at this level over the sequence, as a multiple of one slab's self-weight. */
  ratio: number;
  /** The same, kN/m² of slab. */
  kPa: number;
  /** The stage of the cycle at which it is reached. */
  stage: string;
};

export type BackpropTable = {
  schemeReference: string;
  shoredLevels: number;
  slabThicknessMm: number;
  densityKnM3: number;
  slabSelfWeightKPa: number;
  levels: BackpropLevel[];
  maxSlabLoadRatio: number;
  steps: Step[];
  warnings: string[];
};

export type BackpropLoadInfo = {
  schemeReference: string;
  level: number;
  shoredLevels: number;
  slabSelfWeightKPa: number;
  levelRatio: number;
  levelKPa: number;
  governingStage: string;
  spacingXMm: number;
  spacingYMm: number;
  tributaryAreaM2: number;
  /** Working (unfactored) load per member, N. */
  loadPerMemberN: number;
  steps: Step[];
  warnings: string[];
  engineVersion: string;
};

type Stage = { label: string; propLoadRatios: number[] };

/** The per-level table of a scheme's back-propping, or the reason there is none. */
export function backpropTable(scheme: BackpropScheme): { ok: true; table: BackpropTable } | { ok: false; fields: FieldErrors } {
  const bp = scheme.backprop;
  if (!bp) return { ok: false, fields: { loadSource: `Scheme ${scheme.reference} has no back-propping; choose another load source, or add back-propping to the scheme.` } };
  if (scheme.slabThicknessMm == null) {
    return { ok: false, fields: { backprop: `Scheme ${scheme.reference} gives no slab thickness: back-propping loads are multiples of the slab's self-weight, so give the slab first.` } };
  }
  const density = scheme.concreteDensityKnM3 ?? WET_REINFORCED_CONCRETE_KN_M3;
  const w = (density * scheme.slabThicknessMm) / 1000;
  const r = calculate({
    method: "backprop-sequence",
    shoredLevels: bp.shoredLevels,
    slabSelfWeightKPa: w,
    ...(bp.formworkKPa !== undefined ? { formworkKPa: bp.formworkKPa } : {}),
    ...(bp.constructionKPa !== undefined ? { constructionKPa: bp.constructionKPa } : {}),
    ...(bp.cycles !== undefined ? { cycles: bp.cycles } : {}),
  } as Parameters<typeof calculate>[0]);
  if (!r.ok) {
    const fields: FieldErrors = {};
    for (const e of r.errors) fields[`backprop.${e.field || "shoredLevels"}`] ??= `Scheme ${scheme.reference}: ${e.message}`;
    return { ok: false, fields };
  }
  const value = r as unknown as { stages: Stage[]; maxSlabLoadRatio: number; steps: Step[]; warnings?: string[] };
  const levels: BackpropLevel[] = [];
  for (let i = 0; i < bp.shoredLevels; i++) levels.push({ level: i + 1, ratio: 0, kPa: 0, stage: "—" });
  for (const s of value.stages) {
    s.propLoadRatios.forEach((p, i) => {
      const l = levels[i];
      if (l && p > l.ratio + 1e-12) {
        l.ratio = p;
        l.stage = s.label;
      }
    });
  }
  for (const l of levels) l.kPa = l.ratio * w;
  const steps: Step[] = [
    step("Slab thickness", "t", scheme.slabThicknessMm, "mm", "User input"),
    step(scheme.concreteDensityKnM3 != null ? "Concrete density (given)" : "Density of reinforced concrete (the scheme gives none)", "γ_c", density, "kN/m³", scheme.concreteDensityKnM3 != null ? "User input" : "EN 1991-1-1 Table A.1 and its notes"),
    step("Slab self-weight w = γ_c·t", "w", w, "kPa", "Statics"),
    ...value.steps.filter((s) => s.symbol !== "w"),
  ];
  return {
    ok: true,
    table: {
      schemeReference: scheme.reference, shoredLevels: bp.shoredLevels, slabThicknessMm: scheme.slabThicknessMm, densityKnM3: density,
      slabSelfWeightKPa: w, levels, maxSlabLoadRatio: value.maxSlabLoadRatio, steps, warnings: value.warnings ?? [],
    },
  };
}

/** A member's working load at its level of a back-propped scheme, with the working. */
export function deriveBackpropLoad(scheme: BackpropScheme, level: number, spacingXMm: number, spacingYMm: number): { ok: true; info: BackpropLoadInfo } | { ok: false; fields: FieldErrors } {
  const t = backpropTable(scheme);
  if (!t.ok) return t;
  const fields: FieldErrors = {};
  const n = t.table.shoredLevels;
  if (!Number.isInteger(level) || level < 1 || level > n) {
    fields.level = `Scheme ${scheme.reference} has ${n} level${n === 1 ? "" : "s"} of props; choose a level from 1 (right under the slab being cast) to ${n}.`;
  }
  if (!(spacingXMm > 0)) fields.spacingXMm = "Enter the as-built spacing X (mm) to derive the load from the back-propping.";
  if (!(spacingYMm > 0)) fields.spacingYMm = "Enter the as-built spacing Y (mm) to derive the load from the back-propping.";
  if (Object.keys(fields).length) return { ok: false, fields };
  const row = t.table.levels[level - 1]!;
  const area = (spacingXMm * spacingYMm) / 1e6;
  const loadN = row.kPa * area * 1000;
  const steps: Step[] = [
    ...t.table.steps,
    step(`Prop level of this member (1 = right under the slab being cast, ${n} = the lowest)`, "level", level, "", "User input"),
    step(`Largest prop load ratio at level ${level}, reached at “${row.stage}”`, "P/w", row.ratio, "", GK_SOURCE),
    step(`Prop load at level ${level} = (P/w)·w`, "p", row.kPa, "kPa", GK_SOURCE),
    step("Tributary area per member = s_x·s_y", "A_t", area, "m²", { source: "Geometry", note: `${fmt(spacingXMm)} × ${fmt(spacingYMm)} mm` }),
    step("Working (unfactored) load per member = p·A_t", "N_k", loadN, "N", { source: "Statics", note: "prop load per m² × tributary area" }),
  ];
  const top = t.table.levels.reduce((a, b) => (b.ratio > a.ratio ? b : a));
  const warnings = [...t.table.warnings];
  if (top.level !== level) {
    warnings.push(`Props stay where they stand while the cycle moves on, so the level a prop is at changes with each cast: level ${top.level} carries up to ${fmt(top.ratio)} w (${fmt(top.kPa)} kPa). Update the member's level as casting proceeds, or check it at that level.`);
  }
  return {
    ok: true,
    info: {
      schemeReference: scheme.reference, level, shoredLevels: n, slabSelfWeightKPa: t.table.slabSelfWeightKPa, levelRatio: row.ratio, levelKPa: row.kPa,
      governingStage: row.stage, spacingXMm, spacingYMm, tributaryAreaM2: area, loadPerMemberN: loadN, steps, warnings, engineVersion: ENGINE_VERSION,
    },
  };
}

// Load on one prop from a slab being cast above it, by tributary area.
// All pressures in kN/m² (the unit the loading codes use); the load per member
// is returned in N like every other force in the engine.

import { z } from "zod";
import { isPlainObject, issuesToErrors, numberSchema, own } from "./request-schema";
import { fmt, step } from "./steps";
import type { FieldError, Step } from "./types";
import { ENGINE_VERSION } from "./version";

/** EN 1991-1-1 Table A.1: normal-weight concrete 24 kN/m³, +1 for normal reinforcement, +1 while unhardened. */
export const WET_REINFORCED_CONCRETE_KN_M3 = 26;
/** Allowance for formwork and its bearers (common practice; replace with the system's real self-weight when known). */
export const FORMWORK_ALLOWANCE_KN_M2 = 0.5;
/** EN 12812 §8.2.2.3 / BS 5975 §17: construction operations outside the working area. */
export const CONSTRUCTION_OUTSIDE_KN_M2 = 0.75;
/** Upper limit of the working-area load in EN 12812 / BS 5975 (EN 1991-1-6 Table 4.2 uses 1.5). */
export const WORKING_AREA_MAX_KN_M2 = 1.75;
export const CONSTRUCTION_SOURCE = {
  source: "EN 12812:2008 §8.2.2.3 / BS 5975:2019 §17",
  note: "falsework loads: working area 10 % of the slab weight, 0.75–1.75 kN/m²; elsewhere 0.75 kN/m²",
  toConfirm: "clause numbers to be confirmed against EN 12812:2008 and BS 5975:2019",
};

/** EN 1991-1-6 Table 4.2 working-area value: 10 % of the concrete self-weight, not less than 0.75 and not more than 1.5 kN/m². */
export function workingAreaConstructionLoad(concreteKnM2: number): number {
  return Math.min(1.5, Math.max(0.75, 0.1 * concreteKnM2));
}

/** EN 12812 / BS 5975 working-area value for falsework: 10 % of the concrete self-weight, not less than 0.75 and not more than 1.75 kN/m². Used by the slab-load check. */
export function falseworkWorkingAreaLoad(concreteKnM2: number): number {
  return Math.min(WORKING_AREA_MAX_KN_M2, Math.max(0.75, 0.1 * concreteKnM2));
}

export interface SlabLoadBreakdown {
  /** Both construction-operations values, so a designer sees which members carry which. */
  workingAreaKnM2?: number;
  outsideWorkingAreaKnM2?: number;
  concreteKnM2: number;
  formworkKnM2: number;
  constructionKnM2: number;
  totalKnM2: number;
  tributaryAreaM2: number;
  loadPerMemberN: number;
  factoredKnM2: number;
  factoredLoadPerMemberN: number;
}

/** Raw numbers: thickness and spacings in mm, densities in kN/m³, pressures in kN/m². */
export function slabLoadPerMember(
  thicknessMm: number,
  spacingXMm: number,
  spacingYMm: number,
  densityKnM3: number,
  formworkKnM2: number,
  constructionKnM2: number,
  gammaConcrete: number,
  gammaQ: number,
): SlabLoadBreakdown {
  const concreteKnM2 = (densityKnM3 * thicknessMm) / 1000;
  const totalKnM2 = concreteKnM2 + formworkKnM2 + constructionKnM2;
  const tributaryAreaM2 = (spacingXMm / 1000) * (spacingYMm / 1000);
  const factoredKnM2 = gammaConcrete * (concreteKnM2 + formworkKnM2) + gammaQ * constructionKnM2;
  return {
    concreteKnM2,
    formworkKnM2,
    constructionKnM2,
    totalKnM2,
    tributaryAreaM2,
    loadPerMemberN: totalKnM2 * tributaryAreaM2 * 1000,
    factoredKnM2,
    factoredLoadPerMemberN: factoredKnM2 * tributaryAreaM2 * 1000,
  };
}

const SCHEMA = z.object({
  slabThicknessMm: numberSchema({ label: "Slab thickness", unit: "mm", max: 5_000 }),
  spacingXMm: numberSchema({ label: "Prop spacing in one direction", unit: "mm", max: 20_000 }),
  spacingYMm: numberSchema({ label: "Prop spacing in the other direction", unit: "mm", max: 20_000 }),
  concreteDensityKnM3: numberSchema({ label: "Concrete density", unit: "kN/m³", max: 60 }).optional(),
  formworkKnM2: numberSchema({ label: "Formwork self-weight", unit: "kN/m²", min: 0, max: 50 }).optional(),
  constructionKnM2: numberSchema({ label: "Construction operations load", unit: "kN/m²", min: 0, max: 50 }).optional(),
  constructionRule: z
    .enum(["working-area", "outside-working-area"], {
      error: () => "Construction load rule must be working-area or outside-working-area (EN 1991-1-6 Table 4.2).",
    })
    .optional(),
  concreteAsPermanent: z.boolean({ error: () => "Whether the wet concrete counts as a permanent load must be true or false." }).optional(),
  gammaG: numberSchema({ label: "Permanent load factor γG", min: 1, max: 2 }).optional(),
  gammaQ: numberSchema({ label: "Variable load factor γQ", min: 1, max: 2 }).optional(),
});

export type SlabLoadResult =
  | ({ ok: true; engineVersion: string; steps: Step[]; warnings: string[] } & SlabLoadBreakdown)
  | { ok: false; errors: FieldError[] };

export function calculateSlabLoad(request: unknown): SlabLoadResult {
  try {
    if (!isPlainObject(request)) {
      return {
        ok: false,
        errors: [{ field: "", message: "The slab-load request must be an object with the slab thickness and the prop spacing in each direction (mm)." }],
      };
    }
    const input: Record<string, unknown> = {};
    for (const key of Object.keys(SCHEMA.shape)) {
      const v = own(request, key);
      if (v !== undefined) input[key] = v;
    }
    const parsed = SCHEMA.safeParse(input);
    if (!parsed.success) return { ok: false, errors: issuesToErrors(parsed.error.issues) };
    const r = parsed.data;
    const density = r.concreteDensityKnM3 ?? WET_REINFORCED_CONCRETE_KN_M3;
    const formwork = r.formworkKnM2 ?? FORMWORK_ALLOWANCE_KN_M2;
    const concreteKnM2 = (density * r.slabThicknessMm) / 1000;
    const rule = r.constructionRule ?? "working-area";
    const workingArea = falseworkWorkingAreaLoad(concreteKnM2);
    const construction = r.constructionKnM2 ?? (rule === "working-area" ? workingArea : CONSTRUCTION_OUTSIDE_KN_M2);
    const asPermanent = r.concreteAsPermanent ?? false;
    const gammaQ = r.gammaQ ?? 1.5;
    const gammaConcrete = asPermanent ? (r.gammaG ?? 1.35) : gammaQ;
    const b = slabLoadPerMember(r.slabThicknessMm, r.spacingXMm, r.spacingYMm, density, formwork, construction, gammaConcrete, gammaQ);

    const warnings: string[] = [];
    if (r.formworkKnM2 === undefined) {
      warnings.push(`A formwork self-weight of ${fmt(formwork)} kN/m² was assumed (common practice); use the formwork system's own weight when known.`);
    }
    if (r.slabThicknessMm < 50) {
      warnings.push(`A slab thickness of ${fmt(r.slabThicknessMm)} mm is unusually thin; check it was entered in millimetres.`);
    }
    const steps: Step[] = [
      step("Slab thickness", "t", r.slabThicknessMm, "mm", "User input"),
      step(
        r.concreteDensityKnM3 !== undefined ? "Concrete density (given)" : "Density of wet reinforced concrete: 24 + 1 (reinforcement) + 1 (unhardened)",
        "γ_c",
        density,
        "kN/m³",
        r.concreteDensityKnM3 !== undefined ? "User input" : "EN 1991-1-1 Table A.1 and its notes",
      ),
      step("Concrete self-weight g_c = γ_c·t", "g_c", b.concreteKnM2, "kN/m²", "EN 1991-1-6 §4.11.2 Table 4.2"),
      step(r.formworkKnM2 !== undefined ? "Formwork self-weight (given)" : "Formwork self-weight allowance", "g_f", formwork, "kN/m²", r.formworkKnM2 !== undefined ? "User input" : "Common practice"),
      r.constructionKnM2 !== undefined
        ? step("Construction operations load (given)", "q_c", construction, "kN/m²", "User input")
        : rule === "working-area"
          ? step("Construction operations load in the working area: 10 % of g_c, within 0.75–1.75 (the larger value, used for members under the working area)", "q_c", construction, "kN/m²", CONSTRUCTION_SOURCE)
          : step("Construction operations load outside the working area", "q_c", construction, "kN/m²", CONSTRUCTION_SOURCE),
      step("Construction operations, working area: 10 % of g_c within 0.75–1.75", "q_c,wa", workingArea, "kN/m²", CONSTRUCTION_SOURCE),
      step("Construction operations, outside the working area", "q_c,out", CONSTRUCTION_OUTSIDE_KN_M2, "kN/m²", CONSTRUCTION_SOURCE),
      step("Total working pressure w = g_c + g_f + q_c", "w", b.totalKnM2, "kN/m²", "Sum"),
      step("Tributary area per member = s_x·s_y", "A_t", b.tributaryAreaM2, "m²", { source: "Geometry", note: `${fmt(r.spacingXMm)} × ${fmt(r.spacingYMm)} mm` }),
      step("Working (unfactored) load per member = w·A_t", "N_k", b.loadPerMemberN, "N", { source: "Statics", note: "working pressure × tributary area" }),
      step(
        asPermanent ? "Factor on concrete and formwork, treated as permanent" : "Factor on concrete and formwork, treated as construction (variable) loads",
        "γ",
        gammaConcrete,
        "",
        asPermanent ? "EN 1990 Table A1.2(B)" : { source: "EN 1991-1-6 §4.11 with EN 1990 Table A1.2(B)", note: "Q_cc, Q_cf with γQ", toConfirm: "treatment of fresh concrete as a variable load to be confirmed against EN 1991-1-6 §4.11" },
      ),
      step("Factor on construction operations", "γQ", gammaQ, "", "EN 1990 Table A1.2(B)"),
      step("Factored pressure", "w_d", b.factoredKnM2, "kN/m²", "EN 1990 Eq. 6.10"),
      step("Factored load per member", "N_Ed", b.factoredLoadPerMemberN, "N", "EN 1990 Eq. 6.10"),
    ];
    return { ok: true, engineVersion: ENGINE_VERSION, ...b, workingAreaKnM2: workingArea, outsideWorkingAreaKnM2: CONSTRUCTION_OUTSIDE_KN_M2, steps, warnings };
  } catch {
    return { ok: false, errors: [{ field: "", message: "The slab-load request could not be read; check every value is a number." }] };
  }
}

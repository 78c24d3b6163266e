// The working load on a member from the slab its scheme describes and the member's as-built
// spacing, through the engine's load-per-member method. Pure: the form shows the same numbers.
import { calculateSlabLoad } from "@/lib/engineering";
import type { Step } from "@/lib/engineering";
import type { FieldErrors } from "@/lib/errors";

export type SlabScheme = {
  reference: string;
  slabThicknessMm: number | null;
  concreteDensityKnM3: number | null;
  formworkKnM2: number | null;
  constructionKnM2: number | null;
};

export type SlabLoadInfo = {
  schemeReference: string;
  slabThicknessMm: number;
  spacingXMm: number;
  spacingYMm: number;
  concreteKnM2: number;
  formworkKnM2: number;
  constructionKnM2: number;
  totalKnM2: number;
  tributaryAreaM2: number;
  /** Working (unfactored) load per member, N. */
  loadPerMemberN: number;
  steps: Step[];
  warnings: string[];
  engineVersion: string;
};

const FIELD_MAP: Record<string, string> = { spacingXMm: "spacingXMm", spacingYMm: "spacingYMm", slabThicknessMm: "schemeId" };

export function deriveSlabLoad(scheme: SlabScheme, spacingXMm: number, spacingYMm: number): { ok: true; info: SlabLoadInfo } | { ok: false; fields: FieldErrors } {
  if (scheme.slabThicknessMm == null) {
    return {
      ok: false,
      fields: { loadSource: `Scheme ${scheme.reference} gives no slab thickness, so the load cannot be derived from it; enter the working load directly.` },
    };
  }
  const r = calculateSlabLoad({
    slabThicknessMm: scheme.slabThicknessMm,
    spacingXMm,
    spacingYMm,
    ...(scheme.concreteDensityKnM3 != null ? { concreteDensityKnM3: scheme.concreteDensityKnM3 } : {}),
    ...(scheme.formworkKnM2 != null ? { formworkKnM2: scheme.formworkKnM2 } : {}),
    ...(scheme.constructionKnM2 != null ? { constructionKnM2: scheme.constructionKnM2 } : {}),
  });
  if (!r.ok) {
    const fields: FieldErrors = {};
    for (const e of r.errors) {
      const key = FIELD_MAP[e.field] ?? "loadSource";
      const message = key === "schemeId" ? `Scheme ${scheme.reference}: ${e.message}` : e.message;
      if (!(key in fields)) fields[key] = message;
    }
    return { ok: false, fields };
  }
  return {
    ok: true,
    info: {
      schemeReference: scheme.reference,
      slabThicknessMm: scheme.slabThicknessMm,
      spacingXMm,
      spacingYMm,
      concreteKnM2: r.concreteKnM2,
      formworkKnM2: r.formworkKnM2,
      constructionKnM2: r.constructionKnM2,
      totalKnM2: r.totalKnM2,
      tributaryAreaM2: r.tributaryAreaM2,
      loadPerMemberN: r.loadPerMemberN,
      steps: r.steps,
      warnings: r.warnings,
      engineVersion: r.engineVersion,
    },
  };
}

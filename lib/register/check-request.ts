// Builds the engine request for a member from its type, its measured extension and its load,
// and puts the member's working load on the same basis as the capacity it is compared with.
import type { designCode, endCondition, MemberBase, memberTypeKind, unitSystem } from "@/db/schema";

type Kind = (typeof memberTypeKind.enumValues)[number];
type DesignCode = (typeof designCode.enumValues)[number];
type Ends = (typeof endCondition.enumValues)[number];
type Units = (typeof unitSystem.enumValues)[number];

export type CheckType = {
  kind: Kind;
  params: Record<string, unknown>;
  minExtensionMm: number | null;
  maxExtensionMm: number | null;
};
export type CheckMember = {
  extensionMm: number;
  endConditions: Ends;
  loadN: number;
  /**
   * Measured lean of the member (offset of head over base, mm), e.g. from an inspection.
   * When it is given and not zero, props and steel members are re-checked out of plumb
   * (engine method "out-of-plumb") instead of by their plain capacity.
   */
  outOfPlumbMm?: number | null;
  /** Measured lean from vertical in degrees (an inspection's plumb reading); used when outOfPlumbMm is not given. */
  outOfPlumbDeg?: number | null;
  /** What the member stands on: when given, bearing under the base is checked with it. */
  base?: MemberBase | null;
};
export type CheckSite = { designCode: DesignCode; unitSystem: Units };

/**
 * Partial factors applied to the working load when the capacity is a design resistance or an
 * LRFD available strength. A single factor on the whole load is a simplification on the safe
 * side for props carrying mostly fresh concrete: EN 1990 Table A1.2(B) γG = 1.35, γQ = 1.5
 * (1.5 used for all); ASCE 7 / AISC 360 LRFD 1.2D + 1.6L (1.6 used for all). Common practice
 * for a quick check; a designer's own combination governs.
 */
export const LOAD_FACTORS = {
  "design-resistance": { factor: 1.5, source: "EN 1990 Table A1.2(B): γQ = 1.5 applied to the whole working load (≥ γG = 1.35)" },
  "available-strength": { factor: 1.6, source: "ASCE 7 §2.3 / AISC 360-16 LRFD: 1.6 applied to the whole working load (≥ 1.2 for dead load)" },
  "allowable-strength": { factor: 1.0, source: "AISC 360-16 ASD / NDS: working load compared directly" },
  "safe-working-load": { factor: 1.0, source: "Working load compared with the safe working load" },
  "elastic-critical": { factor: 1.0, source: "Working load compared with the elastic critical load" },
} as const;

export type Basis = keyof typeof LOAD_FACTORS;

/** Whether the member stands out of plumb by a measured amount (an offset or an angle above zero). */
export function isLeaning(member?: Pick<CheckMember, "outOfPlumbMm" | "outOfPlumbDeg">): boolean {
  return (member?.outOfPlumbMm != null && member.outOfPlumbMm > 0) || (member?.outOfPlumbDeg != null && member.outOfPlumbDeg > 0);
}

/** Kinds whose lean the out-of-plumb method checks; for the others a lean is a warning, not a check. */
export const LEAN_CHECKED_KINDS: readonly Kind[] = ["en1065-prop", "steel-section"];

export function methodFor(type: CheckType, site: CheckSite, member?: Pick<CheckMember, "outOfPlumbMm" | "outOfPlumbDeg">): { method: string; basis: Basis } {
  const leaning = isLeaning(member);
  if (leaning && type.kind === "en1065-prop") return { method: "out-of-plumb", basis: "safe-working-load" };
  if (leaning && type.kind === "steel-section") {
    if (site.designCode === "en1993") return { method: "out-of-plumb", basis: "design-resistance" };
    return { method: "out-of-plumb", basis: site.designCode === "aisc360-lrfd" ? "available-strength" : "allowable-strength" };
  }
  switch (type.kind) {
    case "en1065-prop":
      return { method: "en1065", basis: "safe-working-load" };
    case "supplier-table":
    case "trench-strut":
      return { method: "supplier-table", basis: "safe-working-load" };
    case "steel-section":
      if (site.designCode === "en1993") return { method: "en1993", basis: "design-resistance" };
      if (site.designCode === "aisc360-lrfd") return { method: "aisc360-lrfd", basis: "available-strength" };
      return { method: "aisc360-asd", basis: "allowable-strength" };
    case "timber-section":
      return site.unitSystem === "us" || site.designCode !== "en1993"
        ? { method: "nds", basis: "allowable-strength" }
        : { method: "en1995", basis: "design-resistance" };
  }
}

const TYPE_KEYS = [
  "section", "eMpa", "fyMpa", "curve", "gammaM1", "formed", "fc0kMpa", "e005Mpa", "kmod", "gammaM", "betaC",
  "strengthClass", "timberType", "serviceClass", "loadDuration", "steelGrade", "fcStarMpa", "eMinMpa", "c", "propClass", "table",
] as const;

/** The engine request (SI: mm, N, MPa) and the factor that turned the working load into loadN. */
export function buildCheckRequest(type: CheckType, member: CheckMember, site: CheckSite) {
  const { method, basis } = methodFor(type, site, member);
  const loadFactor = LOAD_FACTORS[basis];
  const request: Record<string, unknown> = { method, lengthMm: member.extensionMm, ends: member.endConditions };
  for (const key of TYPE_KEYS) if (type.params[key] !== undefined) request[key] = type.params[key];
  if (method === "out-of-plumb") {
    if (member.outOfPlumbMm != null && member.outOfPlumbMm > 0) request.outOfPlumbMm = member.outOfPlumbMm;
    else request.outOfPlumbDeg = member.outOfPlumbDeg;
    if (type.kind === "steel-section") {
      request.plumbCode = site.designCode === "en1993" ? "en1993" : "aisc360";
      if (site.designCode !== "en1993") request.designBasis = site.designCode === "aisc360-lrfd" ? "lrfd" : "asd";
    }
  }
  if (type.kind === "en1065-prop") {
    if (type.maxExtensionMm != null) request.maxExtensionMm = type.maxExtensionMm;
    if (type.minExtensionMm != null) request.minExtensionMm = type.minExtensionMm;
    delete request.ends; // EN 1065 strengths already assume the prop's own end conditions.
  }
  if (type.kind === "supplier-table" || type.kind === "trench-strut") delete request.ends;
  request.loadN = member.loadN * loadFactor.factor;
  return { request, basis, loadFactor: loadFactor.factor, loadFactorSource: loadFactor.source };
}

import type { SOIL_IDS } from "./soils";
// Shared shapes of the engine's contract. Units inside the engine are always
// N, mm and MPa (N/mm²); conversions live in lib/units.ts at the edges.

export const METHOD_IDS = [
  "euler",
  "en1993",
  "aisc360-lrfd",
  "aisc360-asd",
  "en1065",
  "supplier-table",
  "en1995",
  "nds",
  "point-brace",
] as const;
/** Checks a designer makes around a member's buckling capacity; their results carry `checks` or `stages`. */
export const CHECK_METHOD_IDS = ["out-of-plumb", "base-bearing", "backprop-sequence", "raking-combined"] as const;
export const ALL_METHOD_IDS = [...METHOD_IDS, ...CHECK_METHOD_IDS] as const;
export type CapacityMethodId = (typeof METHOD_IDS)[number];
export type CheckMethodId = (typeof CHECK_METHOD_IDS)[number];
export type MethodId = CapacityMethodId | CheckMethodId;

export type Basis =
  | "elastic-critical"
  | "design-resistance"
  | "available-strength"
  | "allowable-strength"
  | "safe-working-load"
  | "brace-requirement"
  | "bearing-resistance"
  | "load-ratio";

/** One line of a calculation sheet. `value` is a string only for non-numeric items (a curve letter, a choice). */
export interface Step {
  label: string;
  symbol: string;
  value: number | string;
  unit: string;
  /** Where the value comes from: the standard and clause only ("EN 1065:1998 Table 2"), or "User input", "Geometry"… */
  source: string;
  /** Present when the value awaits confirmation: what a checker confirms it against ("value to be confirmed against EN 1065 Table 2"). */
  toConfirm?: string;
  /** Words beside the source: a rule of thumb ("common practice"), the range a value was taken from, a simplification. */
  note?: string;
}

/** A step's origin: the citation and, where they apply, what it awaits confirmation against and a note. */
export interface SourceRef {
  source: string;
  toConfirm?: string;
  note?: string;
}

export interface FieldError {
  /** Request path in dot notation, e.g. "section.tMm" or "table.2.lengthMm"; "" for the request as a whole. */
  field: string;
  message: string;
}

export interface CalculationSuccess {
  ok: true;
  method: MethodId;
  engineVersion: string;
  /** The capacity the load is compared with, in N. Absent only where a check has no force capacity (point braces without a section, the back-propping sequence). */
  capacityN?: number;
  basis: Basis;
  /** Plain-language statement of what load should be compared with capacityN, and the factors used. */
  loadBasis: string;
  characteristicN?: number;
  eulerN?: number;
  /** Geometric slenderness used by the method: L_cr/i (steel, EN 1995) or l_e/d (NDS). */
  slenderness?: number;
  /** Non-dimensional slenderness λ̄ (EN 1993) or λ_rel (EN 1995), or F_y/F_e (AISC). */
  relativeSlenderness?: number;
  /** χ (EN 1993), F_cr/F_y (AISC), k_c (EN 1995), C_P (NDS). */
  reductionFactor?: number;
  effectiveLengthMm?: number;
  idealStiffnessNPerMm?: number;
  requiredStiffnessNPerMm?: number;
  requiredForceN?: number;
  loadN?: number;
  utilisation?: number;
  pass?: boolean;
  /** Combined checks (axial + bending, bearing, punching): each part's utilisation; the largest is `utilisation`. */
  checks?: CheckPart[];
  /** Back-propping sequence (Grundy & Kabaila 1963). */
  stages?: BackpropStage[];
  maxSlabLoadRatio?: number;
  maxPropLoadRatio?: number;
  steps: Step[];
  warnings: string[];
}

export interface CheckPart {
  name: string;
  demand: number;
  resistance: number;
  unit: string;
  utilisation: number;
  source: string;
}

export interface BackpropStage {
  label: string;
  /** Load on each slab, top (newest) first, as a multiple of one slab's self-weight. */
  slabLoadRatios: number[];
  /** Load in each level of props, top level first (the level under the newest slab), as a multiple of one slab's self-weight. */
  propLoadRatios: number[];
}

export interface CalculationFailure {
  ok: false;
  errors: FieldError[];
}

export type CalculationResult = CalculationSuccess | CalculationFailure;

export type EndCondition =
  | "pinned-pinned"
  | "fixed-pinned"
  | "fixed-fixed"
  | "fixed-free"
  | "fixed-sway"
  | "pinned-sway";

export type Section =
  | { shape: "chs"; dMm: number; tMm: number }
  | { shape: "rhs"; bMm: number; hMm: number; tMm: number; cornerRadiusMm?: number }
  | { shape: "rect"; bMm: number; hMm: number }
  | { shape: "round"; dMm: number }
  | { shape: "given"; areaMm2: number; iMinMm4: number };

export type BucklingCurve = "a0" | "a" | "b" | "c" | "d";
export type PropClass = "A" | "B" | "C" | "D" | "E";
export type TimberType = "solid" | "round" | "glulam" | "lvl";
export type LoadDuration = "permanent" | "long-term" | "medium-term" | "short-term" | "instantaneous";
export type ServiceClass = 1 | 2 | 3;
export type Formed = "hot-finished" | "cold-formed";
export type DesignBasis = "lrfd" | "asd";

export interface TableRow {
  lengthMm: number;
  safeLoadN: number;
}

/** A request after type validation: every number here is finite. Semantics (ranges, cross-field rules) are checked by each method. */
export interface CalculationRequest {
  method: MethodId;
  lengthMm: number;
  k?: number;
  ends?: EndCondition;
  section?: Section;
  eMpa?: number;
  fyMpa?: number;
  steelGrade?: string;
  formed?: Formed;
  curve?: BucklingCurve;
  gammaM1?: number;
  fc0kMpa?: number;
  e005Mpa?: number;
  kmod?: number;
  serviceClass?: ServiceClass;
  loadDuration?: LoadDuration;
  gammaM?: number;
  betaC?: number;
  strengthClass?: string;
  timberType?: TimberType;
  fcStarMpa?: number;
  eMinMpa?: number;
  c?: number;
  propClass?: PropClass;
  maxExtensionMm?: number;
  minExtensionMm?: number;
  gammaF?: number;
  table?: TableRow[];
  braces?: number;
  designBasis?: DesignBasis;
  loadN?: number;
  /** AISC HSS: electric-resistance welded (design wall 0.93t) or submerged-arc welded (1.0t). */
  hssWeld?: HssWeld;
  /** Where a grade's yield strength comes from: the product standard by thickness (default) or EN 1993-1-1 Table 3.1. */
  fyFrom?: "product-standard" | "en1993-table-3.1";
  /** NDS §3.7.1.4: during construction l_e/d may reach 75 (default true: temporary works). */
  duringConstruction?: boolean;
  supplierInterpolation?: SupplierInterpolation;
  // out-of-plumb
  outOfPlumbDeg?: number;
  outOfPlumbMm?: number;
  eccentricityMm?: number;
  plumbCode?: "en1993" | "aisc360";
  // base bearing
  basePlateBMm?: number;
  basePlateLMm?: number;
  solePlateBMm?: number;
  solePlateLMm?: number;
  solePlateTMm?: number;
  allowablePressureKPa?: number;
  /** Friction coefficient between a base and what it stands on, for the sliding of a leaning prop's base. */
  frictionCoefficient?: number;
  soil?: SoilId;
  slabDepthMm?: number;
  slabEffectiveDepthMm?: number;
  fckMpa?: number;
  rhoL?: number;
  punchingCode?: "en1992" | "aci318";
  // backprop sequence
  shoredLevels?: number;
  slabSelfWeightKPa?: number;
  formworkKPa?: number;
  constructionKPa?: number;
  cycles?: number;
  // raking combined
  angleDeg?: number;
  selfWeightNPerM?: number;
}

export type HssWeld = "erw" | "saw";
export type SupplierInterpolation = "inverse-square" | "lower-row";
export type SoilId = (typeof SOIL_IDS)[number];

/** What a method computes before the common envelope (version, utilisation) is added. */
export type MethodOutput = Omit<CalculationSuccess, "ok" | "method" | "engineVersion" | "utilisation" | "pass" | "loadN"> & {
  /** Set by checks whose utilisation is not loadN/capacityN (interaction, bearing): the envelope uses it as is. */
  utilisation?: number;
};

export type MethodOutcome = { ok: true; value: MethodOutput } | CalculationFailure;
export type CapacityResult = CalculationSuccess & { capacityN: number };

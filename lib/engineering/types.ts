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
export type MethodId = (typeof METHOD_IDS)[number];

export type Basis =
  | "elastic-critical"
  | "design-resistance"
  | "available-strength"
  | "allowable-strength"
  | "safe-working-load";

/** One line of a calculation sheet. `value` is a string only for non-numeric items (a curve letter, a choice). */
export interface Step {
  label: string;
  symbol: string;
  value: number | string;
  unit: string;
  source: string;
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
  capacityN: number;
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
  steps: Step[];
  warnings: string[];
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
  | { shape: "rhs"; bMm: number; hMm: number; tMm: number }
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
}

/** What a method computes before the common envelope (version, utilisation) is added. */
export type MethodOutput = Omit<CalculationSuccess, "ok" | "method" | "engineVersion" | "utilisation" | "pass" | "loadN">;

export type MethodOutcome = { ok: true; value: MethodOutput } | CalculationFailure;

// What each method is called and which request fields it reads, so a form
// can be built from the same list the engine dispatches on.

import type { Basis, CapacityMethodId, CheckMethodId, MethodId, Section } from "./types";

export interface MethodInfo<Id extends MethodId = CapacityMethodId> {
  id: Id;
  label: string;
  description: string;
  basis: Basis;
  /** Fields that must be present. "fyMpa|steelGrade" means one of them. */
  required: string[];
  optional: string[];
  sectionShapes: Section["shape"][];
  /** False where the capacity does not depend on the member length (EN 1065 D/E still vary by range). */
  lengthDependent: boolean;
}

const ALL_SHAPES: Section["shape"][] = ["chs", "rhs", "rect", "round", "given"];

export const METHODS: readonly MethodInfo[] = [
  {
    id: "euler",
    label: "Elastic critical load (Euler)",
    description: "Theoretical buckling load of a perfectly straight member. No safety margin: for comparison only.",
    basis: "elastic-critical",
    required: ["lengthMm", "section"],
    optional: ["k", "ends", "eMpa", "loadN"],
    sectionShapes: ALL_SHAPES,
    lengthDependent: true,
  },
  {
    id: "en1993",
    label: "Steel member, EN 1993-1-1",
    description: "Design buckling resistance N_b,Rd of a steel tube, section or bar (Eurocode 3 §6.3.1).",
    basis: "design-resistance",
    required: ["lengthMm", "section", "fyMpa|steelGrade"],
    optional: ["k", "ends", "eMpa", "formed", "curve", "gammaM1", "loadN"],
    sectionShapes: ALL_SHAPES,
    lengthDependent: true,
  },
  {
    id: "aisc360-lrfd",
    label: "Steel member, AISC 360-16 LRFD",
    description: "Design strength φc·Pn of a steel member without slender elements (AISC 360-16 §E3).",
    basis: "available-strength",
    required: ["lengthMm", "section", "fyMpa|steelGrade"],
    optional: ["k", "ends", "eMpa", "loadN"],
    sectionShapes: ALL_SHAPES,
    lengthDependent: true,
  },
  {
    id: "aisc360-asd",
    label: "Steel member, AISC 360-16 ASD",
    description: "Allowable strength Pn/Ωc of a steel member without slender elements (AISC 360-16 §E3).",
    basis: "allowable-strength",
    required: ["lengthMm", "section", "fyMpa|steelGrade"],
    optional: ["k", "ends", "eMpa", "loadN"],
    sectionShapes: ALL_SHAPES,
    lengthDependent: true,
  },
  {
    id: "en1065",
    label: "Adjustable steel prop, EN 1065 class",
    description: "Safe working load of an EN 1065 class A–E prop at the extension it is set to.",
    basis: "safe-working-load",
    required: ["lengthMm", "propClass", "maxExtensionMm"],
    optional: ["minExtensionMm", "gammaF", "gammaM", "loadN"],
    sectionShapes: [],
    lengthDependent: true,
  },
  {
    id: "supplier-table",
    label: "Supplier's load table",
    description: "Safe working load read from the supplier's table of length against safe load, interpolated between rows.",
    basis: "safe-working-load",
    required: ["lengthMm", "table"],
    optional: ["loadN"],
    sectionShapes: [],
    lengthDependent: true,
  },
  {
    id: "en1995",
    label: "Timber post, EN 1995-1-1",
    description: "Design resistance of a timber post or strut (Eurocode 5 §6.3.2).",
    basis: "design-resistance",
    required: ["lengthMm", "section", "strengthClass|fc0kMpa+e005Mpa"],
    optional: ["k", "ends", "timberType", "kmod", "serviceClass", "loadDuration", "gammaM", "betaC", "loadN"],
    sectionShapes: ["rect", "round", "given"],
    lengthDependent: true,
  },
  {
    id: "nds",
    label: "Timber post, NDS 2018 (ASD)",
    description: "Allowable axial capacity of a sawn, round, glulam or SCL column (NDS 2018 §3.7.1).",
    basis: "allowable-strength",
    required: ["lengthMm", "section", "fcStarMpa", "eMinMpa"],
    optional: ["k", "ends", "timberType", "c", "loadN"],
    sectionShapes: ["rect", "round"],
    lengthDependent: true,
  },
  {
    id: "point-brace",
    label: "Point braces along a member",
    description: "Buckling load between braces and the strength and stiffness each brace needs (Winter/Yura; AISC 360-16 Appendix 6).",
    basis: "elastic-critical",
    required: ["lengthMm", "braces", "loadN"],
    optional: ["section", "eMpa", "designBasis"],
    sectionShapes: ALL_SHAPES,
    lengthDependent: true,
  },
];

/** The checks around a member: combined or bearing checks and the back-propping sequence. */
export const CHECK_METHODS: readonly MethodInfo<CheckMethodId>[] = [
  {
    id: "out-of-plumb",
    label: "Out of plumb or eccentric load",
    description: "A member standing out of plumb or loaded off its axis: axial force, the horizontal force at the ends and the amplified moment (EN 1993-1-1 §6.3.3 or AISC 360-16 H1); for an EN 1065 prop, its class rating within the plumb tolerance.",
    basis: "design-resistance",
    required: ["lengthMm", "loadN", "outOfPlumbDeg|outOfPlumbMm|eccentricityMm", "section+fyMpa|steelGrade|propClass+maxExtensionMm"],
    optional: ["k", "ends", "eMpa", "formed", "curve", "gammaM1", "plumbCode", "designBasis", "hssWeld", "minExtensionMm"],
    sectionShapes: ["chs", "rhs", "rect", "round"],
    lengthDependent: true,
  },
  {
    id: "base-bearing",
    label: "Bearing under the base",
    description: "Pressure under a base plate or timber sole plate against an allowable bearing pressure, and punching of the slab below a back-prop (EN 1992-1-1 §6.4 or ACI 318-19 §22.6); for a prop out of plumb, the horizontal force its base must resist (and sliding, given a friction coefficient).",
    basis: "bearing-resistance",
    required: ["loadN", "basePlateBMm", "basePlateLMm", "allowablePressureKPa|soil|slabDepthMm+fckMpa"],
    optional: ["solePlateBMm", "solePlateLMm", "solePlateTMm", "slabEffectiveDepthMm", "rhoL", "punchingCode", "outOfPlumbDeg", "outOfPlumbMm", "lengthMm", "frictionCoefficient"],
    sectionShapes: [],
    lengthDependent: false,
  },
  {
    id: "backprop-sequence",
    label: "Back-propping over several floors",
    description: "Loads on each slab and each level of props through the casting cycle, as multiples of one slab's weight (Grundy & Kabaila 1963, simplified method).",
    basis: "load-ratio",
    required: ["shoredLevels", "slabSelfWeightKPa"],
    optional: ["formworkKPa", "constructionKPa", "cycles"],
    sectionShapes: [],
    lengthDependent: false,
  },
  {
    id: "raking-combined",
    label: "Raking shore, axial force and bending",
    description: "A steel raker checked for its axial force with bending from its own weight and any eccentricity (EN 1993-1-1 §6.3.3 or AISC 360-16 H1).",
    basis: "design-resistance",
    required: ["lengthMm", "angleDeg", "loadN", "section", "fyMpa|steelGrade"],
    optional: ["k", "ends", "eMpa", "formed", "curve", "gammaM1", "eccentricityMm", "selfWeightNPerM", "plumbCode", "designBasis", "hssWeld"],
    sectionShapes: ["chs", "rhs", "rect", "round"],
    lengthDependent: true,
  },
];

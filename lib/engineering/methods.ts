// What each method is called and which request fields it reads, so a form
// can be built from the same list the engine dispatches on.

import type { Basis, MethodId, Section } from "./types";

export interface MethodInfo {
  id: MethodId;
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
    required: ["lengthMm", "section", "braces", "loadN"],
    optional: ["eMpa", "designBasis"],
    sectionShapes: ALL_SHAPES,
    lengthDependent: true,
  },
];

export function methodInfo(id: MethodId): MethodInfo {
  // METHODS lists every MethodId, so find() cannot miss.
  return METHODS.find((m) => m.id === id) as MethodInfo;
}

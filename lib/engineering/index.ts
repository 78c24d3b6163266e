export { calculate, capacityCurve, type CurvePoint } from "./calculate";
export { METHODS, CHECK_METHODS, type MethodInfo } from "./methods";
export { ENGINE_VERSION } from "./version";
export { END_CONDITIONS, effectiveLength, type EndConditionInfo } from "./effective-length";
export {
  STEEL_GRADES,
  TIMBER_CLASSES,
  KMOD,
  GAMMA_M_TIMBER,
  BETA_C,
  findTimberClass,
  type SteelGrade,
  type TimberClass,
} from "./materials";
export { sectionProperties, type SectionProperties } from "./sections";
export { calculateRakingShore, rakingShoreGeometry, type RakingShoreGeometry, type RakingShoreResult } from "./raking-shore";
export {
  calculateSlabLoad,
  workingAreaConstructionLoad,
  falseworkWorkingAreaLoad,
  WET_REINFORCED_CONCRETE_KN_M3,
  type SlabLoadBreakdown,
  type SlabLoadResult,
} from "./slab-load";
// Raw numeric cores (plain numbers in, number out) for charts, batch work and the bench.
export { eulerLoad } from "./euler";
export { en1993Chi, en1993BucklingResistance, IMPERFECTION_FACTORS } from "./en1993";
export { aiscFe, aiscFcr, aiscNominalStrength, PHI_C, OMEGA_C } from "./aisc360";
export { en1065CharacteristicN } from "./en1065";
export { interpolateTable } from "./supplier-table";
export { en1995Kc, en1995LambdaRel, en1995Resistance } from "./en1995";
export { ndsCp, ndsFcE, ndsCapacity } from "./nds";
export { idealBraceCoefficient, app6RequiredStiffness } from "./point-brace";
export { backpropSequence } from "./backprop";
export { SOILS, en1992PunchingStress } from "./base-bearing";
export { rhsRoundedSecondMoment } from "./sections";
export { interpolateTableInverseSquare } from "./supplier-table";
export { K_TABLES } from "./effective-length";
export * from "./types";

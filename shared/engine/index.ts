export * from './types';
export { EngineInputError } from './errors';
export { brentRoot, bisectRoot, type RootOptions } from './solve';
export { loadSplit, rearShare, type LoadSplit } from './statics';
export {
  createLeverageCurve,
  leverageRatioAt,
  shockTravelAt,
  wheelTravelAtShockTravel,
  meanLeverageRatio,
  solveShockEquilibrium,
  type LeverageCurve,
  type ShockEquilibriumInput,
} from './leverage';
export {
  clampPreload,
  springVerdict,
  coilBindMargin,
  buildCandidate,
  rankCandidates,
  combineCases,
  runCases,
  isCasesResult,
  type CandidateContext,
} from './candidates';
export { computeRearSpring, evaluateRearSpring, rearRequiredRate, rearPreloadNeeded, type RearModel } from './rear';
export {
  computeForkSpring,
  evaluateForkSpring,
  forkRequiredRate,
  forkSag,
  forkSpringDeflection,
  type ForkModel,
} from './fork';
export {
  computeSpringGeometry,
  shearModulusFor,
  endCoils,
  wahlFactor,
  bergstrasserFactor,
  helicalSpringRate,
  springShearStress,
  SPRING_MATERIALS,
  SPRING_MATERIAL_KEYS,
  SPRING_END_TYPES,
  type SpringMaterial,
  type SpringMaterialKey,
} from './geometry';
export { checkSag, averageReading, DEFAULT_SAG_TOLERANCE_MM } from './sag';

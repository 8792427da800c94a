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
  coilBindMargin,
  buildCandidate,
  rankCandidates,
  combineCases,
  runCases,
  isCasesResult,
  type CandidateContext,
  type PredictedSags,
} from './candidates';
export { judgeSpring, DEFAULT_STATIC_SAG_TOLERANCE_MM, SETTLE_TOLERANCE_MM, type SpringJudgeInput, type SpringJudgement } from './verdict';
export { linearRateBand, curveRateBand, bandInUnits, type RateBandNPerMm, type BandConditions } from './band';
export {
  springPreload,
  bandPreloadRange,
  adjusterTurnsFromFullyOut,
  forkSpacerLength,
  type PreloadSetting,
  type SpringPreload,
} from './preload';
export { roundAnswer, decimalsFor } from './rounding';
export { computeRearSpring, evaluateRearSpring, rearRequiredRate, rearPreloadNeeded, rearRateBand, type RearModel } from './rear';
export {
  computeForkSpring,
  evaluateForkSpring,
  forkRequiredRate,
  forkSag,
  forkSpringDeflection,
  forkRateBand,
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
export { checkSag, averageReading, DEFAULT_SAG_TOLERANCE_MM, sagAdviceText, type LengthText } from './sag';
export { catalogueSolidStress, checkSolidStress, minTensileStrength, TENSILE_STRENGTH_BANDS, ALLOWABLE_SHARE_SET_REMOVED, type SolidStressCheck } from './spring-strength';
export { rearSagSweep, forkSagSweep, loadSteps, type SagCurve, type SagCurvePoint } from './sweep';

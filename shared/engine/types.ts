import type { RateInUnits } from '../units';

/** An added mass (rider, passenger, luggage); position is rearward from the front axle, mm. */
export interface Load {
  massKg: number;
  positionMm: number;
}

/** One named set of loads, e.g. "solo commute" or "two-up touring". */
export interface LoadCase {
  name: string;
  loads: Load[];
}

/** One point of a leverage-ratio curve: ratio = wheel travel / shock travel at that wheel travel. */
export interface LeveragePoint {
  wheelTravelMm: number;
  ratio: number;
}

/** A constant leverage ratio or a curve, linear between points and constant beyond the ends. */
export type LeverageRatioInput = number | LeveragePoint[];

export interface SagTargets {
  staticSagMm: number;
  riderSagMm: number;
}

export interface PreloadRange {
  min: number;
  max: number;
}

/** A candidate spring as a catalogue or a rider gives it. */
export interface SpringCandidateInput {
  id: string;
  rateNPerMm: number;
  freeLengthMm: number;
  solidLengthMm?: number;
}

/** The part of a rate-in-units record the case merger reads. */
export interface RateInUnitsLike {
  nPerMm: number;
}

export type SpringVerdict = 'ok' | 'too-soft' | 'too-stiff' | 'coil-bind';

/** The outcome for one candidate spring; `coilBindMarginMm` only when its solid length is known, `adjusterTurns` only when there is an adjuster pitch. */
export interface SpringCandidateResult {
  id: string;
  rateNPerMm: number;
  preloadNeededMm: number;
  preloadMm: number;
  adjusterTurns?: number;
  installedLengthMm: number;
  staticSagMm: number;
  riderSagMm: number;
  coilBindMarginMm?: number;
  verdict: SpringVerdict;
}

interface SpringInputCommon {
  wheelbaseMm: number;
  /** The bike's own sprung mass on this end, ready to ride, kg. */
  sprungMassKg: number;
  /** Give either `loads` or `cases`. */
  loads?: Load[];
  cases?: LoadCase[];
  targets: SagTargets;
  preloadRangeMm: PreloadRange;
  springs?: SpringCandidateInput[];
}

export interface RearSpringInput extends SpringInputCommon {
  leverageRatio: LeverageRatioInput;
  wheelTravelMm: number;
  shockStrokeMm: number;
  adjusterPitchMm: number;
}

export interface ForkSpringInput extends SpringInputCommon {
  forkAngleDeg: number;
  /** Springs working in parallel; 2 when omitted. */
  springCount?: number;
  forkTravelMm: number;
  /** Omitted for forks without a preload adjuster. */
  adjusterPitchMm?: number;
}

export interface RearSpringResult {
  /** Load the added masses put on the rear wheel, W_r, N. */
  rearLoadN: number;
  /** The bike's own sprung weight on the rear, F_b = g·sprungMassKg, N. */
  bikeLoadN: number;
  requiredRate: RateInUnits;
  candidates: SpringCandidateResult[];
}

export interface ForkSpringResult {
  /** Load the added masses put on the front wheel, W_f, N; always positive (loads that leave the front unloaded are refused). */
  frontLoadN: number;
  /** The bike's own sprung weight on the front, N. */
  bikeLoadN: number;
  /** Required rate of each spring. */
  requiredRate: RateInUnits;
  candidates: SpringCandidateResult[];
}

/** Result for several load cases; see `computeRearSpring` for the meaning of each field. */
export interface CasesResult<R> {
  cases: Array<{ name: string } & R>;
  coversAllCases: string[];
  uncoveredBy: Record<string, string>;
}

export type RearSpringCasesResult = CasesResult<RearSpringResult>;
export type ForkSpringCasesResult = CasesResult<ForkSpringResult>;

export type SpringEndType = 'plain' | 'plain-ground' | 'squared' | 'squared-ground';

export interface SpringGeometryInput {
  wireDiameterMm: number;
  outsideDiameterMm: number;
  totalCoils: number;
  endType: SpringEndType;
  /** A key of `SPRING_MATERIALS`; ignored when `shearModulusMPa` is given. */
  material?: string;
  shearModulusMPa?: number;
  freeLengthMm?: number;
  loadN?: number;
}

export interface SpringGeometryResult {
  meanDiameterMm: number;
  springIndex: number;
  activeCoils: number;
  solidLengthMm: number;
  rateNPerMm: number;
  wahlFactor: number;
  bergstrasserFactor: number;
  shearStressAtLoadMPa?: number;
  shearStressAtSolidMPa?: number;
  travelToSolidMm?: number;
}

/** A sag reading: one number, or a push-down/let-up pair averaged to cancel friction. */
export type SagReading = number | { down: number; up: number };

export interface SagCheckInput {
  end: 'rear' | 'front';
  extendedMm: number;
  staticMm: SagReading;
  riderMm: SagReading;
  targets: SagTargets;
  /** 3 mm when omitted. */
  toleranceMm?: number;
  /** Required for the rear. */
  leverageRatio?: LeverageRatioInput;
  /** Front only; 0 when omitted. */
  forkAngleDeg?: number;
  /** Front only; 2 when omitted. */
  springCount?: number;
  /** Required for the rear; optional at the front (forks without an adjuster). */
  adjusterPitchMm?: number;
  /** The rider's load on this wheel, N. */
  riderLoadN?: number;
}

export interface SagCheckResult {
  staticSagMm: number;
  riderSagMm: number;
  /** Positive: add preload. */
  preloadChangeMm: number;
  adjusterTurns?: number;
  predictedStaticSagMm: number;
  springVerdict: 'ok' | 'too-soft' | 'too-stiff';
  impliedRateNPerMm?: number;
  advice: string;
}

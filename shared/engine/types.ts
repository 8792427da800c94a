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

/** The spring's installed length the preload adjuster allows, from fully in (`min`) to fully out (`max`), mm. */
export interface InstalledLengthWindow {
  min: number;
  max: number;
}

/** A rate band in the three units riders quote: the rates some preload in range can set right. */
export interface RateBand {
  min: RateInUnits;
  max: RateInUnits;
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

/**
 * Why a spring got its verdict: `on-target` (ok); `preload-above-range` / `preload-below-range` (the preload that puts
 * rider sag on target is outside the adjuster's range); `does-not-settle` (a rising ratio lets the bike sink past the
 * rider-sag target); `topped-out` (no static sag at all); `static-sag-low` / `static-sag-high` (static sag outside its
 * tolerance); `coil-bind` (the coils would touch before full stroke).
 */
export type SpringReason =
  | 'on-target'
  | 'preload-above-range'
  | 'preload-below-range'
  | 'does-not-settle'
  | 'topped-out'
  | 'static-sag-low'
  | 'static-sag-high'
  | 'coil-bind';

/**
 * The outcome for one candidate spring; `coilBindMarginMm` only when its solid length is known, `adjusterTurns`
 * (from the adjuster's fully-out position) only when there is an adjuster pitch, `spacerLengthMm` only for a fork
 * without an adjuster whose stock spacer is known.
 */
export interface SpringCandidateResult {
  id: string;
  rateNPerMm: number;
  preloadNeededMm: number;
  preloadMm: number;
  /** This spring's own preload range (it follows its free length when the adjuster is given as an installed-length window). */
  preloadRangeMm: PreloadRange;
  adjusterTurns?: number;
  spacerLengthMm?: number;
  installedLengthMm: number;
  staticSagMm: number;
  riderSagMm: number;
  coilBindMarginMm?: number;
  verdict: SpringVerdict;
  reason: SpringReason;
}

interface SpringInputCommon {
  wheelbaseMm: number;
  /** The bike's own sprung mass on this end, ready to ride, kg. */
  sprungMassKg: number;
  /** Give either `loads` or `cases`. */
  loads?: Load[];
  cases?: LoadCase[];
  targets: SagTargets;
  /** Give either the preload range or the adjuster's installed-length window (each spring's range then follows its free length). */
  preloadRangeMm?: PreloadRange;
  adjusterInstalledLengthMm?: InstalledLengthWindow;
  /** With an installed-length window: the free length the rate band is worked out for (no band without it). */
  bandFreeLengthMm?: number;
  /** How far static sag may sit from its target, mm; 3 when omitted. */
  staticSagToleranceMm?: number;
  springs?: SpringCandidateInput[];
}

/** A fork without an adjuster: the stock spacer, spring and preload from which a new spring's spacer follows. */
export interface ForkSpacerInput {
  stockSpacerMm: number;
  stockFreeLengthMm: number;
  stockPreloadMm: number;
}

export interface RearSpringInput extends SpringInputCommon {
  leverageRatio: LeverageRatioInput;
  wheelTravelMm: number;
  shockStrokeMm: number;
  adjusterPitchMm: number;
  /** Shocks working side by side (1 or 2); rates are per spring and the wheel sees their sum. 1 when omitted. */
  shockCount?: number;
}

export interface ForkSpringInput extends SpringInputCommon {
  forkAngleDeg: number;
  /** Springs working in parallel; 2 when omitted. */
  springCount?: number;
  forkTravelMm: number;
  /** Omitted for forks without a preload adjuster. */
  adjusterPitchMm?: number;
  /** For a fork without an adjuster: gives each candidate the spacer length to cut. */
  spacer?: ForkSpacerInput;
}

export interface RearSpringResult {
  /** Load the added masses put on the rear wheel, W_r, N. */
  rearLoadN: number;
  /** The bike's own sprung weight on the rear, F_b = g·sprungMassKg, N. */
  bikeLoadN: number;
  /** Per spring: the rate that meets both sag targets exactly. */
  requiredRate: RateInUnits;
  /** Per spring: the rates some preload in range sets right; absent when none does or the range depends on the free length. */
  rateBand?: RateBand;
  staticSagToleranceMm: number;
  candidates: SpringCandidateResult[];
}

export interface ForkSpringResult {
  /** Load the added masses put on the front wheel, W_f, N; always positive (loads that leave the front unloaded are refused). */
  frontLoadN: number;
  /** The bike's own sprung weight on the front, N. */
  bikeLoadN: number;
  /** Required rate of each spring. */
  requiredRate: RateInUnits;
  /** Per spring; see `RearSpringResult.rateBand`. */
  rateBand?: RateBand;
  staticSagToleranceMm: number;
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
  /** The bike's own sprung load on this wheel, N; with `riderLoadN` the rear check on a curve is exact. */
  bikeLoadN?: number;
  /** Rear only; 1 when omitted. The implied rate is per spring. */
  shockCount?: number;
}

/** The sag check's word on the spring: the shared rule's verdict, or `unknown` when the bike is topped out on its own weight. */
export type SagSpringVerdict = 'ok' | 'too-soft' | 'too-stiff' | 'unknown';

export interface SagCheckResult {
  staticSagMm: number;
  riderSagMm: number;
  /** Positive: add preload. */
  preloadChangeMm: number;
  adjusterTurns?: number;
  /** Static sag after the change; absent when the bike is topped out on its own weight (it cannot be read). */
  predictedStaticSagMm?: number;
  springVerdict: SagSpringVerdict;
  /** The shared rule's reason; absent with `unknown`. */
  springReason?: Exclude<SpringReason, 'preload-above-range' | 'preload-below-range' | 'coil-bind'>;
  /** Per spring. */
  impliedRateNPerMm?: number;
  /** Preload the spring holds now, solved from the readings (rear with both loads), mm. */
  impliedPreloadMm?: number;
  /** True on a leverage curve without both loads: the shock force is then taken as constant, so re-measure after the change. */
  approximate: boolean;
  /** Set when the bike is topped out on its own weight. */
  warning?: string;
  advice: string;
}

import { g, rateInUnits } from '../units';
import { bandInUnits, linearRateBand, type RateBandNPerMm } from './band';
import { buildCandidate, rankCandidates, runCases } from './candidates';
import { bandPreloadRange, type PreloadSetting } from './preload';
import { loadSplit, requireLoadOnEnd } from './statics';
import { DEFAULT_STATIC_SAG_TOLERANCE_MM } from './verdict';
import type {
  ForkSpacerInput,
  ForkSpringCasesResult,
  ForkSpringInput,
  ForkSpringResult,
  Load,
  PreloadRange,
  SagTargets,
  SpringCandidateInput,
  SpringCandidateResult,
} from './types';

/** Everything about one fork and one load that does not depend on the spring. */
export interface ForkModel {
  /** cos θ of the fork axis from vertical. */
  cosAngle: number;
  springCount: number;
  bikeLoadN: number;
  totalLoadN: number;
  targets: SagTargets;
  preload: PreloadSetting;
  adjusterPitchMm?: number;
  forkTravelMm: number;
  staticSagToleranceMm: number;
  spacer?: ForkSpacerInput;
}

/**
 * Axial spring deflection along the tubes for a vertical wheel load: cos θ·F / (n·k), mm.
 * @example forkSpringDeflection(0, 2, 10, 1000) // 50
 */
export function forkSpringDeflection(forkAngleDeg: number, springCount: number, rateNPerMm: number, wheelForceN: number): number {
  return (Math.cos((forkAngleDeg * Math.PI) / 180) * wheelForceN) / (springCount * rateNPerMm);
}

/**
 * Fork sag with preload p: cos θ·F/(n·k) − p, kept between 0 (topped out) and full travel, mm.
 * @example forkSag(model, 10, 1000, 5) // 45 for a vertical twin-spring fork
 */
export function forkSag(model: Pick<ForkModel, 'cosAngle' | 'springCount' | 'forkTravelMm'>, rateNPerMm: number, wheelForceN: number, preloadMm: number): number {
  const x = (model.cosAngle * wheelForceN) / (model.springCount * rateNPerMm) - preloadMm;
  return Math.min(model.forkTravelMm, Math.max(0, x));
}

/**
 * Required rate of each fork spring: cos θ·W_f / (n·(x_r − x_s)), N/mm.
 * @example forkRequiredRate(1, 2, 400, { staticSagMm: 30, riderSagMm: 40 }) // 20
 */
export function forkRequiredRate(cosAngle: number, springCount: number, frontLoadN: number, targets: SagTargets): number {
  return (cosAngle * frontLoadN) / (springCount * (targets.riderSagMm - targets.staticSagMm));
}

/**
 * Evaluates one candidate fork spring on a prepared model.
 * @example evaluateForkSpring(model, { id: 'F-9', rateNPerMm: 9, freeLengthMm: 300 })
 */
export function evaluateForkSpring(model: ForkModel, spring: SpringCandidateInput): SpringCandidateResult {
  const k = spring.rateNPerMm;
  const preloadNeededMm = (model.cosAngle * model.totalLoadN) / (model.springCount * k) - model.targets.riderSagMm;
  const ctx = {
    preload: model.preload,
    adjusterPitchMm: model.adjusterPitchMm,
    strokeMm: model.forkTravelMm,
    targets: model.targets,
    staticSagToleranceMm: model.staticSagToleranceMm,
    spacer: model.spacer,
  };
  // Sag is linear in load along the tubes, so the fork always comes to rest where the preload puts it.
  return buildCandidate(spring, preloadNeededMm, ctx, (preloadMm) => ({
    staticSagMm: forkSag(model, k, model.bikeLoadN, preloadMm),
    riderSagMm: forkSag(model, k, model.totalLoadN, preloadMm),
    settles: true,
  }));
}

/**
 * Per-spring rate band of a fork for a preload range, in closed form (sag = cos θ·F/(n·k) − p).
 * @example forkRateBand(model, { min: 0, max: 15 })
 */
export function forkRateBand(model: ForkModel, preloadRangeMm: PreloadRange): RateBandNPerMm | undefined {
  const c = { bikeLoadN: model.bikeLoadN, totalLoadN: model.totalLoadN, targets: model.targets, preloadRangeMm, staticSagToleranceMm: model.staticSagToleranceMm };
  const band = linearRateBand(model.cosAngle, 1, c);
  return band && { min: band.min / model.springCount, max: band.max / model.springCount };
}

function forkForLoads(input: ForkSpringInput, loads: readonly Load[]): ForkSpringResult {
  const bikeLoadN = g * input.sprungMassKg;
  const frontLoadN = loadSplit(input.wheelbaseMm, loads).frontN;
  requireLoadOnEnd('front', bikeLoadN, frontLoadN);
  const model: ForkModel = {
    cosAngle: Math.cos((input.forkAngleDeg * Math.PI) / 180),
    springCount: input.springCount ?? 2,
    bikeLoadN,
    totalLoadN: bikeLoadN + frontLoadN,
    targets: input.targets,
    preload: input,
    adjusterPitchMm: input.adjusterPitchMm,
    forkTravelMm: input.forkTravelMm,
    staticSagToleranceMm: input.staticSagToleranceMm ?? DEFAULT_STATIC_SAG_TOLERANCE_MM,
    spacer: input.spacer,
  };
  const required = forkRequiredRate(model.cosAngle, model.springCount, frontLoadN, input.targets);
  const candidates = (input.springs ?? []).map((s) => evaluateForkSpring(model, s));
  const bandRange = bandPreloadRange(input, input.bandFreeLengthMm);
  const rateBand = bandInUnits(bandRange && forkRateBand(model, bandRange));
  return {
    frontLoadN,
    bikeLoadN,
    requiredRate: rateInUnits(required),
    ...(rateBand === undefined ? {} : { rateBand }),
    staticSagToleranceMm: model.staticSagToleranceMm,
    candidates: rankCandidates(candidates, required),
  };
}

/**
 * Fork spring selection, per spring of `springCount` (default 2) working in parallel; sag is along the tubes.
 * Same output shape as `computeRearSpring` with `frontLoadN`; with `cases` it returns the same
 * `{ cases, coversAllCases, uncoveredBy }` shape. `adjusterTurns` is omitted when there is no adjuster pitch; then,
 * with `spacer`, each candidate carries the spacer length to cut.
 * Throws EngineInputError (on `loads`, or `cases.i.loads`) when the loads put no weight on the front wheel or lift it.
 * @example
 * computeForkSpring({ wheelbaseMm: 1500, sprungMassKg: 110, loads: [{ massKg: 80, positionMm: 900 }],
 *   forkAngleDeg: 25, forkTravelMm: 120, targets: { staticSagMm: 25, riderSagMm: 35 },
 *   preloadRangeMm: { min: 0, max: 15 }, springs: [{ id: 'F-9', rateNPerMm: 9, freeLengthMm: 300 }] })
 */
export function computeForkSpring(input: ForkSpringInput & { loads: Load[]; cases?: undefined }): ForkSpringResult;
export function computeForkSpring(input: ForkSpringInput): ForkSpringResult | ForkSpringCasesResult;
export function computeForkSpring(input: ForkSpringInput): ForkSpringResult | ForkSpringCasesResult {
  if (input.cases !== undefined) return runCases(input.cases, input.springs ?? [], (loads) => forkForLoads(input, loads));
  if (input.loads === undefined) throw new RangeError('Give either loads or cases');
  return forkForLoads(input, input.loads);
}

import { g, rateInUnits } from '../units';
import { bandInUnits, curveRateBand, linearRateBand, type RateBandNPerMm } from './band';
import { buildCandidate, rankCandidates, runCases } from './candidates';
import { EngineInputError } from './errors';
import { createLeverageCurve, leverageRatioAt, shockTravelAt, solveShockEquilibrium, type LeverageCurve } from './leverage';
import { bandPreloadRange, type PreloadSetting } from './preload';
import { loadSplit, requireLoadOnEnd } from './statics';
import { DEFAULT_STATIC_SAG_TOLERANCE_MM, SETTLE_TOLERANCE_MM } from './verdict';
import type {
  Load,
  PreloadRange,
  RearSpringCasesResult,
  RearSpringInput,
  RearSpringResult,
  SagTargets,
  SpringCandidateInput,
  SpringCandidateResult,
} from './types';

/** Everything about one rear end and one load that does not depend on the spring. */
export interface RearModel {
  curve: LeverageCurve;
  /** F_b, the bike's own sprung weight on the rear wheel, N. */
  bikeLoadN: number;
  /** F_t = F_b + W_r, N. */
  totalLoadN: number;
  targets: SagTargets;
  preload: PreloadSetting;
  adjusterPitchMm?: number;
  wheelTravelMm: number;
  shockStrokeMm: number;
  /** Shocks side by side; the wheel sees the sum of their rates. */
  shockCount: number;
  staticSagToleranceMm: number;
}

/**
 * Rate that gives both sag targets: k = (LR(s_r)·F_t − LR(s_s)·F_b) / (y(s_r) − y(s_s)), N/mm.
 * With a constant ratio this is LR²·W_r / (s_r − s_s).
 * @example rearRequiredRate(createLeverageCurve(2), 1000, 1500, { staticSagMm: 25, riderSagMm: 65 }) // 50
 */
export function rearRequiredRate(curve: LeverageCurve, bikeLoadN: number, totalLoadN: number, targets: SagTargets): number {
  const { staticSagMm: ss, riderSagMm: sr } = targets;
  const num = leverageRatioAt(curve, sr) * totalLoadN - leverageRatioAt(curve, ss) * bikeLoadN;
  return num / (shockTravelAt(curve, sr) - shockTravelAt(curve, ss));
}

/**
 * Preload that puts the rider sag exactly on target with a spring of rate k: LR(s_r)·F_t / k − y(s_r), mm.
 * @example rearPreloadNeeded(createLeverageCurve(2), 50, 1500, 65) // 27.5
 */
export function rearPreloadNeeded(curve: LeverageCurve, rateNPerMm: number, totalLoadN: number, riderSagMm: number): number {
  return (leverageRatioAt(curve, riderSagMm) * totalLoadN) / rateNPerMm - shockTravelAt(curve, riderSagMm);
}

/**
 * Evaluates one candidate spring on a prepared rear model (with twin shocks the wheel sees both springs). A spring
 * whose preload is in range but which settles short of the rider-sag target (a rising ratio makes the wheel rate
 * negative before it, so the target is not where the bike comes to rest) is too soft for the linkage.
 * @example evaluateRearSpring(model, { id: 'R-58', rateNPerMm: 58, freeLengthMm: 229, solidLengthMm: 110 })
 */
export function evaluateRearSpring(model: RearModel, spring: SpringCandidateInput): SpringCandidateResult {
  const K = model.shockCount * spring.rateNPerMm;
  const preloadNeededMm = rearPreloadNeeded(model.curve, K, model.totalLoadN, model.targets.riderSagMm);
  const ctx = {
    preload: model.preload,
    adjusterPitchMm: model.adjusterPitchMm,
    strokeMm: model.shockStrokeMm,
    targets: model.targets,
    staticSagToleranceMm: model.staticSagToleranceMm,
  };
  return buildCandidate(spring, preloadNeededMm, ctx, (preloadMm) => {
    const solve = (wheelForceN: number): number =>
      solveShockEquilibrium(model.curve, { rateNPerMm: K, preloadMm, wheelForceN, wheelTravelMm: model.wheelTravelMm });
    const riderSagMm = solve(model.totalLoadN);
    return { staticSagMm: solve(model.bikeLoadN), riderSagMm, settles: Math.abs(riderSagMm - model.targets.riderSagMm) <= SETTLE_TOLERANCE_MM };
  });
}

/**
 * Per-spring rate band of a rear model for a preload range: closed form with a constant ratio, bisection on a curve.
 * @example rearRateBand(model, { min: 2, max: 20 })
 */
export function rearRateBand(model: RearModel, preloadRangeMm: PreloadRange): RateBandNPerMm | undefined {
  const c = { bikeLoadN: model.bikeLoadN, totalLoadN: model.totalLoadN, targets: model.targets, preloadRangeMm, staticSagToleranceMm: model.staticSagToleranceMm };
  const lr = model.curve.ratio[0] as number;
  const band = model.curve.flat ? linearRateBand(lr * lr, lr, c) : curveRateBand(model.curve, model.wheelTravelMm, c);
  return band && { min: band.min / model.shockCount, max: band.max / model.shockCount };
}

function rearForLoads(input: RearSpringInput, curve: LeverageCurve, loads: readonly Load[]): RearSpringResult {
  const bikeLoadN = g * input.sprungMassKg;
  const rearLoadN = loadSplit(input.wheelbaseMm, loads).rearN;
  requireLoadOnEnd('rear', bikeLoadN, rearLoadN);
  const model: RearModel = {
    curve,
    bikeLoadN,
    totalLoadN: bikeLoadN + rearLoadN,
    targets: input.targets,
    preload: input,
    adjusterPitchMm: input.adjusterPitchMm,
    wheelTravelMm: input.wheelTravelMm,
    shockStrokeMm: input.shockStrokeMm,
    shockCount: input.shockCount ?? 1,
    staticSagToleranceMm: input.staticSagToleranceMm ?? DEFAULT_STATIC_SAG_TOLERANCE_MM,
  };
  const required = rearRequiredRate(curve, bikeLoadN, model.totalLoadN, input.targets) / model.shockCount;
  // A ratio that falls steeply between the targets can ask the spring to push less at rider sag than at static sag.
  if (!(required > 0)) {
    throw new EngineInputError(
      'leverageRatio',
      'With this leverage curve no spring gives both sag targets: the shock would have to push less at the rider sag than at the static sag. Check the curve and the targets.',
    );
  }
  const candidates = (input.springs ?? []).map((s) => evaluateRearSpring(model, s));
  const bandRange = bandPreloadRange(input, input.bandFreeLengthMm);
  const rateBand = bandInUnits(bandRange && rearRateBand(model, bandRange));
  return {
    rearLoadN,
    bikeLoadN,
    requiredRate: rateInUnits(required),
    ...(rateBand === undefined ? {} : { rateBand }),
    staticSagToleranceMm: model.staticSagToleranceMm,
    candidates: rankCandidates(candidates, required),
  };
}

/**
 * Rear spring selection: required rate for the sag targets, the rate band some preload in range sets right, and,
 * per candidate spring, preload, adjuster turns (from fully out), installed length, predicted sags, coil-bind margin
 * and the verdict of `judgeSpring` with its reason, best candidate first. Rates are per spring (`shockCount`
 * springs side by side); preload comes from `preloadRangeMm` or, per spring, from `adjusterInstalledLengthMm`.
 *
 * With `loads` it returns one `RearSpringResult`. With `cases` instead it returns
 * `{ cases: [{ name, ...RearSpringResult }], coversAllCases, uncoveredBy }` where `coversAllCases` lists the
 * spring ids that are `ok` in every case (closest to the required rates first) and `uncoveredBy` maps each
 * other spring id to the name of the first case that breaks it (empty when every spring covers every case).
 * Throws RangeError when neither `loads` nor `cases` is given, and EngineInputError (on `loads`, `cases.i.loads`
 * or `leverageRatio`) when the loads put no weight on the rear wheel or no positive rate meets both targets.
 * @example
 * computeRearSpring({ wheelbaseMm: 1500, sprungMassKg: 95, loads: [{ massKg: 80, positionMm: 900 }],
 *   leverageRatio: 2.1, wheelTravelMm: 200, shockStrokeMm: 95, targets: { staticSagMm: 25, riderSagMm: 66 },
 *   preloadRangeMm: { min: 2, max: 20 }, adjusterPitchMm: 1,
 *   springs: [{ id: 'R-58', rateNPerMm: 58, freeLengthMm: 229, solidLengthMm: 110 }] }).candidates[0].verdict
 */
export function computeRearSpring(input: RearSpringInput & { loads: Load[]; cases?: undefined }): RearSpringResult;
export function computeRearSpring(input: RearSpringInput): RearSpringResult | RearSpringCasesResult;
export function computeRearSpring(input: RearSpringInput): RearSpringResult | RearSpringCasesResult {
  const curve = createLeverageCurve(input.leverageRatio);
  if (input.cases !== undefined) return runCases(input.cases, input.springs ?? [], (loads) => rearForLoads(input, curve, loads));
  if (input.loads === undefined) throw new RangeError('Give either loads or cases');
  return rearForLoads(input, curve, input.loads);
}

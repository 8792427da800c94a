import { createLeverageCurve, leverageRatioAt, shockTravelAt, solveShockEquilibrium, wheelTravelAtShockTravel, type LeverageCurve } from './leverage';
import type { SagCheckInput, SagCheckResult, SagReading, SagSpringVerdict, SagTargets } from './types';
import { DEFAULT_STATIC_SAG_TOLERANCE_MM, judgeSpring, SETTLE_TOLERANCE_MM } from './verdict';

/** Default band around a sag target inside which no change is advised, mm (common practice, no published source); the same as the finder's. */
export const DEFAULT_SAG_TOLERANCE_MM = DEFAULT_STATIC_SAG_TOLERANCE_MM;

/**
 * One reading from a number or the mean of a push-down/let-up pair (the mean cancels static friction).
 * @example averageReading({ down: 540, up: 546 }) // 543
 */
export function averageReading(reading: SagReading): number {
  return typeof reading === 'number' ? reading : (reading.down + reading.up) / 2;
}

// Formats numbers for the advice sentence only; numeric fields stay raw.
const mmText = (x: number): string => `${Math.round(x * 10) / 10} mm`;
/** How the advice writes a length; an lb rider's page passes inches with mm beside them. */
export type LengthText = (mm: number) => string;

function turnsPhrase(turns: number): string {
  const half = Math.round(Math.abs(turns) * 2) / 2;
  if (half === 0) return 'less than half a turn of the adjuster';
  return `about ${half} ${half === 1 ? 'turn' : 'turns'} of the adjuster`;
}

const springWords: Record<string, (r: Omit<SagCheckResult, 'advice'>, targets: SagTargets, mm: LengthText) => string> = {
  'static-sag-low': (r, t, mm) =>
    `static sag would be only ${mm(r.predictedStaticSagMm ?? 0)} against a ${mm(t.staticSagMm)} target, so the spring is too soft and a stiffer one is advised`,
  'static-sag-high': (r, t, mm) =>
    `static sag would be ${mm(r.predictedStaticSagMm ?? 0)} against a ${mm(t.staticSagMm)} target, so the spring is too stiff and a softer one is advised`,
  'topped-out': () => 'the bike would sit topped out on its own weight, so the spring is too soft and a stiffer one is advised',
  'does-not-settle': () => 'the bike would sink past the rider-sag target on this linkage, so the spring is too soft and a stiffer one is advised',
};

/**
 * The advice sentence for a check's figures; the result's own `advice` is this with lengths in mm.
 * @example sagAdviceText(result, { staticSagMm: 25, riderSagMm: 66 }, 3, (mm) => `${mm / 25.4} in`)
 */
export function sagAdviceText(r: Omit<SagCheckResult, 'advice'>, targets: SagTargets, toleranceMm: number, mm: LengthText = mmText): string {
  const spring = r.springVerdict === 'ok' || r.springReason === undefined ? '' : (springWords[r.springReason]?.(r, targets, mm) ?? '');
  const tail = [r.warning, r.approximate ? APPROXIMATE_NOTE : undefined].filter((x) => x !== undefined).map((x) => ` ${x}`).join('');
  if (r.preloadChangeMm === 0) {
    const onTarget = `Rider sag is ${mm(r.riderSagMm)}, within ${mm(toleranceMm)} of the ${mm(targets.riderSagMm)} target`;
    if (r.springVerdict === 'unknown') return `${onTarget}.${tail}`;
    return (spring === '' ? `${onTarget}, and static sag looks right: no change is needed.` : `${onTarget}, but ${spring}.`) + tail;
  }
  const verb = r.preloadChangeMm > 0 ? 'Add' : 'Remove';
  const turns = r.adjusterTurns === undefined ? '' : ` (${turnsPhrase(r.adjusterTurns)})`;
  const change = `${verb} ${mm(Math.abs(r.preloadChangeMm))} of preload${turns} to bring rider sag from ${mm(r.riderSagMm)} to the ${mm(targets.riderSagMm)} target`;
  return (spring === '' ? `${change}.` : `${change}; after that ${spring}.`) + tail;
}

const APPROXIMATE_NOTE =
  'This linkage’s ratio changes with travel and the wheel loads were not given, so these figures are approximate: measure the sag again after the change.';
const TOPPED_OUT_WARNING =
  'The bike shows no static sag: it is topped out on its own weight, so the spring cannot be judged from this reading. Check that nothing holds the suspension up, take some preload off and measure again.';

function rearCurve(input: SagCheckInput): LeverageCurve {
  if (input.leverageRatio === undefined) throw new RangeError('A rear sag check needs the leverage ratio');
  return createLeverageCurve(input.leverageRatio);
}

/** What the readings say about the spring once the advised change is made. */
interface Estimate {
  preloadChangeMm: number;
  predictedStaticSagMm: number;
  settles: boolean;
  impliedRateNPerMm?: number;
  impliedPreloadMm?: number;
  approximate: boolean;
}

interface Sags {
  staticSagMm: number;
  riderSagMm: number;
  /** Whether rider sag is far enough off its target for a change to be advised. */
  outside: boolean;
}

/**
 * Rear with both wheel loads, exact on any curve: k·(p + y(s)) = LR(s)·F at static and rider sag gives
 * K = (LR(s_r)·F_t − LR(s_s)·F_b)/(y(s_r) − y(s_s)) and p = LR(s_s)·F_b/K − y(s_s); the preload for the target is
 * LR(s_t)·F_t/K − y(s_t), and the static sag after it comes from the same equilibrium the finder solves.
 * Undefined when the readings imply no positive rate.
 */
function rearExact(input: SagCheckInput, curve: LeverageCurve, sags: Sags, bikeLoadN: number, riderLoadN: number): Estimate | undefined {
  const { staticSagMm: ss, riderSagMm: sr } = sags;
  const Ft = bikeLoadN + riderLoadN;
  const K = (leverageRatioAt(curve, sr) * Ft - leverageRatioAt(curve, ss) * bikeLoadN) / (shockTravelAt(curve, sr) - shockTravelAt(curve, ss));
  if (!(K > 0) || !Number.isFinite(K)) return undefined;
  const p = (leverageRatioAt(curve, ss) * bikeLoadN) / K - shockTravelAt(curve, ss);
  const aim = sags.outside ? input.targets.riderSagMm : sr;
  const pAim = sags.outside ? (leverageRatioAt(curve, aim) * Ft) / K - shockTravelAt(curve, aim) : p;
  // The sag check does not know the full travel; the readings bound it from above.
  const wheelTravelMm = Math.max(input.extendedMm, 2 * aim);
  const solve = (F: number): number => solveShockEquilibrium(curve, { rateNPerMm: K, preloadMm: pAim, wheelForceN: F, wheelTravelMm });
  return {
    preloadChangeMm: pAim - p,
    predictedStaticSagMm: solve(bikeLoadN),
    settles: Math.abs(solve(Ft) - aim) <= SETTLE_TOLERANCE_MM,
    impliedRateNPerMm: K / (input.shockCount ?? 1),
    impliedPreloadMm: p,
    approximate: false,
  };
}

/** Rear without both loads: the preload change is the shock travel between measured and target rider sag (exact for a constant ratio). */
function rearShift(input: SagCheckInput, curve: LeverageCurve, sags: Sags): Estimate {
  const { staticSagMm: ss, riderSagMm: sr } = sags;
  const preloadChangeMm = sags.outside ? shockTravelAt(curve, sr) - shockTravelAt(curve, input.targets.riderSagMm) : 0;
  const W = input.riderLoadN;
  return {
    preloadChangeMm,
    predictedStaticSagMm: Math.max(0, wheelTravelAtShockTravel(curve, shockTravelAt(curve, ss) - preloadChangeMm)),
    settles: true,
    ...(W !== undefined && sr > ss
      ? { impliedRateNPerMm: (leverageRatioAt(curve, sr) * W) / (shockTravelAt(curve, sr) - shockTravelAt(curve, ss)) / (input.shockCount ?? 1) }
      : {}),
    approximate: !curve.flat,
  };
}

/** Fork: sag along the tubes is linear in preload, so the change is the sag error and the estimate is exact. */
function forkEstimate(input: SagCheckInput, sags: Sags): Estimate {
  const cosAngle = Math.cos(((input.forkAngleDeg ?? 0) * Math.PI) / 180);
  const n = input.springCount ?? 2;
  const preloadChangeMm = sags.outside ? sags.riderSagMm - input.targets.riderSagMm : 0;
  const growth = sags.riderSagMm - sags.staticSagMm;
  const W = input.riderLoadN;
  return {
    preloadChangeMm,
    predictedStaticSagMm: Math.max(0, sags.staticSagMm - preloadChangeMm),
    settles: true,
    ...(W !== undefined && growth > 0 ? { impliedRateNPerMm: (cosAngle * W) / (n * growth) } : {}),
    approximate: false,
  };
}

/**
 * Sag check after fitting: sags from three readings, the preload change that brings rider sag onto target
 * (positive = add), adjuster turns, the static sag predicted after the change, and the verdict of the same
 * `judgeSpring` the finder uses (static sag within the tolerance of its target, off the top-out stop, at rest on the
 * rider-sag target). At the rear with both `bikeLoadN` and `riderLoadN` the check is exact on any curve (rate and
 * preload solved from the two readings); without them a curve's answer is `approximate` (shock force taken as
 * constant, y(s_measured) − y(s_target)). A static sag of 0 (topped out) gives a warning and the verdict `unknown`.
 * @example
 * checkSag({ end: 'rear', extendedMm: 600, staticMm: 575, riderMm: { down: 526, up: 532 },
 *   targets: { staticSagMm: 25, riderSagMm: 66 }, leverageRatio: 2, adjusterPitchMm: 1 }).advice
 * // "Add 2.5 mm of preload (about 2.5 turns of the adjuster) to bring rider sag from 71 mm to the 66 mm target; after that ..."
 */
export function checkSag(input: SagCheckInput): SagCheckResult {
  const toleranceMm = input.toleranceMm ?? DEFAULT_SAG_TOLERANCE_MM;
  const staticSagMm = input.extendedMm - averageReading(input.staticMm);
  const riderSagMm = input.extendedMm - averageReading(input.riderMm);
  const { targets } = input;
  const sags: Sags = { staticSagMm, riderSagMm, outside: Math.abs(riderSagMm - targets.riderSagMm) > toleranceMm };
  const toppedOut = !(staticSagMm > 0);
  let est: Estimate;
  if (input.end === 'rear') {
    const curve = rearCurve(input);
    const { bikeLoadN, riderLoadN } = input;
    const exact = bikeLoadN !== undefined && riderLoadN !== undefined && !toppedOut && riderSagMm > staticSagMm
      ? rearExact(input, curve, sags, bikeLoadN, riderLoadN)
      : undefined;
    est = exact ?? rearShift(input, curve, sags);
  } else {
    est = forkEstimate(input, sags);
  }
  const result: Omit<SagCheckResult, 'advice'> = { staticSagMm, riderSagMm, preloadChangeMm: est.preloadChangeMm, springVerdict: 'unknown', approximate: est.approximate };
  if (input.adjusterPitchMm !== undefined) result.adjusterTurns = est.preloadChangeMm / input.adjusterPitchMm;
  if (toppedOut) {
    result.warning = TOPPED_OUT_WARNING;
  } else {
    result.predictedStaticSagMm = est.predictedStaticSagMm;
    const j = judgeSpring({ preloadNeededMm: est.preloadChangeMm, settles: est.settles, staticSagMm: est.predictedStaticSagMm, targets, staticSagToleranceMm: toleranceMm });
    result.springVerdict = j.verdict as SagSpringVerdict;
    result.springReason = j.reason as SagCheckResult['springReason'];
  }
  if (est.impliedRateNPerMm !== undefined) result.impliedRateNPerMm = est.impliedRateNPerMm;
  if (est.impliedPreloadMm !== undefined) result.impliedPreloadMm = est.impliedPreloadMm;
  return { ...result, advice: sagAdviceText(result, targets, toleranceMm) };
}

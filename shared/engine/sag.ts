import { createLeverageCurve, leverageRatioAt, shockTravelAt, wheelTravelAtShockTravel, type LeverageCurve } from './leverage';
import type { SagCheckInput, SagCheckResult, SagReading } from './types';

/** Default band around a sag target inside which no change is advised, mm (common practice, no published source). */
export const DEFAULT_SAG_TOLERANCE_MM = 3;

/**
 * One reading from a number or the mean of a push-down/let-up pair (the mean cancels static friction).
 * @example averageReading({ down: 540, up: 546 }) // 543
 */
export function averageReading(reading: SagReading): number {
  return typeof reading === 'number' ? reading : (reading.down + reading.up) / 2;
}

// Formats numbers for the advice sentence only; numeric fields stay raw.
const mm = (x: number): string => `${Math.round(x * 10) / 10} mm`;

function turnsPhrase(turns: number): string {
  const half = Math.round(Math.abs(turns) * 2) / 2;
  if (half === 0) return 'less than half a turn of the adjuster';
  return `about ${half} ${half === 1 ? 'turn' : 'turns'} of the adjuster`;
}

function adviceSentence(r: Omit<SagCheckResult, 'advice'>, targets: SagCheckInput['targets'], toleranceMm: number): string {
  const spring =
    r.springVerdict === 'too-soft'
      ? `static sag would be only ${mm(r.predictedStaticSagMm)} against a ${mm(targets.staticSagMm)} target, so the spring is too soft and a stiffer one is advised`
      : r.springVerdict === 'too-stiff'
        ? `static sag would be ${mm(r.predictedStaticSagMm)} against a ${mm(targets.staticSagMm)} target, so the spring is too stiff and a softer one is advised`
        : '';
  if (r.preloadChangeMm === 0) {
    const onTarget = `Rider sag is ${mm(r.riderSagMm)}, within ${mm(toleranceMm)} of the ${mm(targets.riderSagMm)} target`;
    return spring === '' ? `${onTarget}, and static sag looks right: no change is needed.` : `${onTarget}, but ${spring}.`;
  }
  const verb = r.preloadChangeMm > 0 ? 'Add' : 'Remove';
  const turns = r.adjusterTurns === undefined ? '' : ` (${turnsPhrase(r.adjusterTurns)})`;
  const change = `${verb} ${mm(Math.abs(r.preloadChangeMm))} of preload${turns} to bring rider sag from ${mm(r.riderSagMm)} to the ${mm(targets.riderSagMm)} target`;
  return spring === '' ? `${change}.` : `${change}; after that ${spring}.`;
}

function rearCurve(input: SagCheckInput): LeverageCurve {
  if (input.leverageRatio === undefined) throw new RangeError('A rear sag check needs the leverage ratio');
  return createLeverageCurve(input.leverageRatio);
}

/**
 * Sag check after fitting: sags from three readings, the preload change that brings rider sag onto target
 * (positive = add), adjuster turns, the static sag predicted after the change, a verdict on the spring from
 * that prediction, the rate implied by the readings when the rider's wheel load is given, and one sentence
 * of advice. At the rear with a curve, the preload change is the shock travel between the measured and the
 * target rider sag, y(s_measured) − y(s_target) (for a constant ratio exactly (sag − target)/LR), and the
 * implied rate is LR(s_r)·W / (y(s_r) − y(s_s)) (for a constant ratio LR²·W / (s_r − s_s)).
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
  const outside = Math.abs(riderSagMm - targets.riderSagMm) > toleranceMm;
  let preloadChangeMm = 0;
  let predictedStaticSagMm: number;
  let impliedRateNPerMm: number | undefined;
  const W = input.riderLoadN;
  const sagGrowth = riderSagMm - staticSagMm;
  if (input.end === 'rear') {
    const curve = rearCurve(input);
    if (outside) preloadChangeMm = shockTravelAt(curve, riderSagMm) - shockTravelAt(curve, targets.riderSagMm);
    const shifted = shockTravelAt(curve, staticSagMm) - preloadChangeMm;
    predictedStaticSagMm = Math.max(0, wheelTravelAtShockTravel(curve, shifted));
    if (W !== undefined && sagGrowth > 0) {
      impliedRateNPerMm =
        (leverageRatioAt(curve, riderSagMm) * W) / (shockTravelAt(curve, riderSagMm) - shockTravelAt(curve, staticSagMm));
    }
  } else {
    const cosAngle = Math.cos(((input.forkAngleDeg ?? 0) * Math.PI) / 180);
    const n = input.springCount ?? 2;
    if (outside) preloadChangeMm = riderSagMm - targets.riderSagMm;
    predictedStaticSagMm = Math.max(0, staticSagMm - preloadChangeMm);
    if (W !== undefined && sagGrowth > 0) impliedRateNPerMm = (cosAngle * W) / (n * sagGrowth);
  }
  const springVerdict =
    predictedStaticSagMm < targets.staticSagMm - toleranceMm
      ? 'too-soft'
      : predictedStaticSagMm > targets.staticSagMm + toleranceMm
        ? 'too-stiff'
        : 'ok';
  const result: Omit<SagCheckResult, 'advice'> = { staticSagMm, riderSagMm, preloadChangeMm, predictedStaticSagMm, springVerdict };
  if (input.adjusterPitchMm !== undefined) result.adjusterTurns = preloadChangeMm / input.adjusterPitchMm;
  if (impliedRateNPerMm !== undefined) result.impliedRateNPerMm = impliedRateNPerMm;
  return { ...result, advice: adviceSentence(result, targets, toleranceMm) };
}

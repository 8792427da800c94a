import type { PreloadRange, SagTargets, SpringReason, SpringVerdict } from './types';

/** Band around the static-sag target inside which a spring is judged right, mm (common practice, no published source). */
export const DEFAULT_STATIC_SAG_TOLERANCE_MM = 3;

/** How far the settled rider sag may sit from where it was aimed before the spring is judged not to rest there, mm. */
export const SETTLE_TOLERANCE_MM = 1e-3;

/** Sags are shown to 0.01 mm; the rule judges them at that step, so figures read off the finder get the same word in the sag check. */
export const SAG_STEP_MM = 0.01;

const toStep = (x: number): number => Math.round(x / SAG_STEP_MM) * SAG_STEP_MM;

/**
 * The static sags a spring may leave: from `low` (inclusive) up to `high` (exclusive). These are the ends of
 * target ± tolerance as shown (to 0.01 mm), widened by the half step a shown figure rounds over, and never below the
 * half step (a bike showing 0 mm is topped out).
 * @example staticSagWindow({ staticSagMm: 8, riderSagMm: 32 }, 3) // { low: 4.995, high: 11.005 }
 */
export function staticSagWindow(targets: SagTargets, toleranceMm: number): { low: number; high: number } {
  return {
    low: Math.max(SAG_STEP_MM / 2, toStep(targets.staticSagMm - toleranceMm) - SAG_STEP_MM / 2),
    high: toStep(targets.staticSagMm + toleranceMm) + SAG_STEP_MM / 2,
  };
}

/** What the one spring rule reads: the preload the rider-sag target asks for and the sags that follow from the preload set. */
export interface SpringJudgeInput {
  /** Preload that puts rider sag on its target, mm. */
  preloadNeededMm: number;
  /** The spring's own preload range; absent where it is not known (the sag check), so only the sags are judged. */
  preloadRangeMm?: PreloadRange;
  /** Whether the bike comes to rest at the rider-sag target with the preload set (false on a rising ratio whose wheel rate turns negative first). */
  settles: boolean;
  /** Static sag with the preload set, mm; 0 means topped out on the bike's own weight. */
  staticSagMm: number;
  targets: SagTargets;
  staticSagToleranceMm: number;
  coilBindMarginMm?: number;
}

export interface SpringJudgement {
  verdict: SpringVerdict;
  reason: SpringReason;
}

/**
 * The one spring rule shared by the finder, the recommendations, load cases and the sag check. A spring is `ok`
 * when the preload that puts rider sag on its target lies in the adjuster's range, the bike comes to rest there,
 * and the static sag that follows is off the top-out stop and within the tolerance of its target (judged to the
 * 0.01 mm sags are shown with, see `staticSagWindow`); otherwise it is
 * `too-soft` or `too-stiff` with the first reason that fails, or `coil-bind` when only the coil-bind margin fails.
 * A topped-out bike counts as too soft: all of its weight is held by preload, and a sag check cannot read it.
 * @example judgeSpring({ preloadNeededMm: 8, preloadRangeMm: { min: 2, max: 20 }, settles: true, staticSagMm: 4,
 *   targets: { staticSagMm: 8, riderSagMm: 32 }, staticSagToleranceMm: 3 }) // { verdict: 'too-soft', reason: 'static-sag-low' }
 */
export function judgeSpring(input: SpringJudgeInput): SpringJudgement {
  const range = input.preloadRangeMm;
  if (range !== undefined && input.preloadNeededMm > range.max) return { verdict: 'too-soft', reason: 'preload-above-range' };
  if (range !== undefined && input.preloadNeededMm < range.min) return { verdict: 'too-stiff', reason: 'preload-below-range' };
  if (!input.settles) return { verdict: 'too-soft', reason: 'does-not-settle' };
  if (!(input.staticSagMm >= SAG_STEP_MM / 2)) return { verdict: 'too-soft', reason: 'topped-out' };
  const window = staticSagWindow(input.targets, input.staticSagToleranceMm);
  if (input.staticSagMm < window.low) return { verdict: 'too-soft', reason: 'static-sag-low' };
  if (input.staticSagMm >= window.high) return { verdict: 'too-stiff', reason: 'static-sag-high' };
  if (input.coilBindMarginMm !== undefined && input.coilBindMarginMm < 0) return { verdict: 'coil-bind', reason: 'coil-bind' };
  return { verdict: 'ok', reason: 'on-target' };
}

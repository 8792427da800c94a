import { rateInUnits } from '../units';
import { leverageRatioAt, shockTravelAt, solveShockEquilibrium, type LeverageCurve } from './leverage';
import type { PreloadRange, RateBand, SagTargets } from './types';
import { SETTLE_TOLERANCE_MM, staticSagWindow } from './verdict';

/** A band of rates, N/mm (per spring once divided by the spring count). */
export interface RateBandNPerMm {
  min: number;
  max: number;
}

/** What a band is worked out from, besides the end's own geometry; rates are the end's total (all springs together). */
export interface BandConditions {
  bikeLoadN: number;
  totalLoadN: number;
  targets: SagTargets;
  preloadRangeMm: PreloadRange;
  staticSagToleranceMm: number;
}

/**
 * Band for an end whose sag is linear in load: sag = A·F/K − B·p (a fork: A = cos θ, B = 1; a constant ratio LR at the
 * rear: A = LR², B = LR). With rider sag on target, p = (A·F_t/K − s_r)/B and static sag = s_r − A·W/K, so each
 * condition of `judgeSpring` is one bound on K: p ≤ max → K ≥ A·F_t/(s_r + B·max); p ≥ min → K ≤ A·F_t/(s_r + B·min);
 * static sag ≥ low → K ≥ A·W/(s_r − low); static sag < high → K < A·W/(s_r − high) when that denominator is positive,
 * with low and high the ends of target ± tolerance from `staticSagWindow`. Undefined when the bounds leave nothing.
 * @example linearRateBand(1, 1, { bikeLoadN: 1000, totalLoadN: 1400, targets: { staticSagMm: 30, riderSagMm: 40 },
 *   preloadRangeMm: { min: 0, max: 20 }, staticSagToleranceMm: 3 }) // { min: 400/13.005, max: 35 }
 */
export function linearRateBand(A: number, B: number, c: BandConditions): RateBandNPerMm | undefined {
  const sr = c.targets.riderSagMm;
  const W = c.totalLoadN - c.bikeLoadN;
  const { low, high } = staticSagWindow(c.targets, c.staticSagToleranceMm);
  const min = Math.max((A * c.totalLoadN) / (sr + B * c.preloadRangeMm.max), (A * W) / (sr - low));
  let max = (A * c.totalLoadN) / (sr + B * c.preloadRangeMm.min);
  if (sr - high > 0) max = Math.min(max, (A * W) / (sr - high));
  if (!(min <= max)) return undefined;
  return { min, max };
}

/** Smallest x in [lo, hi] where a predicate false-then-true over the interval turns true (hi assumed true). */
function firstTrue(pred: (x: number) => boolean, lo: number, hi: number): number {
  let a = lo;
  let b = hi;
  for (let i = 0; i < 200 && b - a > 1e-13 * b; i++) {
    const mid = 0.5 * (a + b);
    if (pred(mid)) b = mid;
    else a = mid;
  }
  return b;
}

/** Largest x in [lo, hi] where a predicate true-then-false over the interval is still true (lo assumed true). */
function lastTrue(pred: (x: number) => boolean, lo: number, hi: number): number {
  let a = lo;
  let b = hi;
  for (let i = 0; i < 200 && b - a > 1e-13 * b; i++) {
    const mid = 0.5 * (a + b);
    if (pred(mid)) a = mid;
    else b = mid;
  }
  return a;
}

/**
 * Band for a rear end on a leverage curve, by bisection on the total rate K. With rider sag held on target the preload
 * is p(K) = LR(s_r)·F_t/K − y(s_r); a stiffer spring lowers the spring line below s_r about the point it shares there,
 * so the static sag only grows with K and "comes to rest at s_r" only turns from false to true. The band is
 * p(K) inside the range, settled, static sag above 0 and within the tolerance.
 * @example curveRateBand(createLeverageCurve([{ wheelTravelMm: 0, ratio: 2.5 }, { wheelTravelMm: 200, ratio: 1.9 }]), 200, conditions)
 */
export function curveRateBand(curve: LeverageCurve, wheelTravelMm: number, c: BandConditions): RateBandNPerMm | undefined {
  const sr = c.targets.riderSagMm;
  const { low, high } = staticSagWindow(c.targets, c.staticSagToleranceMm);
  const forceAtRider = leverageRatioAt(curve, sr) * c.totalLoadN;
  const yr = shockTravelAt(curve, sr);
  const preloadFor = (K: number): number => forceAtRider / K - yr;
  const solve = (K: number, F: number): number =>
    solveShockEquilibrium(curve, { rateNPerMm: K, preloadMm: preloadFor(K), wheelForceN: F, wheelTravelMm });
  const lowOk = (K: number): boolean => {
    if (Math.abs(solve(K, c.totalLoadN) - sr) > SETTLE_TOLERANCE_MM) return false;
    return solve(K, c.bikeLoadN) >= low;
  };
  const highOk = (K: number): boolean => solve(K, c.bikeLoadN) < high;
  // p(K) is decreasing: the range's maximum gives the softest rate, its minimum the stiffest.
  const kSoft = forceAtRider / (c.preloadRangeMm.max + yr);
  const kStiff = forceAtRider / (c.preloadRangeMm.min + yr);
  if (!lowOk(kStiff) || !highOk(kSoft)) return undefined;
  const min = lowOk(kSoft) ? kSoft : firstTrue(lowOk, kSoft, kStiff);
  const max = highOk(kStiff) ? kStiff : lastTrue(highOk, kSoft, kStiff);
  return min <= max ? { min, max } : undefined;
}

/** A band in N/mm as the three units riders quote. */
export const bandInUnits = (band: RateBandNPerMm | undefined): RateBand | undefined =>
  band && { min: rateInUnits(band.min), max: rateInUnits(band.max) };

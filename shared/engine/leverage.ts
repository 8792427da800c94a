import { brentRoot } from './solve';
import type { LeverageRatioInput } from './types';

/**
 * A leverage-ratio curve prepared for fast evaluation: knots sorted by wheel travel, the ratio at
 * each knot and the shock travel y at each knot (y(s) = ∫₀ˢ dσ / LR(σ), exact per segment).
 */
export interface LeverageCurve {
  readonly wheelTravelMm: readonly number[];
  readonly ratio: readonly number[];
  readonly shockTravelMm: readonly number[];
  /** True when every knot has the same ratio. */
  readonly flat: boolean;
}

/** The linear piece of LR around a wheel travel: LR(s) = a + b·(s − x), y(s) = y0 + ∫ₓˢ dσ / LR(σ). */
interface Region {
  x: number;
  a: number;
  b: number;
  y0: number;
}

/** ∫₀ᵘ dt / (a + b·t), closed form; log1p keeps it accurate when b·u is small. */
function segmentIntegral(a: number, b: number, u: number): number {
  return b === 0 ? u / a : Math.log1p((b * u) / a) / b;
}

/** Inverse of segmentIntegral: the u whose integral is v. */
function segmentIntegralInverse(a: number, b: number, v: number): number {
  return b === 0 ? a * v : (a * Math.expm1(b * v)) / b;
}

/**
 * Builds a curve from one ratio or from points `{wheelTravelMm, ratio}` (at least one, wheel travel
 * strictly increasing, ratio > 0). Throws RangeError otherwise.
 * @example createLeverageCurve([{ wheelTravelMm: 0, ratio: 2.5 }, { wheelTravelMm: 200, ratio: 1.9 }])
 */
export function createLeverageCurve(input: LeverageRatioInput): LeverageCurve {
  const points = typeof input === 'number' ? [{ wheelTravelMm: 0, ratio: input }] : input;
  if (points.length === 0) throw new RangeError('A leverage curve needs at least one point');
  const xs: number[] = [];
  const rs: number[] = [];
  for (const p of points) {
    if (!(p.ratio > 0) || !Number.isFinite(p.ratio)) throw new RangeError('Leverage ratio must be a positive number');
    if (!Number.isFinite(p.wheelTravelMm)) throw new RangeError('Wheel travel must be a finite number');
    const last = xs[xs.length - 1];
    if (last !== undefined && !(p.wheelTravelMm > last)) {
      throw new RangeError('Leverage curve wheel travel must be strictly increasing');
    }
    xs.push(p.wheelTravelMm);
    rs.push(p.ratio);
  }
  const r0 = rs[0] as number;
  const x0 = xs[0] as number;
  // Before the first knot the ratio is constant, so y at the first knot is x0 / r0 (negative if x0 < 0).
  const ys: number[] = [x0 / r0];
  for (let i = 0; i + 1 < xs.length; i++) {
    const a = rs[i] as number;
    const dx = (xs[i + 1] as number) - (xs[i] as number);
    const b = ((rs[i + 1] as number) - a) / dx;
    ys.push((ys[i] as number) + segmentIntegral(a, b, dx));
  }
  return { wheelTravelMm: xs, ratio: rs, shockTravelMm: ys, flat: rs.every((r) => r === r0) };
}

/** Index of the last knot at or below s, or -1 before the first knot. */
function knotIndex(values: readonly number[], s: number): number {
  let lo = -1;
  let hi = values.length - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if ((values[mid] as number) <= s) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}

function regionAt(curve: LeverageCurve, i: number): Region {
  const xs = curve.wheelTravelMm;
  const rs = curve.ratio;
  const n = xs.length;
  const k = Math.max(0, i);
  const x = xs[k] as number;
  const a = rs[k] as number;
  const y0 = curve.shockTravelMm[k] as number;
  if (i < 0 || k >= n - 1) return { x, a, b: 0, y0 };
  const b = ((rs[k + 1] as number) - a) / ((xs[k + 1] as number) - x);
  return { x, a, b, y0 };
}

/**
 * Leverage ratio at wheel travel s: linear between points, constant beyond the ends.
 * @example leverageRatioAt(createLeverageCurve(2.1), 50) // 2.1
 */
export function leverageRatioAt(curve: LeverageCurve, s: number): number {
  const r = regionAt(curve, knotIndex(curve.wheelTravelMm, s));
  return r.a + r.b * (s - r.x);
}

/**
 * Shock displacement y(s) = ∫₀ˢ dσ / LR(σ) at wheel travel s, mm, exact for the piecewise-linear curve.
 * @example shockTravelAt(createLeverageCurve(2), 100) // 50
 */
export function shockTravelAt(curve: LeverageCurve, s: number): number {
  const r = regionAt(curve, knotIndex(curve.wheelTravelMm, s));
  return r.y0 + segmentIntegral(r.a, r.b, s - r.x);
}

/**
 * Wheel travel at which the shock has moved y mm (inverse of `shockTravelAt`).
 * @example wheelTravelAtShockTravel(createLeverageCurve(2), 50) // 100
 */
export function wheelTravelAtShockTravel(curve: LeverageCurve, y: number): number {
  const r = regionAt(curve, knotIndex(curve.shockTravelMm, y));
  return r.x + segmentIntegralInverse(r.a, r.b, y - r.y0);
}

/**
 * Average ratio between two wheel travels, Δs / Δy; the ratio itself when they coincide.
 * @example meanLeverageRatio(createLeverageCurve(2), 0, 100) // 2
 */
export function meanLeverageRatio(curve: LeverageCurve, fromMm: number, toMm: number): number {
  if (fromMm === toMm) return leverageRatioAt(curve, fromMm);
  return (toMm - fromMm) / (shockTravelAt(curve, toMm) - shockTravelAt(curve, fromMm));
}

export interface ShockEquilibriumInput {
  rateNPerMm: number;
  preloadMm: number;
  /** Vertical force on the wheel to be carried by the spring, N. */
  wheelForceN: number;
  /** Full wheel travel, mm; the wheel bottoms here. */
  wheelTravelMm: number;
}

/**
 * Wheel travel at which k·(p + y(s)) = LR(s)·F, searched from top-out: 0 when the preload alone holds
 * the load (k·p ≥ LR(0)·F), full travel when no s balances it. The curve is cut into pieces on which the
 * imbalance is monotone (at knots and where its derivative vanishes), so the first crossing is found
 * exactly: closed form where the ratio is constant, Brent's method (tolerance 1e-7 mm) elsewhere.
 * @example solveShockEquilibrium(createLeverageCurve(2), { rateNPerMm: 50, preloadMm: 5, wheelForceN: 1000, wheelTravelMm: 150 }) // 70
 */
export function solveShockEquilibrium(curve: LeverageCurve, input: ShockEquilibriumInput): number {
  const { rateNPerMm: k, preloadMm: p, wheelForceN: F, wheelTravelMm: T } = input;
  const imbalance = (r: Region, s: number): number => {
    const u = s - r.x;
    return k * (p + r.y0 + segmentIntegral(r.a, r.b, u)) - (r.a + r.b * u) * F;
  };
  const xs = curve.wheelTravelMm;
  let i = knotIndex(xs, 0);
  let lo = 0;
  if (imbalance(regionAt(curve, i), 0) >= 0) return 0;
  while (lo < T) {
    const r = regionAt(curve, i);
    const next = i + 1 < xs.length ? (xs[i + 1] as number) : Infinity;
    const end = Math.min(next, T);
    // Where b·F > 0 the imbalance has one turning point, at LR = k / (b·F); split there to keep pieces monotone.
    const cuts: number[] = [];
    if (r.b * F > 0) {
      const sTurn = r.x + (k / (r.b * F) - r.a) / r.b;
      if (sTurn > lo && sTurn < end) cuts.push(sTurn);
    }
    cuts.push(end);
    let pieceLo = lo;
    for (const pieceHi of cuts) {
      if (imbalance(r, pieceHi) >= 0) {
        if (r.b === 0) return Math.min(pieceHi, Math.max(pieceLo, r.x + r.a * ((r.a * F) / k - p - r.y0)));
        // At a knot the next segment's own rounding can already read a balance; the crossing is then the knot itself.
        if (imbalance(r, pieceLo) >= 0) return pieceLo;
        return brentRoot((s) => imbalance(r, s), pieceLo, pieceHi, { tolerance: 1e-7, maxIterations: 100 });
      }
      pieceLo = pieceHi;
    }
    lo = end;
    i += 1;
  }
  return T;
}

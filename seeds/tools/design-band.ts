// The design tool's own arithmetic for the spring rule, so the demo data can be laid out before and apart from the
// engine: a spring suits a load when the preload that puts rider sag on target is inside the adjuster's range and
// the static sag that follows is within the tolerance of its target. The demo grid test checks the result with the engine.
import { createLeverageCurve, leverageRatioAt, shockTravelAt, solveShockEquilibrium, type LeverageCurve } from '../../shared/engine/leverage';
import { loadSplit } from '../../shared/engine/statics';
import type { Load } from '../../shared/engine/types';
import { g } from '../../shared/units';

export interface EndDesign {
  end: 'fork' | 'shock';
  /** Own sprung weight on this wheel, N. */
  bikeLoadN: number;
  /** The rider's (and passenger's) weight on this wheel, N. */
  riderLoadN: number;
  targets: { staticSagMm: number; riderSagMm: number };
  toleranceMm: number;
  /** Preload range of a spring as long as the stock one, mm (shock or fork axis). */
  preloadRangeMm: { min: number; max: number };
  /** Fork: cos θ; shock: the leverage curve. */
  cosAngle?: number;
  curve?: LeverageCurve;
  /** Springs in parallel: 2 fork legs, or 1–2 shocks. */
  count: number;
  travelMm: number;
}

export interface Band {
  min: number;
  max: number;
}

/** Preload (spring axis) that puts rider sag on target with a spring of rate k, mm. */
export function preloadForRiderSag(e: EndDesign, k: number): number {
  const total = e.bikeLoadN + e.riderLoadN;
  if (e.end === 'fork') return (e.cosAngle! * total) / (e.count * k) - e.targets.riderSagMm;
  const c = e.curve!;
  return (leverageRatioAt(c, e.targets.riderSagMm) * total) / (e.count * k) - shockTravelAt(c, e.targets.riderSagMm);
}

/** Static sag with rate k and preload p, mm on the targets' axis. */
export function staticSag(e: EndDesign, k: number, p: number): number {
  if (e.end === 'fork') return Math.min(e.travelMm, Math.max(0, (e.cosAngle! * e.bikeLoadN) / (e.count * k) - p));
  return solveShockEquilibrium(e.curve!, { rateNPerMm: e.count * k, preloadMm: p, wheelForceN: e.bikeLoadN, wheelTravelMm: e.travelMm });
}

/** The rule: preload for rider sag inside the range (offset by the spring's extra free length) and static sag within tolerance. */
export function suits(e: EndDesign, k: number, extraFreeLengthMm = 0): boolean {
  const p = preloadForRiderSag(e, k);
  if (p < e.preloadRangeMm.min + extraFreeLengthMm || p > e.preloadRangeMm.max + extraFreeLengthMm) return false;
  return Math.abs(staticSag(e, k, p) - e.targets.staticSagMm) <= e.toleranceMm;
}

/**
 * The rates that suit a load. With a constant ratio (or a fork) in closed form: rider − static sag = LR²·W/(n·k)
 * at the rear and cos θ·W/(n·k) at the fork, so the static window gives k between LR²·W/(n·(D + t)) and
 * LR²·W/(n·(D − t)) with D = rider − static target; the preload range gives k between LR·F_t/(n·(p_max + s_r/LR))
 * and LR·F_t/(n·(p_min + s_r/LR)). On a curve the edges are found by bisection on the same rule.
 */
export function rateBand(e: EndDesign): Band | null {
  const { staticSagMm: S, riderSagMm: R } = e.targets;
  const t = e.toleranceMm;
  const D = R - S;
  const total = e.bikeLoadN + e.riderLoadN;
  const flat = e.end === 'fork' || e.curve!.flat;
  if (flat) {
    const a = e.end === 'fork' ? e.cosAngle! : e.curve!.ratio[0]!;
    const sq = e.end === 'fork' ? a : a * a;
    const rs = e.end === 'fork' ? R : R / a;
    const lo = Math.max((sq * e.riderLoadN) / (e.count * (D + t)), (a * total) / (e.count * (e.preloadRangeMm.max + rs)));
    const hiStatic = D - t > 0 ? (sq * e.riderLoadN) / (e.count * (D - t)) : Infinity;
    const hi = Math.min(hiStatic, (a * total) / (e.count * Math.max(1e-9, e.preloadRangeMm.min + rs)));
    return lo <= hi ? { min: lo, max: hi } : null;
  }
  // Static sag rises with k (less preload is needed) and the preload needed falls with k, so the suiting rates are one interval.
  const grid = Array.from({ length: 400 }, (_, i) => 1.02 ** i);
  const inside = grid.filter((k) => suits(e, k));
  if (!inside.length) return null;
  const edge = (good: number, bad: number) => {
    for (let i = 0; i < 50; i++) {
      const mid = Math.sqrt(good * bad);
      if (suits(e, mid)) good = mid;
      else bad = mid;
    }
    return good;
  };
  const min = edge(inside[0]!, inside[0]! / 1.02);
  const max = edge(inside[inside.length - 1]!, inside[inside.length - 1]! * 1.02);
  return { min, max };
}

/** Wheel loads of the added masses on one end, N. */
export function riderLoadOn(end: 'fork' | 'shock', wheelbaseMm: number, loads: Load[]): number {
  const s = loadSplit(wheelbaseMm, loads);
  return end === 'fork' ? s.frontN : s.rearN;
}

export { createLeverageCurve, g };

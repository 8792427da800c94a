import { g } from '../units';
import { computeForkSpring, forkSag } from './fork';
import { createLeverageCurve, solveShockEquilibrium } from './leverage';
import { computeRearSpring } from './rear';
import { loadSplit } from './statics';
import type { ForkSpringInput, Load, RearSpringInput, SpringCandidateResult } from './types';

export interface SagCurvePoint {
  /** Riders, gear and luggage together, kg, placed where the rider's own load sits. */
  addedKg: number;
  riderSagMm: number;
}

/** One spring's predicted rider sag over a range of added load, with the preload set for the rider's own load. */
export interface SagCurve {
  id: string;
  rateNPerMm: number;
  preloadMm: number;
  points: SagCurvePoint[];
}

/**
 * The end's added wheel load for `addedKg` spread like `loads` (same centre of mass): it scales linearly, since the
 * positions stay put.
 */
function wheelLoadPerKg(wheelbaseMm: number, loads: readonly Load[], end: 'front' | 'rear'): number {
  const total = loads.reduce((s, l) => s + l.massKg, 0);
  if (!(total > 0)) throw new RangeError('A sag sweep needs some added load to take its centre of mass from');
  const split = loadSplit(wheelbaseMm, loads);
  return (end === 'rear' ? split.rearN : split.frontN) / total;
}

function pick(candidates: readonly SpringCandidateResult[], ids: readonly string[] | undefined): SpringCandidateResult[] {
  return ids === undefined ? [...candidates] : ids.flatMap((id) => candidates.filter((c) => c.id === id));
}

/**
 * Predicted rider sag at the wheel against added load for each spring, the preload staying where the engine set it
 * for the rider's own load: the curve a rider reads to see how far a heavier or lighter load moves the sag.
 * With a constant ratio LR and one shock it is static sag + LR²·W_r/k (W_r the load's share on the rear wheel).
 * @example rearSagSweep(rearSpringExample(), [0, 50, 100], ['R-58'])[0].points[0].riderSagMm // the static sag
 */
export function rearSagSweep(input: RearSpringInput & { loads: Load[]; cases?: undefined }, addedKg: readonly number[], springIds?: readonly string[]): SagCurve[] {
  const result = computeRearSpring(input);
  const curve = createLeverageCurve(input.leverageRatio);
  const bikeLoadN = g * input.sprungMassKg;
  const perKg = wheelLoadPerKg(input.wheelbaseMm, input.loads, 'rear');
  const shocks = input.shockCount ?? 1;
  return pick(result.candidates, springIds).map((c) => ({
    id: c.id,
    rateNPerMm: c.rateNPerMm,
    preloadMm: c.preloadMm,
    points: addedKg.map((kg) => ({
      addedKg: kg,
      riderSagMm: solveShockEquilibrium(curve, { rateNPerMm: shocks * c.rateNPerMm, preloadMm: c.preloadMm, wheelForceN: bikeLoadN + perKg * kg, wheelTravelMm: input.wheelTravelMm }),
    })),
  }));
}

/**
 * The fork's counterpart of `rearSagSweep`: sag along the tubes, cos θ·F/(n·k) − preload, for each added load.
 * @example forkSagSweep(forkSpringExample(), [0, 80])[0].points[1].riderSagMm
 */
export function forkSagSweep(input: ForkSpringInput & { loads: Load[]; cases?: undefined }, addedKg: readonly number[], springIds?: readonly string[]): SagCurve[] {
  const result = computeForkSpring(input);
  const bikeLoadN = g * input.sprungMassKg;
  const perKg = wheelLoadPerKg(input.wheelbaseMm, input.loads, 'front');
  const model = { cosAngle: Math.cos((input.forkAngleDeg * Math.PI) / 180), springCount: input.springCount ?? 2, forkTravelMm: input.forkTravelMm };
  return pick(result.candidates, springIds).map((c) => ({
    id: c.id,
    rateNPerMm: c.rateNPerMm,
    preloadMm: c.preloadMm,
    points: addedKg.map((kg) => ({ addedKg: kg, riderSagMm: forkSag(model, c.rateNPerMm, bikeLoadN + perKg * kg, c.preloadMm) })),
  }));
}

/** Evenly spaced added loads from 0 to `maxKg` in `steps` steps, for a chart's x axis. */
export function loadSteps(maxKg: number, steps = 24): number[] {
  return Array.from({ length: steps + 1 }, (_, i) => (maxKg * i) / steps);
}

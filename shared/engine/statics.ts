import { g } from '../units';
import { EngineInputError } from './errors';
import type { Load } from './types';

/** Added axle loads from a set of masses, N. */
export interface LoadSplit {
  /** W_r = g·Σ m·x / L; more than the total weight when a load sits behind the rear axle. */
  rearN: number;
  /** W_f = g·Σ m·(L − x) / L; negative when a load behind the rear axle lifts the front. */
  frontN: number;
  totalN: number;
}

/**
 * Splits added masses between the axles by moments about the front axle (rigid beam on two supports).
 * Positions are measured rearward from the front axle; beyond the wheelbase is behind the rear axle.
 * @example loadSplit(1500, [{ massKg: 80, positionMm: 900 }]) // { rearN: 470.7..., frontN: 313.8..., totalN: 784.5... }
 */
export function loadSplit(wheelbaseMm: number, loads: readonly Load[]): LoadSplit {
  if (!(wheelbaseMm > 0)) throw new RangeError('Wheelbase must be positive');
  let mass = 0;
  let moment = 0;
  let frontMoment = 0;
  for (const l of loads) {
    mass += l.massKg;
    moment += l.massKg * l.positionMm;
    // Moments about the rear axle too, so a load exactly on it gives the front exactly 0, not a rounding residue.
    frontMoment += l.massKg * (wheelbaseMm - l.positionMm);
  }
  const totalN = g * mass;
  return { rearN: (g * moment) / wheelbaseMm, frontN: (g * frontMoment) / wheelbaseMm, totalN };
}

/**
 * Share of one load carried by the rear axle: position / wheelbase (above 1 behind the rear axle).
 * @example rearShare(1500, 1750) // 1.1666...
 */
export function rearShare(wheelbaseMm: number, positionMm: number): number {
  return positionMm / wheelbaseMm;
}

const unloadedWording = {
  front: { wheel: 'front', beyond: 'behind the rear axle', at: 'at or behind the rear axle', spring: 'fork spring', sag: 'fork sag' },
  rear: { wheel: 'rear', beyond: 'ahead of the front axle', at: 'at or ahead of the front axle', spring: 'shock spring', sag: 'rear sag' },
} as const;

/**
 * Refuses loads that add no weight to an end, or lift its wheel: rider sag deeper than static sag then needs
 * a spring rate of 0 or less. Throws EngineInputError on `loads`.
 * @example requireLoadOnEnd('rear', 931, 0) // throws: the loads put no weight on the rear wheel
 */
export function requireLoadOnEnd(end: 'front' | 'rear', bikeLoadN: number, addedLoadN: number): void {
  if (addedLoadN > 0) return;
  const w = unloadedWording[end];
  throw new EngineInputError(
    'loads',
    bikeLoadN + addedLoadN <= 0
      ? `The loads ${w.beyond} lift the ${w.wheel} wheel off the ground, so there is no ${w.sag} to set.`
      : `The loads put no weight on the ${w.wheel} wheel (they sit ${w.at}), so no ${w.spring} can give a rider sag deeper than the static sag.`,
  );
}

import type { SpringCandidateResult, SpringReason } from '@shared/engine/types';
import { nPerMmToKgfPerMm, nPerMmToLbfPerIn } from '@shared/units';
import { formatLength, type UnitSystem } from '@shared/length-format';
import { formatNumber } from './format';

export interface StaticTarget {
  staticSagMm: number;
  riderSagMm: number;
  staticSagToleranceMm: number;
}

type Judged = Pick<SpringCandidateResult, 'reason' | 'preloadNeededMm' | 'preloadRangeMm' | 'staticSagMm' | 'riderSagMm' | 'coilBindMarginMm'>;

/** Our own words for why a spring got its verdict, with the figures behind it, so colour is never the only carrier. */
export function reasonInWords(c: Judged, t: StaticTarget, system: UnitSystem = 'metric'): string {
  const mm = (v: number) => formatLength(v, system);
  const target = `target ${mm(t.staticSagMm)} ± ${system === 'metric' ? formatNumber(t.staticSagToleranceMm, 1) : mm(t.staticSagToleranceMm)}`;
  const words: Record<SpringReason, () => string> = {
    'on-target': () => `Sits ${mm(c.staticSagMm)} down on its own weight (${target}) and ${mm(c.riderSagMm)} with you aboard.`,
    'preload-above-range': () => `Needs ${mm(c.preloadNeededMm)} of preload to hold your sag; the adjuster gives at most ${mm(c.preloadRangeMm.max)}.`,
    'preload-below-range': () => `Would need only ${mm(Math.max(0, c.preloadNeededMm))} of preload; the adjuster gives at least ${mm(c.preloadRangeMm.min)}, so the bike would sit too high.`,
    'does-not-settle': () => 'On this linkage the bike would sink past the rider-sag target instead of resting on it.',
    'topped-out': () => 'Would sit topped out on its own weight, with no static sag at all.',
    'static-sag-low': () => `Sits only ${mm(c.staticSagMm)} down on its own weight, ${target}.`,
    'static-sag-high': () => `Sinks ${mm(c.staticSagMm)} on its own weight, ${target}.`,
    'coil-bind': () => `Its coils would touch ${mm(Math.abs(c.coilBindMarginMm ?? 0))} before full travel.`,
  };
  return words[c.reason]();
}

/**
 * "Rates from X to Y suit this load" in the rider's units (kgf/mm or lbf/in) with N/mm beside them.
 * @example rateBandInWords({ min: 79.17, max: 91.15 }, 'metric') // "Rates from 8.07 to 9.29 kgf/mm (79.2–91.2 N/mm) suit this load."
 */
export function rateBandInWords(band: { min: number; max: number } | undefined, system: 'metric' | 'imperial'): string {
  if (!band) return 'No rate suits this load within the adjuster’s range and the static-sag tolerance.';
  const shown =
    system === 'metric'
      ? `${formatNumber(nPerMmToKgfPerMm(band.min), 2)} to ${formatNumber(nPerMmToKgfPerMm(band.max), 2)} kgf/mm`
      : `${formatNumber(nPerMmToLbfPerIn(band.min), 0)} to ${formatNumber(nPerMmToLbfPerIn(band.max), 0)} lbf/in`;
  return `Rates from ${shown} (${formatNumber(band.min, 1)}–${formatNumber(band.max, 1)} N/mm) suit this load.`;
}

import { describe, expect, it } from 'vitest';
import { unit } from 'mathjs';
import { formatLength } from '@shared/length-format';
import { rateBandInWords, reasonInWords } from './spring-reasons';

const target = { staticSagMm: 8, riderSagMm: 32, staticSagToleranceMm: 3 };
const base = { preloadNeededMm: 9, preloadRangeMm: { min: 2, max: 16 }, staticSagMm: 4, riderSagMm: 32 };

describe('the finder says why, in words', () => {
  it('names the static sag and its target for a spring that sits too high on its own weight', () => {
    expect(reasonInWords({ ...base, reason: 'static-sag-low' }, target)).toBe('Sits only 4\u202fmm down on its own weight, target 8\u202fmm ± 3.');
  });

  it('names the preload asked for and the adjuster’s end for a spring out of range', () => {
    expect(reasonInWords({ ...base, preloadNeededMm: 21, reason: 'preload-above-range' }, target)).toMatch(/21\u202fmm of preload.*at most 16\u202fmm/);
  });

  it('gives an lb rider each length in inches first, written by the one shared length formatter the setup sheet uses', () => {
    const words = reasonInWords({ ...base, reason: 'static-sag-low' }, target, 'imperial');
    expect(words).toBe(`Sits only ${formatLength(4, 'imperial')} down on its own weight, target ${formatLength(8, 'imperial')} ± ${formatLength(3, 'imperial')}.`);
    // 4 mm = 0.157 in (mathjs; 1 in = 25.4 mm exactly), shown to 0.01.
    expect(words).toContain(`${Number(unit(4, 'mm').toNumber('in').toFixed(2))}\u202fin (4\u202fmm)`);
  });

  it('says the band in kgf/mm or lbf/in with N/mm beside it (1 kgf/mm = 9.80665 N/mm and 1 lbf/in = 0.175127 N/mm, by definition of the units)', () => {
    expect(rateBandInWords({ min: 9.80665 * 8, max: 9.80665 * 9 }, 'metric')).toBe('Rates from 8 to 9 kgf/mm (78.5–88.3 N/mm) suit this load.');
    expect(rateBandInWords({ min: 0.17512683524647636 * 450, max: 0.17512683524647636 * 520 }, 'imperial')).toMatch(/^Rates from 450 to 520 lbf\/in/);
    expect(rateBandInWords(undefined, 'metric')).toMatch(/No rate suits this load/);
  });
});

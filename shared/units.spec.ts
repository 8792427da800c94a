import { describe, expect, it } from 'vitest';
import { unit } from 'mathjs';
import { convert, unitFactors, unitFactorsModule } from './unit-factors';
import {
  ftLbfToNm,
  g,
  inToMm,
  kgfPerMmToNPerMm,
  kgToLb,
  lbfPerInToNPerMm,
  lbfToN,
  lbToKg,
  mmToIn,
  nmToFtLbf,
  nPerMmToKgfPerMm,
  nPerMmToLbfPerIn,
  nToLbf,
  rateInUnits,
  weightN,
} from './units';

/** Relative closeness: NIST SP 811 prints 7 significant digits, so 1e-6 covers its rounding. */
const closeRel = (actual: number, expected: number, rel = 1e-6): void => {
  expect(Math.abs(actual - expected) / Math.abs(expected)).toBeLessThanOrEqual(rel);
};

describe('unit conversions against NIST SP 811 (2008), Appendix B.8/B.9, tolerance 1e-6 relative', () => {
  it('converts one pound-force to 4.448222 N', () => {
    closeRel(lbfToN(1), 4.448222);
    closeRel(nToLbf(4.448222), 1);
  });

  it('converts one lbf/in to 175.1268 N/m, i.e. 0.1751268 N/mm', () => {
    closeRel(lbfPerInToNPerMm(1), 0.1751268);
    closeRel(nPerMmToLbfPerIn(0.1751268), 1);
  });

  it('converts one foot pound-force to 1.355818 N·m', () => {
    closeRel(ftLbfToNm(1), 1.355818);
    closeRel(nmToFtLbf(1.355818), 1);
  });

  it('takes one kilogram-force as exactly 9.80665 N, the same g as the engine', () => {
    expect(g).toBe(9.80665);
    closeRel(kgfPerMmToNPerMm(1), 9.80665, 1e-12);
    closeRel(nPerMmToKgfPerMm(9.80665), 1, 1e-12);
  });

  it('converts one avoirdupois pound (mass) to 0.4535924 kg', () => {
    closeRel(lbToKg(1), 0.4535924);
    closeRel(kgToLb(0.4535924), 1);
  });

  it('converts one inch to exactly 25.4 mm', () => {
    closeRel(inToMm(1), 25.4, 1e-12);
    closeRel(mmToIn(25.4), 1, 1e-12);
  });
});

describe('mathjs cross-check (direct mathjs calls against the same NIST SP 811 factors, 1e-6 relative)', () => {
  it('agrees with mathjs on force, rate, torque and mass', () => {
    closeRel(unit(1, 'lbf').toNumber('N'), 4.448222);
    closeRel(unit(1, 'lbf/in').toNumber('N/m'), 175.1268);
    closeRel(unit(1, 'ft lbf').toNumber('N m'), 1.355818);
    closeRel(unit(1, 'kgf').toNumber('N'), 9.80665, 1e-12);
    closeRel(unit(1, 'lb').toNumber('kg'), 0.4535924);
    closeRel(convert(58, 'N/mm', 'lbf/in'), unit(58, 'N/mm').toNumber('lbf/in'), 1e-12);
  });

  it('ships to browsers the very factors mathjs gives, as literals the client build puts in place of mathjs', async () => {
    const shipped = (await import(`data:text/javascript,${encodeURIComponent(unitFactorsModule())}`)) as { unitFactors: typeof unitFactors };
    expect(shipped.unitFactors).toEqual(unitFactors);
    expect(shipped.unitFactors.nPerMmToLbfPerIn).toBe(unit(1, 'N/mm').toNumber('lbf/in'));
    expect(shipped.unitFactors.kgToLb).toBe(unit(1, 'kg').toNumber('lb'));
  });

  it('refuses to turn a mass (lb) into a force (lbf)', () => {
    expect(() => convert(1, 'lb', 'lbf')).toThrow();
  });

  it('gives a rate in N/mm, kgf/mm and lbf/in at once', () => {
    const r = rateInUnits(58);
    expect(r.nPerMm).toBe(58);
    closeRel(r.kgfPerMm, 58 / 9.80665, 1e-12);
    closeRel(r.lbfPerIn, 58 / 0.1751268);
  });

  it('weighs an 80 kg rider at 784.532 N with standard gravity', () => {
    closeRel(weightN(80), 784.532, 1e-12);
  });
});

describe('facts of the trade (common practice, no published source)', () => {
  it('reads a 33 ft·lbf torque spec as about 44.7 N·m (±0.05 N·m)', () => {
    expect(Math.abs(ftLbfToNm(33) - 44.7)).toBeLessThan(0.05);
  });
});

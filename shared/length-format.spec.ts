import { describe, expect, it } from 'vitest';
import { unit } from 'mathjs';
import { formatInches, formatLength, formatLengthChange } from './length-format';

/** The figures of a formatted length, read back as numbers: [first, second-in-brackets]. */
const figures = (text: string): number[] => [...text.matchAll(/[−+-]?[\d,]+(?:\.\d+)?/g)].map((m) => Number(m[0].replace(/,/g, '').replace('−', '-')));

describe('lengths in the rider’s units', () => {
  it('writes mm alone for a kg rider', () => {
    expect(formatLength(12.46, 'metric')).toBe('12.5\u202fmm');
    expect(formatLength(600, 'metric', { gap: ' ' })).toBe('600 mm');
  });

  it('writes inches first with mm in brackets for an lb rider, the inches agreeing with mathjs to the shown decimals', () => {
    for (const mm of [0.3, 4.2, 12.5, 25.4, 33.33, 71.6, 287, 600, 1234.5]) {
      const text = formatLength(mm, 'imperial');
      expect(text).toMatch(/^[\d,.]+\u202fin \([\d,.]+\u202fmm\)$/);
      const [inches, back] = figures(text);
      // mathjs's own unit conversion (1 in = 25.4 mm exactly: NIST SP 811, 2008, appendix B.8) rounded to 2 decimals.
      expect(inches).toBeCloseTo(unit(mm, 'mm').toNumber('in'), 2);
      expect(Math.abs(inches! - unit(mm, 'mm').toNumber('in'))).toBeLessThanOrEqual(0.005 + 1e-12);
      expect(back).toBeCloseTo(mm, 1);
    }
  });

  it('writes mm first with inches in brackets on a sheet that carries both', () => {
    const text = formatLength(254, 'both', { gap: ' ', mmDecimals: 1 });
    // 254 mm = 10 in exactly (NIST SP 811, 2008, appendix B.8: 1 in = 0.0254 m).
    expect(text).toBe('254 mm (10 in)');
  });

  it('honours the decimals asked for in each unit', () => {
    const text = formatLength(30.48, 'imperial', { inDecimals: 3, mmDecimals: 0 });
    expect(text).toBe(`${Number(unit(30.48, 'mm').toNumber('in').toFixed(3))}\u202fin (30\u202fmm)`);
  });

  it('writes the inch figure alone for a hint beside a reading typed in mm', () => {
    // 600 mm = 23.622 in (mathjs; 1 in = 25.4 mm exactly).
    expect(formatInches(600)).toBe(`${unit(600, 'mm').toNumber('in').toFixed(2)}\u202fin`);
    expect(formatInches(600)).toBe('23.62\u202fin');
  });

  it('writes an em dash for no figure', () => {
    expect(formatLength(null, 'metric')).toBe('—');
    expect(formatLength(Number.NaN, 'imperial')).toBe('—');
  });

  it('signs a change in each unit, and leaves a change that rounds to zero unsigned', () => {
    expect(formatLengthChange(5, 'metric')).toBe('+5\u202fmm');
    expect(formatLengthChange(-5, 'imperial')).toBe(`−${Number(unit(5, 'mm').toNumber('in').toFixed(2))}\u202fin (−5\u202fmm)`);
    expect(formatLengthChange(0.01, 'metric')).toBe('0\u202fmm');
    // 1 mm is 0.04 in: both figures are signed.
    expect(formatLengthChange(1, 'imperial')).toBe('+0.04\u202fin (+1\u202fmm)');
  });

  it('never writes a negative zero', () => {
    expect(formatLength(-0.01, 'imperial')).toBe('0\u202fin (0\u202fmm)');
  });
});

import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { divideRounded, lineTotalCents, sumCents, vatIncludedCents } from './money';

describe('money in integer cents', () => {
  it('the VAT inside a gross price at 20 % is one sixth of it', () => {
    // HMRC VAT Notice 700, "VAT fraction": 1/6 at the 20 % standard rate (from memory).
    expect(vatIncludedCents(12_000, 2000)).toBe(2000);
    expect(vatIncludedCents(600, 2000)).toBe(100);
  });

  it('the VAT inside a gross price at 19 % is 19/119 of it, rounded to the cent', () => {
    // Tax-inclusive price: VAT = gross × rate / (100 + rate); 119.00 gross at 19 % holds 19.00 VAT (common practice).
    expect(vatIncludedCents(11_900, 1900)).toBe(1900);
    // 100.00 gross: 100 × 19/119 = 15.966… → 15.97.
    expect(vatIncludedCents(10_000, 1900)).toBe(1597);
  });

  it('rounds half away from zero without floats', () => {
    expect(divideRounded(5, 2)).toBe(3);
    expect(divideRounded(-5, 2)).toBe(-3);
    expect(divideRounded(4, 3)).toBe(1);
  });

  it('net plus VAT gives back the gross for every amount and rate', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 10_000_000 }), fc.integer({ min: 0, max: 3000 }), (gross, bp) => {
        const vat = vatIncludedCents(gross, bp);
        const net = gross - vat;
        // The net re-taxed lands within half a cent of the gross (exact rational check).
        expect(Math.abs(net * (10_000 + bp) - gross * 10_000)).toBeLessThanOrEqual((10_000 + bp) / 2);
      }),
    );
  });

  it('refuses fractions of a cent and fractional quantities', () => {
    expect(() => sumCents([1.5])).toThrow(RangeError);
    expect(() => lineTotalCents(100, 1.5)).toThrow(RangeError);
    expect(lineTotalCents(14_900, 2)).toBe(29_800);
  });
});

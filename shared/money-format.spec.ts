import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { formatMoney } from './money-format';

describe('formatMoney', () => {
  it('formats integer cents as euros with two decimals (ISO 4217: EUR has 2 minor-unit digits)', () => {
    expect(formatMoney(123456, 'EUR')).toBe('€1,234.56');
    expect(formatMoney(100, 'EUR')).toBe('€1.00');
    expect(formatMoney(5, 'EUR')).toBe('€0.05');
    expect(formatMoney(0, 'EUR')).toBe('€0.00');
    expect(formatMoney(-250, 'EUR')).toBe('-€2.50');
  });

  it('keeps every digit of amounts a float division would round (0.1 + 0.2 style errors cannot occur)', () => {
    // 2^53 - 1 cents: as a double, this many euros is not exact; built from the integer, no rounding is involved.
    expect(formatMoney(Number.MAX_SAFE_INTEGER, 'EUR')).toBe('€90,071,992,547,409.91');
    expect(formatMoney(1_000_000_001, 'EUR')).toBe('€10,000,000.01');
  });

  it('follows the currency’s minor unit (ISO 4217: JPY 0 digits, KWD 3 digits)', () => {
    expect(formatMoney(1234, 'JPY')).toMatch(/^JP¥1,234$/);
    expect(formatMoney(1234, 'KWD')).toMatch(/1\.234$/);
  });

  it('refuses amounts that are not whole minor units', () => {
    expect(() => formatMoney(12.5, 'EUR')).toThrow(RangeError);
    expect(() => formatMoney(Number.NaN, 'EUR')).toThrow(RangeError);
  });

  it('for any whole amount, the digits shown are exactly the cents given', () => {
    fc.assert(
      fc.property(fc.integer({ min: -1e12, max: 1e12 }), (cents) => {
        const shown = formatMoney(cents, 'EUR');
        const digits = shown.replace(/[^0-9]/g, '');
        expect(BigInt(digits) * (cents < 0 ? -1n : 1n)).toBe(BigInt(cents));
        expect(shown.startsWith('-')).toBe(cents < 0);
      }),
    );
  });
});

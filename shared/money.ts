/** Money is integer minor units (cents) with a currency code; every sum in the shop goes through here. */
export type CurrencyCode = 'EUR';

export interface Money {
  cents: number;
  currency: CurrencyCode;
}

/** Refuses anything that is not a whole, safe number of cents, so a float never sneaks into a total. */
export function assertCents(cents: number, what = 'amount'): number {
  if (!Number.isSafeInteger(cents)) throw new RangeError(`${what} must be a whole number of cents, got ${cents}`);
  return cents;
}

/**
 * Sums amounts in cents.
 * @example sumCents([1999, 1]) // 2000
 */
export function sumCents(amounts: readonly number[]): number {
  let total = 0;
  for (const a of amounts) total += assertCents(a);
  return assertCents(total, 'total');
}

/**
 * A unit price times a whole quantity.
 * @example lineTotalCents(14900, 2) // 29800
 */
export function lineTotalCents(unitPriceCents: number, quantity: number): number {
  assertCents(unitPriceCents, 'unit price');
  if (!Number.isSafeInteger(quantity) || quantity < 0) throw new RangeError(`quantity must be a whole number ≥ 0, got ${quantity}`);
  return assertCents(unitPriceCents * quantity, 'line total');
}

/** Integer division rounding half away from zero, without floats. */
export function divideRounded(numerator: number, denominator: number): number {
  if (!Number.isSafeInteger(numerator) || !Number.isSafeInteger(denominator) || denominator <= 0) throw new RangeError('whole numbers with a positive divisor only');
  const sign = numerator < 0 ? -1 : 1;
  const n = Math.abs(numerator);
  const q = Math.floor(n / denominator);
  const r = n - q * denominator;
  return sign * (2 * r >= denominator ? q + 1 : q);
}

/**
 * The VAT inside a VAT-inclusive gross amount: gross × rate / (1 + rate), rate in basis points (2000 = 20 %).
 * @example vatIncludedCents(12000, 2000) // 2000
 */
export function vatIncludedCents(grossCents: number, rateBasisPoints: number): number {
  assertCents(grossCents, 'gross amount');
  if (!Number.isSafeInteger(rateBasisPoints) || rateBasisPoints < 0) throw new RangeError('VAT rate must be whole basis points ≥ 0');
  return divideRounded(grossCents * rateBasisPoints, 10_000 + rateBasisPoints);
}

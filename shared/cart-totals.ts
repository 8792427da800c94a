import { lineTotalCents, sumCents, vatIncludedCents, type CurrencyCode } from './money';

/** The shop's pricing figures the totals depend on (seeded shop settings; editable by the admin later). */
export interface PricingSettings {
  currency: CurrencyCode;
  /** VAT rate in basis points: 2000 = 20 %. Prices already include it. */
  vatRateBasisPoints: number;
  shippingFlatCents: number;
  /** Shipping is free when the goods come to at least this much. */
  freeShippingThresholdCents: number;
}

export interface PricedLine {
  unitPriceCents: number;
  quantity: number;
}

export interface CartTotals {
  currency: CurrencyCode;
  subtotalCents: number;
  shippingCents: number;
  /** The VAT contained in the total (goods and shipping), shown as its own line. */
  vatCents: number;
  totalCents: number;
  /** How much more would make shipping free; 0 once it is. */
  toFreeShippingCents: number;
}

/**
 * Totals of a cart or order: VAT-inclusive prices, VAT shown as the part of the total it is, flat shipping
 * that is free from a threshold; an empty cart costs nothing, shipping included. Client and server both call this.
 * @example cartTotals([{unitPriceCents: 5000, quantity: 1}], {currency: 'EUR', vatRateBasisPoints: 2000, shippingFlatCents: 600, freeShippingThresholdCents: 10000})
 * // {subtotalCents: 5000, shippingCents: 600, vatCents: 933, totalCents: 5600, toFreeShippingCents: 5000, currency: 'EUR'}
 */
export function cartTotals(lines: readonly PricedLine[], s: PricingSettings): CartTotals {
  const subtotalCents = sumCents(lines.map((l) => lineTotalCents(l.unitPriceCents, l.quantity)));
  const free = subtotalCents === 0 || subtotalCents >= s.freeShippingThresholdCents;
  const shippingCents = free ? 0 : s.shippingFlatCents;
  const totalCents = sumCents([subtotalCents, shippingCents]);
  return {
    currency: s.currency,
    subtotalCents,
    shippingCents,
    vatCents: vatIncludedCents(totalCents, s.vatRateBasisPoints),
    totalCents,
    toFreeShippingCents: subtotalCents === 0 ? 0 : Math.max(0, s.freeShippingThresholdCents - subtotalCents),
  };
}

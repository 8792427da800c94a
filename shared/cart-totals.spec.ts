import { describe, expect, it } from 'vitest';
import { cartTotals, type PricingSettings } from './cart-totals';

const shop: PricingSettings = { currency: 'EUR', vatRateBasisPoints: 2000, shippingFlatCents: 690, freeShippingThresholdCents: 15_000 };

describe('cart totals', () => {
  it('below the threshold, flat shipping is added and VAT is the sixth of the whole at 20 %', () => {
    const t = cartTotals([{ unitPriceCents: 4_900, quantity: 2 }], shop);
    expect(t.subtotalCents).toBe(9_800);
    expect(t.shippingCents).toBe(690);
    expect(t.totalCents).toBe(10_490);
    // 10 490 / 6 = 1 748.33 → 1 748 (VAT fraction 1/6 at 20 %, HMRC VAT Notice 700, from memory).
    expect(t.vatCents).toBe(1_748);
    expect(t.toFreeShippingCents).toBe(5_200);
  });

  it('at the threshold shipping is free', () => {
    const t = cartTotals([{ unitPriceCents: 15_000, quantity: 1 }], shop);
    expect(t.shippingCents).toBe(0);
    expect(t.totalCents).toBe(15_000);
    expect(t.vatCents).toBe(2_500);
    expect(t.toFreeShippingCents).toBe(0);
  });

  it('an empty cart costs nothing, not the shipping', () => {
    expect(cartTotals([], shop)).toMatchObject({ subtotalCents: 0, shippingCents: 0, totalCents: 0, vatCents: 0 });
  });
});

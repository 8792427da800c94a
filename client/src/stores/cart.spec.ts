import fc from 'fast-check';
import { createPinia, setActivePinia } from 'pinia';
import { describe, expect, it } from 'vitest';
import { cartTotals } from '@shared/cart-totals';
import type { CartDto } from '@shared/commerce/cart.dto';
import { totalsOf, useCartStore } from './cart';

const shop = { currency: 'EUR' as const, vatRateBasisPoints: 2000, shippingFlatCents: 690, freeShippingThresholdCents: 15_000, shopName: 'x', shopAddress: 'y', reservationMinutes: 30 };

describe('cart totals in the client', () => {
  it('are the shared computation the server answers with, for any cart', () => {
    // The server's cart answer carries cartTotals(lines, shop) (see cart.api.spec.ts); the client computes the same.
    fc.assert(
      fc.property(fc.array(fc.record({ unitPriceCents: fc.integer({ min: 0, max: 100_000 }), quantity: fc.integer({ min: 1, max: 20 }) }), { maxLength: 12 }), (lines) => {
        expect(totalsOf({ lines: lines as unknown as CartDto['lines'], shop })).toEqual(cartTotals(lines, shop));
      }),
    );
  });

  it('the header, drawer and pages show the totals of the cart the server sent', () => {
    setActivePinia(createPinia());
    const store = useCartStore();
    const lines = [{ unitPriceCents: 6_450, quantity: 2 }, { unitPriceCents: 1_200, quantity: 1 }];
    const answer = { lines, sets: [], shop, totals: cartTotals(lines, shop), itemCount: 3, currency: 'EUR' } as unknown as CartDto;
    store.set(answer);
    expect(store.totals).toEqual(answer.totals);
    expect(store.totals).toMatchObject({ subtotalCents: 14_100, shippingCents: 690, totalCents: 14_790, vatCents: 2_465 });
  });
});

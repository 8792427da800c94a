import { cartTotals, type CartTotals, type PricingSettings, type PricedLine } from '../../shared/cart-totals';
import type { ShopSettings } from '../shop/ShopSettings.entity';

/** The server's totals for a cart or an order: the shared computation with the shop's own figures. */
export function cartTotalsFor(lines: readonly PricedLine[], s: Pick<ShopSettings, keyof PricingSettings>): CartTotals {
  return cartTotals(lines, { currency: s.currency, vatRateBasisPoints: s.vatRateBasisPoints, shippingFlatCents: s.shippingFlatCents, freeShippingThresholdCents: s.freeShippingThresholdCents });
}

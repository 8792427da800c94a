import type { EntityManager } from 'typeorm';
import type { Config } from '../config';
import { enqueueMail } from '../mail/outbox';
import { orderCancelledMail, orderConfirmationMail, paymentFailedMail, refundMail, shippedMail, type OrderMailData } from '../mail/templates';
import { lineTotalCents } from '../../shared/money';
import { getShopSettings } from '../shop/shop-settings.service';
import { orderSetupSheetUrl, orderUrl } from './order-access';
import { orderLinesOf } from './order-dto';
import type { Order } from './Order.entity';

const cancelWords: Record<string, string> = {
  expired: 'The order was not paid within the time we hold stock for it, so the parts went back on the shelf.',
  'rider-cancelled': 'You cancelled the order.',
  'payment-unavailable': 'The payment service could not be reached, so nothing was charged.',
  replaced: 'You started a new checkout, which replaces this one.',
  'staff-cancelled': 'The shop cancelled the order.',
  refunded: 'The order was refunded in full.',
};

/** What every order mail shows, copied from the order (and its spring lines' setup figures) at the moment of the change. */
async function mailData(em: EntityManager, config: Config, o: Order): Promise<OrderMailData> {
  const lines = await orderLinesOf(em, o.id);
  const shop = await getShopSettings(em);
  const setup = lines.flatMap((l) =>
    l.setup
      ? [{
          end: l.setup.end,
          springName: l.setup.springName,
          rateNPerMm: l.setup.rateNPerMm,
          preloadMm: l.setup.preloadMm,
          ...(l.setup.adjusterTurns === undefined ? {} : { adjusterTurns: l.setup.adjusterTurns }),
          staticSagMm: l.setup.staticSagMm,
          riderSagMm: l.setup.riderSagMm,
          toleranceMm: l.setup.toleranceMm,
        }]
      : [],
  );
  return {
    orderNumber: o.number,
    orderUrl: orderUrl(config, o.id),
    ...(setup.length ? { setupSheetUrl: orderSetupSheetUrl(config, o.id) } : {}),
    customerName: o.customerName,
    shop: { name: shop.shopName, address: shop.shopAddress },
    currency: o.currency,
    lines: lines.map((l) => ({ name: l.name, sku: l.sku, quantity: l.quantity, unitPriceCents: l.unitPriceCents, lineTotalCents: l.lineTotalCents })),
    subtotalCents: o.subtotalCents,
    shippingCents: o.shippingCents,
    vatCents: o.vatCents,
    totalCents: o.totalCents,
    setup,
  };
}

/** Each mail is promised in the transaction of the change it reports; the dedupe key makes a repeat a no-op. */
export const orderMail = {
  async confirmed(em: EntityManager, config: Config, o: Order) {
    await enqueueMail(em, `order-confirmed:${o.id}`, { to: o.email, ...orderConfirmationMail(await mailData(em, config, o)) });
  },
  async paymentFailed(em: EntityManager, config: Config, o: Order, reason: string) {
    await enqueueMail(em, `payment-failed:${o.id}`, { to: o.email, ...paymentFailedMail({ ...(await mailData(em, config, o)), reason }) });
  },
  async cancelled(em: EntityManager, config: Config, o: Order) {
    const reason = cancelWords[o.cancelReason ?? ''] ?? 'The order was cancelled.';
    await enqueueMail(em, `order-cancelled:${o.id}`, { to: o.email, ...orderCancelledMail({ ...(await mailData(em, config, o)), reason }) });
  },
  /** One mail per parcel, listing what is in it, with the carrier and tracking number. */
  async shipped(em: EntityManager, config: Config, o: Order, parcel: { shipmentId: string; carrier: string; trackingNumber: string; lines: { orderLineId: string; quantity: number }[] }) {
    const data = await mailData(em, config, o);
    const all = await orderLinesOf(em, o.id);
    const lines = parcel.lines.flatMap((p) => {
      const l = all.find((x) => x.id === p.orderLineId);
      return l ? [{ name: l.name, sku: l.sku, quantity: p.quantity, unitPriceCents: l.unitPriceCents, lineTotalCents: lineTotalCents(l.unitPriceCents, p.quantity) }] : [];
    });
    await enqueueMail(em, `shipped:${parcel.shipmentId}`, { to: o.email, ...shippedMail({ ...data, lines, carrier: parcel.carrier, trackingNumber: parcel.trackingNumber }) });
  },
  async refunded(em: EntityManager, config: Config, o: Order, refundId: string, refundCents: number) {
    await enqueueMail(em, `refund:${refundId}`, { to: o.email, ...refundMail({ ...(await mailData(em, config, o)), refundCents }) });
  },
};

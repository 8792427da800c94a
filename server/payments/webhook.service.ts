import type { EntityManager } from 'typeorm';
import { expireReservation } from '../checkout/reservations';
import { applyExchangePaymentEvent, type ExchangeEventOutcome } from '../exchanges/exchange-payments';
import type { Config } from '../config';
import { AppDataSource } from '../db/data-source';
import { orderMail } from '../orders/order-mail';
import { lockOrder, moveOrder } from '../orders/order-moves';
import { recordProviderRefund } from '../orders/refunds.service';
import type { Order } from '../orders/Order.entity';
import type { ProviderEvent } from './payment-provider';

export type EventOutcome = ExchangeEventOutcome | 'duplicate' | 'unknown-order' | 'paid' | 'already-paid' | 'paid-after-cancel' | 'not-yet-paid' | 'failed' | 'expired' | 'refund-noted' | 'refund-recorded' | 'ignored' | 'no-change';

const str = (v: unknown) => (typeof v === 'string' ? v : null);

async function orderForSession(em: EntityManager, obj: Record<string, unknown>): Promise<Order | null> {
  const sessionId = str(obj.id);
  const bySession = sessionId ? await lockOrder(em, { paymentSessionId: sessionId }) : null;
  if (bySession) return bySession;
  // The session id is stored just after it is made; an event that outruns that finds the order by its reference.
  const ref = str(obj.client_reference_id);
  return ref && /^[0-9a-f-]{36}$/i.test(ref) ? lockOrder(em, { id: ref }) : null;
}

async function orderForIntent(em: EntityManager, obj: Record<string, unknown>, intentKey: 'id' | 'payment_intent'): Promise<Order | null> {
  const pi = str(obj[intentKey]);
  const byIntent = pi ? await lockOrder(em, { paymentIntentId: pi }) : null;
  if (byIntent) return byIntent;
  const ref = str((obj.metadata as Record<string, unknown> | undefined)?.orderId);
  return ref && /^[0-9a-f-]{36}$/i.test(ref) ? lockOrder(em, { id: ref }) : null;
}

async function markPaid(em: EntityManager, config: Config, o: Order, paymentIntentId: string | null): Promise<EventOutcome> {
  if (paymentIntentId) o.paymentIntentId = paymentIntentId;
  if (o.paymentStatus === 'paid' || o.paymentStatus === 'refunded' || o.paymentStatus === 'partially-refunded') return 'already-paid';
  if (o.status === 'cancelled') {
    // Money arrived for an order that no longer holds stock: recorded, then refunded after this commits.
    await moveOrder(em, o, { paymentStatus: 'paid' });
    return 'paid-after-cancel';
  }
  o.paymentFailure = null;
  await moveOrder(em, o, { paymentStatus: 'paid', status: 'confirmed' });
  // The cart lines this order bought are done with; anything added since stays.
  await em.query(
    `DELETE FROM cart_lines c USING order_lines l
      WHERE l.order_id = $1 AND c.cart_id = $2 AND c.product_id = l.product_id AND c.spring_set_id IS NOT DISTINCT FROM l.spring_set_id`,
    [o.id, o.cartId],
  );
  await orderMail.confirmed(em, config, o);
  return 'paid';
}

async function markFailed(em: EntityManager, config: Config, o: Order, reason: string): Promise<EventOutcome> {
  if (o.status !== 'pending' || (o.paymentStatus !== 'awaiting' && o.paymentStatus !== 'failed')) return 'no-change';
  o.paymentFailure = reason;
  await moveOrder(em, o, { paymentStatus: 'failed' });
  await orderMail.paymentFailed(em, config, o, reason);
  return 'failed';
}

async function apply(em: EntityManager, config: Config, event: ProviderEvent): Promise<{ outcome: EventOutcome; order: Order | null }> {
  const obj = event.object;
  // A payment page for an exchange's price difference refers to the exchange, not to an order.
  const forExchange = await applyExchangePaymentEvent(em, config, event);
  if (forExchange) return { outcome: forExchange, order: null };
  switch (event.type) {
    case 'checkout.session.completed':
    case 'checkout.session.async_payment_succeeded': {
      const o = await orderForSession(em, obj);
      if (!o) return { outcome: 'unknown-order', order: null };
      // A delayed payment method completes the session unpaid; the money is not there yet.
      if (obj.payment_status !== 'paid') return { outcome: 'not-yet-paid', order: o };
      return { outcome: await markPaid(em, config, o, str(obj.payment_intent)), order: o };
    }
    case 'checkout.session.expired': {
      const o = await orderForSession(em, obj);
      if (!o) return { outcome: 'unknown-order', order: null };
      return { outcome: (await expireReservation(em, config, o)) ? 'expired' : 'no-change', order: o };
    }
    case 'checkout.session.async_payment_failed': {
      const o = await orderForSession(em, obj);
      if (!o) return { outcome: 'unknown-order', order: null };
      return { outcome: await markFailed(em, config, o, 'The payment did not go through.'), order: o };
    }
    case 'payment_intent.payment_failed': {
      const o = await orderForIntent(em, obj, 'id');
      if (!o) return { outcome: 'unknown-order', order: null };
      if (str(obj.id) && !o.paymentIntentId) o.paymentIntentId = str(obj.id);
      const err = obj.last_payment_error as { message?: string } | undefined;
      return { outcome: await markFailed(em, config, o, err?.message ?? 'The payment was declined.'), order: o };
    }
    case 'charge.refunded': {
      // Refunds the shop makes are recorded when made (this only confirms them); one made on the provider's side is recorded here.
      const o = await orderForIntent(em, obj, 'payment_intent');
      if (!o) return { outcome: 'unknown-order', order: null };
      const refunds = (obj.refunds as { data?: { id?: unknown }[] } | undefined)?.data ?? [];
      const recorded = await recordProviderRefund(em, config, o, {
        amountRefundedCents: typeof obj.amount_refunded === 'number' && Number.isSafeInteger(obj.amount_refunded) ? obj.amount_refunded : 0,
        refundIds: refunds.map((r) => str(r.id)).filter((id): id is string => !!id),
      });
      return { outcome: recorded ? 'refund-recorded' : 'refund-noted', order: o };
    }
    default:
      return { outcome: 'ignored', order: null };
  }
}

/**
 * Handles one verified provider event exactly once: its id is recorded in the same transaction as the change it
 * causes, so a repeated delivery (or two at once) finds the record and changes nothing.
 */
export async function handlePaymentEvent(config: Config, event: ProviderEvent): Promise<{ outcome: EventOutcome; orderId: string | null }> {
  return AppDataSource.transaction(async (em) => {
    const [claimed] = (await em.query(
      `INSERT INTO payment_events (id, type, outcome) VALUES ($1, $2, 'processing') ON CONFLICT (id) DO NOTHING RETURNING id`,
      [event.id, event.type],
    )) as { id: string }[];
    if (!claimed) return { outcome: 'duplicate' as const, orderId: null };
    const { outcome, order } = await apply(em, config, event);
    await em.query(`UPDATE payment_events SET outcome = $2, order_id = $3 WHERE id = $1`, [event.id, outcome, order?.id ?? null]);
    return { outcome, orderId: order?.id ?? null };
  });
}

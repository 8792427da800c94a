import request from 'supertest';
import { describe, expect, it } from 'vitest';
import type { OrderDto } from '../../shared/commerce/order.dto';
import { AppDataSource } from '../db/data-source';
import { address, plainProduct, stockOf } from '../test/commerce-factories';
import { userWithToken } from '../test/factories';
import { eventually, paymentsApp, payOnPage, standinPort, type PaymentsApp } from '../test/payments-standin';

/** A guest's paid order: 2 × 30.00 plus 6.90 shipping = 66.90, paid with the test card on the stand-in's page. */
async function paidOrder() {
  const a = await paymentsApp();
  const p = await plainProduct(5, 3_000, 'Preload collar');
  const guest = request.agent(a.app);
  await guest.post('/api/cart/lines').send({ productId: p.id, quantity: 2 }).expect(201);
  const { orderId, paymentUrl } = (await guest.post('/api/checkout').send({ email: 'buyer@example.test', shippingAddress: address }).expect(201)).body as { orderId: string; paymentUrl: string };
  await payOnPage(paymentUrl, '4242424242424242');
  const paid = await eventually(async () => {
    const [o] = (await AppDataSource.query(`SELECT payment_status, payment_intent_id, total_cents FROM orders WHERE id = $1`, [orderId])) as { payment_status: string; payment_intent_id: string; total_cents: number }[];
    return o?.payment_status === 'paid' && o;
  }, 'the payment');
  return { a, p, orderId, paymentIntentId: paid.payment_intent_id, totalCents: paid.total_cents };
}

/** A person refunding on the payment service's own dashboard (the stand-in's dashboard route), outside the shop. */
async function refundOnDashboard(a: PaymentsApp, paymentIntentId: string, amountCents: number) {
  const res = await fetch(`http://127.0.0.1:${standinPort}/dashboard/payment_intents/${paymentIntentId}/refund`, {
    method: 'POST',
    headers: { Authorization: `Bearer ${a.secretKey}`, 'Content-Type': 'application/json' },
    body: JSON.stringify({ amount: amountCents }),
  });
  expect(res.status).toBe(200);
  return (await res.json()) as { id: string; amount: number };
}

const refundsOf = async (orderId: string) =>
  (await AppDataSource.query(`SELECT provider_refund_id, amount_cents, actor_id FROM refunds WHERE order_id = $1 ORDER BY created_at`, [orderId])) as { provider_refund_id: string; amount_cents: number; actor_id: string | null }[];
const refundMails = async () => ((await AppDataSource.query(`SELECT dedupe_key FROM mail_outbox WHERE dedupe_key LIKE 'refund:%'`)) as unknown[]).length;
const orderRow = async (id: string) =>
  ((await AppDataSource.query(`SELECT status, payment_status, refunded_cents, updated_at FROM orders WHERE id = $1`, [id])) as { status: string; payment_status: string; refunded_cents: number; updated_at: Date }[])[0]!;

const send = (a: PaymentsApp, payload: string) =>
  a.http.post('/api/payments/webhook').set('Content-Type', 'application/json').set('Stripe-Signature', a.stripe.webhooks.generateTestHeaderString({ payload, secret: a.webhookSecret })).send(payload);

/** charge.refunded as the service sends it: the charge's running refunded total and its refunds, newest first. */
function chargeRefunded(paymentIntentId: string, amountRefunded: number, refundIds: string[], id = `evt_test_${Math.random().toString(36).slice(2)}`) {
  return JSON.stringify({
    id, object: 'event', type: 'charge.refunded', api_version: '2026-10-28.endive', created: Math.floor(Date.now() / 1000), livemode: false,
    data: { object: { id: 'ch_test_1', object: 'charge', amount_refunded: amountRefunded, payment_intent: paymentIntentId, refunds: { object: 'list', data: refundIds.map((r) => ({ id: r, object: 'refund' })) } } },
  });
}

describe('a refund made on the payment service, outside the shop', () => {
  it('part of the money back on the dashboard: the order becomes partially refunded, the refund is recorded once with one mail, stock stays; the whole rest makes it refunded', async () => {
    const { a, p, orderId, paymentIntentId, totalCents } = await paidOrder();
    expect(totalCents).toBe(6_690);
    expect(await stockOf(p.id)).toBe(3);
    const first = await refundOnDashboard(a, paymentIntentId, 2_000);
    await eventually(async () => (await orderRow(orderId)).payment_status === 'partially-refunded', 'the refund event');
    expect(await orderRow(orderId)).toMatchObject({ status: 'confirmed', payment_status: 'partially-refunded', refunded_cents: 2_000 });
    expect(await refundsOf(orderId)).toEqual([{ provider_refund_id: first.id, amount_cents: 2_000, actor_id: null }]);
    expect(await refundMails()).toBe(1);
    // No goods came back: the shelf is as it was.
    expect(await stockOf(p.id)).toBe(3);

    // The same news again, once under a new event id and twice under one id: nothing more is recorded or mailed.
    const before = await orderRow(orderId);
    const again = chargeRefunded(paymentIntentId, 2_000, [first.id]);
    expect((await send(a, again)).body.outcome).toBe('refund-noted');
    expect((await send(a, again)).body.outcome).toBe('duplicate');
    expect((await send(a, chargeRefunded(paymentIntentId, 2_000, [first.id]))).body.outcome).toBe('refund-noted');
    expect(await orderRow(orderId)).toEqual(before);
    expect(await refundsOf(orderId)).toHaveLength(1);
    expect(await refundMails()).toBe(1);

    // The rest refunded on the dashboard too: the order is refunded in full, each refund recorded once.
    const second = await refundOnDashboard(a, paymentIntentId, totalCents - 2_000);
    await eventually(async () => (await orderRow(orderId)).payment_status === 'refunded', 'the second refund event');
    expect((await refundsOf(orderId)).map((r) => [r.provider_refund_id, r.amount_cents])).toEqual([[first.id, 2_000], [second.id, totalCents - 2_000]]);
    expect(await orderRow(orderId)).toMatchObject({ refunded_cents: totalCents });
    expect(await refundMails()).toBe(2);
    expect(await stockOf(p.id)).toBe(3);
  });

  it('the event for a refund the shop made itself records no second refund and sends no second mail', async () => {
    const { a, orderId } = await paidOrder();
    const staff = await userWithToken(a.config, 'staff');
    const refunded = (await a.http.post(`/api/staff/orders/${orderId}/refunds`).set(staff.auth).send({ restock: false, reason: 'Wrong size ordered' }).expect(201)).body as OrderDto;
    expect(refunded.paymentStatus).toBe('refunded');
    const event = await eventually(async () => {
      const [e] = (await AppDataSource.query(`SELECT outcome FROM payment_events WHERE type = 'charge.refunded' AND order_id = $1`, [orderId])) as { outcome: string }[];
      return e;
    }, 'the provider confirming the refund');
    expect(event.outcome).toBe('refund-noted');
    expect(await refundsOf(orderId)).toHaveLength(1);
    expect(await refundMails()).toBe(1);
  });
});

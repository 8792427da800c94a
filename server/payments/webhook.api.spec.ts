import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { AppDataSource } from '../db/data-source';
import { address, plainProduct } from '../test/commerce-factories';
import { paymentsApp, type PaymentsApp } from '../test/payments-standin';

async function pendingOrder() {
  const a = await paymentsApp();
  const p = await plainProduct(5, 4_000);
  const guest = request.agent(a.app);
  await guest.post('/api/cart/lines').send({ productId: p.id, quantity: 1 }).expect(201);
  const { orderId } = (await guest.post('/api/checkout').send({ email: 'g@example.test', shippingAddress: address }).expect(201)).body as { orderId: string };
  const [o] = (await AppDataSource.query(`SELECT payment_session_id FROM orders WHERE id = $1`, [orderId])) as { payment_session_id: string }[];
  return { a, orderId, sessionId: o!.payment_session_id };
}

function completedEvent(sessionId: string, orderId: string, id = `evt_test_${Math.random().toString(36).slice(2)}`) {
  return JSON.stringify({
    id,
    object: 'event',
    type: 'checkout.session.completed',
    api_version: '2026-10-28.endive',
    created: Math.floor(Date.now() / 1000),
    livemode: false,
    data: { object: { id: sessionId, object: 'checkout.session', status: 'complete', payment_status: 'paid', payment_intent: 'pi_test_webhook', client_reference_id: orderId, amount_total: 4_690 } },
  });
}

const send = (a: PaymentsApp, payload: string, secret = a.webhookSecret) =>
  a.http.post('/api/payments/webhook').set('Content-Type', 'application/json').set('Stripe-Signature', a.stripe.webhooks.generateTestHeaderString({ payload, secret })).send(payload);

const orderRow = async (id: string) =>
  ((await AppDataSource.query(`SELECT status, payment_status, paid_at, updated_at FROM orders WHERE id = $1`, [id])) as { status: string; payment_status: string; paid_at: Date; updated_at: Date }[])[0]!;

describe('payment webhook', () => {
  it('the same event delivered five times, two of them at once, changes the order once and promises one mail', async () => {
    const { a, orderId, sessionId } = await pendingOrder();
    const payload = completedEvent(sessionId, orderId);
    const first = await send(a, payload);
    expect(first.status).toBe(200);
    expect(first.body.outcome).toBe('paid');
    const after = await orderRow(orderId);
    const repeats = await Promise.all([send(a, payload), send(a, payload)]);
    repeats.push(await send(a, payload), await send(a, payload));
    expect(repeats.map((r) => [r.status, r.body.outcome])).toEqual(Array(4).fill([200, 'duplicate']));
    const now = await orderRow(orderId);
    expect(now).toMatchObject({ status: 'confirmed', payment_status: 'paid' });
    expect(now.paid_at.getTime()).toBe(after.paid_at.getTime());
    expect(now.updated_at.getTime()).toBe(after.updated_at.getTime());
    expect(await AppDataSource.query(`SELECT count(*)::int AS n FROM payment_events WHERE id = $1`, [JSON.parse(payload).id])).toEqual([{ n: 1 }]);
    expect(await AppDataSource.query(`SELECT dedupe_key FROM mail_outbox`)).toEqual([{ dedupe_key: `order-confirmed:${orderId}` }]);
  });

  it('a different event for the same payment (the provider sending it again under a new id) still changes nothing twice', async () => {
    const { a, orderId, sessionId } = await pendingOrder();
    expect((await send(a, completedEvent(sessionId, orderId))).body.outcome).toBe('paid');
    expect((await send(a, completedEvent(sessionId, orderId))).body.outcome).toBe('already-paid');
    expect(await AppDataSource.query(`SELECT count(*)::int AS n FROM mail_outbox`)).toEqual([{ n: 1 }]);
  });

  it('a bad signature is a 400 and changes nothing', async () => {
    const { a, orderId, sessionId } = await pendingOrder();
    const payload = completedEvent(sessionId, orderId);
    const forged = await send(a, payload, 'whsec_not_the_shops_secret');
    expect(forged.status).toBe(400);
    // A body changed after signing fails the same way.
    const header = a.stripe.webhooks.generateTestHeaderString({ payload, secret: a.webhookSecret });
    const tampered = await a.http.post('/api/payments/webhook').set('Content-Type', 'application/json').set('Stripe-Signature', header).send(payload.replace('"paid"', '"paid" '));
    expect(tampered.status).toBe(400);
    expect((await a.http.post('/api/payments/webhook').set('Content-Type', 'application/json').send(payload)).status).toBe(400);
    expect(await orderRow(orderId)).toMatchObject({ status: 'pending', payment_status: 'awaiting', paid_at: null });
    expect(await AppDataSource.query(`SELECT id FROM payment_events`)).toEqual([]);
  });

  it('an event for a session the shop does not know is acknowledged with 2xx, recorded, and changes nothing', async () => {
    const { a, orderId } = await pendingOrder();
    const res = await send(a, completedEvent('cs_test_someone_elses', '00000000-0000-4000-8000-000000000000'));
    expect(res.status).toBe(200);
    expect(res.body.outcome).toBe('unknown-order');
    expect(await orderRow(orderId)).toMatchObject({ status: 'pending', payment_status: 'awaiting' });
    expect(await AppDataSource.query(`SELECT outcome, order_id FROM payment_events`)).toEqual([{ outcome: 'unknown-order', order_id: null }]);
  });
});

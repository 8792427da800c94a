import request from 'supertest';
import { describe, expect, it } from 'vitest';
import type { OrderDto } from '../../shared/commerce/order.dto';
import { AppDataSource } from '../db/data-source';
import { address, ledgerSumOf, plainProduct, stockOf } from '../test/commerce-factories';
import { userWithToken } from '../test/factories';
import { eventually, paymentsApp, payOnPage, type PaymentsApp } from '../test/payments-standin';

/** A guest's order of 2 × 30.00 waiting for its payment, with its payment page open on the stand-in. */
async function pendingOrder() {
  const a = await paymentsApp();
  const p = await plainProduct(5, 3_000, 'Preload collar');
  const guest = request.agent(a.app);
  await guest.post('/api/cart/lines').send({ productId: p.id, quantity: 2 }).expect(201);
  const { orderId, paymentUrl } = (await guest.post('/api/checkout').send({ email: 'buyer@example.test', shippingAddress: address }).expect(201)).body as { orderId: string; paymentUrl: string };
  const staff = await userWithToken(a.config, 'staff');
  return { a, p, orderId, paymentUrl, staff };
}

const sessionOf = async (a: PaymentsApp, orderId: string) => {
  const [o] = (await AppDataSource.query(`SELECT payment_session_id FROM orders WHERE id = $1`, [orderId])) as { payment_session_id: string }[];
  return a.stripe.checkout.sessions.retrieve(o!.payment_session_id);
};

describe('staff cancel an unpaid order', () => {
  it('a pending, unpaid order: stock back through the ledger, payment page closed, buyer mailed once, audited; a second cancel is refused', async () => {
    const { a, p, orderId, staff } = await pendingOrder();
    expect(await stockOf(p.id)).toBe(3);
    const before = (await a.http.get(`/api/staff/orders/${orderId}`).set(staff.auth).expect(200)).body as OrderDto;
    expect(before).toMatchObject({ status: 'pending', paymentStatus: 'awaiting', mayStaffCancel: true });

    const res = await a.http.post(`/api/staff/orders/${orderId}/cancel`).set(staff.auth).send({});
    expect(res.status).toBe(200);
    expect(res.body as OrderDto).toMatchObject({ status: 'cancelled', cancelReason: 'staff-cancelled', paymentStatus: 'awaiting', mayStaffCancel: false });
    expect(await stockOf(p.id)).toBe(5);
    expect(await ledgerSumOf(p.id)).toBe(5);
    const moves = (await AppDataSource.query(`SELECT reason, quantity, actor_id FROM stock_movements WHERE order_id = $1 ORDER BY created_at`, [orderId])) as { reason: string; quantity: number; actor_id: string | null }[];
    expect(moves).toEqual([{ reason: 'sale', quantity: -2, actor_id: null }, { reason: 'cancel', quantity: 2, actor_id: staff.user.id }]);
    expect((await sessionOf(a, orderId)).status).toBe('expired');
    expect(await AppDataSource.query(`SELECT dedupe_key FROM mail_outbox`)).toEqual([{ dedupe_key: `order-cancelled:${orderId}` }]);
    const audit = (await AppDataSource.query(`SELECT actor_id, action, before, after FROM audit_log WHERE entity_type = 'order' AND entity_id = $1`, [orderId])) as { actor_id: string; action: string; before: { status: string }; after: { status: string; cancelReason: string } }[];
    expect(audit).toEqual([expect.objectContaining({ actor_id: staff.user.id, action: 'update', before: expect.objectContaining({ status: 'pending' }), after: expect.objectContaining({ status: 'cancelled', cancelReason: 'staff-cancelled' }) })]);

    // The stand-in's expiry event for the closed page arrives after: it finds nothing to do.
    await eventually(async () => ((await AppDataSource.query(`SELECT 1 FROM payment_events WHERE type = 'checkout.session.expired' AND order_id = $1`, [orderId])) as unknown[]).length > 0, 'the expiry event');
    expect(await stockOf(p.id)).toBe(5);
    const again = await a.http.post(`/api/staff/orders/${orderId}/cancel`).set(staff.auth).send({});
    expect(again.status).toBe(409);
    expect(again.body.message).toMatch(/already cancelled/);
    expect(await stockOf(p.id)).toBe(5);
  });

  it('a paid order is refused with a clear 409 and nothing changes', async () => {
    const { a, p, orderId, paymentUrl, staff } = await pendingOrder();
    await payOnPage(paymentUrl, '4242424242424242');
    await eventually(async () => (await a.http.get(`/api/staff/orders/${orderId}`).set(staff.auth)).body.paymentStatus === 'paid', 'the payment');
    const res = await a.http.post(`/api/staff/orders/${orderId}/cancel`).set(staff.auth).send({});
    expect(res.status).toBe(409);
    expect(res.body.message).toMatch(/is paid.*refund it instead/);
    expect((await a.http.get(`/api/staff/orders/${orderId}`).set(staff.auth)).body).toMatchObject({ status: 'confirmed', paymentStatus: 'paid', mayStaffCancel: false });
    expect(await stockOf(p.id)).toBe(3);
    expect(await AppDataSource.query(`SELECT count(*)::int AS n FROM audit_log WHERE entity_type = 'order'`)).toEqual([{ n: 0 }]);
  });

  it('a card declined on the page leaves the order cancellable by staff; riders and guests may not cancel it this way', async () => {
    const { a, orderId, paymentUrl, staff } = await pendingOrder();
    await payOnPage(paymentUrl, '4000000000000002');
    await eventually(async () => (await a.http.get(`/api/staff/orders/${orderId}`).set(staff.auth)).body.paymentStatus === 'failed', 'the declined payment');
    const rider = await userWithToken(a.config);
    expect((await a.http.post(`/api/staff/orders/${orderId}/cancel`).set(rider.auth).send({})).status).toBe(403);
    expect((await a.http.post(`/api/staff/orders/${orderId}/cancel`).send({})).status).toBe(401);
    expect((await a.http.post(`/api/staff/orders/00000000-0000-4000-8000-000000000000/cancel`).set(staff.auth).send({})).status).toBe(404);
    expect((await a.http.post(`/api/staff/orders/${orderId}/cancel`).set(staff.auth).send({})).body).toMatchObject({ status: 'cancelled', paymentStatus: 'failed' });
  });
});

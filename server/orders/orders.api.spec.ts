import request from 'supertest';
import { describe, expect, it } from 'vitest';
import type { OrderDto, OrderSummaryDto } from '../../shared/commerce/order.dto';
import type { Page } from '../../shared/catalogue';
import { AppDataSource } from '../db/data-source';
import { address, plainProduct, stockOf } from '../test/commerce-factories';
import { createUser, testPassword, userWithToken } from '../test/factories';
import { eventually, paymentsApp, payOnPage } from '../test/payments-standin';

/** A paid order of two products (2 × 30.00 and 1 × 12.00) bought by a signed-in rider, through the stand-in's page. */
async function paidOrder() {
  const a = await paymentsApp();
  const rider = await createUser();
  const agent = request.agent(a.app);
  await agent.post('/api/auth/login').send({ email: rider.email, password: testPassword }).expect(200);
  const p = await plainProduct(5, 3_000, 'Preload collar');
  const q = await plainProduct(5, 1_200, 'Seal kit');
  await agent.post('/api/cart/lines').send({ productId: p.id, quantity: 2 }).expect(201);
  await agent.post('/api/cart/lines').send({ productId: q.id, quantity: 1 }).expect(201);
  const { orderId, paymentUrl, accessToken } = (await agent.post('/api/checkout').send({ email: rider.email, shippingAddress: address }).expect(201)).body;
  await payOnPage(paymentUrl, '4242424242424242');
  await eventually(async () => (await agent.get(`/api/orders/${orderId}`)).body.paymentStatus === 'paid', 'the payment');
  return { a, rider, agent, p, q, orderId: orderId as string, accessToken: accessToken as string };
}

/** The refunds recorded for an order, with the provider's refund ids. */
const refundsOf = async (orderId: string) =>
  (await AppDataSource.query(`SELECT provider_refund_id, amount_cents FROM refunds WHERE order_id = $1 ORDER BY created_at`, [orderId])) as { provider_refund_id: string; amount_cents: number }[];

describe('orders', () => {
  it('a rider sees their own orders; a guest opens one by its link; anyone else gets a 404', async () => {
    const { a, agent, orderId, accessToken } = await paidOrder();
    const mine = (await agent.get('/api/orders').expect(200)).body.items as OrderSummaryDto[];
    expect(mine.map((o) => [o.id, o.itemCount, o.totalCents])).toEqual([[orderId, 3, 7_200 + 690]]);
    expect((await a.http.get(`/api/orders/${orderId}?token=${accessToken}`)).status).toBe(200);
    expect((await a.http.get(`/api/orders/${orderId}?token=${accessToken.slice(1)}x`)).status).toBe(404);
    expect((await a.http.get(`/api/orders/${orderId}`)).status).toBe(404);
    const other = await userWithToken(a.config);
    expect((await a.http.get(`/api/orders/${orderId}`).set(other.auth)).status).toBe(404);
    expect((await a.http.get('/api/orders')).status).toBe(401);
  });

  it('a rider cancels a paid order before packing: stock back and the whole amount refunded through the provider', async () => {
    const { agent, p, q, orderId } = await paidOrder();
    expect(await stockOf(p.id)).toBe(3);
    const res = await agent.post(`/api/orders/${orderId}/cancel`).send({});
    expect(res.status).toBe(200);
    const o = res.body as OrderDto;
    expect(o).toMatchObject({ status: 'cancelled', cancelReason: 'rider-cancelled', paymentStatus: 'refunded', refundedCents: o.totalCents, mayCancel: false });
    expect(await stockOf(p.id)).toBe(5);
    expect(await stockOf(q.id)).toBe(5);
    const refunds = await refundsOf(orderId);
    expect(refunds).toEqual([{ provider_refund_id: expect.stringMatching(/^re_/), amount_cents: o.totalCents }]);
    // The provider confirms with charge.refunded; recorded, nothing changes a second time.
    await eventually(async () => ((await AppDataSource.query(`SELECT outcome FROM payment_events WHERE type = 'charge.refunded'`)) as unknown[]).length > 0, 'charge.refunded');
    expect((await agent.post(`/api/orders/${orderId}/cancel`).send({})).status).toBe(409);
    const keys = ((await AppDataSource.query(`SELECT dedupe_key FROM mail_outbox ORDER BY created_at`)) as { dedupe_key: string }[]).map((m) => m.dedupe_key.split(':')[0]);
    expect(keys).toEqual(['order-confirmed', 'refund', 'order-cancelled']);
  });

  it('once packed, a rider can no longer cancel', async () => {
    const { agent, orderId } = await paidOrder();
    await AppDataSource.query(`UPDATE orders SET fulfilment_status = 'packed', packed_at = now() WHERE id = $1`, [orderId]);
    const res = await agent.post(`/api/orders/${orderId}/cancel`).send({});
    expect(res.status).toBe(409);
    expect(res.body.message).toMatch(/already packed/);
  });

  it('staff list every order and filter by state; riders may not', async () => {
    const { a, orderId } = await paidOrder();
    const staff = await userWithToken(a.config, 'staff');
    const all = (await a.http.get('/api/staff/orders').set(staff.auth).expect(200)).body as Page<OrderSummaryDto>;
    expect(all.items.map((o) => o.id)).toEqual([orderId]);
    expect((await a.http.get('/api/staff/orders?paymentStatus=paid').set(staff.auth)).body.total).toBe(1);
    expect((await a.http.get('/api/staff/orders?status=cancelled').set(staff.auth)).body.total).toBe(0);
    expect((await a.http.get('/api/staff/orders?status=lost').set(staff.auth)).status).toBe(400);
    const rider = await userWithToken(a.config);
    expect((await a.http.get('/api/staff/orders').set(rider.auth)).status).toBe(403);
  });

  it('staff refund some units of a line that came back: that amount only, stock back for them, payment partially refunded', async () => {
    const { a, p, orderId } = await paidOrder();
    await AppDataSource.query(`UPDATE orders SET fulfilment_status = 'packed' WHERE id = $1`, [orderId]);
    await AppDataSource.query(`UPDATE orders SET fulfilment_status = 'shipped' WHERE id = $1`, [orderId]);
    const staff = await userWithToken(a.config, 'staff');
    const order = (await a.http.get(`/api/staff/orders/${orderId}`).set(staff.auth).expect(200)).body as OrderDto;
    const collar = order.lines.find((l) => l.productId === p.id)!;
    const res = await a.http.post(`/api/staff/orders/${orderId}/refunds`).set(staff.auth).send({ lines: [{ orderLineId: collar.id, quantity: 1, restock: true }], reason: 'One collar came back unused' });
    expect(res.status).toBe(201);
    const after = res.body as OrderDto;
    expect(after).toMatchObject({ paymentStatus: 'partially-refunded', refundedCents: 3_000, status: 'confirmed' });
    expect(after.lines.find((l) => l.id === collar.id)).toMatchObject({ refundedQuantity: 1, restockedQuantity: 1 });
    expect(await stockOf(p.id)).toBe(4);
    const tooMany = await a.http.post(`/api/staff/orders/${orderId}/refunds`).set(staff.auth).send({ lines: [{ orderLineId: collar.id, quantity: 2, restock: false }] });
    expect(tooMany.status).toBe(400);
    expect(tooMany.body.fields['lines.0.quantity']).toMatch(/At most 1/);
    // The rest of the order, whole: what is left of the total, no restock.
    const rest = (await a.http.post(`/api/staff/orders/${orderId}/refunds`).set(staff.auth).send({ restock: false }).expect(201)).body as OrderDto;
    expect(rest).toMatchObject({ paymentStatus: 'refunded', refundedCents: rest.totalCents });
    expect(rest.refunds.map((r) => r.amountCents)).toEqual([3_000, rest.totalCents - 3_000]);
    expect(await stockOf(p.id)).toBe(4);
    expect((await a.http.post(`/api/staff/orders/${orderId}/refunds`).set(staff.auth).send({})).status).toBe(409);
  });
});

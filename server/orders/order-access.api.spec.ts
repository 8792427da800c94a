import request from 'supertest';
import { describe, expect, it } from 'vitest';
import type { ForkRecommendationDto, RecommendationDto, ShockRecommendationDto } from '../../shared/catalogue';
import type { OrderDto } from '../../shared/commerce/order.dto';
import { AppDataSource } from '../db/data-source';
import { address, load, shopWithSprings } from '../test/commerce-factories';
import { createUser, testPassword, userWithToken } from '../test/factories';
import { eventually, paymentsApp, payOnPage } from '../test/payments-standin';

/** A rider's paid order of a spring set (so it has a setup sheet), bought through the stand-in's payment page. */
async function ridersSpringSetOrder() {
  const a = await paymentsApp();
  const shop = await shopWithSprings(a);
  const rec = (await a.http.post('/api/recommendations').send({ fitmentId: shop.fitment.id, ...load }).expect(200)).body as RecommendationDto;
  const fork = (rec.fork as ForkRecommendationDto).candidates.find((c) => c.verdict === 'ok')!;
  const shock = (rec.shock as ShockRecommendationDto).candidates.find((c) => c.verdict === 'ok')!;
  const rider = await createUser();
  const agent = request.agent(a.app);
  await agent.post('/api/auth/login').send({ email: rider.email, password: testPassword }).expect(200);
  await agent.post('/api/cart/spring-set').send({ fitmentId: shop.fitment.id, ...load, forkProductId: fork.id, shockProductId: shock.id }).expect(201);
  const { orderId, paymentUrl } = (await agent.post('/api/checkout').send({ email: rider.email, shippingAddress: address }).expect(201)).body as { orderId: string; paymentUrl: string };
  await payOnPage(paymentUrl, '4242424242424242');
  await eventually(async () => (await agent.get(`/api/orders/${orderId}`)).body.paymentStatus === 'paid', 'the payment');
  return { a, agent, orderId };
}

describe('a rider’s order is theirs alone', () => {
  it('another rider guessing its id gets the answer of a missing order on every route: view, cancel, setup sheet and its PDF', async () => {
    const { a, agent, orderId } = await ridersSpringSetOrder();
    const mine = (await agent.get(`/api/orders/${orderId}`).expect(200)).body as OrderDto;
    // The owner reaches each of them, so the refusals below are about who asks, not a route that never answers.
    await agent.get(`/api/setup-sheet/orders/${orderId}`).expect(200);
    await agent.get(`/api/setup-sheet/orders/${orderId}/pdf`).expect(200);

    const other = await userWithToken(a.config, 'rider');
    const missing = '00000000-0000-4000-8000-000000000000';
    for (const id of [orderId, missing]) {
      const as = (r: request.Test) => r.set(other.auth);
      expect((await as(a.http.get(`/api/orders/${id}`))).status, `view ${id}`).toBe(404);
      expect((await as(a.http.post(`/api/orders/${id}/cancel`).send({}))).status, `cancel ${id}`).toBe(404);
      expect((await as(a.http.get(`/api/setup-sheet/orders/${id}`))).status, `sheet ${id}`).toBe(404);
      expect((await as(a.http.get(`/api/setup-sheet/orders/${id}/pdf`))).status, `sheet pdf ${id}`).toBe(404);
    }
    for (const lineId of mine.lines.map((l) => l.id)) {
      expect((await a.http.get(`/api/exchanges/proposal?orderLineId=${lineId}`).set(other.auth)).status).toBe(404);
    }
    expect((await a.http.get('/api/orders').set(other.auth).expect(200)).body.items).toEqual([]);

    // The guess changed nothing: still paid, not cancelled, nothing refunded.
    const [row] = (await AppDataSource.query(`SELECT status, payment_status, refunded_cents FROM orders WHERE id = $1`, [orderId])) as { status: string; payment_status: string; refunded_cents: number }[];
    expect(row).toEqual({ status: mine.status, payment_status: 'paid', refunded_cents: 0 });
  });
});

import request from 'supertest';
import { afterEach, describe, expect, it } from 'vitest';
import type { ForkRecommendationDto, RecommendationDto, ShockRecommendationDto } from '../../shared/catalogue';
import type { ExchangeDto, ExchangeProposalDto } from '../../shared/commerce/exchange.dto';
import type { OrderDto } from '../../shared/commerce/order.dto';
import { checkSag } from '../../shared/engine';
import { AppDataSource } from '../db/data-source';
import { address, load, shopWithSprings, stockOf } from '../test/commerce-factories';
import { createUser, testPassword, userWithToken } from '../test/factories';
import { eventually, paymentsApp, payOnPage } from '../test/payments-standin';

afterEach(async () => {
  await AppDataSource.query(`UPDATE shop_settings SET exchange_window_days = 30`);
});

// The worked example of the sag check's own API test: rider sag 76 mm against a 66 mm target on a 2:1 shock.
const rearSagCheck = { end: 'rear', extendedMm: 600, staticMm: { down: 572, up: 578 }, riderMm: 524, targets: { staticSagMm: 25, riderSagMm: 66 }, leverageRatio: 2, adjusterPitchMm: 1 };

/**
 * A rider's paid and delivered order of a spring set: an ok fork pair and a shock the engine calls too soft for the
 * load (bought anyway), so an exchange has a stiffer ok rate to propose.
 */
async function deliveredSpringOrder(deliveredDaysAgo = 2) {
  const a = await paymentsApp();
  const shop = await shopWithSprings(a);
  const rec = (await a.http.post('/api/recommendations').send({ fitmentId: shop.fitment.id, ...load }).expect(200)).body as RecommendationDto;
  const fork = (rec.fork as ForkRecommendationDto).candidates.find((c) => c.verdict === 'ok')!;
  const shock = (rec.shock as ShockRecommendationDto).candidates.find((c) => c.verdict === 'too-soft')!;
  const okShocks = (rec.shock as ShockRecommendationDto).candidates.filter((c) => c.verdict === 'ok');
  const rider = await createUser();
  const agent = request.agent(a.app);
  await agent.post('/api/auth/login').send({ email: rider.email, password: testPassword }).expect(200);
  await agent.post('/api/cart/spring-set').send({ fitmentId: shop.fitment.id, ...load, forkProductId: fork.id, shockProductId: shock.id, acceptVerdict: true }).expect(201);
  const { orderId, paymentUrl } = (await agent.post('/api/checkout').send({ email: rider.email, shippingAddress: address }).expect(201)).body as { orderId: string; paymentUrl: string };
  await payOnPage(paymentUrl, '4242424242424242');
  await eventually(async () => (await agent.get(`/api/orders/${orderId}`)).body.paymentStatus === 'paid', 'the payment');
  await AppDataSource.query(`UPDATE orders SET fulfilment_status = 'delivered', packed_at = now(), shipped_at = now(), delivered_at = now() - make_interval(days => $2) WHERE id = $1`, [orderId, deliveredDaysAgo]);
  const order = (await agent.get(`/api/orders/${orderId}`).expect(200)).body as OrderDto;
  const shockLine = order.lines.find((l) => l.productId === shock.id)!;
  const forkLine = order.lines.find((l) => l.productId === fork.id)!;
  const staff = await userWithToken(a.config, 'staff');
  const warehouse = await userWithToken(a.config, 'warehouse');
  return { a, shop, agent, rider, order, fork, shock, okShocks, shockLine, forkLine, staff, warehouse };
}

/** The ledger rows an exchange wrote, and whether a product's ledger still sums to its on-hand count. */
const ledgerOf = async (exchangeId: string) =>
  (await AppDataSource.query(`SELECT product_id, quantity, reason FROM stock_movements WHERE exchange_id = $1 ORDER BY created_at`, [exchangeId])) as { product_id: string; quantity: number; reason: string }[];
const ledgerSum = async (productId: string) =>
  ((await AppDataSource.query(`SELECT coalesce(sum(quantity), 0)::int AS n FROM stock_movements WHERE product_id = $1`, [productId])) as { n: number }[])[0]!.n;

const mailsOf = async (exchangeId: string) =>
  ((await AppDataSource.query(`SELECT dedupe_key FROM mail_outbox WHERE dedupe_key LIKE '%' || $1 ORDER BY created_at`, [exchangeId])) as { dedupe_key: string }[]).map((r) => r.dedupe_key.split(':')[0]);

describe('exchanges', () => {
  it('proposes the stiffer rate the engine calls ok for the saved load and records the sag check verdict worked out on the server', async () => {
    const { agent, shockLine, okShocks, shock } = await deliveredSpringOrder();
    const p = (await agent.get(`/api/exchanges/proposal?orderLineId=${shockLine.id}&reason=too-soft`).expect(200)).body as ExchangeProposalDto;
    expect(p.end).toBe('shock');
    expect(p.blockedBy).toBeNull();
    expect(p.proposed).not.toBeNull();
    expect(p.proposed!.verdict).toBe('ok');
    // The recommendation's own ranking: the first ok shock stiffer than the one bought.
    expect(p.proposed!.productId).toBe(okShocks.find((c) => c.rateNPerMm > shock.rateNPerMm)!.id);
    expect(p.options.find((o) => o.productId === shock.id)!.verdict).toBe('too-soft');

    const res = await agent.post('/api/exchanges').send({ orderLineId: shockLine.id, kind: 'exchange', reason: 'too-soft', sagCheck: rearSagCheck });
    expect(res.status).toBe(201);
    const ex = res.body as ExchangeDto;
    expect(ex).toMatchObject({ state: 'requested', kind: 'exchange', differenceCents: 0, settlement: 'none' });
    expect(ex.replacement!.productId).toBe(p.proposed!.productId);
    const expected = checkSag(rearSagCheck as Parameters<typeof checkSag>[0]);
    expect(ex.sagCheck!.result.springVerdict).toBe(expected.springVerdict);
    expect(ex.sagCheck!.result.preloadChangeMm).toBeCloseTo(5, 9);
    // A second request for the same spring is refused while the first stands.
    expect((await agent.post('/api/exchanges').send({ orderLineId: shockLine.id, kind: 'exchange', reason: 'too-soft' })).status).toBe(409);
  });

  it('is open only within the window after delivery, read from the shop settings', async () => {
    const { agent, shockLine } = await deliveredSpringOrder(31);
    const p = (await agent.get(`/api/exchanges/proposal?orderLineId=${shockLine.id}`).expect(200)).body as ExchangeProposalDto;
    expect(p.blockedBy).toMatch(/30 days after delivery/);
    const late = await agent.post('/api/exchanges').send({ orderLineId: shockLine.id, kind: 'return', reason: 'too-soft' });
    expect(late.status).toBe(409);
    await AppDataSource.query(`UPDATE shop_settings SET exchange_window_days = 40`);
    expect((await agent.post('/api/exchanges').send({ orderLineId: shockLine.id, kind: 'return', reason: 'too-soft' })).status).toBe(201);
    await AppDataSource.query(`UPDATE orders SET delivered_at = NULL, fulfilment_status = 'shipped' WHERE id = (SELECT order_id FROM order_lines WHERE id = $1)`, [shockLine.id]);
    const p2 = (await agent.get(`/api/exchanges/proposal?orderLineId=${shockLine.id}`).expect(200)).body as ExchangeProposalDto;
    expect(p2.blockedBy).toMatch(/not been delivered/);
  });

  it('a rider never sees or asks about another rider’s order line or exchange, by guessing its id', async () => {
    const { a, agent, shockLine } = await deliveredSpringOrder();
    const ex = (await agent.post('/api/exchanges').send({ orderLineId: shockLine.id, kind: 'exchange', reason: 'other', reasonText: 'Feels wallowy two-up' }).expect(201)).body as ExchangeDto;
    const other = await userWithToken(a.config, 'rider');
    expect((await a.http.get(`/api/exchanges/${ex.id}`).set(other.auth)).status).toBe(404);
    expect((await a.http.get(`/api/exchanges/proposal?orderLineId=${shockLine.id}`).set(other.auth)).status).toBe(404);
    expect((await a.http.post('/api/exchanges').set(other.auth).send({ orderLineId: shockLine.id, kind: 'return', reason: 'too-stiff' })).status).toBe(404);
    expect((await a.http.get('/api/exchanges').set(other.auth).expect(200)).body.items).toEqual([]);
    expect((await a.http.get(`/api/exchanges/${ex.id}`)).status).toBe(401);
    expect((await agent.get(`/api/exchanges/${ex.id}`)).status).toBe(200);
    // Staff routes are not the rider's, and the warehouse does not decide.
    expect((await agent.get('/api/staff/exchanges')).status).toBe(403);
    expect((await agent.post(`/api/warehouse/exchanges/${ex.id}/receive`)).status).toBe(403);
  });

  it('answers bad input with per-field messages', async () => {
    const { agent, shockLine, forkLine } = await deliveredSpringOrder();
    const res = await agent.post('/api/exchanges').send({ orderLineId: 'nope', kind: 'swap', reason: 'other' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.fields ?? res.body.error?.fields ?? {})).toEqual(expect.arrayContaining(['orderLineId', 'kind', 'reasonText']));
    const wrongEnd = await agent.post('/api/exchanges').send({ orderLineId: forkLine.id, kind: 'exchange', reason: 'too-soft', sagCheck: rearSagCheck });
    expect(wrongEnd.status).toBe(400);
    const notOffered = await agent.post('/api/exchanges').send({ orderLineId: shockLine.id, kind: 'exchange', reason: 'too-soft', replacementProductId: forkLine.productId });
    expect(notOffered.status).toBe(400);
  });

  it('exchange for a dearer rate: approved with a payment page, received back on the shelf, paid through the stand-in once, then shipped', async () => {
    const { a, agent, shockLine, shock, staff, warehouse } = await deliveredSpringOrder();
    const proposed = ((await agent.get(`/api/exchanges/proposal?orderLineId=${shockLine.id}&reason=too-soft`).expect(200)).body as ExchangeProposalDto).proposed!;
    // The stiffer spring costs 20.00 more now than the one bought.
    await AppDataSource.query(`UPDATE products SET price_cents = price_cents + 2000 WHERE id = $1`, [proposed.productId]);
    const ex = (await agent.post('/api/exchanges').send({ orderLineId: shockLine.id, kind: 'exchange', reason: 'too-soft', sagCheck: rearSagCheck }).expect(201)).body as ExchangeDto;
    expect(ex.differenceCents).toBe(2_000);

    // Not yet approved: the warehouse cannot receive it.
    expect((await a.http.post(`/api/warehouse/exchanges/${ex.id}/receive`).set(warehouse.auth)).status).toBe(409);
    expect((await a.http.post(`/api/staff/exchanges/${ex.id}/decision`).set(warehouse.auth).send({ approve: true, message: 'ok' })).status).toBe(403);
    const approved = (await a.http.post(`/api/staff/exchanges/${ex.id}/decision`).set(staff.auth).send({ approve: true, message: 'Stiffer spring on its way once yours is back.' }).expect(200)).body as ExchangeDto;
    expect(approved).toMatchObject({ state: 'approved', settlement: 'awaiting-payment' });
    expect(approved.paymentUrl).toMatch(/\/pay\/cs_test_/);
    expect((await a.http.post(`/api/staff/exchanges/${ex.id}/decision`).set(staff.auth).send({ approve: false, message: 'Changed my mind' })).status).toBe(409);

    const before = await stockOf(shock.id);
    const received = (await a.http.post(`/api/warehouse/exchanges/${ex.id}/receive`).set(warehouse.auth).expect(200)).body as ExchangeDto;
    expect(received.state).toBe('received');
    expect(await stockOf(shock.id)).toBe(before + 1);
    expect((await a.http.post(`/api/warehouse/exchanges/${ex.id}/receive`).set(warehouse.auth)).status).toBe(409);
    // The difference is owed: the replacement waits.
    const early = await a.http.post(`/api/warehouse/exchanges/${ex.id}/ship`).set(warehouse.auth).send({ carrier: 'Parcel Co', trackingNumber: 'TRK123456' });
    expect(early.status).toBe(409);

    await payOnPage(approved.paymentUrl!, '4242424242424242');
    const paid = await eventually(async () => {
      const e = (await agent.get(`/api/exchanges/${ex.id}`)).body as ExchangeDto;
      return e.settlement === 'paid' ? e : null;
    }, 'the difference paid');
    expect(paid.paymentUrl).toBeNull();
    const session = await a.stripe.checkout.sessions.retrieve(approved.paymentUrl!.split('/pay/')[1]!.split(/[?#]/)[0]!);
    expect(session.amount_total).toBe(2_000);
    const events = (await AppDataSource.query(`SELECT outcome FROM payment_events WHERE outcome LIKE 'exchange-%'`)) as { outcome: string }[];
    expect(events.filter((e) => e.outcome === 'exchange-paid')).toHaveLength(1);

    const replacementBefore = await stockOf(proposed.productId);
    const shipped = (await a.http.post(`/api/warehouse/exchanges/${ex.id}/ship`).set(warehouse.auth).send({ carrier: 'Parcel Co', trackingNumber: 'TRK123456' }).expect(200)).body as ExchangeDto;
    expect(shipped).toMatchObject({ state: 'shipped', carrier: 'Parcel Co', trackingNumber: 'TRK123456' });
    expect(await stockOf(proposed.productId)).toBe(replacementBefore - 1);
    expect(await ledgerOf(ex.id)).toEqual([
      { product_id: shock.id, quantity: 1, reason: 'return' },
      { product_id: proposed.productId, quantity: -1, reason: 'sale' },
    ]);
    expect(await ledgerSum(shock.id)).toBe(await stockOf(shock.id));
    expect(await ledgerSum(proposed.productId)).toBe(await stockOf(proposed.productId));
    expect(await mailsOf(ex.id)).toEqual(['exchange-requested', 'exchange-approved', 'exchange-received', 'exchange-paid', 'exchange-shipped']);
    // The staff list filters by state and reason.
    const listed = (await a.http.get('/api/staff/exchanges?state=shipped&reason=too-soft').set(staff.auth).expect(200)).body.items as ExchangeDto[];
    expect(listed.map((e) => e.id)).toContain(ex.id);
    expect((await a.http.get('/api/staff/exchanges?state=lost').set(staff.auth)).status).toBe(400);
  });

  it('a plain return is refunded through the stand-in when the springs reach the warehouse', async () => {
    const { a, agent, forkLine, fork, staff, warehouse, order } = await deliveredSpringOrder();
    const ex = (await agent.post('/api/exchanges').send({ orderLineId: forkLine.id, kind: 'return', reason: 'other', reasonText: 'Sold the bike' }).expect(201)).body as ExchangeDto;
    expect(ex.differenceCents).toBe(-forkLine.unitPriceCents * forkLine.quantity);
    const approved = (await a.http.post(`/api/staff/exchanges/${ex.id}/decision`).set(staff.auth).send({ approve: true, message: 'Send them back in their box.' }).expect(200)).body as ExchangeDto;
    expect(approved).toMatchObject({ settlement: 'refund-due', paymentUrl: null });
    const before = await stockOf(fork.id);
    const done = (await a.http.post(`/api/warehouse/exchanges/${ex.id}/receive`).set(warehouse.auth).expect(200)).body as ExchangeDto;
    expect(done).toMatchObject({ state: 'refunded', settlement: 'refunded' });
    expect(await stockOf(fork.id)).toBe(before + forkLine.quantity);
    expect(await ledgerOf(ex.id)).toEqual([{ product_id: fork.id, quantity: forkLine.quantity, reason: 'return' }]);
    expect(await ledgerSum(fork.id)).toBe(await stockOf(fork.id));
    const refunds = (await AppDataSource.query(`SELECT provider_refund_id, amount_cents FROM refunds WHERE order_id = $1`, [order.id])) as { provider_refund_id: string; amount_cents: number }[];
    expect(refunds).toEqual([{ provider_refund_id: expect.stringMatching(/^re_/), amount_cents: forkLine.unitPriceCents * forkLine.quantity }]);
    // The stand-in made the refund and says so through its own signed event, which the webhook notes against the order.
    await eventually(async () => ((await AppDataSource.query(`SELECT 1 FROM payment_events WHERE order_id = $1 AND outcome = 'refund-noted'`, [order.id])) as unknown[]).length === 1, 'the refund event');
    const after = (await agent.get(`/api/orders/${order.id}`).expect(200)).body as OrderDto;
    expect(after).toMatchObject({ paymentStatus: 'partially-refunded', refundedCents: forkLine.unitPriceCents * forkLine.quantity });
    expect(await mailsOf(ex.id)).toEqual(['exchange-requested', 'exchange-approved', 'exchange-received']);
    // A return has no replacement to ship.
    expect((await a.http.post(`/api/warehouse/exchanges/${ex.id}/ship`).set(warehouse.auth).send({ carrier: 'Parcel Co', trackingNumber: 'TRK123456' })).status).toBe(409);
  });

  it('a refused request gets its message and leaves room to ask again', async () => {
    const { a, agent, shockLine, staff } = await deliveredSpringOrder();
    const ex = (await agent.post('/api/exchanges').send({ orderLineId: shockLine.id, kind: 'exchange', reason: 'too-stiff' }).expect(201)).body as ExchangeDto;
    const refused = (await a.http.post(`/api/staff/exchanges/${ex.id}/decision`).set(staff.auth).send({ approve: false, message: 'The readings show the spring suits you; try the preload first.' }).expect(200)).body as ExchangeDto;
    expect(refused).toMatchObject({ state: 'refused', staffMessage: 'The readings show the spring suits you; try the preload first.' });
    expect(await mailsOf(ex.id)).toEqual(['exchange-requested', 'exchange-refused']);
    expect((await agent.post('/api/exchanges').send({ orderLineId: shockLine.id, kind: 'return', reason: 'too-stiff' })).status).toBe(201);
  });
});

describe('exchange counts for the dashboard', () => {
  it('counts exchanges by state and reason, the same as a plain SQL count', async () => {
    const { a, agent, shockLine, forkLine, staff } = await deliveredSpringOrder();
    const ex = (await agent.post('/api/exchanges').send({ orderLineId: shockLine.id, kind: 'exchange', reason: 'too-soft' }).expect(201)).body as ExchangeDto;
    await agent.post('/api/exchanges').send({ orderLineId: forkLine.id, kind: 'return', reason: 'too-stiff' }).expect(201);
    await a.http.post(`/api/staff/exchanges/${ex.id}/decision`).set(staff.auth).send({ approve: false, message: 'Try the preload first.' }).expect(200);
    const { countExchangesByStateAndReason } = await import('./exchange-staff.service');
    const open = await countExchangesByStateAndReason(['requested', 'approved', 'received']);
    const bySql = (await AppDataSource.query(`SELECT state, reason, kind, count(*)::int AS count FROM exchanges WHERE state IN ('requested', 'approved', 'received') GROUP BY 1, 2, 3`)) as { state: string; reason: string; kind: string; count: number }[];
    expect(open).toEqual(expect.arrayContaining(bySql));
    expect(open).toHaveLength(bySql.length);
    expect(open).toContainEqual({ state: 'requested', reason: 'too-stiff', kind: 'return', count: expect.any(Number) });
    expect((await countExchangesByStateAndReason()).some((c) => c.state === 'refused')).toBe(true);
  });
});

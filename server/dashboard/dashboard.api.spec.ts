import request from 'supertest';
import { describe, expect, it } from 'vitest';
import type { DashboardDto } from '../../shared/admin/dashboard';
import type { ForkRecommendationDto, RecommendationDto, ShockRecommendationDto } from '../../shared/catalogue';
import { AppDataSource } from '../db/data-source';
import { flushRecommendationCounts } from '../recommendations/served-counter';
import { address, load, plainProduct, shopWithSprings } from '../test/commerce-factories';
import { userWithToken } from '../test/factories';
import type { ExchangeDto } from '../../shared/commerce/exchange.dto';
import { paymentsApp, type PaymentsApp } from '../test/payments-standin';

const day = (offset: number) => new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10);

/** Checks out a cart and pays it through the webhook path, as the provider would after a card payment. */
async function checkoutAndPay(a: PaymentsApp, agent: ReturnType<typeof request.agent>, pay = true): Promise<string> {
  const { orderId } = (await agent.post('/api/checkout').send({ email: 'buyer@example.test', shippingAddress: address }).expect(201)).body as { orderId: string };
  if (!pay) return orderId;
  const [o] = (await AppDataSource.query(`SELECT payment_session_id, total_cents FROM orders WHERE id = $1`, [orderId])) as { payment_session_id: string; total_cents: number }[];
  const payload = JSON.stringify({
    id: `evt_dash_${Math.random().toString(36).slice(2)}`,
    object: 'event',
    type: 'checkout.session.completed',
    created: Math.floor(Date.now() / 1000),
    livemode: false,
    data: { object: { id: o!.payment_session_id, object: 'checkout.session', status: 'complete', payment_status: 'paid', payment_intent: `pi_dash_${orderId.slice(0, 8)}`, client_reference_id: orderId, amount_total: o!.total_cents } },
  });
  const res = await a.http
    .post('/api/payments/webhook')
    .set('Content-Type', 'application/json')
    .set('Stripe-Signature', a.stripe.webhooks.generateTestHeaderString({ payload, secret: a.webhookSecret }))
    .send(payload);
  expect(res.body.outcome).toBe('paid');
  return orderId;
}

/** A few weeks of trade made through the cart, checkout and webhook, then spread over earlier days by moving paid_at. */
async function seededHistory() {
  const a = await paymentsApp();
  const shop = await shopWithSprings(a);
  const recommend = async () => (await a.http.post('/api/recommendations').send({ fitmentId: shop.fitment.id, ...load }).expect(200)).body as RecommendationDto;
  const orders: { id: string; daysAgo: number }[] = [];
  const springSetOrder = async (daysAgo: number, forkIndex: number, pay = true) => {
    const rec = await recommend();
    const fork = (rec.fork as ForkRecommendationDto).candidates.filter((c) => c.verdict === 'ok')[forkIndex] ?? (rec.fork as ForkRecommendationDto).candidates.find((c) => c.verdict === 'ok')!;
    const shock = (rec.shock as ShockRecommendationDto).candidates.find((c) => c.verdict === 'ok')!;
    const agent = request.agent(a.app);
    await agent.post('/api/cart/spring-set').send({ fitmentId: shop.fitment.id, ...load, forkProductId: fork.id, shockProductId: shock.id }).expect(201);
    const id = await checkoutAndPay(a, agent, pay);
    if (pay) orders.push({ id, daysAgo });
  };
  const plainOrder = async (daysAgo: number, productId: string, quantity: number) => {
    const agent = request.agent(a.app);
    await agent.post('/api/cart/lines').send({ productId, quantity }).expect(201);
    orders.push({ id: await checkoutAndPay(a, agent), daysAgo });
  };
  const tool = await plainProduct(40, 2_350, 'Sag measuring tool');
  await springSetOrder(0, 0);
  await springSetOrder(1, 1);
  await springSetOrder(1, 0);
  await springSetOrder(3, 0, false); // checked out, never paid: no revenue, no purchase
  await plainOrder(3, tool.id, 2);
  await plainOrder(6, tool.id, 1);
  await springSetOrder(20, 0); // outside the week asked for
  await recommend(); // served, never taken to the cart
  await flushRecommendationCounts();
  for (const o of orders) await AppDataSource.query(`UPDATE orders SET paid_at = paid_at - make_interval(days => $2) WHERE id = $1`, [o.id, o.daysAgo]);
  // Earlier days' served counts, as the counter would have written them then.
  await AppDataSource.query(`INSERT INTO recommendation_counts (day, served) VALUES ($1, 7), ($2, 5), ($3, 9)`, [day(-2), day(-6), day(-20)]);
  const staff = await userWithToken(a.config, 'staff');
  await exchangesInEveryState(a, staff, orders.map((o) => o.id));
  return { a, staff, shop, tool };
}

/**
 * Exchanges and returns on the history's spring lines, walked through the rider's, staff's and warehouse's routes to
 * each state: open ones (requested, approved, received) and finished ones (refused, shipped) of every reason.
 */
async function exchangesInEveryState(a: PaymentsApp, staff: { auth: Record<string, string> }, orderIds: string[]) {
  const rider = await userWithToken(a.config, 'rider');
  const warehouse = await userWithToken(a.config, 'warehouse');
  await AppDataSource.query(
    `UPDATE orders SET user_id = $2, fulfilment_status = 'delivered', packed_at = now(), shipped_at = now(), delivered_at = now() - interval '1 day' WHERE id = ANY($1::uuid[])`,
    [orderIds, rider.user.id],
  );
  const lines = (await AppDataSource.query(`SELECT id FROM order_lines WHERE kind = 'spring' AND order_id = ANY($1::uuid[]) ORDER BY id`, [orderIds])) as { id: string }[];
  const walks: { kind: 'exchange' | 'return'; reason: 'too-soft' | 'too-stiff' | 'other'; to: 'requested' | 'approved' | 'refused' | 'received' | 'shipped' }[] = [
    { kind: 'exchange', reason: 'too-soft', to: 'requested' },
    { kind: 'return', reason: 'too-soft', to: 'requested' },
    { kind: 'exchange', reason: 'too-stiff', to: 'approved' },
    { kind: 'exchange', reason: 'other', to: 'received' },
    { kind: 'exchange', reason: 'too-soft', to: 'refused' },
    { kind: 'exchange', reason: 'too-stiff', to: 'shipped' },
    { kind: 'return', reason: 'other', to: 'refused' },
  ];
  expect(lines.length).toBeGreaterThanOrEqual(walks.length);
  for (const [i, w] of walks.entries()) {
    const body = { orderLineId: lines[i]!.id, kind: w.kind, reason: w.reason, ...(w.reason === 'other' ? { reasonText: 'Knocks over small bumps' } : {}) };
    const ex = (await a.http.post('/api/exchanges').set(rider.auth).send(body).expect(201)).body as ExchangeDto;
    if (w.to === 'requested') continue;
    const approve = w.to !== 'refused';
    await a.http.post(`/api/staff/exchanges/${ex.id}/decision`).set(staff.auth).send({ approve, message: approve ? 'Send it back to us.' : 'Try the preload first.' }).expect(200);
    if (w.to === 'approved' || w.to === 'refused') continue;
    await a.http.post(`/api/warehouse/exchanges/${ex.id}/receive`).set(warehouse.auth).expect(200);
    if (w.to === 'received') continue;
    await a.http.post(`/api/warehouse/exchanges/${ex.id}/ship`).set(warehouse.auth).send({ carrier: 'Parcel Co', trackingNumber: 'TRK-DASH-1' }).expect(200);
  }
}

describe('staff dashboard', () => {
  it('its figures equal the same sums taken by SQL over a seeded history of paid orders', async () => {
    const { a, staff } = await seededHistory();
    const from = day(-6);
    const to = day(0);
    const res = await a.http.get('/api/staff/dashboard').query({ from, to }).set(staff.auth).expect(200);
    const d = res.body as DashboardDto;

    // Orders and revenue per day, grouped here by date_trunc rather than the service's series join.
    const perDay = (await AppDataSource.query(
      `SELECT to_char(date_trunc('day', paid_at AT TIME ZONE 'UTC'), 'YYYY-MM-DD') AS day, count(*)::int AS orders, sum(total_cents)::int AS revenue
         FROM orders WHERE paid_at IS NOT NULL AND (paid_at AT TIME ZONE 'UTC')::date BETWEEN $1 AND $2 GROUP BY 1`,
      [from, to],
    )) as { day: string; orders: number; revenue: number }[];
    const expected = new Map(perDay.map((r) => [r.day, r]));
    expect(d.days).toHaveLength(7);
    for (const row of d.days) {
      expect({ day: row.day, orders: row.orders, revenueCents: row.revenueCents }).toEqual({
        day: row.day,
        orders: expected.get(row.day)?.orders ?? 0,
        revenueCents: expected.get(row.day)?.revenue ?? 0,
      });
    }
    expect(d.totals.orders).toBe(perDay.reduce((n, r) => n + r.orders, 0));
    expect(d.totals.revenueCents).toBe(perDay.reduce((n, r) => n + r.revenue, 0));
    // Five paid orders fall inside the week (today, two yesterday, three and six days ago); the unpaid and the old one do not.
    expect(d.totals.orders).toBe(5);

    const springs = (await AppDataSource.query(
      `SELECT l.sku, sum(l.quantity)::int AS units, sum(l.unit_price_cents * l.quantity)::int AS revenue
         FROM order_lines l, orders o WHERE o.id = l.order_id AND l.kind = 'spring' AND (o.paid_at AT TIME ZONE 'UTC')::date BETWEEN $1 AND $2
        GROUP BY l.sku`,
      [from, to],
    )) as { sku: string; units: number; revenue: number }[];
    expect(d.topSprings.map((s) => ({ sku: s.sku, units: s.unitsSold, revenue: s.revenueCents })).sort((x, y) => x.sku.localeCompare(y.sku))).toEqual(
      springs.map((s) => ({ sku: s.sku, units: s.units, revenue: s.revenue })).sort((x, y) => x.sku.localeCompare(y.sku)),
    );
    const units = d.topSprings.map((s) => s.unitsSold);
    expect(units).toEqual([...units].sort((x, y) => y - x));

    const [served] = (await AppDataSource.query(`SELECT sum(served)::int AS n FROM recommendation_counts WHERE day BETWEEN $1 AND $2`, [from, to])) as { n: number }[];
    const [bought] = (await AppDataSource.query(
      `SELECT count(*)::int AS n FROM spring_sets s WHERE EXISTS (
         SELECT 1 FROM order_lines l JOIN orders o ON o.id = l.order_id
          WHERE l.spring_set_id = s.id AND (o.paid_at AT TIME ZONE 'UTC')::date BETWEEN $1 AND $2)`,
      [from, to],
    )) as { n: number }[];
    // Served today: one recommendation per spring set (five) and one never taken to the cart; 7 and 5 on earlier days in range.
    expect(served!.n).toBe(6 + 7 + 5);
    expect(d.recommendations).toEqual({ served: served!.n, purchased: bought!.n, shareBasisPoints: Math.round((bought!.n * 10_000) / served!.n) });
    expect(bought!.n).toBe(3);

    // Open exchanges and returns by reason: every state a request can still move on from, counted here by hand.
    const openRows = (await AppDataSource.query(
      `SELECT reason, count(*)::int AS n FROM exchanges WHERE state IN ('requested', 'approved', 'received') GROUP BY reason`,
    )) as { reason: string; n: number }[];
    const openBy = (r: string) => openRows.find((x) => x.reason === r)?.n ?? 0;
    expect(d.exchanges.byReason).toEqual([
      { reason: 'too-soft', count: openBy('too-soft') },
      { reason: 'too-stiff', count: openBy('too-stiff') },
      { reason: 'other', count: openBy('other') },
    ]);
    expect(d.exchanges.total).toBe(openRows.reduce((n, r) => n + r.n, 0));
    // Two too soft asked, one too stiff approved, one other received; the refused and the shipped ones are done.
    expect(d.exchanges.byReason.map((r) => r.count)).toEqual([2, 1, 1]);
    const [states] = (await AppDataSource.query(`SELECT count(DISTINCT state)::int AS n FROM exchanges`)) as { n: number }[];
    expect(states!.n).toBe(5);
  });

  it('recommendations served count the answers the finder showed in the browser as well as the server’s, once each', async () => {
    const a = await paymentsApp();
    const shop = await shopWithSprings(a);
    const staff = await userWithToken(a.config, 'staff');
    await flushRecommendationCounts();
    await AppDataSource.query(`DELETE FROM recommendation_counts`);
    await a.http.post('/api/recommendations').send({ fitmentId: shop.fitment.id, ...load }).expect(200);
    await a.http.post('/api/recommendations/shown').send({ fitmentId: shop.fitment.id }).expect(204);
    await a.http.post('/api/recommendations/shown').send({ fitmentId: shop.fitment.id }).expect(204);
    // A bike that is not in the catalogue counts nothing; a malformed body is named per field.
    expect((await a.http.post('/api/recommendations/shown').send({ fitmentId: '00000000-0000-4000-8000-000000000000' })).status).toBe(404);
    const bad = await a.http.post('/api/recommendations/shown').send({ fitmentId: 'bike' });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.fields)).toEqual(['fitmentId']);
    await flushRecommendationCounts();
    const [row] = (await AppDataSource.query(`SELECT coalesce(sum(served), 0)::int AS n FROM recommendation_counts WHERE day = $1`, [day(0)])) as { n: number }[];
    expect(row!.n).toBe(3);
    const d = (await a.http.get('/api/staff/dashboard').query({ from: day(0), to: day(0) }).set(staff.auth).expect(200)).body as DashboardDto;
    expect(d.recommendations.served).toBe(row!.n);
  });

  it('the low-stock list holds the active products at or under the shop’s threshold, lowest first', async () => {
    const a = await paymentsApp();
    const staff = await userWithToken(a.config, 'staff');
    await plainProduct(0, 1_000, 'Empty shelf tool');
    await plainProduct(3, 1_000, 'Three left tool');
    await plainProduct(4, 1_000, 'Four left tool');
    const hidden = await plainProduct(1, 1_000, 'Retired tool');
    await AppDataSource.query(`UPDATE products SET active = false WHERE id = $1`, [hidden.id]);
    const d = (await a.http.get('/api/staff/dashboard').query({ from: day(-1), to: day(0) }).set(staff.auth).expect(200)).body as DashboardDto;
    expect(d.lowStockThreshold).toBe(3);
    const expected = (await AppDataSource.query(`SELECT name, stock_on_hand FROM products WHERE active AND stock_on_hand <= 3 ORDER BY stock_on_hand, sku`)) as { name: string; stock_on_hand: number }[];
    expect(d.lowStock.map((p) => [p.name, p.stockOnHand])).toEqual(expected.map((p) => [p.name, p.stock_on_hand]));
    expect(d.lowStock.map((p) => p.name)).toEqual(['Empty shelf tool', 'Three left tool']);
  });

  it.each([
    ['an end before the start', { from: day(0), to: day(-1) }, 'to'],
    ['more than a year', { from: day(-400), to: day(0) }, 'to'],
    ['a day that is not in the calendar', { from: '2026-02-30', to: day(0) }, 'from'],
    ['a start that is not a date', { from: 'last week', to: day(0) }, 'from'],
  ])('a range with %s is a 400 naming the field', async (_what, query, field) => {
    const a = await paymentsApp();
    const staff = await userWithToken(a.config, 'staff');
    const res = await a.http.get('/api/staff/dashboard').query(query).set(staff.auth);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.fields)).toContain(field);
  });
});

import request from 'supertest';
import { describe, expect, it } from 'vitest';
import type { CartDto } from '../../shared/commerce/cart.dto';
import type { OrderDto } from '../../shared/commerce/order.dto';
import type { RecommendationDto, ShockRecommendationDto, ForkRecommendationDto } from '../../shared/catalogue';
import { AppDataSource } from '../db/data-source';
import { address, load, plainProduct, shopWithSprings, stockOf } from '../test/commerce-factories';
import { testApp } from '../test/factories';
import { eventually, paymentsApp, payOnPage, type PaymentsApp } from '../test/payments-standin';
import { sweepReservations } from './reservations';
import { paymentProviderFor } from '../payments/stripe-provider';

async function app() {
  const a = await paymentsApp();
  return a;
}
const outbox = async (orderId: string) =>
  (await AppDataSource.query(`SELECT dedupe_key, recipient, subject, text_body FROM mail_outbox WHERE dedupe_key LIKE '%' || $1 ORDER BY created_at`, [orderId])) as {
    dedupe_key: string; recipient: string; subject: string; text_body: string;
  }[];
const orderOf = async (a: PaymentsApp, id: string, token: string) => (await a.http.get(`/api/orders/${id}?token=${token}`).expect(200)).body as OrderDto;

describe('checkout and payment', () => {
  it('a guest buys a spring set: pending order with copied lines and reserved stock, paid on the stand-in page, confirmed by its webhook, mail promised', async () => {
    const a = await app();
    const { fitment } = await shopWithSprings(a);
    const rec = (await a.http.post('/api/recommendations').send({ fitmentId: fitment.id, ...load }).expect(200)).body as RecommendationDto;
    const fork = (rec.fork as ForkRecommendationDto).candidates.find((c) => c.verdict === 'ok')!;
    const shock = (rec.shock as ShockRecommendationDto).candidates.find((c) => c.verdict === 'ok')!;
    const guest = request.agent(a.app);
    const cart = (await guest.post('/api/cart/spring-set').send({ fitmentId: fitment.id, ...load, forkProductId: fork.id, shockProductId: shock.id }).expect(201)).body as CartDto;
    const forkStock = await stockOf(fork.id);

    const res = await guest.post('/api/checkout').send({ email: 'Guest@Example.test', shippingAddress: address });
    expect(res.status).toBe(201);
    const { orderId, paymentUrl, accessToken } = res.body as { orderId: string; paymentUrl: string; accessToken: string };
    expect(paymentUrl).toMatch(/^http:\/\/127\.0\.0\.1:\d+\/pay\/cs_test_/);
    // One fork set is one pair of springs: one unit of the fork product.
    expect(await stockOf(fork.id)).toBe(forkStock - 1);
    let order = await orderOf(a, orderId, accessToken);
    expect(order).toMatchObject({ status: 'pending', paymentStatus: 'awaiting', fulfilmentStatus: 'unfulfilled', totalCents: cart.totals.totalCents, vatCents: cart.totals.vatCents });
    expect(order.lines.map((l) => [l.sku, l.unitPriceCents, l.quantity]).sort()).toEqual(cart.lines.map((l) => [l.sku, l.unitPriceCents, l.quantity]).sort());
    expect(order.lines.find((l) => l.productId === shock.id)!.setup).toMatchObject({ end: 'shock', preloadMm: shock.preloadMm, riderSagMm: shock.riderSagMm });

    const paid = await payOnPage(paymentUrl, '4242 4242 4242 4242');
    expect(paid.status).toBe(303);
    expect(paid.location).toContain(`/checkout/done?order=${orderId}`);
    order = await eventually(async () => {
      const o = await orderOf(a, orderId, accessToken);
      return o.paymentStatus === 'paid' && o;
    }, 'the order to be paid');
    expect(order.status).toBe('confirmed');
    expect(order.milestones.paidAt).not.toBeNull();
    // The stock stays taken once paid; the bought lines leave the cart.
    expect(await stockOf(fork.id)).toBe(forkStock - 1);
    expect((await guest.get('/api/cart')).body.lines).toEqual([]);
    const mails = await outbox(orderId);
    expect(mails.map((m) => m.dedupe_key)).toEqual([`order-confirmed:${orderId}`]);
    expect(mails[0]!.recipient).toBe('guest@example.test');
    expect(mails[0]!.text_body).toContain(shock.sku);
  });

  it('a declined card marks the payment failed, keeps the cart and the order payable, and tells the buyer why', async () => {
    const a = await app();
    const p = await plainProduct(4, 3_000);
    const guest = request.agent(a.app);
    await guest.post('/api/cart/lines').send({ productId: p.id, quantity: 1 }).expect(201);
    const { orderId, paymentUrl, accessToken } = (await guest.post('/api/checkout').send({ email: 'g@example.test', shippingAddress: address }).expect(201)).body;
    const declined = await payOnPage(paymentUrl, '4000 0000 0000 0002');
    expect(declined.status).toBe(402);
    expect(declined.html).toContain('declined');
    const order = await eventually(async () => {
      const o = await orderOf(a, orderId, accessToken);
      return o.paymentStatus === 'failed' && o;
    }, 'the payment to fail');
    expect(order.status).toBe('pending');
    expect(order.paymentFailure).toMatch(/declined/);
    expect((await guest.get('/api/cart')).body.lines).toHaveLength(1);
    expect((await outbox(orderId)).map((m) => m.dedupe_key)).toEqual([`payment-failed:${orderId}`]);
    // The same page still takes a good card.
    expect((await payOnPage(paymentUrl, '4242424242424242')).status).toBe(303);
    await eventually(async () => (await orderOf(a, orderId, accessToken)).paymentStatus === 'paid', 'the second try to pay');
  });

  it('out of stock is a 409 naming the product; nothing is reserved and the cart is kept', async () => {
    const a = await app();
    const p = await plainProduct(2, 1_500, 'Sag gauge');
    const guest = request.agent(a.app);
    await guest.post('/api/cart/lines').send({ productId: p.id, quantity: 2 }).expect(201);
    await AppDataSource.query(`UPDATE products SET stock_on_hand = 1 WHERE id = $1`, [p.id]);
    const res = await guest.post('/api/checkout').send({ email: 'g@example.test', shippingAddress: address });
    expect(res.status).toBe(409);
    expect(res.body.message).toContain('Sag gauge');
    expect(await stockOf(p.id)).toBe(1);
    expect((await guest.get('/api/cart')).body.lines[0].quantity).toBe(2);
    expect(await AppDataSource.query(`SELECT id FROM orders`)).toEqual([]);
  });

  it('with the payment service away, checkout answers 503 with a clear message, holds no stock and keeps the cart', async () => {
    const t = testApp({ stripeApiPort: 9 });
    const p = await plainProduct(3);
    const guest = request.agent(t.app);
    await guest.post('/api/cart/lines').send({ productId: p.id, quantity: 2 }).expect(201);
    const res = await guest.post('/api/checkout').send({ email: 'g@example.test', shippingAddress: address });
    expect(res.status).toBe(503);
    expect(res.body.message).toMatch(/Payment is not available right now.*nothing is held.*cart is kept/);
    expect(await stockOf(p.id)).toBe(3);
    expect((await guest.get('/api/cart')).body.lines[0].quantity).toBe(2);
    const [o] = (await AppDataSource.query(`SELECT status, cancel_reason, stock_held FROM orders`)) as { status: string; cancel_reason: string; stock_held: boolean }[];
    expect(o).toEqual({ status: 'cancelled', cancel_reason: 'payment-unavailable', stock_held: false });
  });

  it('a price changed since the line was added is shown and must be confirmed, never charged silently', async () => {
    const a = await app();
    const p = await plainProduct(3, 2_000, 'Fork oil');
    const guest = request.agent(a.app);
    await guest.post('/api/cart/lines').send({ productId: p.id, quantity: 1 }).expect(201);
    await AppDataSource.query(`UPDATE products SET price_cents = 2400 WHERE id = $1`, [p.id]);
    const res = await guest.post('/api/checkout').send({ email: 'g@example.test', shippingAddress: address });
    expect(res.status).toBe(409);
    expect(res.body.details).toMatchObject({ reason: 'price-changed', lines: [{ name: 'Fork oil', was: 2_000, now: 2_400 }] });
    expect((await guest.get('/api/cart')).body.lines[0].unitPriceCents).toBe(2_400);
    const again = await guest.post('/api/checkout').send({ email: 'g@example.test', shippingAddress: address }).expect(201);
    expect((await orderOf(a, again.body.orderId, again.body.accessToken)).subtotalCents).toBe(2_400);
  });

  it('checkout refuses a bad address per field and an empty cart plainly', async () => {
    const { http } = testApp();
    const bad = await http.post('/api/checkout').send({ email: 'nope', shippingAddress: { ...address, postalCode: '', country: 'Germany' } });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.fields).sort()).toEqual(['email', 'shippingAddress.country', 'shippingAddress.postalCode']);
    const empty = await http.post('/api/checkout').send({ email: 'g@example.test', shippingAddress: address });
    expect(empty.status).toBe(409);
    expect(empty.body.message).toBe('Your cart is empty.');
  });

  it('an unpaid reservation expires: stock back, order cancelled as expired; the provider\'s expiry event then changes nothing', async () => {
    const a = await app();
    const p = await plainProduct(5);
    const guest = request.agent(a.app);
    await guest.post('/api/cart/lines').send({ productId: p.id, quantity: 3 }).expect(201);
    const { orderId, accessToken } = (await guest.post('/api/checkout').send({ email: 'g@example.test', shippingAddress: address }).expect(201)).body;
    expect(await stockOf(p.id)).toBe(2);
    expect(await sweepReservations(a.config, paymentProviderFor(a.config), new Date(Date.now() + 31 * 60_000))).toBe(1);
    const order = await orderOf(a, orderId, accessToken);
    expect(order).toMatchObject({ status: 'cancelled', cancelReason: 'expired', paymentStatus: 'awaiting' });
    expect(await stockOf(p.id)).toBe(5);
    // The sweeper closed the payment page; the stand-in's checkout.session.expired arrives and finds nothing to do.
    const [event] = await eventually(
      async () => {
        const rows = (await AppDataSource.query(`SELECT outcome FROM payment_events WHERE type = 'checkout.session.expired' AND order_id = $1`, [orderId])) as { outcome: string }[];
        return rows.length ? rows : undefined;
      },
      'the expiry event',
    );
    expect(event!.outcome).toBe('no-change');
    expect(await stockOf(p.id)).toBe(5);
    expect((await guest.get('/api/cart')).body.lines[0].quantity).toBe(3);
  });
});

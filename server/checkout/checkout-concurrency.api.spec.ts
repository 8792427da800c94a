import pg from 'pg';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { AppDataSource } from '../db/data-source';
import { paymentProviderFor } from '../payments/stripe-provider';
import { address, plainProduct, stockOf } from '../test/commerce-factories';
import { paymentsApp } from '../test/payments-standin';
import { sweepReservations } from './reservations';

describe('checkout under load', () => {
  it('200 buyers on two app servers race for 10 units: exactly 10 reserve, 190 hear it is out of stock, stock never below 0, and every unit returns after expiry', async () => {
    const servers = [await paymentsApp(), await paymentsApp()];
    const p = await plainProduct(10, 3_900, 'Last-batch shock spring');
    // 200 guest carts with one unit each, written directly: the race is the checkout, not the adding.
    const carts = (await AppDataSource.query(`INSERT INTO carts (user_id) SELECT NULL FROM generate_series(1, 200) RETURNING id`)) as { id: string }[];
    await AppDataSource.query(`INSERT INTO cart_lines (cart_id, product_id, quantity, unit_price_cents) SELECT unnest($1::uuid[]), $2, 1, 3900`, [carts.map((c) => c.id), p.id]);

    // Watched on a connection of its own, so the watching does not take the app's pool.
    const watcher = new pg.Client({ connectionString: process.env.DATABASE_URL });
    await watcher.connect();
    let lowest = 10;
    let watching = true;
    const watch = (async () => {
      while (watching) {
        const { rows } = await watcher.query<{ s: number }>(`SELECT stock_on_hand AS s FROM products WHERE id = $1`, [p.id]);
        lowest = Math.min(lowest, rows[0]!.s);
        await new Promise((r) => setTimeout(r, 5));
      }
    })();
    const answers = await Promise.all(
      carts.map((c, i) =>
        request(servers[i % 2]!.app).post('/api/checkout').set('Cookie', `loadline_cart=${c.id}`).send({ email: `buyer${i}@example.test`, shippingAddress: address }),
      ),
    );
    watching = false;
    await watch;
    await watcher.end();

    const statuses = answers.map((r) => r.status);
    // Anything but the two expected answers is shown whole, so a failure says what it was.
    expect(answers.filter((r) => r.status !== 201 && r.status !== 409).map((r) => [r.status, r.body.message])).toEqual([]);
    expect(statuses.filter((s) => s === 201)).toHaveLength(10);
    expect(statuses.filter((s) => s === 409)).toHaveLength(190);
    const refusal = answers.find((r) => r.status === 409)!;
    expect(refusal.body.message).toContain('Last-batch shock spring is out of stock');
    expect(refusal.body.details).toMatchObject({ reason: 'out-of-stock', productId: p.id });
    expect(await stockOf(p.id)).toBe(0);
    expect(lowest).toBeGreaterThanOrEqual(0);
    expect(await AppDataSource.query(`SELECT count(*)::int AS n FROM orders WHERE status = 'pending' AND stock_held`)).toEqual([{ n: 10 }]);
    // The refused buyers keep their carts.
    expect(await AppDataSource.query(`SELECT count(*)::int AS n FROM cart_lines`)).toEqual([{ n: 200 }]);

    const cfg = servers[0]!.config;
    const swept = await Promise.all([
      sweepReservations(cfg, paymentProviderFor(cfg), new Date(Date.now() + 31 * 60_000)),
      sweepReservations(servers[1]!.config, paymentProviderFor(servers[1]!.config), new Date(Date.now() + 31 * 60_000)),
    ]);
    expect(swept[0]! + swept[1]!).toBe(10);
    expect(await stockOf(p.id)).toBe(10);
    expect(await AppDataSource.query(`SELECT cancel_reason, count(*)::int AS n FROM orders GROUP BY cancel_reason`)).toEqual([{ cancel_reason: 'expired', n: 10 }]);
  }, 120_000);
});

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { updateStock } from '../catalogue/catalogue.service';
import { AppDataSource } from '../db/data-source';
import { AppError } from '../errors';
import { releaseStock, reserveStock } from '../orders/order-stock';
import { Order } from '../orders/Order.entity';
import { address, ledgerSumOf, plainProduct, stockOf } from '../test/commerce-factories';
import { createUser } from '../test/factories';
import { recordStockMovement } from './stock-ledger';
import { receiveDelivery } from './stock.service';

type Op =
  | { kind: 'checkout'; product: number; quantity: number }
  | { kind: 'release'; order: number; reason: 'expiry' | 'cancel' | 'refund' }
  | { kind: 'receipt'; product: number; quantity: number }
  | { kind: 'return'; product: number; quantity: number }
  | { kind: 'adjust'; product: number; change: number }
  | { kind: 'count'; product: number; count: number };

const products = 2;
const op: fc.Arbitrary<Op> = fc.oneof(
  fc.record({ kind: fc.constant('checkout' as const), product: fc.nat(products - 1), quantity: fc.integer({ min: 1, max: 6 }) }),
  fc.record({ kind: fc.constant('release' as const), order: fc.nat(20), reason: fc.constantFrom('expiry' as const, 'cancel' as const, 'refund' as const) }),
  fc.record({ kind: fc.constant('receipt' as const), product: fc.nat(products - 1), quantity: fc.integer({ min: 1, max: 5 }) }),
  fc.record({ kind: fc.constant('return' as const), product: fc.nat(products - 1), quantity: fc.integer({ min: 1, max: 2 }) }),
  fc.record({ kind: fc.constant('adjust' as const), product: fc.nat(products - 1), change: fc.integer({ min: -6, max: 6 }).filter((c) => c !== 0) }),
  fc.record({ kind: fc.constant('count' as const), product: fc.nat(products - 1), count: fc.integer({ min: 0, max: 12 }) }),
);

/** An unpaid order holding `quantity` of one product, placed as the checkout does: order row, line, then reservation. */
async function checkout(productId: string, quantity: number, actorId: string): Promise<string> {
  return AppDataSource.transaction(async (em) => {
    const [o] = (await em.query(
      `INSERT INTO orders (email, customer_name, shipping_address, status, payment_status, fulfilment_status, currency, subtotal_cents, shipping_cents, vat_cents, total_cents, vat_rate_bp, reserved_until)
       VALUES ('buyer@example.test', 'Test Rider', $1, 'pending', 'awaiting', 'unfulfilled', 'EUR', 0, 0, 0, 0, 2000, now() + interval '30 minutes') RETURNING id`,
      [JSON.stringify(address)],
    )) as { id: string }[];
    await em.query(`INSERT INTO order_lines (order_id, position, product_id, sku, name, kind, unit_price_cents, quantity, line_total_cents) VALUES ($1, 1, $2, 'LL-T', 'Tool', 'tool', 0, $3, 0)`, [o!.id, productId, quantity]);
    await reserveStock(em, [{ productId, name: 'Tool', quantity }], { orderId: o!.id, actorId });
    return o!.id;
  });
}

const refused = (e: unknown) => e instanceof AppError && e.kind === 'conflict';

describe('stock ledger', () => {
  it('after any sequence of sales, expiries, cancels, refunds, receipts, returns, adjustments and stock takes, on-hand equals the sum of the ledger and a model of the shelf, and never went below 0', async () => {
    const actor = await createUser({ role: 'staff' });
    await fc.assert(
      fc.asyncProperty(fc.array(op, { minLength: 1, maxLength: 25 }), fc.array(fc.integer({ min: 0, max: 8 }), { minLength: products, maxLength: products }), async (ops, opening) => {
        const ids = await Promise.all(opening.map((n) => plainProduct(n).then((p) => p.id)));
        const model = [...opening];
        const orders: { id: string; product: number; quantity: number; open: boolean }[] = [];
        for (const o of ops) {
          if (o.kind === 'checkout') {
            const ok = model[o.product]! >= o.quantity;
            const id = await checkout(ids[o.product]!, o.quantity, actor.id).catch((e: unknown) => (refused(e) ? undefined : Promise.reject(e)));
            expect(id !== undefined).toBe(ok);
            if (id) {
              model[o.product]! -= o.quantity;
              orders.push({ id, product: o.product, quantity: o.quantity, open: true });
            }
          } else if (o.kind === 'release') {
            const held = orders[o.order % Math.max(orders.length, 1)];
            if (!held) continue;
            await AppDataSource.transaction(async (em) => {
              const order = await em.getRepository(Order).findOneOrFail({ where: { id: held.id }, lock: { mode: 'pessimistic_write' } });
              await releaseStock(em, order, { reason: o.reason, actorId: actor.id });
              await em.getRepository(Order).save(order);
            });
            // A second release of the same order gives nothing back.
            if (held.open) model[held.product]! += held.quantity;
            held.open = false;
          } else if (o.kind === 'receipt') {
            await receiveDelivery(actor.id, { deliveryRef: 'DN-1', lines: [{ productId: ids[o.product]!, quantity: o.quantity }] });
            model[o.product]! += o.quantity;
          } else if (o.kind === 'return') {
            await AppDataSource.transaction((em) => recordStockMovement(em, { productId: ids[o.product]!, quantity: o.quantity, reason: 'return', actorId: actor.id }));
            model[o.product]! += o.quantity;
          } else if (o.kind === 'adjust') {
            const ok = model[o.product]! + o.change >= 0;
            const done = await updateStock(actor.id, ids[o.product]!, { change: o.change }).then(() => true, (e: unknown) => (refused(e) ? false : Promise.reject(e)));
            expect(done).toBe(ok);
            if (ok) model[o.product]! += o.change;
          } else {
            await updateStock(actor.id, ids[o.product]!, { stockOnHand: o.count });
            model[o.product] = o.count;
          }
        }
        for (const [i, id] of ids.entries()) {
          const onHand = await stockOf(id);
          expect(onHand).toBe(model[i]);
          expect(await ledgerSumOf(id)).toBe(onHand);
          const [{ lowest }] = (await AppDataSource.query(`SELECT COALESCE(min(stock_after), 0)::int AS lowest FROM stock_movements WHERE product_id = $1`, [id])) as [{ lowest: number }];
          expect(lowest).toBeGreaterThanOrEqual(0);
        }
      }),
      { numRuns: 15 },
    );
  }, 120_000);

  it('many changes at once on one product queue on its row: the count still equals the ledger and never goes below 0', async () => {
    const actor = await createUser({ role: 'staff' });
    await fc.assert(
      fc.asyncProperty(fc.array(fc.integer({ min: -4, max: 4 }).filter((c) => c !== 0), { minLength: 4, maxLength: 16 }), async (changes) => {
        const { id } = await plainProduct(5);
        const results = await Promise.allSettled(changes.map((c) => updateStock(actor.id, id, { change: c })));
        for (const r of results) if (r.status === 'rejected') expect(refused(r.reason)).toBe(true);
        const onHand = await stockOf(id);
        expect(onHand).toBeGreaterThanOrEqual(0);
        expect(await ledgerSumOf(id)).toBe(onHand);
        const applied = changes.filter((_, i) => results[i]!.status === 'fulfilled');
        expect(onHand).toBe(5 + applied.reduce((a, b) => a + b, 0));
      }),
      { numRuns: 8 },
    );
  }, 120_000);

  it('a movement whose sign does not fit its reason is refused and writes nothing', async () => {
    const { id } = await plainProduct(3);
    await expect(AppDataSource.transaction((em) => recordStockMovement(em, { productId: id, quantity: -1, reason: 'receipt', actorId: null }))).rejects.toMatchObject({ kind: 'validation' });
    await expect(AppDataSource.transaction((em) => recordStockMovement(em, { productId: id, quantity: 1, reason: 'sale', actorId: null }))).rejects.toMatchObject({ kind: 'validation' });
    expect(await stockOf(id)).toBe(3);
    expect(await ledgerSumOf(id)).toBe(3);
  });
});

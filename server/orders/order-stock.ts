import type { EntityManager } from 'typeorm';
import { AppError } from '../errors';
import { isShortOfStock, recordStockMovement } from '../stock/stock-ledger';
import type { Order } from './Order.entity';

export interface StockNeed {
  productId: string;
  name: string;
  quantity: number;
}

/** The checkout's answer when the shelf cannot cover a line: 409, the product named, the cart untouched. */
export function outOfStock(name: string, productId: string, available: number, wanted: number): AppError {
  return new AppError('conflict', `${name} is out of stock: ${available === 0 ? 'none left' : `only ${available} left`}, ${wanted} wanted. Your cart is kept.`, undefined, {
    reason: 'out-of-stock',
    productId,
    name,
    available,
    wanted,
  });
}

/**
 * Takes units off the shelf for an order, one ledger row per product, in product-id order, so concurrent checkouts
 * lock rows in the same order (no deadlock) and stock can never go below zero.
 */
export async function reserveStock(em: EntityManager, needs: StockNeed[], ref: { orderId: string; actorId: string | null }): Promise<void> {
  const byProduct = new Map<string, StockNeed>();
  for (const n of needs) {
    const seen = byProduct.get(n.productId);
    byProduct.set(n.productId, seen ? { ...seen, quantity: seen.quantity + n.quantity } : { ...n });
  }
  for (const n of [...byProduct.values()].sort((a, b) => (a.productId < b.productId ? -1 : 1))) {
    try {
      await recordStockMovement(em, { productId: n.productId, quantity: -n.quantity, reason: 'sale', orderId: ref.orderId, actorId: ref.actorId, requireActive: true });
    } catch (e) {
      if (isShortOfStock(e)) throw outOfStock(n.name, n.productId, e.details.active ? e.details.available : 0, n.quantity);
      throw e;
    }
  }
}

/**
 * Puts an order's units back on the shelf, once: the order is locked by the caller and stock_held marks it done.
 * Each product gets a ledger row with the reason the order ended (expiry, cancel or refund).
 */
export async function releaseStock(em: EntityManager, order: Order, why: { reason: 'expiry' | 'cancel' | 'refund'; actorId: string | null }): Promise<void> {
  if (!order.stockHeld) return;
  const back = (await em.query(
    `SELECT product_id, sum(quantity - restocked_quantity)::int AS qty FROM order_lines
      WHERE order_id = $1 AND product_id IS NOT NULL GROUP BY product_id HAVING sum(quantity - restocked_quantity) > 0 ORDER BY product_id`,
    [order.id],
  )) as { product_id: string; qty: number }[];
  // Product-id order, as reserveStock takes them, so a release and a checkout never deadlock.
  for (const b of back) await recordStockMovement(em, { productId: b.product_id, quantity: b.qty, reason: why.reason, orderId: order.id, actorId: why.actorId });
  await em.query(`UPDATE order_lines SET restocked_quantity = quantity WHERE order_id = $1`, [order.id]);
  order.stockHeld = false;
}

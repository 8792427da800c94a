import type { EntityManager } from 'typeorm';
import { AppError } from '../errors';
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
 * Takes units off the shelf for an order. One guarded update per product, in product-id order, so concurrent
 * checkouts lock rows in the same order (no deadlock) and stock can never go below zero.
 */
export async function reserveStock(em: EntityManager, needs: StockNeed[]): Promise<void> {
  const byProduct = new Map<string, StockNeed>();
  for (const n of needs) {
    const seen = byProduct.get(n.productId);
    byProduct.set(n.productId, seen ? { ...seen, quantity: seen.quantity + n.quantity } : { ...n });
  }
  for (const n of [...byProduct.values()].sort((a, b) => (a.productId < b.productId ? -1 : 1))) {
    // An UPDATE answers [rows, rowCount] through TypeORM.
    const [rows] = (await em.query(
      `UPDATE products SET stock_on_hand = stock_on_hand - $2, updated_at = now()
        WHERE id = $1 AND active AND stock_on_hand >= $2 RETURNING id`,
      [n.productId, n.quantity],
    )) as [unknown[], number];
    if (rows.length === 0) {
      const [p] = (await em.query(`SELECT stock_on_hand, active FROM products WHERE id = $1`, [n.productId])) as { stock_on_hand: number; active: boolean }[];
      throw outOfStock(n.name, n.productId, p?.active ? p.stock_on_hand : 0, n.quantity);
    }
  }
}

/** Puts an order's units back on the shelf, once: the order is locked by the caller and stock_held marks it done. */
export async function releaseStock(em: EntityManager, order: Order): Promise<void> {
  if (!order.stockHeld) return;
  // Rows locked in product-id order first, as reserveStock takes them, so a release and a checkout never deadlock.
  await em.query(
    `SELECT p.id FROM products p WHERE p.id IN (SELECT product_id FROM order_lines WHERE order_id = $1) ORDER BY p.id FOR UPDATE`,
    [order.id],
  );
  await em.query(
    `UPDATE products p SET stock_on_hand = p.stock_on_hand + back.qty, updated_at = now()
       FROM (SELECT product_id, sum(quantity - restocked_quantity)::int AS qty FROM order_lines
              WHERE order_id = $1 AND product_id IS NOT NULL GROUP BY product_id) back
      WHERE p.id = back.product_id AND back.qty > 0`,
    [order.id],
  );
  await em.query(`UPDATE order_lines SET restocked_quantity = quantity WHERE order_id = $1`, [order.id]);
  order.stockHeld = false;
}

import type { EntityManager } from 'typeorm';
import { AppError } from '../errors';
import { lockedShelfJson, recordStockMovement, stockMovementCtes, stockMovesFromJson, stockMovesJson, type LockedShelf } from '../stock/stock-ledger';
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
 * The `moves` CTE of a sale (see stockMovementCtes): one row per product of the lines in the CTE `linesCte` (product_id,
 * quantity), taking their units off the shelf for the order `orderParam`, placed by `actorParam` (placeholders).
 */
export function saleMovesCte(linesCte: string, orderParam: string, actorParam: string): string {
  return `moves AS (
      SELECT product_id, -sum(quantity)::int AS quantity, 'sale'::varchar AS reason, ${orderParam}::uuid AS order_id, NULL::uuid AS exchange_id,
             NULL::varchar AS delivery_ref, ''::text AS note, ${actorParam}::uuid AS actor_id
        FROM ${linesCte} WHERE product_id IS NOT NULL GROUP BY product_id
    )`;
}

/**
 * The 409 for a sale the shelf could not cover, from what the statement saw once it held the locks: the first
 * product short in product-id order (the order the locks are taken in), or null when every product was covered.
 */
export function uncoveredSale(needs: StockNeed[], shelf: LockedShelf[]): AppError | null {
  const wanted = new Map<string, StockNeed>();
  for (const n of needs) {
    const seen = wanted.get(n.productId);
    wanted.set(n.productId, seen ? { ...seen, quantity: seen.quantity + n.quantity } : { ...n });
  }
  for (const n of [...wanted.values()].sort((a, b) => (a.productId < b.productId ? -1 : 1))) {
    const p = shelf.find((s) => s.id === n.productId);
    if (!p || !p.active) return outOfStock(n.name, n.productId, 0, n.quantity);
    if (p.stockOnHand < n.quantity) return outOfStock(n.name, n.productId, p.stockOnHand, n.quantity);
  }
  return null;
}

/**
 * Takes units off the shelf for an order already written, one ledger row per product, in one guarded statement:
 * all products or none, stock never below zero, locks in product-id order. Checkout does the same inside its own
 * statement.
 */
export async function reserveStock(em: EntityManager, needs: StockNeed[], ref: { orderId: string; actorId: string | null }): Promise<void> {
  const perProduct = new Map<string, number>();
  for (const n of needs) perProduct.set(n.productId, (perProduct.get(n.productId) ?? 0) + n.quantity);
  const moves = stockMovesJson([...perProduct].map(([productId, quantity]) => ({ productId, quantity: -quantity, reason: 'sale' as const, orderId: ref.orderId, actorId: ref.actorId })));
  const [row] = (await em.query(`WITH ${stockMovesFromJson('$1')}, ${stockMovementCtes({ requireActive: true })} SELECT (SELECT ok FROM stock_covered) AS ok, ${lockedShelfJson} AS shelf`, [moves])) as { ok: boolean; shelf: LockedShelf[] }[];
  if (!row!.ok) throw uncoveredSale(needs, row!.shelf) ?? new Error('The shelf refused a sale it could cover');
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

import type { EntityManager } from 'typeorm';
import { AppError } from '../errors';
import { isShortOfStock, recordStockMovement, shortOfStockError, stockMovementCtes, stockMovesFromJson, stockMovesJson } from '../stock/stock-ledger';
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
 * The `moves` CTE of a sale (see stockMovementCtes): one row per product of the order lines inserted by the CTE named
 * `linesCte`, taking their units off the shelf; `actorParam` is the placeholder of who placed the order.
 */
export function saleMovesCte(linesCte: string, actorParam: string): string {
  return `moves AS (
      SELECT product_id, -sum(quantity)::int AS quantity, 'sale'::varchar AS reason, order_id, NULL::uuid AS exchange_id,
             NULL::varchar AS delivery_ref, ''::text AS note, ${actorParam}::uuid AS actor_id
        FROM ${linesCte} WHERE product_id IS NOT NULL GROUP BY product_id, order_id
    )`;
}

/**
 * After a sale's statement: when the shelf could not cover every product (fewer moved than needed), the 409 names
 * the first one short in product-id order, as the locks were taken. The caller's transaction rolls the rest back.
 */
export async function refuseUncoveredSale(em: EntityManager, needs: StockNeed[], movedIds: string[]): Promise<void> {
  const moved = new Set(movedIds);
  const short = [...needs].sort((a, b) => (a.productId < b.productId ? -1 : 1)).find((n) => !moved.has(n.productId));
  if (!short) return;
  const wanted = needs.filter((n) => n.productId === short.productId).reduce((s, n) => s + n.quantity, 0);
  const e = await shortOfStockError(em, short.productId, -wanted);
  if (isShortOfStock(e)) throw outOfStock(short.name, short.productId, e.details.active ? e.details.available : 0, wanted);
  throw e;
}

/**
 * Takes units off the shelf for an order already written, one ledger row per product, in one guarded statement
 * (stock never below zero, locks in product-id order). Checkout does the same inside its own statement.
 */
export async function reserveStock(em: EntityManager, needs: StockNeed[], ref: { orderId: string; actorId: string | null }): Promise<void> {
  const perProduct = new Map<string, number>();
  for (const n of needs) perProduct.set(n.productId, (perProduct.get(n.productId) ?? 0) + n.quantity);
  const moves = stockMovesJson([...perProduct].map(([productId, quantity]) => ({ productId, quantity: -quantity, reason: 'sale' as const, orderId: ref.orderId, actorId: ref.actorId })));
  const [row] = (await em.query(`WITH ${stockMovesFromJson('$1')}, ${stockMovementCtes({ requireActive: true })} SELECT ARRAY(SELECT id FROM stock_moved)::text[] AS ids`, [moves])) as { ids: string[] }[];
  await refuseUncoveredSale(em, needs, row!.ids);
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

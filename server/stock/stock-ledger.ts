import type { EntityManager } from 'typeorm';
import { fitsReason, type StockReason } from '../../shared/warehouse/stock';
import { AppError } from '../errors';

export interface StockMovementInput {
  productId: string;
  /** Signed change of the on-hand count: negative takes units off the shelf. */
  quantity: number;
  reason: StockReason;
  orderId?: string | null;
  exchangeId?: string | null;
  deliveryRef?: string | null;
  note?: string;
  /** Who did it; null for the shop's own timers (reservation expiry). */
  actorId: string | null;
  /** A sale takes only from products still on sale. */
  requireActive?: boolean;
}

/** Details of the 409 when the shelf cannot cover a change, for callers that word it their own way. */
export interface ShortOfStock {
  reason: 'insufficient-stock';
  productId: string;
  available: number;
  wanted: number;
  active: boolean;
}

export const isShortOfStock = (e: unknown): e is AppError & { details: ShortOfStock } =>
  e instanceof AppError && (e.details as ShortOfStock | undefined)?.reason === 'insufficient-stock';

/**
 * The one way a product's on-hand count changes: a guarded update that never goes below zero and the ledger row
 * that explains it, both in the caller's transaction. Concurrent changes queue on the product row.
 * @returns the count left on hand
 */
export async function recordStockMovement(em: EntityManager, m: StockMovementInput): Promise<number> {
  if (!fitsReason(m.reason, m.quantity)) {
    throw AppError.validation(`A ${m.reason} cannot change stock by ${m.quantity}.`, { quantity: `A ${m.reason} cannot change stock by ${m.quantity}.` });
  }
  // An UPDATE answers [rows, rowCount] through TypeORM.
  const [rows] = (await em.query(
    `UPDATE products SET stock_on_hand = stock_on_hand + $2, updated_at = now()
      WHERE id = $1 AND stock_on_hand + $2 >= 0 ${m.requireActive ? 'AND active' : ''}
      RETURNING stock_on_hand`,
    [m.productId, m.quantity],
  )) as [{ stock_on_hand: number }[], number];
  const row = rows[0];
  if (!row) {
    const [p] = (await em.query(`SELECT sku, stock_on_hand, active FROM products WHERE id = $1`, [m.productId])) as { sku: string; stock_on_hand: number; active: boolean }[];
    if (!p) throw AppError.notFound('The product');
    const details: ShortOfStock = { reason: 'insufficient-stock', productId: m.productId, available: p.stock_on_hand, wanted: -m.quantity, active: p.active };
    throw new AppError('conflict', `Only ${p.stock_on_hand} of ${p.sku} on hand: taking out ${-m.quantity} would leave ${p.stock_on_hand + m.quantity}, and stock cannot go below 0.`, undefined, details);
  }
  await em.query(
    `INSERT INTO stock_movements (product_id, quantity, reason, order_id, exchange_id, delivery_ref, note, actor_id, stock_after)
     VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9)`,
    [m.productId, m.quantity, m.reason, m.orderId ?? null, m.exchangeId ?? null, m.deliveryRef ?? null, (m.note ?? '').trim(), m.actorId, row.stock_on_hand],
  );
  return row.stock_on_hand;
}

/**
 * Sets a product's count after a stock take: the difference is recorded as an adjustment (nothing when equal).
 * The product row is locked first, so the difference is taken against the count that is really there.
 */
export async function countStockTo(em: EntityManager, productId: string, count: number, opts: { actorId: string | null; note?: string }): Promise<number> {
  const [p] = (await em.query(`SELECT stock_on_hand FROM products WHERE id = $1 FOR UPDATE`, [productId])) as { stock_on_hand: number }[];
  if (!p) throw AppError.notFound('The product');
  const change = count - p.stock_on_hand;
  if (change === 0) return count;
  return recordStockMovement(em, { productId, quantity: change, reason: 'adjustment', note: opts.note ?? 'stock take', actorId: opts.actorId });
}

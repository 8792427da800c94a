import type { EntityManager } from 'typeorm';
import { AppError } from '../errors';

/** The ledger's reasons this part writes: a spring back on the shelf (return), a replacement off it (sale). */
export type ExchangeStockReason = 'return' | 'sale';

export interface ExchangeStockMovement {
  productId: string;
  /** Positive: onto the shelf; negative: off it. */
  quantity: number;
  reason: ExchangeStockReason;
  orderId?: string;
  exchangeId?: string;
  note?: string;
  actorId: string;
}

/**
 * Moves stock for an exchange in the caller's transaction, guarded so the shelf never goes below zero.
 * Written against the stock ledger's one entry point, recordStockMovement(manager, movement): when the ledger is
 * merged this body becomes that call, and every movement gets its ledger row.
 */
export async function moveExchangeStock(em: EntityManager, m: ExchangeStockMovement): Promise<void> {
  const [rows] = (await em.query(
    `UPDATE products SET stock_on_hand = stock_on_hand + $2, updated_at = now() WHERE id = $1 AND stock_on_hand + $2 >= 0 RETURNING id`,
    [m.productId, m.quantity],
  )) as [unknown[], number];
  if (rows.length === 0) throw new AppError('conflict', 'Not enough of the replacement spring on the shelf to ship it; receive stock first.', undefined, { reason: 'out-of-stock', productId: m.productId });
}

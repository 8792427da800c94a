import type { EntityManager } from 'typeorm';
import { recordStockMovement } from '../stock/stock-ledger';

/** The ledger's reasons this part writes: a spring back on the shelf (return), a replacement off it (sale). */
export type ExchangeStockReason = 'return' | 'sale';

export interface ExchangeStockMovement {
  productId: string;
  /** Positive: onto the shelf; negative: off it. */
  quantity: number;
  reason: ExchangeStockReason;
  orderId: string;
  exchangeId: string;
  note: string;
  actorId: string;
}

/** Moves stock for an exchange through the stock ledger, in the caller's transaction: never below zero, one ledger row each. */
export async function moveExchangeStock(em: EntityManager, m: ExchangeStockMovement): Promise<number> {
  return recordStockMovement(em, m);
}

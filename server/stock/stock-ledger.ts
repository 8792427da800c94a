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

/** Refuses a change whose sign does not fit its reason (a receipt that takes stock, a sale that adds it). */
function checkReason(m: Pick<StockMovementInput, 'reason' | 'quantity'>): void {
  if (!fitsReason(m.reason, m.quantity)) {
    throw AppError.validation(`A ${m.reason} cannot change stock by ${m.quantity}.`, { quantity: `A ${m.reason} cannot change stock by ${m.quantity}.` });
  }
}

/**
 * The ledger rule as SQL, for a statement that needs it among other changes. Given a CTE `moves` of (product_id,
 * quantity, reason, order_id, exchange_id, delivery_ref, note, actor_id) with one row per product, it adds:
 * - `stock_locked` (id, stock_on_hand, active): those products locked in id order, so no two changes deadlock, with
 *   the lock an UPDATE takes anyway (NO KEY UPDATE lets other orders' foreign-key checks through); the counts are
 *   the ones really there once locked;
 * - `stock_covered` (ok): whether every change fits (the count stays at or above zero; for sales, the product is on
 *   sale). Changes apply all together or not at all, so a statement never leaves a half-taken basket;
 * - `stock_moved` (id, stock_on_hand): the guarded updates, made only once every lock is held and all fit;
 * - `stock_ledger`: one ledger row per change made, with the count left.
 */
export function stockMovementCtes(opts: { requireActive: boolean }): string {
  const fits = `l.stock_on_hand + m.quantity >= 0 ${opts.requireActive ? 'AND l.active' : ''}`;
  return `stock_locked AS (
      SELECT p.id, p.stock_on_hand, p.active FROM products p WHERE p.id = ANY (ARRAY(SELECT product_id FROM moves)) ORDER BY p.id FOR NO KEY UPDATE
    ), stock_covered AS (
      SELECT count(*) = (SELECT count(*) FROM moves) AND coalesce(bool_and(${fits}), true) AS ok
        FROM stock_locked l JOIN moves m ON m.product_id = l.id
    ), stock_moved AS (
      UPDATE products p SET stock_on_hand = p.stock_on_hand + m.quantity, updated_at = now()
        FROM moves m
       WHERE p.id = ANY (ARRAY(SELECT id FROM stock_locked)) AND p.id = m.product_id AND (SELECT ok FROM stock_covered) AND p.stock_on_hand + m.quantity >= 0
      RETURNING p.id, p.stock_on_hand
    ), stock_ledger AS (
      INSERT INTO stock_movements (product_id, quantity, reason, order_id, exchange_id, delivery_ref, note, actor_id, stock_after)
      SELECT m.product_id, m.quantity, m.reason, m.order_id, m.exchange_id, m.delivery_ref, btrim(m.note), m.actor_id, s.stock_on_hand
        FROM moves m JOIN stock_moved s ON s.id = m.product_id
      RETURNING product_id
    )`;
}

/** What stock_locked saw, as the statement's answer: `shelf` in the caller's final SELECT. */
export const lockedShelfJson = `(SELECT coalesce(json_agg(json_build_object('id', id, 'stockOnHand', stock_on_hand, 'active', active) ORDER BY id), '[]') FROM stock_locked)`;
export interface LockedShelf {
  id: string;
  stockOnHand: number;
  active: boolean;
}

/** The `moves` CTE over a JSON list of changes, for stockMovementCtes; `$n` is where the caller passes stockMovesJson(...). */
export const stockMovesFromJson = (param: string) =>
  `moves AS (SELECT * FROM jsonb_to_recordset(${param}::jsonb) AS m(product_id uuid, quantity int, reason varchar, order_id uuid, exchange_id uuid, delivery_ref varchar, note text, actor_id uuid))`;

/** The changes as the JSON stockMovesFromJson reads, each checked against its reason first. */
export function stockMovesJson(moves: StockMovementInput[]): string {
  for (const m of moves) checkReason(m);
  return JSON.stringify(
    moves.map((m) => ({
      product_id: m.productId, quantity: m.quantity, reason: m.reason, order_id: m.orderId ?? null, exchange_id: m.exchangeId ?? null,
      delivery_ref: m.deliveryRef ?? null, note: m.note ?? '', actor_id: m.actorId,
    })),
  );
}

/** The 409 for a change the shelf cannot cover, read after the refused update so it names the count really there. */
export async function shortOfStockError(em: EntityManager, productId: string, quantity: number): Promise<AppError> {
  const [p] = (await em.query(`SELECT sku, stock_on_hand, active FROM products WHERE id = $1`, [productId])) as { sku: string; stock_on_hand: number; active: boolean }[];
  if (!p) return AppError.notFound('The product');
  const details: ShortOfStock = { reason: 'insufficient-stock', productId, available: p.stock_on_hand, wanted: -quantity, active: p.active };
  return new AppError('conflict', `Only ${p.stock_on_hand} of ${p.sku} on hand: taking out ${-quantity} would leave ${p.stock_on_hand + quantity}, and stock cannot go below 0.`, undefined, details);
}

/**
 * The one way a product's on-hand count changes: a guarded update that never goes below zero and the ledger row
 * that explains it, both in the caller's transaction and in one statement (stockMovementCtes). Concurrent changes
 * queue on the product row.
 * @returns the count left on hand
 */
export async function recordStockMovement(em: EntityManager, m: StockMovementInput): Promise<number> {
  const json = stockMovesJson([m]);
  const rows = (await em.query(
    `WITH ${stockMovesFromJson('$1')}, ${stockMovementCtes({ requireActive: !!m.requireActive })}
     SELECT stock_on_hand FROM stock_moved`,
    [json],
  )) as { stock_on_hand: number }[];
  const row = rows[0];
  if (!row) throw await shortOfStockError(em, m.productId, m.quantity);
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

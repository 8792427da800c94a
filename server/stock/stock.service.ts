import type { EntityManager } from 'typeorm';
import type { StockMovementDto } from '../../shared/warehouse/stock';
import type { DeliveryReceivedDto, LowStockListDto, ReceiveDeliveryDto, StockMovementPageDto, StockMovementQueryDto, StockProductDto } from '../../shared/warehouse/stock.dto';
import { recordAudit } from '../audit/audit.service';
import { catalogueChanged } from '../catalogue/catalogue-cache';
import { AppDataSource } from '../db/data-source';
import { AppError } from '../errors';
import { getShopSettings } from '../shop/shop-settings.service';
import { recordStockMovement } from './stock-ledger';

/** The threshold a product without its own is judged by: the shop settings' low-stock threshold. */
export async function lowStockDefault(em?: EntityManager): Promise<number> {
  return (await getShopSettings(em)).lowStockThreshold;
}

/** A delivery arrives: each line is a receipt in the ledger (who, when, the delivery's reference), all in one transaction. */
export async function receiveDelivery(actorId: string, dto: ReceiveDeliveryDto): Promise<DeliveryReceivedDto> {
  const ids = dto.lines.map((l) => l.productId.toLowerCase());
  if (new Set(ids).size !== ids.length) throw AppError.validation('Name each product once.', { lines: 'Name each product once; add the quantities together.' });
  const deliveryRef = dto.deliveryRef.trim();
  const out = await AppDataSource.transaction(async (em) => {
    const found = (await em.query(`SELECT id, sku, name FROM products WHERE id = ANY($1::uuid[])`, [ids])) as { id: string; sku: string; name: string }[];
    const missing = dto.lines.map((l, i) => [l, i] as const).filter(([l]) => !found.some((p) => p.id === l.productId.toLowerCase()));
    if (missing.length) throw AppError.validation('A line names a product that does not exist.', Object.fromEntries(missing.map(([, i]) => [`lines.${i}.productId`, 'No such product.'])));
    const lines: DeliveryReceivedDto['lines'] = [];
    // Product-id order, as checkouts take their rows, so a delivery and a checkout never deadlock.
    for (const l of [...dto.lines].sort((a, b) => (a.productId.toLowerCase() < b.productId.toLowerCase() ? -1 : 1))) {
      const p = found.find((x) => x.id === l.productId.toLowerCase())!;
      const stockAfter = await recordStockMovement(em, { productId: p.id, quantity: l.quantity, reason: 'receipt', deliveryRef, note: dto.note ?? '', actorId });
      lines.push({ productId: p.id, sku: p.sku, name: p.name, quantity: l.quantity, stockAfter });
    }
    return { deliveryRef, lines };
  });
  catalogueChanged();
  return out;
}

interface MovementRow {
  id: string;
  product_id: string;
  sku: string;
  product_name: string;
  quantity: number;
  reason: StockMovementDto['reason'];
  order_id: string | null;
  order_number: string | null;
  exchange_id: string | null;
  delivery_ref: string | null;
  note: string;
  actor_name: string | null;
  stock_after: number;
  created_at: Date;
}

/** The ledger, newest first, for one product or all, optionally of one reason. */
export async function listMovements(q: StockMovementQueryDto): Promise<StockMovementPageDto> {
  const page = q.page ?? 1;
  const pageSize = q.pageSize ?? 50;
  const where: string[] = [];
  const args: unknown[] = [];
  if (q.productId) where.push(`m.product_id = $${args.push(q.productId)}`);
  if (q.reason) where.push(`m.reason = $${args.push(q.reason)}`);
  const cond = where.length ? `WHERE ${where.join(' AND ')}` : '';
  const [{ n }] = (await AppDataSource.query(`SELECT count(*)::int AS n FROM stock_movements m ${cond}`, args)) as [{ n: number }];
  const rows = (await AppDataSource.query(
    `SELECT m.id, m.product_id, p.sku, p.name AS product_name, m.quantity, m.reason, m.order_id, o.number AS order_number, m.exchange_id,
            m.delivery_ref, m.note, u.display_name AS actor_name, m.stock_after, m.created_at
       FROM stock_movements m JOIN products p ON p.id = m.product_id
       LEFT JOIN orders o ON o.id = m.order_id LEFT JOIN users u ON u.id = m.actor_id
       ${cond} ORDER BY m.created_at DESC, m.id DESC LIMIT $${args.length + 1} OFFSET $${args.length + 2}`,
    [...args, pageSize, (page - 1) * pageSize],
  )) as MovementRow[];
  return {
    items: rows.map((r) => ({
      id: r.id,
      productId: r.product_id,
      sku: r.sku,
      productName: r.product_name,
      quantity: r.quantity,
      reason: r.reason,
      orderId: r.order_id,
      orderNumber: r.order_number,
      exchangeId: r.exchange_id,
      deliveryRef: r.delivery_ref,
      note: r.note,
      actorName: r.actor_name,
      stockAfter: r.stock_after,
      createdAt: r.created_at.toISOString(),
    })),
    total: n,
    page,
    pageSize,
  };
}

/** Products on sale at or under their threshold (their own, else the shop's default), emptiest first. */
export async function lowStockList(): Promise<LowStockListDto> {
  const def = await lowStockDefault();
  const rows = (await AppDataSource.query(
    `SELECT id, sku, name, bin_location, stock_on_hand, low_stock_threshold FROM products
      WHERE active AND stock_on_hand <= COALESCE(low_stock_threshold, $1) ORDER BY stock_on_hand, sku LIMIT 500`,
    [def],
  )) as { id: string; sku: string; name: string; bin_location: string; stock_on_hand: number; low_stock_threshold: number | null }[];
  return {
    defaultThreshold: def,
    items: rows.map((r) => ({
      productId: r.id,
      sku: r.sku,
      name: r.name,
      binLocation: r.bin_location,
      stockOnHand: r.stock_on_hand,
      threshold: r.low_stock_threshold ?? def,
      thresholdIsDefault: r.low_stock_threshold === null,
    })),
  };
}

/** Sets or clears (null) a product's own low-stock threshold, audited. */
export async function setLowStockThreshold(actorId: string, productId: string, threshold: number | null): Promise<{ productId: string; threshold: number | null }> {
  return AppDataSource.transaction(async (em) => {
    const [p] = (await em.query(`SELECT low_stock_threshold FROM products WHERE id = $1 FOR UPDATE`, [productId])) as { low_stock_threshold: number | null }[];
    if (!p) throw AppError.notFound('The product');
    await em.query(`UPDATE products SET low_stock_threshold = $2 WHERE id = $1`, [productId, threshold]);
    await recordAudit(em, { actorId, entityType: 'product', entityId: productId, action: 'update', before: { lowStockThreshold: p.low_stock_threshold }, after: { lowStockThreshold: threshold } });
    return { productId, threshold };
  });
}

/** Every product with its shelf, by SKU, for the delivery form (the warehouse has no catalogue pages). */
export async function stockProducts(): Promise<StockProductDto[]> {
  const rows = (await AppDataSource.query(`SELECT id, sku, name, bin_location, stock_on_hand FROM products ORDER BY sku LIMIT 5000`)) as { id: string; sku: string; name: string; bin_location: string; stock_on_hand: number }[];
  return rows.map((r) => ({ id: r.id, sku: r.sku, name: r.name, binLocation: r.bin_location, stockOnHand: r.stock_on_hand }));
}

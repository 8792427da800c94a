import type { EntityManager } from 'typeorm';
import type { FulfilmentStatus } from '../../shared/order-status';
import { isForWarehouse, mayDeliver, mayPack, mayPick, openQueueStates, pickLimit, queueStates, shipmentOutcome, unitsDue, unitsInTote } from '../../shared/warehouse/fulfilment';
import type { PickListDto, ShipDto, WarehouseQueueDto, WarehouseQueueQueryDto } from '../../shared/warehouse/fulfilment.dto';
import type { Config } from '../config';
import { AppDataSource } from '../db/data-source';
import { AppError } from '../errors';
import { orderMail } from '../orders/order-mail';
import { lockOrder, moveOrder } from '../orders/order-moves';
import { Order } from '../orders/Order.entity';
import { OrderLine } from '../orders/OrderLine.entity';
import { barcodeDataUri } from './barcode';
import { Shipment } from './Shipment.entity';
import { shipmentsOf } from './shipments';

/** Paid orders for the warehouse, oldest payment first, with how many orders stand in each fulfilment state. */
export async function warehouseQueue(q: WarehouseQueueQueryDto): Promise<WarehouseQueueDto> {
  const paid = `o.status <> 'cancelled' AND o.payment_status IN ('paid', 'partially-refunded')`;
  const countRows = (await AppDataSource.query(`SELECT o.fulfilment_status AS s, count(*)::int AS n FROM orders o WHERE ${paid} GROUP BY 1`)) as { s: FulfilmentStatus; n: number }[];
  const counts = Object.fromEntries(queueStates.map((s) => [s, countRows.find((r) => r.s === s)?.n ?? 0])) as Record<FulfilmentStatus, number>;
  const states: readonly FulfilmentStatus[] = q.state ? [q.state] : openQueueStates;
  const rows = (await AppDataSource.query(
    `SELECT o.id, o.number, o.customer_name, o.fulfilment_status, o.paid_at,
            COALESCE(sum(l.quantity - l.refunded_quantity), 0)::int AS units, COALESCE(sum(l.picked_quantity), 0)::int AS picked
       FROM orders o LEFT JOIN order_lines l ON l.order_id = o.id
      WHERE ${paid} AND o.fulfilment_status = ANY($1)
      GROUP BY o.id ORDER BY o.paid_at ASC NULLS LAST, o.number LIMIT 200`,
    [states],
  )) as { id: string; number: string; customer_name: string; fulfilment_status: FulfilmentStatus; paid_at: Date | null; units: number; picked: number }[];
  return {
    counts,
    items: rows.map((r) => ({
      id: r.id,
      number: r.number,
      customerName: r.customer_name,
      fulfilmentStatus: r.fulfilment_status,
      paidAt: r.paid_at?.toISOString() ?? null,
      units: r.units,
      unitsPicked: r.picked,
    })),
  };
}

async function linesWithBins(em: EntityManager, orderId: string): Promise<(OrderLine & { binLocation: string })[]> {
  const lines = await em.getRepository(OrderLine).find({ where: { orderId }, order: { position: 'ASC' } });
  const ids = lines.map((l) => l.productId).filter((x): x is string => !!x);
  const bins = ids.length ? ((await em.query(`SELECT id, bin_location FROM products WHERE id = ANY($1::uuid[])`, [ids])) as { id: string; bin_location: string }[]) : [];
  return lines.map((l) => Object.assign(l, { binLocation: bins.find((b) => b.id === l.productId)?.bin_location ?? '' }));
}

/** The pick list: lines in bin order (the walk through the shelves), each with its scannable code, and what may happen next. */
export async function pickList(orderId: string, em: EntityManager = AppDataSource.manager): Promise<PickListDto> {
  const o = await em.getRepository(Order).findOneBy({ id: orderId });
  if (!o || !isForWarehouse(o)) throw AppError.notFound('The order');
  const lines = (await linesWithBins(em, o.id)).sort((a, b) => a.binLocation.localeCompare(b.binLocation) || a.position - b.position);
  const next = shipmentOutcome(o, lines);
  return {
    id: o.id,
    number: o.number,
    customerName: o.customerName,
    shippingAddress: o.shippingAddress,
    fulfilmentStatus: o.fulfilmentStatus,
    paidAt: o.paidAt?.toISOString() ?? null,
    packedAt: o.packedAt?.toISOString() ?? null,
    shippedAt: o.shippedAt?.toISOString() ?? null,
    deliveredAt: o.deliveredAt?.toISOString() ?? null,
    lines: lines.map((l) => ({
      id: l.id,
      productId: l.productId,
      sku: l.sku,
      name: l.name,
      binLocation: l.binLocation,
      quantity: l.quantity,
      refundedQuantity: l.refundedQuantity,
      pickedQuantity: l.pickedQuantity,
      shippedQuantity: l.shippedQuantity,
      due: unitsDue(l),
      barcode: barcodeDataUri(l.sku),
    })),
    shipments: await shipmentsOf(em, o.id),
    mayPick: mayPick(o),
    mayPack: mayPack(o, lines),
    // A parcel leaves from a packed order, or from a back-order once more is picked.
    shipWouldLeave: o.fulfilmentStatus === 'unfulfilled' ? null : (next ?? null),
    mayDeliver: mayDeliver(o),
  };
}

/** Every warehouse step starts here: the order locked, still the warehouse's, its lines read under the same lock. */
async function lockedForWarehouse(em: EntityManager, orderId: string): Promise<{ o: Order; lines: OrderLine[] }> {
  const o = await lockOrder(em, { id: orderId });
  if (!o || !isForWarehouse(o)) throw AppError.notFound('The order');
  const lines = await em.getRepository(OrderLine).find({ where: { orderId }, order: { position: 'ASC' } });
  return { o, lines };
}

const notPickable = (o: Order) =>
  new AppError('conflict', `Order ${o.number} is ${o.fulfilmentStatus}; picking is closed.`, undefined, { fulfilmentStatus: o.fulfilmentStatus });

/** A scanned or typed code counts one unit of the line with that SKU (the first one still short). */
export async function scanCode(orderId: string, code: string): Promise<PickListDto> {
  return AppDataSource.transaction(async (em) => {
    const { o, lines } = await lockedForWarehouse(em, orderId);
    if (!mayPick(o)) throw notPickable(o);
    const wanted = code.trim().toUpperCase();
    const matching = lines.filter((l) => l.sku.toUpperCase() === wanted);
    if (!matching.length) throw AppError.validation(`${code.trim()} is not on this order.`, { code: `${code.trim()} is not on this order.` });
    const line = matching.find((l) => l.pickedQuantity < pickLimit(l));
    if (!line) throw new AppError('conflict', `Every unit of ${matching[0]!.sku} is already picked.`, { code: `Every unit of ${matching[0]!.sku} is already picked.` });
    await em.getRepository(OrderLine).update({ id: line.id }, { pickedQuantity: line.pickedQuantity + 1 });
    return pickList(orderId, em);
  });
}

/** Ticks a line (all units in the tote) or corrects its count; never below what already shipped. */
export async function setPicked(orderId: string, lineId: string, pickedQuantity: number): Promise<PickListDto> {
  return AppDataSource.transaction(async (em) => {
    const { o, lines } = await lockedForWarehouse(em, orderId);
    if (!mayPick(o)) throw notPickable(o);
    const line = lines.find((l) => l.id === lineId);
    if (!line) throw AppError.notFound('The order line');
    if (pickedQuantity > pickLimit(line) || pickedQuantity < line.shippedQuantity) {
      const msg = `Between ${line.shippedQuantity} and ${pickLimit(line)} of ${line.sku} can be picked.`;
      throw AppError.validation(msg, { pickedQuantity: msg });
    }
    await em.getRepository(OrderLine).update({ id: line.id }, { pickedQuantity });
    return pickList(orderId, em);
  });
}

/** Packs the order: one guarded move, so of two people packing at once only the first succeeds. */
export async function packOrder(actorId: string, orderId: string): Promise<PickListDto> {
  return AppDataSource.transaction(async (em) => {
    const { o, lines } = await lockedForWarehouse(em, orderId);
    if (o.fulfilmentStatus === 'unfulfilled' && !lines.some((l) => unitsInTote(l) > 0)) {
      throw new AppError('conflict', `Pick something for order ${o.number} before packing it.`);
    }
    o.packedBy = actorId;
    await moveOrder(em, o, { fulfilmentStatus: 'packed' });
    return pickList(orderId, em);
  });
}

/**
 * Sends what is in the tote as one parcel: shipped when nothing more is due, else partially shipped with the rest
 * back-ordered. The shipped mail is queued in the same transaction.
 */
export async function shipOrder(config: Config, actorId: string, orderId: string, dto: ShipDto): Promise<PickListDto> {
  return AppDataSource.transaction(async (em) => {
    const { o, lines } = await lockedForWarehouse(em, orderId);
    if (o.fulfilmentStatus === 'unfulfilled') throw new AppError('conflict', `Order ${o.number} cannot go from unfulfilled to shipped: pack it first.`);
    const next = shipmentOutcome(o, lines);
    if (!next) {
      throw new AppError('conflict', o.fulfilmentStatus === 'partially-shipped' ? `Pick the back-ordered units of order ${o.number} before sending another parcel.` : `Order ${o.number} cannot be shipped now (${o.fulfilmentStatus}).`);
    }
    const parcel = lines.filter((l) => unitsInTote(l) > 0).map((l) => ({ orderLineId: l.id, quantity: unitsInTote(l) }));
    for (const p of parcel) await em.query(`UPDATE order_lines SET shipped_quantity = shipped_quantity + $2 WHERE id = $1`, [p.orderLineId, p.quantity]);
    const shipment = await em.getRepository(Shipment).save(
      em.getRepository(Shipment).create({ orderId: o.id, carrier: dto.carrier.trim(), trackingNumber: dto.trackingNumber.trim().toUpperCase(), lines: parcel, backOrdered: next === 'partially-shipped', shippedBy: actorId }),
    );
    await moveOrder(em, o, { fulfilmentStatus: next });
    await orderMail.shipped(em, config, o, {
      shipmentId: shipment.id,
      carrier: shipment.carrier,
      trackingNumber: shipment.trackingNumber,
      lines: parcel.map((p) => ({ orderLineId: p.orderLineId, quantity: p.quantity })),
    });
    return pickList(orderId, em);
  });
}

/** The carrier reports the last parcel delivered. */
export async function deliverOrder(orderId: string): Promise<PickListDto> {
  return AppDataSource.transaction(async (em) => {
    const { o } = await lockedForWarehouse(em, orderId);
    await moveOrder(em, o, { fulfilmentStatus: 'delivered' });
    return pickList(orderId, em);
  });
}

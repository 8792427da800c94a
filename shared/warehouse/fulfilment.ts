import { canMove, type FulfilmentStatus, type OrderStates } from '../order-status';

/** What the warehouse needs of a line to judge it: ordered, refunded, picked and already shipped units. */
export interface PickLineState {
  quantity: number;
  refundedQuantity: number;
  pickedQuantity: number;
  shippedQuantity: number;
}

/**
 * Units of a line the rider is still owed (refunded units never ship).
 * @example unitsDue({ quantity: 3, refundedQuantity: 1, pickedQuantity: 0, shippedQuantity: 1 }) // 1
 */
export function unitsDue(l: PickLineState): number {
  return Math.max(0, l.quantity - l.refundedQuantity - l.shippedQuantity);
}

/** Units picked into the tote and not yet in a parcel. */
export function unitsInTote(l: PickLineState): number {
  return Math.max(0, l.pickedQuantity - l.shippedQuantity);
}

/** How many units of a line may be picked in all: what is due plus what already shipped. */
export function pickLimit(l: PickLineState): number {
  return l.shippedQuantity + unitsDue(l);
}

/** An order is in the warehouse's hands once paid and not cancelled. */
export function isForWarehouse(o: OrderStates): boolean {
  return o.status !== 'cancelled' && (o.paymentStatus === 'paid' || o.paymentStatus === 'partially-refunded');
}

/** Picking is open until the order is packed, and again while a back-order waits. */
export function mayPick(o: OrderStates): boolean {
  return isForWarehouse(o) && (o.fulfilmentStatus === 'unfulfilled' || o.fulfilmentStatus === 'partially-shipped');
}

/** Packing closes the first parcel: something must be in the tote. */
export function mayPack(o: OrderStates, lines: PickLineState[]): boolean {
  return isForWarehouse(o) && canMove('fulfilmentStatus', o.fulfilmentStatus, 'packed') && lines.some((l) => unitsInTote(l) > 0);
}

/**
 * Where a parcel leaves the order: shipped when nothing more is due after it, partially shipped when a line was short
 * and the rest waits as a back-order. Undefined when no parcel can leave now.
 * @example shipmentOutcome({status:'confirmed',paymentStatus:'paid',fulfilmentStatus:'packed'}, [{quantity:2,refundedQuantity:0,pickedQuantity:1,shippedQuantity:0}]) // 'partially-shipped'
 */
export function shipmentOutcome(o: OrderStates, lines: PickLineState[]): FulfilmentStatus | undefined {
  if (!isForWarehouse(o) || !lines.some((l) => unitsInTote(l) > 0)) return undefined;
  const leftAfter = lines.reduce((n, l) => n + unitsDue(l) - unitsInTote(l), 0);
  const next: FulfilmentStatus = leftAfter > 0 ? 'partially-shipped' : 'shipped';
  return canMove('fulfilmentStatus', o.fulfilmentStatus, next) ? next : undefined;
}

export function mayDeliver(o: OrderStates): boolean {
  return isForWarehouse(o) && canMove('fulfilmentStatus', o.fulfilmentStatus, 'delivered');
}

/** The states the warehouse queue counts, in the order work flows. */
export const queueStates = ['unfulfilled', 'packed', 'partially-shipped', 'shipped', 'delivered'] as const satisfies readonly FulfilmentStatus[];
/** States that still need hands in the warehouse. */
export const openQueueStates = ['unfulfilled', 'packed', 'partially-shipped'] as const satisfies readonly FulfilmentStatus[];

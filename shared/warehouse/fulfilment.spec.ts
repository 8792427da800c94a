import { describe, expect, it } from 'vitest';
import type { OrderStates } from '../order-status';
import { mayDeliver, mayPack, mayPick, pickLimit, shipmentOutcome, unitsDue, unitsInTote } from './fulfilment';
import { fitsReason, isLowStock, stockReasons } from './stock';

const paid = (fulfilmentStatus: OrderStates['fulfilmentStatus']): OrderStates => ({ status: 'confirmed', paymentStatus: 'paid', fulfilmentStatus });
const line = (quantity: number, pickedQuantity = 0, shippedQuantity = 0, refundedQuantity = 0) => ({ quantity, pickedQuantity, shippedQuantity, refundedQuantity });

describe('fulfilment rules', () => {
  it('units due leave out refunded and shipped units; the tote holds picked units not yet shipped', () => {
    expect(unitsDue(line(3, 0, 1, 1))).toBe(1);
    expect(unitsDue(line(2, 2, 2, 1))).toBe(0);
    expect(unitsInTote(line(3, 2, 1))).toBe(1);
    expect(pickLimit(line(3, 0, 1, 1))).toBe(2);
  });

  it('a parcel that leaves nothing due ships the order; one that leaves units due ships it partially', () => {
    expect(shipmentOutcome(paid('packed'), [line(2, 2), line(1, 1)])).toBe('shipped');
    expect(shipmentOutcome(paid('packed'), [line(2, 1), line(1, 1)])).toBe('partially-shipped');
    expect(shipmentOutcome(paid('partially-shipped'), [line(2, 2, 1), line(1, 1, 1)])).toBe('shipped');
    // Nothing in the tote: no parcel.
    expect(shipmentOutcome(paid('partially-shipped'), [line(2, 1, 1)])).toBeUndefined();
    // Every track moves only as canMove allows: shipped and delivered orders send no more parcels.
    expect(shipmentOutcome(paid('shipped'), [line(2, 2, 1)])).toBeUndefined();
  });

  it('unpaid or cancelled orders are not the warehouse’s; packing needs something picked; delivery follows the last parcel', () => {
    expect(mayPick({ status: 'pending', paymentStatus: 'awaiting', fulfilmentStatus: 'unfulfilled' })).toBe(false);
    expect(mayPick({ status: 'cancelled', paymentStatus: 'refunded', fulfilmentStatus: 'unfulfilled' })).toBe(false);
    expect(mayPick(paid('unfulfilled'))).toBe(true);
    expect(mayPick(paid('packed'))).toBe(false);
    expect(mayPack(paid('unfulfilled'), [line(1)])).toBe(false);
    expect(mayPack(paid('unfulfilled'), [line(1, 1)])).toBe(true);
    expect(mayPack(paid('partially-shipped'), [line(2, 2, 1)])).toBe(false);
    expect(mayDeliver(paid('partially-shipped'))).toBe(false);
    expect(mayDeliver(paid('shipped'))).toBe(true);
  });
});

describe('stock reasons', () => {
  it('a sale only takes, receipts, returns and releases only put back, an adjustment goes either way, never by zero', () => {
    expect(stockReasons.filter((r) => fitsReason(r, -1))).toEqual(['sale', 'adjustment']);
    expect(stockReasons.filter((r) => fitsReason(r, 1))).toEqual(['expiry', 'cancel', 'refund', 'receipt', 'return', 'adjustment']);
    expect(stockReasons.some((r) => fitsReason(r, 0) || fitsReason(r, 1.5))).toBe(false);
  });

  it('low stock is at or under the threshold (common practice: a reorder point)', () => {
    expect([isLowStock(0, 0), isLowStock(3, 3), isLowStock(4, 3)]).toEqual([true, true, false]);
  });
});

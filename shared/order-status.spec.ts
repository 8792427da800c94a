import { describe, expect, it } from 'vitest';
import { allowedMoves, canMove, fulfilmentStatuses, mayRefund, mayRiderCancel, mayStaffCancel, orderStatuses, paymentStatuses } from './order-status';

describe('order state moves', () => {
  it('an order is confirmed or cancelled from pending, and nothing leaves cancelled or completed', () => {
    expect(canMove('status', 'pending', 'confirmed')).toBe(true);
    expect(canMove('status', 'pending', 'cancelled')).toBe(true);
    for (const to of orderStatuses) {
      expect(canMove('status', 'cancelled', to)).toBe(false);
      expect(canMove('status', 'completed', to)).toBe(false);
    }
  });

  it('money once refunded is never paid again, and a payment is never taken twice', () => {
    expect(canMove('paymentStatus', 'refunded', 'paid')).toBe(false);
    expect(canMove('paymentStatus', 'paid', 'paid')).toBe(false);
    expect(canMove('paymentStatus', 'failed', 'paid')).toBe(true);
  });

  it('a parcel moves forward only', () => {
    const order = fulfilmentStatuses;
    for (const [i, from] of order.entries()) {
      for (const [j, to] of order.entries()) if (j < i) expect(canMove('fulfilmentStatus', from, to)).toBe(false);
    }
  });

  it('every state of every track has an entry, so no state is stuck by omission', () => {
    expect(Object.keys(allowedMoves.status).sort()).toEqual([...orderStatuses].sort());
    expect(Object.keys(allowedMoves.paymentStatus).sort()).toEqual([...paymentStatuses].sort());
    expect(Object.keys(allowedMoves.fulfilmentStatus).sort()).toEqual([...fulfilmentStatuses].sort());
  });

  it('a rider cancels until packing; staff refund only money taken', () => {
    expect(mayRiderCancel({ status: 'confirmed', paymentStatus: 'paid', fulfilmentStatus: 'unfulfilled' })).toBe(true);
    expect(mayRiderCancel({ status: 'confirmed', paymentStatus: 'paid', fulfilmentStatus: 'packed' })).toBe(false);
    expect(mayRiderCancel({ status: 'cancelled', paymentStatus: 'awaiting', fulfilmentStatus: 'unfulfilled' })).toBe(false);
    expect(mayRefund({ status: 'confirmed', paymentStatus: 'awaiting', fulfilmentStatus: 'unfulfilled' })).toBe(false);
    expect(mayRefund({ status: 'confirmed', paymentStatus: 'partially-refunded', fulfilmentStatus: 'shipped' })).toBe(true);
  });

  it('staff cancel only a pending order whose money has not come in; a paid one is refunded, never cancelled by staff', () => {
    for (const status of orderStatuses) {
      for (const paymentStatus of paymentStatuses) {
        const expected = status === 'pending' && (paymentStatus === 'awaiting' || paymentStatus === 'failed');
        expect(mayStaffCancel({ status, paymentStatus, fulfilmentStatus: 'unfulfilled' }), `${status}/${paymentStatus}`).toBe(expected);
        // Never both: an order staff may cancel has nothing to refund.
        if (expected) expect(mayRefund({ status, paymentStatus, fulfilmentStatus: 'unfulfilled' })).toBe(false);
      }
    }
  });
});

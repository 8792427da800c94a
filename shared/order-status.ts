/** An order carries three states kept apart: where the order stands, where its money stands, where its parcel stands. */
export const orderStatuses = ['pending', 'confirmed', 'completed', 'cancelled'] as const;
export const paymentStatuses = ['awaiting', 'paid', 'failed', 'refunded', 'partially-refunded'] as const;
export const fulfilmentStatuses = ['unfulfilled', 'packed', 'partially-shipped', 'shipped', 'delivered'] as const;
export type OrderStatus = (typeof orderStatuses)[number];
export type PaymentStatus = (typeof paymentStatuses)[number];
export type FulfilmentStatus = (typeof fulfilmentStatuses)[number];

export interface OrderStates {
  status: OrderStatus;
  paymentStatus: PaymentStatus;
  fulfilmentStatus: FulfilmentStatus;
}
export type Track = keyof OrderStates;

/** Every allowed move per track; anything not listed is refused. */
export const allowedMoves = {
  status: {
    pending: ['confirmed', 'cancelled'],
    confirmed: ['completed', 'cancelled'],
    completed: [],
    cancelled: [],
  },
  paymentStatus: {
    awaiting: ['paid', 'failed'],
    // A declined card can be followed by a good one on the same payment page.
    failed: ['paid', 'failed'],
    paid: ['refunded', 'partially-refunded'],
    'partially-refunded': ['refunded', 'partially-refunded'],
    refunded: [],
  },
  fulfilmentStatus: {
    unfulfilled: ['packed'],
    packed: ['partially-shipped', 'shipped'],
    'partially-shipped': ['partially-shipped', 'shipped'],
    shipped: ['delivered'],
    delivered: [],
  },
} as const satisfies { [T in Track]: Record<OrderStates[T], readonly OrderStates[T][]> };

/**
 * Tells whether one track of an order may move from one state to another.
 * @example canMove('status', 'pending', 'confirmed') // true
 * @example canMove('paymentStatus', 'refunded', 'paid') // false
 */
export function canMove<T extends Track>(track: T, from: OrderStates[T], to: OrderStates[T]): boolean {
  return ((allowedMoves[track] as Record<string, readonly string[]>)[from] ?? []).includes(to);
}

/**
 * A rider may cancel an order until it is packed; the shop refunds what was paid.
 * @example mayRiderCancel({status: 'confirmed', paymentStatus: 'paid', fulfilmentStatus: 'unfulfilled'}) // true
 */
export function mayRiderCancel(o: OrderStates): boolean {
  return canMove('status', o.status, 'cancelled') && o.fulfilmentStatus === 'unfulfilled';
}

/**
 * Staff may cancel an order still waiting for its money (awaiting, or a card declined); a paid one is refunded instead.
 * @example mayStaffCancel({status: 'pending', paymentStatus: 'awaiting', fulfilmentStatus: 'unfulfilled'}) // true
 * @example mayStaffCancel({status: 'confirmed', paymentStatus: 'paid', fulfilmentStatus: 'unfulfilled'}) // false
 */
export function mayStaffCancel(o: OrderStates): boolean {
  return o.status === 'pending' && (o.paymentStatus === 'awaiting' || o.paymentStatus === 'failed') && canMove('status', o.status, 'cancelled');
}

/** Staff may refund money that was taken and not yet all given back. */
export function mayRefund(o: OrderStates): boolean {
  return o.paymentStatus === 'paid' || o.paymentStatus === 'partially-refunded';
}

export const cancelReasons = ['expired', 'rider-cancelled', 'payment-unavailable', 'replaced', 'staff-cancelled', 'refunded'] as const;
export type CancelReason = (typeof cancelReasons)[number];

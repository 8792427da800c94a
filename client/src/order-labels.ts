import type { FulfilmentStatus, OrderStatus, PaymentStatus } from '@shared/order-status';

// The words and colours riders and staff see for each of an order's three states.
export const orderStatusLabel: Record<OrderStatus, string> = { pending: 'Waiting for payment', confirmed: 'Confirmed', completed: 'Completed', cancelled: 'Cancelled' };
export const paymentStatusLabel: Record<PaymentStatus, string> = { awaiting: 'Not paid yet', paid: 'Paid', failed: 'Payment failed', refunded: 'Refunded', 'partially-refunded': 'Partly refunded' };
export const fulfilmentStatusLabel: Record<FulfilmentStatus, string> = { unfulfilled: 'Not packed yet', packed: 'Packed', 'partially-shipped': 'Partly shipped', shipped: 'Shipped', delivered: 'Delivered' };
type Severity = 'success' | 'info' | 'warn' | 'danger' | 'secondary';
export const orderStatusSeverity: Record<OrderStatus, Severity> = { pending: 'warn', confirmed: 'info', completed: 'success', cancelled: 'secondary' };
export const paymentStatusSeverity: Record<PaymentStatus, Severity> = { awaiting: 'warn', paid: 'success', failed: 'danger', refunded: 'secondary', 'partially-refunded': 'info' };
export const fulfilmentStatusSeverity: Record<FulfilmentStatus, Severity> = { unfulfilled: 'secondary', packed: 'info', 'partially-shipped': 'info', shipped: 'success', delivered: 'success' };
export const cancelReasonLabel: Record<string, string> = {
  expired: 'not paid in time',
  'rider-cancelled': 'cancelled by you',
  'payment-unavailable': 'payment was unavailable',
  replaced: 'replaced by a newer checkout',
  'staff-cancelled': 'cancelled by the shop',
  refunded: 'refunded',
};

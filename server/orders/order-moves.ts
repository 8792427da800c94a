import type { EntityManager } from 'typeorm';
import { canMove, type CancelReason, type OrderStates, type Track } from '../../shared/order-status';
import { AppError } from '../errors';
import { Order } from './Order.entity';

// The milestone each state stamps when an order reaches it.
const milestones: { [T in Track]: Partial<Record<OrderStates[T], keyof Order>> } = {
  status: { confirmed: 'confirmedAt', completed: 'completedAt', cancelled: 'cancelledAt' },
  paymentStatus: { paid: 'paidAt', failed: 'paymentFailedAt', refunded: 'refundedAt', 'partially-refunded': 'refundedAt' },
  fulfilmentStatus: { packed: 'packedAt', shipped: 'shippedAt', 'partially-shipped': 'shippedAt', delivered: 'deliveredAt' },
};

/** Loads an order under a row lock: every change to an order starts here, so two changes never interleave. */
export async function lockOrder(em: EntityManager, where: { id: string } | { paymentSessionId: string } | { paymentIntentId: string }): Promise<Order | null> {
  return em.getRepository(Order).findOne({ where, lock: { mode: 'pessimistic_write' } });
}

/**
 * The one way an order changes state: each track moves only as canMove allows, each milestone is stamped, and the
 * order is saved in the caller's transaction. A refused move is a 409 naming it.
 */
export async function moveOrder(em: EntityManager, order: Order, to: Partial<OrderStates>, opts: { cancelReason?: CancelReason; at?: Date } = {}): Promise<Order> {
  const at = opts.at ?? new Date();
  for (const track of Object.keys(to) as Track[]) {
    const next = to[track]!;
    const from = order[track];
    if (!canMove(track, from as never, next as never)) {
      throw new AppError('conflict', `Order ${order.number} cannot go from ${from} to ${next}.`, undefined, { track, from, to: next });
    }
    (order as unknown as Record<string, unknown>)[track] = next;
    const stamp = (milestones[track] as Record<string, keyof Order>)[next];
    if (stamp) (order as unknown as Record<string, unknown>)[stamp] = at;
  }
  if (to.status === 'cancelled') order.cancelReason = opts.cancelReason ?? 'staff-cancelled';
  return em.getRepository(Order).save(order);
}

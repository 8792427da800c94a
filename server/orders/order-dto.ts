import type { EntityManager } from 'typeorm';
import type { SpringSetDto } from '../../shared/commerce/cart.dto';
import type { OrderDto, OrderSummaryDto } from '../../shared/commerce/order.dto';
import { mayRefund, mayRiderCancel, mayStaffCancel } from '../../shared/order-status';
import { SpringSet } from '../cart/SpringSet.entity';
import { toSpringSetDto } from '../cart/cart-dto';
import type { Order } from './Order.entity';
import { OrderLine } from './OrderLine.entity';
import { Refund } from './Refund.entity';
import { shipmentsOf } from '../warehouse/shipments';

const iso = (d: Date | null) => (d ? d.toISOString() : null);

export function toOrderSummaryDto(o: Order, itemCount: number): OrderSummaryDto {
  return {
    id: o.id,
    number: o.number,
    email: o.email,
    customerName: o.customerName,
    status: o.status,
    paymentStatus: o.paymentStatus,
    fulfilmentStatus: o.fulfilmentStatus,
    cancelReason: o.cancelReason,
    currency: o.currency,
    totalCents: o.totalCents,
    refundedCents: o.refundedCents,
    itemCount,
    createdAt: o.createdAt.toISOString(),
  };
}

export async function orderLinesOf(em: EntityManager, orderId: string): Promise<OrderLine[]> {
  return em.getRepository(OrderLine).find({ where: { orderId }, order: { position: 'ASC' } });
}

export async function setsOf(em: EntityManager, lines: OrderLine[]): Promise<SpringSetDto[]> {
  const ids = [...new Set(lines.map((l) => l.springSetId).filter((x): x is string => !!x))];
  if (!ids.length) return [];
  const sets = await em.getRepository(SpringSet).createQueryBuilder('s').where('s.id IN (:...ids)', { ids }).getMany();
  return sets.map(toSpringSetDto);
}

/** The whole order as its buyer and the staff see it. */
export async function toOrderDto(em: EntityManager, o: Order): Promise<OrderDto> {
  const lines = await orderLinesOf(em, o.id);
  const refunds = await em.getRepository(Refund).find({ where: { orderId: o.id }, order: { createdAt: 'ASC' } });
  return {
    ...toOrderSummaryDto(o, lines.reduce((s, l) => s + l.quantity, 0)),
    shippingAddress: o.shippingAddress,
    subtotalCents: o.subtotalCents,
    shippingCents: o.shippingCents,
    vatCents: o.vatCents,
    vatRateBasisPoints: o.vatRateBasisPoints,
    // The payment page is offered only while the order can still be paid.
    paymentUrl: o.status === 'pending' && o.paymentStatus !== 'paid' ? o.paymentUrl : null,
    paymentFailure: o.paymentFailure,
    reservedUntil: o.reservedUntil.toISOString(),
    lines: lines.map((l) => ({
      id: l.id,
      productId: l.productId,
      sku: l.sku,
      name: l.name,
      kind: l.kind,
      unitPriceCents: l.unitPriceCents,
      quantity: l.quantity,
      lineTotalCents: l.lineTotalCents,
      refundedQuantity: l.refundedQuantity,
      restockedQuantity: l.restockedQuantity,
      shippedQuantity: l.shippedQuantity,
      springSetId: l.springSetId,
      setup: l.setup,
    })),
    sets: await setsOf(em, lines),
    milestones: {
      paidAt: iso(o.paidAt),
      paymentFailedAt: iso(o.paymentFailedAt),
      confirmedAt: iso(o.confirmedAt),
      cancelledAt: iso(o.cancelledAt),
      refundedAt: iso(o.refundedAt),
      packedAt: iso(o.packedAt),
      shippedAt: iso(o.shippedAt),
      deliveredAt: iso(o.deliveredAt),
      completedAt: iso(o.completedAt),
    },
    refunds: refunds.map((r) => ({ id: r.id, amountCents: r.amountCents, reason: r.reason, createdAt: r.createdAt.toISOString() })),
    mayCancel: mayRiderCancel(o),
    mayStaffCancel: mayStaffCancel(o),
    mayRefund: mayRefund(o),
    shipments: await shipmentsOf(em, o.id),
  };
}

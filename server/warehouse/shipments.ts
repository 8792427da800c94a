import type { EntityManager } from 'typeorm';
import type { ShipmentDto } from '../../shared/warehouse/fulfilment.dto';
import { OrderLine } from '../orders/OrderLine.entity';
import { Shipment } from './Shipment.entity';

/** An order's parcels, oldest first, with the SKU and name of each line in them (for the rider's page and the warehouse). */
export async function shipmentsOf(em: EntityManager, orderId: string): Promise<ShipmentDto[]> {
  const shipments = await em.getRepository(Shipment).find({ where: { orderId }, order: { createdAt: 'ASC' } });
  if (!shipments.length) return [];
  const lines = await em.getRepository(OrderLine).find({ where: { orderId } });
  return shipments.map((s) => ({
    id: s.id,
    carrier: s.carrier,
    trackingNumber: s.trackingNumber,
    backOrdered: s.backOrdered,
    lines: s.lines.map((p) => {
      const l = lines.find((x) => x.id === p.orderLineId);
      return { orderLineId: p.orderLineId, sku: l?.sku ?? '', name: l?.name ?? '', quantity: p.quantity };
    }),
    shippedAt: s.createdAt.toISOString(),
  }));
}

import { Router } from 'express';
import { LowStockThresholdDto, ReceiveDeliveryDto, StockMovementQueryDto } from '../../shared/warehouse/stock.dto';
import { requireRole, requireUser } from '../http/auth';
import { endpoint } from '../http/endpoint';
import * as stock from './stock.service';

/** Stock for the people behind the counter: deliveries in, the ledger, and what is running low. */
export function stockRoutes(): Router {
  const r = Router();
  r.use(requireRole('staff', 'warehouse', 'admin'));
  r.post('/deliveries', endpoint({ summary: 'Receive a delivery into stock (one ledger row per line)', body: ReceiveDeliveryDto, status: 201 }, async ({ body }, req, res) => {
    res.status(201).json(await stock.receiveDelivery(requireUser(req).id, body));
  }));
  r.get('/movements', endpoint({ summary: 'The stock ledger, filtered and paged', query: StockMovementQueryDto }, async ({ query }, _req, res) => {
    res.json(await stock.listMovements(query));
  }));
  r.get('/products', endpoint({ summary: 'Every product’s SKU, bin and count, for the delivery form' }, async (_input, _req, res) => {
    res.json({ items: await stock.stockProducts() });
  }));
  r.get('/low', endpoint({ summary: 'Products at or under their low-stock threshold' }, async (_input, _req, res) => {
    res.json(await stock.lowStockList());
  }));
  r.put('/products/:id/threshold', requireRole('staff', 'admin'), endpoint({ summary: 'Set a product’s own low-stock threshold (empty: the shop’s)', ids: { id: 'The product' }, body: LowStockThresholdDto }, async ({ ids, body }, req, res) => {
    res.json(await stock.setLowStockThreshold(requireUser(req).id, ids.id, body.threshold ?? null));
  }));
  return r;
}

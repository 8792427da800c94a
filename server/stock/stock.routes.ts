import { Router } from 'express';
import { LowStockThresholdDto, ReceiveDeliveryDto, StockMovementQueryDto } from '../../shared/warehouse/stock.dto';
import { requireRole, requireUser } from '../http/auth';
import { parseBody, parseQuery, uuidParam } from '../http/validate';
import * as stock from './stock.service';

/** Stock for the people behind the counter: deliveries in, the ledger, and what is running low. */
export function stockRoutes(): Router {
  const r = Router();
  r.use(requireRole('staff', 'warehouse', 'admin'));
  r.post('/deliveries', async (req, res) => {
    const dto = await parseBody(ReceiveDeliveryDto, req.body);
    res.status(201).json(await stock.receiveDelivery(requireUser(req).id, dto));
  });
  r.get('/movements', async (req, res) => {
    res.json(await stock.listMovements(await parseQuery(StockMovementQueryDto, req.query)));
  });
  r.get('/products', async (_req, res) => {
    res.json({ items: await stock.stockProducts() });
  });
  r.get('/low', async (_req, res) => {
    res.json(await stock.lowStockList());
  });
  r.put('/products/:id/threshold', requireRole('staff', 'admin'), async (req, res) => {
    const id = uuidParam(req.params.id, 'The product');
    const dto = await parseBody(LowStockThresholdDto, req.body);
    res.json(await stock.setLowStockThreshold(requireUser(req).id, id, dto.threshold ?? null));
  });
  return r;
}

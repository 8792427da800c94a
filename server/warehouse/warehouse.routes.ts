import { Router } from 'express';
import { ScanDto, SetPickedDto, ShipDto, WarehouseQueueQueryDto } from '../../shared/warehouse/fulfilment.dto';
import type { Config } from '../config';
import { requireRole, requireUser } from '../http/auth';
import { endpoint } from '../http/endpoint';
import * as warehouse from './warehouse.service';

/** The warehouse's work: the queue of paid orders, the pick list, and each step of pick, pack, ship and deliver. */
export function warehouseRoutes(config: Config): Router {
  const r = Router();
  r.use(requireRole('warehouse', 'admin'));
  const order = { id: 'The order' };
  r.get('/orders', endpoint({ summary: 'Paid orders to pick, oldest first, with counts per state', query: WarehouseQueueQueryDto }, async ({ query }, _req, res) => {
    res.json(await warehouse.warehouseQueue(query));
  }));
  r.get('/orders/:id', endpoint({ summary: 'An order’s pick list with bins and scannable codes', ids: order }, async ({ ids }, _req, res) => {
    res.json(await warehouse.pickList(ids.id));
  }));
  r.post('/orders/:id/scan', endpoint({ summary: 'Scan a line’s code: one more unit picked', ids: order, body: ScanDto }, async ({ ids, body }, _req, res) => {
    res.json(await warehouse.scanCode(ids.id, body.code));
  }));
  r.put('/orders/:id/lines/:lineId/picked', endpoint({ summary: 'Set how many units of a line are picked', ids: { ...order, lineId: 'The order line' }, body: SetPickedDto }, async ({ ids, body }, _req, res) => {
    res.json(await warehouse.setPicked(ids.id, ids.lineId, body.pickedQuantity));
  }));
  r.post('/orders/:id/pack', endpoint({ summary: 'Mark the order packed (one packer wins)', ids: order }, async ({ ids }, req, res) => {
    res.json(await warehouse.packOrder(requireUser(req).id, ids.id));
  }));
  r.post('/orders/:id/ship', endpoint({ summary: 'Ship what is packed with carrier and tracking; the rest waits', ids: order, body: ShipDto }, async ({ ids, body }, req, res) => {
    res.json(await warehouse.shipOrder(config, requireUser(req).id, ids.id, body));
  }));
  r.post('/orders/:id/deliver', endpoint({ summary: 'Mark a shipped order delivered', ids: order }, async ({ ids }, _req, res) => {
    res.json(await warehouse.deliverOrder(ids.id));
  }));
  return r;
}

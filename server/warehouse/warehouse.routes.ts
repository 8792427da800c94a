import { Router } from 'express';
import { ScanDto, SetPickedDto, ShipDto, WarehouseQueueQueryDto } from '../../shared/warehouse/fulfilment.dto';
import type { Config } from '../config';
import { requireRole, requireUser } from '../http/auth';
import { parseBody, parseQuery, uuidParam } from '../http/validate';
import * as warehouse from './warehouse.service';

/** The warehouse's work: the queue of paid orders, the pick list, and each step of pick, pack, ship and deliver. */
export function warehouseRoutes(config: Config): Router {
  const r = Router();
  r.use(requireRole('warehouse', 'admin'));
  r.get('/orders', async (req, res) => {
    res.json(await warehouse.warehouseQueue(await parseQuery(WarehouseQueueQueryDto, req.query)));
  });
  r.get('/orders/:id', async (req, res) => {
    res.json(await warehouse.pickList(uuidParam(req.params.id, 'The order')));
  });
  r.post('/orders/:id/scan', async (req, res) => {
    const id = uuidParam(req.params.id, 'The order');
    const dto = await parseBody(ScanDto, req.body);
    res.json(await warehouse.scanCode(id, dto.code));
  });
  r.put('/orders/:id/lines/:lineId/picked', async (req, res) => {
    const id = uuidParam(req.params.id, 'The order');
    const lineId = uuidParam(req.params.lineId, 'The order line');
    const dto = await parseBody(SetPickedDto, req.body);
    res.json(await warehouse.setPicked(id, lineId, dto.pickedQuantity));
  });
  r.post('/orders/:id/pack', async (req, res) => {
    res.json(await warehouse.packOrder(requireUser(req).id, uuidParam(req.params.id, 'The order')));
  });
  r.post('/orders/:id/ship', async (req, res) => {
    const id = uuidParam(req.params.id, 'The order');
    const dto = await parseBody(ShipDto, req.body);
    res.json(await warehouse.shipOrder(config, requireUser(req).id, id, dto));
  });
  r.post('/orders/:id/deliver', async (req, res) => {
    res.json(await warehouse.deliverOrder(uuidParam(req.params.id, 'The order')));
  });
  return r;
}

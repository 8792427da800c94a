import { Router } from 'express';
import { RefundDto, StaffOrderQueryDto } from '../../shared/commerce/order.dto';
import type { Config } from '../config';
import { requireRole, requireUser } from '../http/auth';
import { parseBody, parseQuery, uuidParam } from '../http/validate';
import type { PaymentProvider } from '../payments/payment-provider';
import * as orders from './orders.service';
import { refundOrder } from './refunds.service';

/** A buyer's orders: the signed-in rider's list, and one order for its owner or the holder of its link. */
export function orderRoutes(config: Config, provider: PaymentProvider): Router {
  const r = Router();
  r.get('/', async (req, res) => {
    res.json({ items: await orders.listOwnOrders(requireUser(req)) });
  });
  r.get('/:id', async (req, res) => {
    res.json(await orders.viewOrder(config, req.user, uuidParam(req.params.id, 'The order'), req.query.token));
  });
  r.post('/:id/cancel', async (req, res) => {
    const token = (req.body as { token?: unknown } | undefined)?.token ?? req.query.token;
    res.json(await orders.cancelByRider(config, provider, req.user, uuidParam(req.params.id, 'The order'), token));
  });
  return r;
}

/** Every order for the staff, with refunds of whole orders or some lines. */
export function staffOrderRoutes(config: Config, provider: PaymentProvider): Router {
  const r = Router();
  r.use(requireRole('staff', 'admin'));
  r.get('/', async (req, res) => {
    res.json(await orders.listOrdersForStaff(await parseQuery(StaffOrderQueryDto, req.query)));
  });
  r.get('/:id', async (req, res) => {
    res.json(await orders.viewOrderForStaff(uuidParam(req.params.id, 'The order')));
  });
  r.post('/:id/refunds', async (req, res) => {
    const id = uuidParam(req.params.id, 'The order');
    const dto = await parseBody(RefundDto, req.body);
    res.status(201).json(await refundOrder(config, provider, requireUser(req).id, id, dto));
  });
  return r;
}

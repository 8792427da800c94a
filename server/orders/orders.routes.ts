import { Router } from 'express';
import { OrderAccessQueryDto, RefundDto, StaffOrderQueryDto } from '../../shared/commerce/order.dto';
import type { Config } from '../config';
import { requireRole, requireUser } from '../http/auth';
import { endpoint } from '../http/endpoint';
import type { PaymentProvider } from '../payments/payment-provider';
import * as orders from './orders.service';
import { refundOrder } from './refunds.service';
import { cancelUnpaidByStaff } from './staff-cancel.service';

/** A buyer's orders: the signed-in rider's list, and one order for its owner or the holder of its link. */
export function orderRoutes(config: Config, provider: PaymentProvider): Router {
  const r = Router();
  const order = { id: 'The order' };
  r.get('/', endpoint({ summary: 'The signed-in rider’s own orders, newest first', signedIn: true }, async (_input, req, res) => {
    res.json({ items: await orders.listOwnOrders(requireUser(req)) });
  }));
  r.get('/:id', endpoint({ summary: 'One order, for its owner or the holder of its link', ids: order, query: OrderAccessQueryDto }, async ({ ids, query }, req, res) => {
    res.json(await orders.viewOrder(config, req.user, ids.id, query.token));
  }));
  r.post('/:id/cancel', endpoint({ summary: 'Cancel an order before it is packed (stock back, payment refunded)', ids: order, query: OrderAccessQueryDto }, async ({ ids, query }, req, res) => {
    res.json(await orders.cancelByRider(config, provider, req.user, ids.id, query.token));
  }));
  return r;
}

/** Every order for the staff, with refunds of whole orders or some lines. */
export function staffOrderRoutes(config: Config, provider: PaymentProvider): Router {
  const r = Router();
  r.use(requireRole('staff', 'admin'));
  const order = { id: 'The order' };
  r.get('/', endpoint({ summary: 'Every order, filtered by state and paged', query: StaffOrderQueryDto }, async ({ query }, _req, res) => {
    res.json(await orders.listOrdersForStaff(query));
  }));
  r.get('/:id', endpoint({ summary: 'One order as staff see it', ids: order }, async ({ ids }, _req, res) => {
    res.json(await orders.viewOrderForStaff(ids.id));
  }));
  r.post('/:id/cancel', endpoint({ summary: 'Cancel a pending order that is not paid (stock back, payment page closed, buyer told)', ids: order }, async ({ ids }, req, res) => {
    res.json(await cancelUnpaidByStaff(config, provider, requireUser(req).id, ids.id));
  }));
  r.post('/:id/refunds', endpoint({ summary: 'Refund a whole order or some of its lines', ids: order, body: RefundDto, status: 201 }, async ({ ids, body }, req, res) => {
    res.status(201).json(await refundOrder(config, provider, requireUser(req).id, ids.id, body));
  }));
  return r;
}

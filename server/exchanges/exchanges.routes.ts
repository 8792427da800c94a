import { Router } from 'express';
import { ExchangeDecisionDto, ExchangeProposalQueryDto, ExchangeQueryDto, ExchangeRequestDto, ExchangeShipDto } from '../../shared/commerce/exchange.dto';
import type { Config } from '../config';
import { requireRole, requireUser } from '../http/auth';
import { endpoint } from '../http/endpoint';
import type { PaymentProvider } from '../payments/payment-provider';
import { createBikeCache } from '../recommendations/recommendations.service';
import * as staff from './exchange-staff.service';
import * as rider from './exchanges.service';

const exchange = { id: 'The exchange' };

/** A rider's own exchanges and returns: the proposal for a line, the request, the list and one of them. */
export function exchangeRoutes(config: Config): Router {
  const r = Router();
  const cache = createBikeCache(config.catalogueCacheTtlMs);
  const own = { signedIn: true };
  r.get('/proposal', endpoint({ ...own, summary: 'The rate the engine proposes in exchange for an order line', query: ExchangeProposalQueryDto }, async ({ query }, req, res) => {
    res.json(await rider.proposal(cache, requireUser(req), query));
  }));
  r.get('/', endpoint({ ...own, summary: 'The rider’s own exchanges and returns' }, async (_input, req, res) => {
    res.json({ items: await rider.listOwnExchanges(requireUser(req)) });
  }));
  r.get('/:id', endpoint({ ...own, summary: 'One of the rider’s exchanges or returns', ids: exchange }, async ({ ids }, req, res) => {
    res.json(await rider.viewOwnExchange(requireUser(req), ids.id));
  }));
  r.post('/', endpoint({ ...own, summary: 'Ask to exchange a spring for another rate, or to return it', body: ExchangeRequestDto, status: 201 }, async ({ body }, req, res) => {
    res.status(201).json(await rider.requestExchange(config, cache, requireUser(req), body));
  }));
  return r;
}

/** Staff see every exchange and approve or refuse it with a message. */
export function staffExchangeRoutes(config: Config, provider: PaymentProvider): Router {
  const r = Router();
  r.use(requireRole('staff', 'admin'));
  r.get('/', endpoint({ summary: 'Every exchange and return, filtered by state and reason', query: ExchangeQueryDto }, async ({ query }, _req, res) => {
    res.json({ items: await staff.listExchanges(query) });
  }));
  r.get('/:id', endpoint({ summary: 'One exchange or return as staff see it', ids: exchange }, async ({ ids }, _req, res) => {
    res.json(await staff.viewExchange(ids.id));
  }));
  r.post('/:id/decision', endpoint({ summary: 'Approve or refuse an exchange with a message', ids: exchange, body: ExchangeDecisionDto }, async ({ ids, body }, req, res) => {
    res.json(await staff.decideExchange(config, provider, requireUser(req).id, ids.id, body));
  }));
  return r;
}

/** The warehouse receives returned springs and ships replacements. */
export function warehouseExchangeRoutes(config: Config, provider: PaymentProvider): Router {
  const r = Router();
  r.use(requireRole('warehouse', 'admin'));
  r.get('/', endpoint({ summary: 'Exchanges and returns for the warehouse', query: ExchangeQueryDto }, async ({ query }, _req, res) => {
    res.json({ items: await staff.listExchanges(query) });
  }));
  r.post('/:id/receive', endpoint({ summary: 'Receive a returned spring back into stock', ids: exchange }, async ({ ids }, req, res) => {
    res.json(await staff.receiveReturn(config, provider, requireUser(req).id, ids.id));
  }));
  r.post('/:id/ship', endpoint({ summary: 'Ship the replacement spring with carrier and tracking', ids: exchange, body: ExchangeShipDto }, async ({ ids, body }, req, res) => {
    res.json(await staff.shipReplacement(config, requireUser(req).id, ids.id, body));
  }));
  return r;
}

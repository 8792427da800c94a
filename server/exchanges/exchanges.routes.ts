import { Router } from 'express';
import { ExchangeDecisionDto, ExchangeProposalQueryDto, ExchangeQueryDto, ExchangeRequestDto, ExchangeShipDto } from '../../shared/commerce/exchange.dto';
import type { Config } from '../config';
import { requireRole, requireUser } from '../http/auth';
import { parseBody, parseQuery, uuidParam } from '../http/validate';
import type { PaymentProvider } from '../payments/payment-provider';
import { createBikeCache } from '../recommendations/recommendations.service';
import * as staff from './exchange-staff.service';
import * as rider from './exchanges.service';

/** A rider's own exchanges and returns: the proposal for a line, the request, the list and one of them. */
export function exchangeRoutes(config: Config): Router {
  const r = Router();
  const cache = createBikeCache(config.catalogueCacheTtlMs);
  r.get('/proposal', async (req, res) => {
    res.json(await rider.proposal(cache, requireUser(req), await parseQuery(ExchangeProposalQueryDto, req.query)));
  });
  r.get('/', async (req, res) => {
    res.json({ items: await rider.listOwnExchanges(requireUser(req)) });
  });
  r.get('/:id', async (req, res) => {
    res.json(await rider.viewOwnExchange(requireUser(req), uuidParam(req.params.id, 'The exchange')));
  });
  r.post('/', async (req, res) => {
    const user = requireUser(req);
    res.status(201).json(await rider.requestExchange(config, cache, user, await parseBody(ExchangeRequestDto, req.body)));
  });
  return r;
}

/** Staff see every exchange and approve or refuse it with a message. */
export function staffExchangeRoutes(config: Config, provider: PaymentProvider): Router {
  const r = Router();
  r.use(requireRole('staff', 'admin'));
  r.get('/', async (req, res) => {
    res.json({ items: await staff.listExchanges(await parseQuery(ExchangeQueryDto, req.query)) });
  });
  r.get('/:id', async (req, res) => {
    res.json(await staff.viewExchange(uuidParam(req.params.id, 'The exchange')));
  });
  r.post('/:id/decision', async (req, res) => {
    const id = uuidParam(req.params.id, 'The exchange');
    res.json(await staff.decideExchange(config, provider, requireUser(req).id, id, await parseBody(ExchangeDecisionDto, req.body)));
  });
  return r;
}

/** The warehouse receives returned springs and ships replacements. */
export function warehouseExchangeRoutes(config: Config, provider: PaymentProvider): Router {
  const r = Router();
  r.use(requireRole('warehouse', 'admin'));
  r.get('/', async (req, res) => {
    res.json({ items: await staff.listExchanges(await parseQuery(ExchangeQueryDto, req.query)) });
  });
  r.post('/:id/receive', async (req, res) => {
    res.json(await staff.receiveReturn(config, provider, requireUser(req).id, uuidParam(req.params.id, 'The exchange')));
  });
  r.post('/:id/ship', async (req, res) => {
    const id = uuidParam(req.params.id, 'The exchange');
    res.json(await staff.shipReplacement(config, requireUser(req).id, id, await parseBody(ExchangeShipDto, req.body)));
  });
  return r;
}

import { Router } from 'express';
import { AddCartLineDto, AddSpringSetDto, UpdateCartLineDto } from '../../shared/commerce/cart.dto';
import type { Config } from '../config';
import { limiter } from '../http/rate-limit';
import { parseBody, uuidParam } from '../http/validate';
import { createBikeCache } from '../recommendations/recommendations.service';
import { withCart } from './cart-identity';
import * as cart from './cart.service';
import { addSpringSet } from './spring-set.service';

/** The cart of a guest (cookie) or a signed-in rider; a guest cart merges into the rider's on sign-in. */
export function cartRoutes(config: Config): Router {
  const r = Router();
  const cache = createBikeCache(config.catalogueCacheTtlMs);

  r.get('/', async (req, res) => {
    res.json(await withCart(req, res, config, { create: false }, (em, id) => cart.viewCart(em, config, id)));
  });

  r.post('/lines', async (req, res) => {
    const dto = await parseBody(AddCartLineDto, req.body);
    res.status(201).json(await withCart(req, res, config, { create: true }, (em, id) => cart.addLine(em, config, id!, dto)));
  });

  r.patch('/lines/:id', async (req, res) => {
    const lineId = uuidParam(req.params.id, 'The cart line');
    const dto = await parseBody(UpdateCartLineDto, req.body);
    res.json(await withCart(req, res, config, { create: false }, (em, id) => cart.updateLine(em, config, id, lineId, dto)));
  });

  r.delete('/lines/:id', async (req, res) => {
    const lineId = uuidParam(req.params.id, 'The cart line');
    res.json(await withCart(req, res, config, { create: false }, (em, id) => cart.removeLine(em, config, id, lineId)));
  });

  // Runs the engine like a recommendation, so it shares that route's per-address limit.
  r.post('/spring-set', limiter({ name: 'recommendations', windowMs: 60_000, limit: config.calcRateLimitPerMinute }), async (req, res) => {
    const dto = await parseBody(AddSpringSetDto, req.body);
    res.status(201).json(await withCart(req, res, config, { create: true }, (em, id) => addSpringSet(em, config, cache, id!, dto)));
  });

  return r;
}

import { Router } from 'express';
import { AddCartLineDto, AddSpringSetDto, UpdateCartLineDto } from '../../shared/commerce/cart.dto';
import type { Config } from '../config';
import { endpoint } from '../http/endpoint';
import { limiter } from '../http/rate-limit';
import { createBikeCache } from '../recommendations/recommendations.service';
import { withCart } from './cart-identity';
import * as cart from './cart.service';
import { addSpringSet } from './spring-set.service';

/** The cart of a guest (cookie) or a signed-in rider; a guest cart merges into the rider's on sign-in. */
export function cartRoutes(config: Config): Router {
  const r = Router();
  const cache = createBikeCache(config.catalogueCacheTtlMs);
  const line = { id: 'The cart line' };

  r.get('/', endpoint({ summary: 'The cart of this guest or rider, with its totals' }, async (_input, req, res) => {
    res.json(await withCart(req, res, config, { create: false }, (em, id) => cart.viewCart(em, config, id)));
  }));

  r.post('/lines', endpoint({ summary: 'Add a product to the cart', body: AddCartLineDto, status: 201 }, async ({ body }, req, res) => {
    res.status(201).json(await withCart(req, res, config, { create: true }, (em, id) => cart.addLine(em, config, id!, body)));
  }));

  r.patch('/lines/:id', endpoint({ summary: 'Change the quantity of a cart line', ids: line, body: UpdateCartLineDto }, async ({ ids, body }, req, res) => {
    res.json(await withCart(req, res, config, { create: false }, (em, id) => cart.updateLine(em, config, id, ids.id, body)));
  }));

  r.delete('/lines/:id', endpoint({ summary: 'Remove a cart line', ids: line }, async ({ ids }, req, res) => {
    res.json(await withCart(req, res, config, { create: false }, (em, id) => cart.removeLine(em, config, id, ids.id)));
  }));

  // Runs the engine like a recommendation, so it counts against that route's per-address limit.
  r.post(
    '/spring-set',
    limiter({ name: 'recommendations', windowMs: 60_000, limit: config.calcRateLimitPerMinute }),
    endpoint({ summary: 'Add the springs the engine chose for a bike and load, with their adapters and setup figures', body: AddSpringSetDto, status: 201 }, async ({ body }, req, res) => {
      res.status(201).json(await withCart(req, res, config, { create: true }, (em, id) => addSpringSet(em, config, cache, id!, body)));
    }),
  );

  return r;
}

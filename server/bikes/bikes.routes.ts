import { Router } from 'express';
import { BikeNicknameDto, BikeSagCheckInputDto, SaveBikeDto } from '../../shared/bikes';
import type { Config } from '../config';
import { requireUser } from '../http/auth';
import { parseBody, uuidParam } from '../http/validate';
import { createBikeCache } from '../recommendations/recommendations.service';
import { addSagCheck, deleteSagCheck, listSagChecks } from './bike-sag-checks.service';
import * as bikes from './bikes.service';

/** A signed-in rider's saved bikes, their sag-check history and their orders; only ever the rider's own. */
export function bikeRoutes(config: Config): Router {
  const r = Router();
  const cache = createBikeCache(config.catalogueCacheTtlMs);
  const bikeId = (v: unknown) => uuidParam(v, 'The bike');

  r.get('/', async (req, res) => {
    res.json({ items: await bikes.listBikes(requireUser(req)) });
  });
  r.post('/', async (req, res) => {
    const user = requireUser(req);
    res.status(201).json(await bikes.saveBike(user, await parseBody(SaveBikeDto, req.body), cache));
  });
  r.get('/:id', async (req, res) => {
    res.json(await bikes.getBike(requireUser(req), bikeId(req.params.id)));
  });
  r.put('/:id', async (req, res) => {
    const user = requireUser(req);
    res.json(await bikes.updateBike(user, bikeId(req.params.id), await parseBody(SaveBikeDto, req.body), cache));
  });
  r.patch('/:id', async (req, res) => {
    const user = requireUser(req);
    res.json(await bikes.renameBike(user, bikeId(req.params.id), await parseBody(BikeNicknameDto, req.body)));
  });
  r.delete('/:id', async (req, res) => {
    await bikes.deleteBike(requireUser(req), bikeId(req.params.id));
    res.status(204).end();
  });
  r.get('/:id/sag-checks', async (req, res) => {
    res.json({ items: await listSagChecks(requireUser(req), bikeId(req.params.id)) });
  });
  r.post('/:id/sag-checks', async (req, res) => {
    const user = requireUser(req);
    res.status(201).json(await addSagCheck(user, bikeId(req.params.id), await parseBody(BikeSagCheckInputDto, req.body), cache));
  });
  r.delete('/:id/sag-checks/:checkId', async (req, res) => {
    await deleteSagCheck(requireUser(req), bikeId(req.params.id), uuidParam(req.params.checkId, 'The sag check'));
    res.status(204).end();
  });
  r.get('/:id/orders', async (req, res) => {
    res.json({ items: await bikes.ordersForBike(requireUser(req), bikeId(req.params.id)) });
  });
  return r;
}

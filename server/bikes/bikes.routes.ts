import { Router } from 'express';
import { BikeNicknameDto, BikeSagCheckInputDto, SaveBikeDto } from '../../shared/bikes';
import type { Config } from '../config';
import { requireUser } from '../http/auth';
import { endpoint } from '../http/endpoint';
import { createBikeCache } from '../recommendations/recommendations.service';
import { addSagCheck, deleteSagCheck, listSagChecks } from './bike-sag-checks.service';
import * as bikes from './bikes.service';

/** A signed-in rider's saved bikes, their sag-check history and their orders; only ever the rider's own. */
export function bikeRoutes(config: Config): Router {
  const r = Router();
  const cache = createBikeCache(config.catalogueCacheTtlMs);
  const bike = { id: 'The bike' };
  const own = { signedIn: true };

  r.get('/', endpoint({ ...own, summary: 'The signed-in rider’s saved bikes' }, async (_input, req, res) => {
    res.json({ items: await bikes.listBikes(requireUser(req)) });
  }));
  r.post('/', endpoint({ ...own, summary: 'Save a bike with its load, load cases and chosen springs', body: SaveBikeDto, status: 201 }, async ({ body }, req, res) => {
    res.status(201).json(await bikes.saveBike(requireUser(req), body, cache));
  }));
  r.get('/:id', endpoint({ ...own, summary: 'One of the rider’s saved bikes', ids: bike }, async ({ ids }, req, res) => {
    res.json(await bikes.getBike(requireUser(req), ids.id));
  }));
  r.put('/:id', endpoint({ ...own, summary: 'Replace a saved bike’s load, cases and springs', ids: bike, body: SaveBikeDto }, async ({ ids, body }, req, res) => {
    res.json(await bikes.updateBike(requireUser(req), ids.id, body, cache));
  }));
  r.patch('/:id', endpoint({ ...own, summary: 'Rename a saved bike', ids: bike, body: BikeNicknameDto }, async ({ ids, body }, req, res) => {
    res.json(await bikes.renameBike(requireUser(req), ids.id, body));
  }));
  r.delete('/:id', endpoint({ ...own, summary: 'Remove a saved bike and its sag checks', ids: bike, reply: 'none' }, async ({ ids }, req, res) => {
    await bikes.deleteBike(requireUser(req), ids.id);
    res.status(204).end();
  }));
  r.get('/:id/sag-checks', endpoint({ ...own, summary: 'A saved bike’s sag-check history, newest first', ids: bike }, async ({ ids }, req, res) => {
    res.json({ items: await listSagChecks(requireUser(req), ids.id) });
  }));
  r.post('/:id/sag-checks', endpoint({ ...own, summary: 'Check sag readings against the bike and keep the answer in its history', ids: bike, body: BikeSagCheckInputDto, status: 201 }, async ({ ids, body }, req, res) => {
    res.status(201).json(await addSagCheck(requireUser(req), ids.id, body, cache));
  }));
  r.delete('/:id/sag-checks/:checkId', endpoint({ ...own, summary: 'Remove one sag check from a bike’s history', ids: { ...bike, checkId: 'The sag check' }, reply: 'none' }, async ({ ids }, req, res) => {
    await deleteSagCheck(requireUser(req), ids.id, ids.checkId);
    res.status(204).end();
  }));
  r.get('/:id/orders', endpoint({ ...own, summary: 'The rider’s orders with springs for this bike', ids: bike }, async ({ ids }, req, res) => {
    res.json({ items: await bikes.ordersForBike(requireUser(req), ids.id) });
  }));
  return r;
}

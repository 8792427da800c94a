import { Router } from 'express';
import {
  ForkSpringRequestDto,
  RearSpringRequestDto,
  SagCheckRequestDto,
  SpringGeometryRequestDto,
} from '../../shared/dto/calculations.dto';
import type { Config } from '../config';
import { limiter } from '../http/rate-limit';
import { endpoint } from '../http/endpoint';
import * as calculations from './calculations.service';

/** The stateless calculation API: no sign-in, limited per address. */
export function calculationRoutes(config: Config): Router {
  const r = Router();
  // Open while the database is away: the calculations themselves need none.
  r.use(limiter({ name: 'calculations', windowMs: 60_000, limit: config.calcRateLimitPerMinute, failOpen: true }));

  r.post('/rear-spring', endpoint({ summary: 'Shock spring rate for a bike, its loads and its leverage', body: RearSpringRequestDto }, ({ body }, _req, res) => {
    res.json(calculations.rearSpring(body));
  }));
  r.post('/fork-spring', endpoint({ summary: 'Fork spring rate for a bike and its loads', body: ForkSpringRequestDto }, ({ body }, _req, res) => {
    res.json(calculations.forkSpring(body));
  }));
  r.post('/spring-geometry', endpoint({ summary: 'Rate, solid length and stress of a coil spring from its wire, coils and ends', body: SpringGeometryRequestDto }, ({ body }, _req, res) => {
    res.json(calculations.springGeometry(body));
  }));
  r.post('/sag-check', endpoint({ summary: 'Measured sag against its targets, with the preload change to reach them', body: SagCheckRequestDto }, ({ body }, _req, res) => {
    res.json(calculations.sagCheck(body));
  }));
  return r;
}

import { Router } from 'express';
import {
  ForkSpringRequestDto,
  RearSpringRequestDto,
  SagCheckRequestDto,
  SpringGeometryRequestDto,
} from '../../shared/dto/calculations.dto';
import type { Config } from '../config';
import { limiter } from '../http/rate-limit';
import { parseBody } from '../http/validate';
import * as calculations from './calculations.service';

/** The stateless calculation API: no sign-in, limited per address. */
export function calculationRoutes(config: Config): Router {
  const r = Router();
  // Open while the database is away: the calculations themselves need none.
  r.use(limiter({ name: 'calculations', windowMs: 60_000, limit: config.calcRateLimitPerMinute, failOpen: true }));

  r.post('/rear-spring', async (req, res) => {
    res.json(calculations.rearSpring(await parseBody(RearSpringRequestDto, req.body)));
  });
  r.post('/fork-spring', async (req, res) => {
    res.json(calculations.forkSpring(await parseBody(ForkSpringRequestDto, req.body)));
  });
  r.post('/spring-geometry', async (req, res) => {
    res.json(calculations.springGeometry(await parseBody(SpringGeometryRequestDto, req.body)));
  });
  r.post('/sag-check', async (req, res) => {
    res.json(calculations.sagCheck(await parseBody(SagCheckRequestDto, req.body)));
  });
  return r;
}

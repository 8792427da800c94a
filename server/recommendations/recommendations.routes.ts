import { Router } from 'express';
import { RecommendationRequestDto } from '../../shared/catalogue';
import type { Config } from '../config';
import { limiter } from '../http/rate-limit';
import { parseBody, uuidParam } from '../http/validate';
import { bikeForRecommendation, createBikeCache, recommend } from './recommendations.service';

/** Spring recommendations for a rider's bike and load: no sign-in, limited per address like the calculations. */
export function recommendationRoutes(config: Config): Router {
  const r = Router();
  const cache = createBikeCache(config.catalogueCacheTtlMs);
  r.use(limiter({ name: 'recommendations', windowMs: 60_000, limit: config.calcRateLimitPerMinute }));
  r.post('/', async (req, res) => {
    res.json(await recommend(await parseBody(RecommendationRequestDto, req.body), cache));
  });
  // The finder fetches this once per bike and runs the same rule in the browser as the rider types.
  r.get('/bikes/:fitmentId', async (req, res) => {
    res.json(await bikeForRecommendation(uuidParam(req.params.fitmentId, 'The bike'), cache));
  });
  return r;
}

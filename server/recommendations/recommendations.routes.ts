import { Router } from 'express';
import { RecommendationRequestDto, RecommendationShownDto } from '../../shared/catalogue';
import type { Config } from '../config';
import { limiter } from '../http/rate-limit';
import { endpoint } from '../http/endpoint';
import { bikeForRecommendation, createBikeCache, recommend } from './recommendations.service';
import { countRecommendationServed } from './served-counter';

/** Spring recommendations for a rider's bike and load: no sign-in, limited per address like the calculations. */
export function recommendationRoutes(config: Config): Router {
  const r = Router();
  const cache = createBikeCache(config.catalogueCacheTtlMs);
  r.use(limiter({ name: 'recommendations', windowMs: 60_000, limit: config.calcRateLimitPerMinute }));
  r.post('/', endpoint({ summary: 'Catalogue springs for a bike, a rider and a load, best first', body: RecommendationRequestDto }, async ({ body }, _req, res) => {
    res.json(await recommend(body, cache));
    countRecommendationServed();
  }));
  // The finder works answers out in the browser; it reports each load's answer once shown, so the dashboard's share counts what riders saw.
  r.post('/shown', endpoint({ summary: 'Counts an answer the finder worked out in the browser and showed, for the dashboard', body: RecommendationShownDto, status: 204, reply: 'none' }, async ({ body }, _req, res) => {
    await bikeForRecommendation(body.fitmentId, cache);
    countRecommendationServed();
    res.status(204).end();
  }));
  // The finder fetches this once per bike and runs the same rule in the browser as the rider types.
  r.get('/bikes/:fitmentId', endpoint({ summary: 'A bike and the springs that fit it: what the finder needs to run the recommendation in the browser', ids: { fitmentId: 'The bike' } }, async ({ ids }, _req, res) => {
    res.json(await bikeForRecommendation(ids.fitmentId, cache));
  }));
  return r;
}

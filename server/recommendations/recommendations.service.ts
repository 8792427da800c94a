import type { RecommendationDto, RecommendationRequestDto } from '../../shared/catalogue';
import { recommendFor, RecommendationProblem, type BikeForRecommendationDto } from '../../shared/recommend/recommend';
import { TtlCache } from '../catalogue/catalogue-cache';
import { fittingSprings } from '../catalogue/compatibility.service';
import { AppError } from '../errors';
import { findFitment, toFitmentDto, toFitmentSummary } from '../fitment/fitment.service';

async function loadBike(fitmentId: string): Promise<BikeForRecommendationDto> {
  const f = await findFitment(fitmentId);
  if (!f) throw AppError.notFound('The bike');
  return { fitment: toFitmentDto(f), summary: toFitmentSummary(f), springs: await fittingSprings(fitmentId) };
}

export type BikeCache = TtlCache<BikeForRecommendationDto>;

/** Each app keeps its own copy of what recommendations read, for `ttlMs` at most. */
export function createBikeCache(ttlMs: number): BikeCache {
  return new TtlCache<BikeForRecommendationDto>(ttlMs);
}

/** What the finder fetches once per bike, to run the same recommendation in the browser as the rider types. */
export async function bikeForRecommendation(fitmentId: string, cache: BikeCache): Promise<BikeForRecommendationDto> {
  return cache.getOrLoad(fitmentId, () => loadBike(fitmentId));
}

/**
 * The rider's spring choice: the shared rule (`recommendFor`) on the bike's fitment and the springs that fit it.
 * The finder runs the same function in the browser; this answer is the reference (the cart works it out again).
 */
export async function recommend(dto: RecommendationRequestDto, cache: BikeCache): Promise<RecommendationDto> {
  const bike = await cache.getOrLoad(dto.fitmentId, () => loadBike(dto.fitmentId));
  try {
    return recommendFor(bike, dto);
  } catch (e) {
    if (e instanceof RecommendationProblem) throw new AppError(e.kind, e.message, e.kind === 'validation' ? e.fields : undefined);
    throw e;
  }
}

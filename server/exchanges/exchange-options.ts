import type { EntityManager } from 'typeorm';
import { isCasesRecommendation, type RecommendationRequestDto } from '../../shared/catalogue';
import type { ExchangeReplacementDto } from '../../shared/commerce/exchange.dto';
import type { ExchangeReason } from '../../shared/exchange-status';
import { chosen } from '../cart/spring-set.service';
import { SpringSet } from '../cart/SpringSet.entity';
import type { OrderLine } from '../orders/OrderLine.entity';
import { recommend, type BikeCache } from '../recommendations/recommendations.service';

export interface EngineOptions {
  end: 'fork' | 'shock';
  targets: { staticSagMm: number; riderSagMm: number; staticSagToleranceMm: number };
  options: ExchangeReplacementDto[];
}

/**
 * Every spring the shop offers for the order's bike at this line's end, judged by the same recommendation (and the
 * same verdict over load cases) as the finder and cart, for the load saved with the order: ok ones first, best first.
 */
export async function engineOptions(em: EntityManager, cache: BikeCache, line: OrderLine): Promise<EngineOptions | null> {
  if (!line.setup || !line.springSetId) return null;
  const set = await em.getRepository(SpringSet).findOneBy({ id: line.springSetId });
  if (!set?.fitmentId) return null;
  const end = line.setup.end;
  const r = await recommend({ ...(set.request as unknown as RecommendationRequestDto), fitmentId: set.fitmentId }, cache);
  const e = r[end];
  const candidates = isCasesRecommendation(e) ? (e.cases[0]?.candidates ?? []) : e.candidates;
  const options = candidates.flatMap((c): ExchangeReplacementDto[] => {
    const judged = chosen(r, end, c.id);
    if (!judged) return [];
    const s = judged.spring;
    return [{ productId: s.id, name: s.name, sku: s.sku, rateNPerMm: s.rateNPerMm, priceCents: s.priceCents, inStock: s.inStock, verdict: judged.verdict, reason: s.reason, staticSagMm: s.staticSagMm, riderSagMm: s.riderSagMm, preloadMm: s.preloadMm, preloadNeededMm: s.preloadNeededMm, preloadRangeMm: s.preloadRangeMm, ...(s.coilBindMarginMm === undefined ? {} : { coilBindMarginMm: s.coilBindMarginMm }) }];
  });
  // Stable: the engine's ranking stands within ok and within the rest.
  options.sort((a, b) => (a.verdict === 'ok' ? 0 : 1) - (b.verdict === 'ok' ? 0 : 1));
  return { end, targets: { staticSagMm: r.targets[end].staticSagMm, riderSagMm: r.targets[end].riderSagMm, staticSagToleranceMm: r.targets[end].staticSagToleranceMm }, options };
}

/**
 * The rate the request page proposes: the best-ranked one the engine calls ok, not the one bought, stiffer when the
 * rider finds the spring too soft and softer when too stiff (when the engine offers one that way).
 */
export function proposeReplacement(options: ExchangeReplacementDto[], bought: { productId: string | null; rateNPerMm: number | null }, reason?: ExchangeReason): ExchangeReplacementDto | null {
  const ok = options.filter((o) => o.verdict === 'ok' && o.productId !== bought.productId);
  const rate = bought.rateNPerMm;
  const way = rate === null ? [] : reason === 'too-soft' ? ok.filter((o) => o.rateNPerMm > rate) : reason === 'too-stiff' ? ok.filter((o) => o.rateNPerMm < rate) : [];
  return way[0] ?? ok[0] ?? null;
}

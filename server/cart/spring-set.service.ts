import type { EntityManager } from 'typeorm';
import { isCasesRecommendation, unitsToBuy, type RecommendationDto, type RecommendedSpringDto } from '../../shared/catalogue';
import type { AddSpringSetDto, CartDto, SpringSetupDto } from '../../shared/commerce/cart.dto';
import { DEFAULT_SAG_TOLERANCE_MM } from '../../shared/engine';
import type { SpringVerdict } from '../../shared/engine/types';
import type { Config } from '../config';
import { AppError } from '../errors';
import { findFitment } from '../fitment/fitment.service';
import { recommend, type BikeCache } from '../recommendations/recommendations.service';
import { toCartDto } from './cart-dto';
import { checkStock, quantityInCart } from './cart.service';
import { CartLine } from './CartLine.entity';
import { SpringSet } from './SpringSet.entity';

type End = 'fork' | 'shock';

/** One end's chosen spring as the engine judged it (the cart and exchanges ask the same): the single load, or with cases the first ("as entered") and the verdict over all. */
export function chosen(r: RecommendationDto, end: End, productId: string): { spring: RecommendedSpringDto; verdict: SpringVerdict } | null {
  const e = r[end];
  if (!isCasesRecommendation(e)) {
    const spring = e.candidates.find((c) => c.id === productId);
    return spring ? { spring, verdict: spring.verdict } : null;
  }
  const spring = e.cases[0]?.candidates.find((c) => c.id === productId);
  if (!spring) return null;
  if (e.coversAllCases.includes(productId)) return { spring, verdict: 'ok' };
  const failing = e.cases.find((c) => c.name === e.uncoveredBy[productId]);
  return { spring, verdict: failing?.candidates.find((c) => c.id === productId)?.verdict ?? spring.verdict };
}

const verdictWords: Record<Exclude<SpringVerdict, 'ok'>, string> = { 'too-soft': 'too soft', 'too-stiff': 'too stiff', 'coil-bind': 'at risk of coil bind' };

interface Need {
  productId: string;
  quantity: number;
  verdict: SpringVerdict | null;
}

/**
 * Adds the springs the engine chose for a bike and load, with the adapters they need on that bike. The server runs the
 * recommendation again from the load, so the set, its figures and its prices are never the client's; a spring the
 * engine does not call ok goes in only with acceptVerdict.
 */
export async function addSpringSet(em: EntityManager, config: Config, cache: BikeCache, cartId: string, dto: AddSpringSetDto): Promise<CartDto> {
  const r = await recommend(dto, cache);
  const fitment = await findFitment(dto.fitmentId, em);
  if (!fitment) throw AppError.notFound('The bike');
  const picks: { end: End; productId: string; field: string }[] = [];
  if (dto.forkProductId) picks.push({ end: 'fork', productId: dto.forkProductId.toLowerCase(), field: 'forkProductId' });
  if (dto.shockProductId) picks.push({ end: 'shock', productId: dto.shockProductId.toLowerCase(), field: 'shockProductId' });

  const setup: SpringSetupDto[] = [];
  const needs: Need[] = [];
  const problems: Record<string, string> = {};
  for (const pick of picks) {
    const c = chosen(r, pick.end, pick.productId);
    if (!c) {
      problems[pick.field] = `That ${pick.end} spring is not one the shop offers for this bike.`;
      continue;
    }
    if (c.verdict !== 'ok' && dto.acceptVerdict !== true) {
      problems[pick.field] = `For this load the engine calls ${c.spring.name} ${verdictWords[c.verdict]}. Choose another, or confirm you want it anyway.`;
      continue;
    }
    const springCount = pick.end === 'fork' ? fitment.forkSpringCount : fitment.shockCount;
    const targets = r.targets[pick.end];
    setup.push({
      end: pick.end,
      productId: c.spring.id,
      springName: c.spring.name,
      sku: c.spring.sku,
      rateNPerMm: c.spring.rateNPerMm,
      springCount,
      preloadMm: c.spring.preloadMm,
      ...(c.spring.adjusterTurns === undefined ? {} : { adjusterTurns: c.spring.adjusterTurns }),
      staticSagMm: c.spring.staticSagMm,
      riderSagMm: c.spring.riderSagMm,
      targets: { staticSagMm: targets.staticSagMm, riderSagMm: targets.riderSagMm },
      // The fitment's own static-sag tolerance when the engine gives one, else the sag check's default.
      toleranceMm: (targets as { staticSagToleranceMm?: number }).staticSagToleranceMm ?? DEFAULT_SAG_TOLERANCE_MM,
      verdict: c.verdict,
    });
    // Fork springs are sold as a pair, shock springs one by one: a two-leg fork takes one unit, twin shocks two.
    needs.push({ productId: c.spring.id, quantity: unitsToBuy(pick.end, springCount), verdict: c.verdict });
    for (const a of c.spring.adapters) needs.push({ productId: a.id, quantity: a.quantity, verdict: null });
  }
  if (Object.keys(problems).length) {
    const needsConsent = Object.values(problems).some((m) => m.includes('anyway'));
    throw new AppError(needsConsent ? 'conflict' : 'validation', Object.values(problems)[0]!, problems, needsConsent ? { reason: 'verdict-not-ok' } : undefined);
  }

  // Prices and stock from the catalogue as it is now, under lock, in product-id order like every other stock writer.
  const ids = [...new Set(needs.map((n) => n.productId))].sort();
  const products = (await em.query(`SELECT id, name, price_cents, stock_on_hand, active FROM products WHERE id = ANY($1::uuid[]) ORDER BY id FOR SHARE`, [ids])) as {
    id: string; name: string; price_cents: number; stock_on_hand: number; active: boolean;
  }[];
  const byId = new Map(products.map((p) => [p.id, p]));
  for (const id of ids) {
    const p = byId.get(id);
    if (!p || !p.active) throw new AppError('conflict', 'A part of this set is no longer sold; work out your springs again.');
    const adding = needs.filter((n) => n.productId === id).reduce((s, n) => s + n.quantity, 0);
    checkStock(p, (await quantityInCart(em, cartId, id)) + adding, 'quantity');
  }

  const set = await em.getRepository(SpringSet).save(
    em.getRepository(SpringSet).create({
      fitmentId: fitment.id,
      bikeLabel: [r.fitment.make, r.fitment.model, r.fitment.variant].filter(Boolean).join(' ') + ` (${r.fitment.yearFrom}–${r.fitment.yearTo})`,
      ridingStyle: r.ridingStyle,
      request: { fitmentId: dto.fitmentId, ridingStyle: dto.ridingStyle, rider: dto.rider, passengerKg: dto.passengerKg ?? null, luggage: dto.luggage ?? [] },
      loads: r.loads,
      setup,
    }),
  );
  // One line per product in the set; an adapter both ends need is one line with both quantities.
  const merged = new Map<string, Need>();
  for (const n of needs) {
    const m = merged.get(n.productId);
    merged.set(n.productId, m ? { ...m, quantity: m.quantity + n.quantity } : { ...n });
  }
  await em.getRepository(CartLine).insert(
    [...merged.values()].map((n) => ({ cartId, productId: n.productId, quantity: n.quantity, unitPriceCents: byId.get(n.productId)!.price_cents, springSetId: set.id, verdict: n.verdict })),
  );
  return toCartDto(em, config, cartId);
}

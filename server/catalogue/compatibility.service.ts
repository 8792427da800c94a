import type { EntityManager } from 'typeorm';
import {
  springFitToleranceMm,
  type AdapterNeedDto,
  type AdapterNeedsDto,
  type CompatibilityOverrideDto,
  type FitmentCompatibilityDto,
  type SpringEnd,
  type SpringBikeFitDto,
  type SpringFitDto,
} from '../../shared/catalogue';
import type { FittingSpringDto } from '../../shared/recommend/recommend';
import { recordAudit } from '../audit/audit.service';
import { AppDataSource } from '../db/data-source';
import { AppError } from '../errors';
import { Fitment } from '../fitment/Fitment.entity';
import { AdapterNeed } from './AdapterNeed.entity';
import { catalogueChanged } from './catalogue-cache';
import { Product } from './Product.entity';
import { SpringFitOverride } from './SpringFitOverride.entity';

/** SQL for "the spring's diameter and free length sit in the fitment's window for its end". */
export function derivedFitSql(p: string, f: string): string {
  const end = (e: SpringEnd) =>
    `(${p}.spring_end = '${e}' AND abs(${p}.inner_diameter_mm - ${f}.${e}_spring_inner_diameter_mm) <= ${springFitToleranceMm} ` +
    `AND ${p}.free_length_mm BETWEEN ${f}.${e}_spring_free_length_min_mm AND ${f}.${e}_spring_free_length_max_mm)`;
  return `(${end('fork')} OR ${end('shock')})`;
}

/** SQL for "this spring fits this fitment": staff's override when there is one, else the window. */
export function fitsSql(p: string, f: string, o: string): string {
  return `(${p}.kind = 'spring' AND COALESCE(${o}.fits, ${derivedFitSql(p, f)}))`;
}

interface FitRow {
  id: string;
  sku: string;
  name: string;
  spring_end: SpringEnd;
  rate_n_per_mm: number;
  free_length_mm: number;
  inner_diameter_mm: number;
  solid_length_mm: number;
  active: boolean;
  price_cents: number;
  stock_on_hand: number;
  derived: boolean;
  override: boolean | null;
  override_note: string | null;
}

async function fitRows(em: EntityManager, fitmentId: string, only?: { productId?: string; fittingActive?: boolean }): Promise<FitRow[]> {
  const where = [`p.kind = 'spring'`];
  const params: unknown[] = [fitmentId];
  if (only?.productId) {
    params.push(only.productId);
    where.push(`p.id = $${params.length}`);
  }
  if (only?.fittingActive) where.push(`p.active`, fitsSql('p', 'f', 'o'));
  return em.query(
    `SELECT p.id, p.sku, p.name, p.spring_end, p.rate_n_per_mm, p.free_length_mm, p.inner_diameter_mm,
            COALESCE(p.solid_length_mm, p.computed_solid_length_mm) AS solid_length_mm, p.active, p.price_cents, p.stock_on_hand,
            ${derivedFitSql('p', 'f')} AS derived, o.fits AS override, o.note AS override_note
       FROM products p
       JOIN fitments f ON f.id = $1
       LEFT JOIN spring_fit_overrides o ON o.fitment_id = f.id AND o.product_id = p.id
      WHERE ${where.join(' AND ')}
      ORDER BY p.spring_end, p.rate_n_per_mm, p.sku`,
    params,
  );
}

async function adaptersFor(em: EntityManager, fitmentId: string, springIds: string[]): Promise<Map<string, AdapterNeedDto[]>> {
  const out = new Map<string, AdapterNeedDto[]>(springIds.map((id) => [id, []]));
  if (!springIds.length) return out;
  const rows: { spring_id: string; id: string; sku: string; name: string; price_cents: number; quantity: number; stock_on_hand: number }[] = await em.query(
    `SELECT n.spring_id, a.id, a.sku, a.name, a.price_cents, n.quantity, a.stock_on_hand
       FROM adapter_needs n JOIN products a ON a.id = n.adapter_id
      WHERE n.fitment_id = $1 AND n.spring_id = ANY($2::uuid[])
      ORDER BY a.sku`,
    [fitmentId, springIds],
  );
  for (const r of rows) {
    out.get(r.spring_id)?.push({ id: r.id, sku: r.sku, name: r.name, priceCents: r.price_cents, currency: 'EUR', quantity: r.quantity, inStock: r.stock_on_hand >= r.quantity });
  }
  return out;
}

function toSpringFit(r: FitRow, adapters: AdapterNeedDto[]): SpringFitDto {
  return {
    productId: r.id,
    sku: r.sku,
    name: r.name,
    end: r.spring_end,
    rateNPerMm: r.rate_n_per_mm,
    freeLengthMm: r.free_length_mm,
    innerDiameterMm: r.inner_diameter_mm,
    active: r.active,
    derivedFits: r.derived,
    override: r.override,
    overrideNote: r.override_note ?? '',
    fits: r.override ?? r.derived,
    adapters,
  };
}

// Writers take a share lock, so a delete of the row waits for them or has already removed it: never a dangling reference.
const shareLock = { mode: 'pessimistic_read' } as const;

async function requireFitment(em: EntityManager, id: string, lock = false): Promise<void> {
  const found = lock ? await em.getRepository(Fitment).findOne({ select: { id: true }, where: { id }, lock: shareLock }) : await em.getRepository(Fitment).existsBy({ id });
  if (!found) throw AppError.notFound('The fitment');
}

/** Every spring of the catalogue against one fitment, for the staff compatibility table. */
export async function fitmentCompatibility(fitmentId: string): Promise<FitmentCompatibilityDto> {
  const em = AppDataSource.manager;
  await requireFitment(em, fitmentId);
  const rows = await fitRows(em, fitmentId);
  const adapters = await adaptersFor(em, fitmentId, rows.map((r) => r.id));
  return { fitmentId, springs: rows.map((r) => toSpringFit(r, adapters.get(r.id) ?? [])) };
}

async function springFit(em: EntityManager, fitmentId: string, productId: string): Promise<SpringFitDto> {
  const [row] = await fitRows(em, fitmentId, { productId });
  if (!row) throw AppError.notFound('The spring');
  return toSpringFit(row, (await adaptersFor(em, fitmentId, [productId])).get(productId) ?? []);
}

async function requireSpring(em: EntityManager, productId: string, lock: 'pessimistic_read' | 'pessimistic_write' = 'pessimistic_read'): Promise<void> {
  const p = await em.getRepository(Product).findOne({ where: { id: productId }, lock: { mode: lock } });
  if (!p || p.kind !== 'spring') throw AppError.notFound('The spring');
}

/** Staff force a spring to fit a fitment, or exclude it, whatever the window says. */
export async function setOverride(actorId: string, fitmentId: string, productId: string, dto: CompatibilityOverrideDto): Promise<SpringFitDto> {
  const out = await AppDataSource.transaction(async (em) => {
    await requireFitment(em, fitmentId, true);
    await requireSpring(em, productId);
    const before = await springFit(em, fitmentId, productId);
    await em.getRepository(SpringFitOverride).upsert({ fitmentId, productId, fits: dto.fits, note: (dto.note ?? '').trim() }, ['fitmentId', 'productId']);
    const after = await springFit(em, fitmentId, productId);
    await recordAudit(em, { actorId, entityType: 'compatibility', entityId: fitmentId, action: 'update', before, after });
    return after;
  });
  catalogueChanged();
  return out;
}

export async function clearOverride(actorId: string, fitmentId: string, productId: string): Promise<SpringFitDto> {
  const out = await AppDataSource.transaction(async (em) => {
    await requireFitment(em, fitmentId, true);
    await requireSpring(em, productId);
    const before = await springFit(em, fitmentId, productId);
    await em.getRepository(SpringFitOverride).delete({ fitmentId, productId });
    const after = await springFit(em, fitmentId, productId);
    await recordAudit(em, { actorId, entityType: 'compatibility', entityId: fitmentId, action: 'update', before, after });
    return after;
  });
  catalogueChanged();
  return out;
}

/** Replaces the adapters a spring needs on a fitment. */
export async function setAdapters(actorId: string, fitmentId: string, springId: string, dto: AdapterNeedsDto): Promise<SpringFitDto> {
  const out = await AppDataSource.transaction(async (em) => {
    await requireFitment(em, fitmentId, true);
    // Two saves of one spring's list take turns, so the second replaces the first instead of colliding with it.
    await requireSpring(em, springId, 'pessimistic_write');
    const fields: Record<string, string> = {};
    const seen = new Set<string>();
    // A UUID in capitals names the same adapter, so duplicates are found on the lower-case form.
    const adapters = dto.adapters.map((a) => ({ productId: a.productId.toLowerCase(), quantity: a.quantity }));
    for (const [i, a] of adapters.entries()) {
      const p = await em.getRepository(Product).findOne({ where: { id: a.productId }, lock: shareLock });
      if (!p || p.kind !== 'adapter') fields[`adapters.${i}.productId`] = 'This is not an adapter kit of the catalogue.';
      if (seen.has(a.productId)) fields[`adapters.${i}.productId`] = 'Each adapter appears once; raise its quantity instead.';
      seen.add(a.productId);
    }
    if (Object.keys(fields).length) throw AppError.validation('Some adapters need attention.', fields);
    const before = await springFit(em, fitmentId, springId);
    const repo = em.getRepository(AdapterNeed);
    await repo.delete({ fitmentId, springId });
    if (adapters.length) await repo.insert(adapters.map((a) => ({ fitmentId, springId, adapterId: a.productId, quantity: a.quantity })));
    const after = await springFit(em, fitmentId, springId);
    await recordAudit(em, { actorId, entityType: 'compatibility', entityId: fitmentId, action: 'update', before, after });
    return after;
  });
  catalogueChanged();
  return out;
}

/** The active springs that fit a fitment, with their adapters: what a recommendation chooses from. */
export async function fittingSprings(fitmentId: string, em: EntityManager = AppDataSource.manager): Promise<FittingSpringDto[]> {
  const rows = await fitRows(em, fitmentId, { fittingActive: true });
  const adapters = await adaptersFor(em, fitmentId, rows.map((r) => r.id));
  return rows.map((r) => ({
    id: r.id,
    sku: r.sku,
    name: r.name,
    end: r.spring_end,
    rateNPerMm: r.rate_n_per_mm,
    freeLengthMm: r.free_length_mm,
    solidLengthMm: r.solid_length_mm,
    priceCents: r.price_cents,
    inStock: r.stock_on_hand > 0,
    adapters: adapters.get(r.id) ?? [],
  }));
}

/** The bikes an active spring fits (window or staff override), each with the adapters it needs there: for the product page. */
export async function bikesForSpring(productId: string, em: EntityManager = AppDataSource.manager): Promise<SpringBikeFitDto[]> {
  const p = await em.getRepository(Product).findOneBy({ id: productId });
  if (!p || !p.active) throw AppError.notFound('The product');
  if (p.kind !== 'spring') return [];
  const rows: { id: string; make: string; model: string; variant: string; year_from: number; year_to: number | null }[] = await em.query(
    `SELECT f.id, b.make, b.model, f.variant, f.year_from, f.year_to
       FROM fitments f JOIN bikes b ON b.id = f.bike_id
       JOIN products p ON p.id = $1
       LEFT JOIN spring_fit_overrides o ON o.fitment_id = f.id AND o.product_id = p.id
      WHERE ${fitsSql('p', 'f', 'o')}
      ORDER BY b.make, b.model, f.variant, f.year_from
      LIMIT 200`,
    [productId],
  );
  const needs: { fitment_id: string; id: string; sku: string; name: string; price_cents: number; quantity: number; stock_on_hand: number }[] = rows.length
    ? await em.query(
        `SELECT n.fitment_id, a.id, a.sku, a.name, a.price_cents, n.quantity, a.stock_on_hand
           FROM adapter_needs n JOIN products a ON a.id = n.adapter_id
          WHERE n.spring_id = $1 AND n.fitment_id = ANY($2::uuid[])
          ORDER BY a.sku`,
        [productId, rows.map((r) => r.id)],
      )
    : [];
  return rows.map((r) => ({
    fitmentId: r.id,
    make: r.make,
    model: r.model,
    variant: r.variant,
    yearFrom: r.year_from,
    yearTo: r.year_to,
    adapters: needs
      .filter((n) => n.fitment_id === r.id)
      .map((n) => ({ id: n.id, sku: n.sku, name: n.name, priceCents: n.price_cents, currency: 'EUR' as const, quantity: n.quantity, inStock: n.stock_on_hand >= n.quantity })),
  }));
}

import type { EntityManager, ObjectLiteral, SelectQueryBuilder } from 'typeorm';
import {
  defaultStaticSagToleranceMm,
  fitmentProblems,
  sprungFromWet,
  type FitmentDto,
  type FitmentInputDto,
  type FitmentListQueryDto,
  type FitmentSummaryDto,
  type MakeDto,
  type Page,
} from '../../shared/catalogue';
import { recordAudit } from '../audit/audit.service';
import { catalogueChanged } from '../catalogue/catalogue-cache';
import { nmToFtLbf, rateInUnits } from '../catalogue/units';
import { AppDataSource } from '../db/data-source';
import { AppError } from '../errors';
import { Bike } from './Bike.entity';
import { Fitment } from './Fitment.entity';

export type FitmentWithBike = Fitment & { bike: Bike };

export function toFitmentSummary(f: FitmentWithBike): FitmentSummaryDto {
  return { id: f.id, make: f.bike.make, model: f.bike.model, variant: f.variant, yearFrom: f.yearFrom, yearTo: f.yearTo, updatedAt: f.updatedAt.toISOString() };
}

export function toFitmentDto(f: FitmentWithBike): FitmentDto {
  return {
    ...toFitmentSummary(f),
    massInput: f.massInput,
    frontSprungMassKg: f.frontSprungMassKg,
    rearSprungMassKg: f.rearSprungMassKg,
    wetMassKg: f.wetMassKg,
    frontStaticSharePct: f.frontStaticSharePct,
    frontUnsprungMassKg: f.frontUnsprungMassKg,
    rearUnsprungMassKg: f.rearUnsprungMassKg,
    ratedLoadKg: f.ratedLoadKg,
    wheelbaseMm: f.wheelbaseMm,
    loadStations: f.loadStations.map((s) => ({ station: s.station, positionMm: s.positionMm, maxLoadKg: s.maxLoadKg })),
    rearLeverageRatio: f.rearLeverageRatio,
    rearLeverageCurve: f.rearLeverageCurve?.map((p) => ({ wheelTravelMm: p.wheelTravelMm, ratio: p.ratio })) ?? null,
    rearWheelTravelMm: f.rearWheelTravelMm,
    shockStrokeMm: f.shockStrokeMm,
    shockCount: f.shockCount,
    rearPreloadMinMm: f.rearPreloadMinMm,
    rearPreloadMaxMm: f.rearPreloadMaxMm,
    rearAdjusterPitchMm: f.rearAdjusterPitchMm,
    shockSpringInnerDiameterMm: f.shockSpringInnerDiameterMm,
    shockSpringFreeLengthMinMm: f.shockSpringFreeLengthMinMm,
    shockSpringFreeLengthMaxMm: f.shockSpringFreeLengthMaxMm,
    forkAngleDeg: f.forkAngleDeg,
    forkTravelMm: f.forkTravelMm,
    forkSpringCount: f.forkSpringCount,
    forkPreloadMinMm: f.forkPreloadMinMm,
    forkPreloadMaxMm: f.forkPreloadMaxMm,
    forkAdjusterPitchMm: f.forkAdjusterPitchMm,
    forkStockSpacerMm: f.forkStockSpacerMm,
    forkStockPreloadMm: f.forkStockPreloadMm,
    forkSpringInnerDiameterMm: f.forkSpringInnerDiameterMm,
    forkSpringFreeLengthMinMm: f.forkSpringFreeLengthMinMm,
    forkSpringFreeLengthMaxMm: f.forkSpringFreeLengthMaxMm,
    sag: f.sag,
    frontStaticSagToleranceMm: f.frontStaticSagToleranceMm,
    rearStaticSagToleranceMm: f.rearStaticSagToleranceMm,
    stockForkRateNPerMm: f.stockForkRateNPerMm,
    stockForkFreeLengthMm: f.stockForkFreeLengthMm,
    stockShockRateNPerMm: f.stockShockRateNPerMm,
    stockShockFreeLengthMm: f.stockShockFreeLengthMm,
    stockForkRate: rateInUnits(f.stockForkRateNPerMm),
    stockShockRate: rateInUnits(f.stockShockRateNPerMm),
    torques: f.torques.map((t) => ({ fastener: t.fastener, torqueNm: t.torqueNm, torqueFtLbf: nmToFtLbf(t.torqueNm) })),
    tools: [...f.tools],
    notes: f.notes,
  };
}

/** Refuses an input whose fields disagree with each other, with a message on each field. */
export function checkFitmentInput(dto: FitmentInputDto): void {
  const problems = fitmentProblems(dto);
  if (Object.keys(problems).length) throw AppError.validation('Some fields need attention.', problems);
}

/** Copies a validated input onto an entity; sprung masses are derived when the wet mass was given. */
export function applyFitmentInput(f: Fitment, dto: FitmentInputDto, bikeId: string): void {
  const sprung =
    dto.massInput === 'wet'
      ? sprungFromWet(dto.wetMassKg!, dto.frontStaticSharePct!, dto.frontUnsprungMassKg!, dto.rearUnsprungMassKg!)
      : { frontSprungMassKg: dto.frontSprungMassKg!, rearSprungMassKg: dto.rearSprungMassKg! };
  const wet = dto.massInput === 'wet';
  Object.assign(f, {
    bikeId,
    variant: (dto.variant ?? '').trim(),
    yearFrom: dto.yearFrom,
    yearTo: dto.yearTo,
    massInput: dto.massInput,
    frontSprungMassKg: sprung.frontSprungMassKg,
    rearSprungMassKg: sprung.rearSprungMassKg,
    wetMassKg: wet ? dto.wetMassKg! : null,
    frontStaticSharePct: wet ? dto.frontStaticSharePct! : null,
    frontUnsprungMassKg: wet ? dto.frontUnsprungMassKg! : null,
    rearUnsprungMassKg: wet ? dto.rearUnsprungMassKg! : null,
    ratedLoadKg: dto.ratedLoadKg,
    wheelbaseMm: dto.wheelbaseMm,
    loadStations: dto.loadStations.map((s) => ({ station: s.station, positionMm: s.positionMm, maxLoadKg: s.maxLoadKg })),
    rearLeverageRatio: dto.rearLeverageCurve ? null : dto.rearLeverageRatio!,
    rearLeverageCurve: dto.rearLeverageCurve ? dto.rearLeverageCurve.map((p) => ({ wheelTravelMm: p.wheelTravelMm, ratio: p.ratio })) : null,
    rearWheelTravelMm: dto.rearWheelTravelMm,
    shockStrokeMm: dto.shockStrokeMm,
    shockCount: dto.shockCount ?? 1,
    rearPreloadMinMm: dto.rearPreloadMinMm,
    rearPreloadMaxMm: dto.rearPreloadMaxMm,
    rearAdjusterPitchMm: dto.rearAdjusterPitchMm,
    shockSpringInnerDiameterMm: dto.shockSpringInnerDiameterMm,
    shockSpringFreeLengthMinMm: dto.shockSpringFreeLengthMinMm,
    shockSpringFreeLengthMaxMm: dto.shockSpringFreeLengthMaxMm,
    forkAngleDeg: dto.forkAngleDeg,
    forkTravelMm: dto.forkTravelMm,
    forkSpringCount: dto.forkSpringCount,
    forkPreloadMinMm: dto.forkPreloadMinMm,
    forkPreloadMaxMm: dto.forkPreloadMaxMm,
    forkAdjusterPitchMm: dto.forkAdjusterPitchMm ?? null,
    forkStockSpacerMm: dto.forkStockSpacerMm ?? null,
    forkStockPreloadMm: dto.forkStockPreloadMm ?? dto.forkPreloadMinMm,
    forkSpringInnerDiameterMm: dto.forkSpringInnerDiameterMm,
    forkSpringFreeLengthMinMm: dto.forkSpringFreeLengthMinMm,
    forkSpringFreeLengthMaxMm: dto.forkSpringFreeLengthMaxMm,
    sag: {
      front: sagEnd(dto.sag.front),
      rear: sagEnd(dto.sag.rear),
    },
    frontStaticSagToleranceMm: dto.frontStaticSagToleranceMm ?? defaultStaticSagToleranceMm,
    rearStaticSagToleranceMm: dto.rearStaticSagToleranceMm ?? defaultStaticSagToleranceMm,
    stockForkRateNPerMm: dto.stockForkRateNPerMm,
    stockForkFreeLengthMm: dto.stockForkFreeLengthMm,
    stockShockRateNPerMm: dto.stockShockRateNPerMm,
    stockShockFreeLengthMm: dto.stockShockFreeLengthMm,
    torques: (dto.torques ?? []).map((t) => ({ fastener: t.fastener.trim(), torqueNm: t.torqueNm })),
    tools: (dto.tools ?? []).map((t) => t.trim()),
    notes: dto.notes ?? '',
  } satisfies Partial<Fitment>);
}

const sagEnd = (e: FitmentInputDto['sag']['front']) => ({
  unit: e.unit,
  road: { static: e.road.static, rider: e.road.rider },
  adventure: { static: e.adventure.static, rider: e.adventure.rider },
  offRoad: { static: e.offRoad.static, rider: e.offRoad.rider },
});

const fitments = (em: EntityManager = AppDataSource.manager) => em.getRepository(Fitment);

const sortColumns: Record<string, string> = {
  make: 'b.make',
  model: 'b.model',
  yearFrom: 'f.yearFrom',
  yearTo: 'f.yearTo',
  updatedAt: 'f.updatedAt',
};

/** Sorts by `field` or `-field`, then by tie-breakers that are not the sort itself, so pages never overlap. */
export function orderPage(qb: SelectQueryBuilder<ObjectLiteral>, sort: string, columns: Record<string, string>, tieBreakers: string[]): void {
  const desc = sort.startsWith('-');
  const primary = columns[desc ? sort.slice(1) : sort] ?? tieBreakers[0]!;
  qb.orderBy(primary, desc ? 'DESC' : 'ASC');
  // Re-adding the sort column would replace its direction, so it is skipped.
  for (const t of tieBreakers) if (t !== primary) qb.addOrderBy(t, 'ASC');
}

export const likePattern = (s: string) => `%${s.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

/** The picker's and the staff table's list: filtered, sorted, one page. */
export async function listFitments(q: FitmentListQueryDto): Promise<Page<FitmentSummaryDto>> {
  const page = q.page ?? 1;
  const pageSize = q.pageSize ?? 20;
  const qb = fitments().createQueryBuilder('f').innerJoinAndSelect('f.bike', 'b');
  if (q.make) qb.andWhere('lower(b.make) = lower(:make)', { make: q.make.trim() });
  if (q.model) qb.andWhere('lower(b.model) = lower(:model)', { model: q.model.trim() });
  if (q.year !== undefined) qb.andWhere(':year BETWEEN f.year_from AND f.year_to', { year: q.year });
  if (q.q) qb.andWhere("(b.make || ' ' || b.model || ' ' || f.variant) ILIKE :q", { q: likePattern(q.q.trim()) });
  orderPage(qb, q.sort ?? 'make', sortColumns, ['b.make', 'b.model', 'f.variant', 'f.yearFrom', 'f.id']);
  const [rows, total] = await qb.skip((page - 1) * pageSize).take(pageSize).getManyAndCount();
  return { items: rows.map((f) => toFitmentSummary(f as FitmentWithBike)), total, page, pageSize };
}

export async function listMakes(): Promise<MakeDto[]> {
  const rows: { make: string; model: string }[] = await AppDataSource.query(
    `SELECT DISTINCT b.make, b.model FROM bikes b JOIN fitments f ON f.bike_id = b.id ORDER BY b.make, b.model`,
  );
  const byMake = new Map<string, string[]>();
  for (const r of rows) byMake.set(r.make, [...(byMake.get(r.make) ?? []), r.model]);
  return [...byMake].map(([make, models]) => ({ make, models }));
}

export async function findFitment(id: string, em?: EntityManager): Promise<FitmentWithBike | null> {
  return (await fitments(em).findOne({ where: { id }, relations: { bike: true } })) as FitmentWithBike | null;
}

export async function getFitment(id: string): Promise<FitmentDto> {
  const f = await findFitment(id);
  if (!f) throw AppError.notFound('The fitment');
  return toFitmentDto(f);
}

/** Finds the make and model whatever their case, or adds them. */
export async function findOrCreateBike(em: EntityManager, make: string, model: string): Promise<Bike> {
  const repo = em.getRepository(Bike);
  const found = await repo
    .createQueryBuilder('b')
    .where('lower(b.make) = lower(:make) AND lower(b.model) = lower(:model)', { make: make.trim(), model: model.trim() })
    .getOne();
  if (found) return found;
  await em.query(`INSERT INTO bikes (make, model) VALUES ($1, $2) ON CONFLICT DO NOTHING`, [make.trim(), model.trim()]);
  return repo
    .createQueryBuilder('b')
    .where('lower(b.make) = lower(:make) AND lower(b.model) = lower(:model)', { make: make.trim(), model: model.trim() })
    .getOneOrFail();
}

const duplicate = () =>
  new AppError('conflict', 'This bike already has a fitment with this variant and first year.', {
    yearFrom: 'Another fitment of this make, model and variant starts in this year.',
  });

async function saveUnique(em: EntityManager, f: Fitment): Promise<Fitment> {
  try {
    return await em.transaction(async (inner) => inner.save(f));
  } catch (e) {
    if ((e as { code?: string }).code === '23505') throw duplicate();
    throw e;
  }
}

/** Staff add a fitment; the make and model are created when new. */
export async function createFitment(actorId: string, dto: FitmentInputDto): Promise<FitmentDto> {
  checkFitmentInput(dto);
  const dtoOut = await AppDataSource.transaction(async (em) => {
    const bike = await findOrCreateBike(em, dto.make, dto.model);
    const f = fitments(em).create();
    applyFitmentInput(f, dto, bike.id);
    const saved = await saveUnique(em, f);
    const after = toFitmentDto((await findFitment(saved.id, em))!);
    await recordAudit(em, { actorId, entityType: 'fitment', entityId: saved.id, action: 'create', before: null, after });
    return after;
  });
  catalogueChanged();
  return dtoOut;
}

/** Staff replace a fitment's values; the before and after go to the audit log. */
export async function updateFitment(actorId: string, id: string, dto: FitmentInputDto): Promise<FitmentDto> {
  checkFitmentInput(dto);
  const out = await AppDataSource.transaction(async (em) => {
    // The row lock makes two staff saving the same fitment take turns, so the audit's "before" is true.
    const f = await fitments(em).findOne({ where: { id }, lock: { mode: 'pessimistic_write' } });
    if (!f) throw AppError.notFound('The fitment');
    const oldBike = await em.getRepository(Bike).findOneByOrFail({ id: f.bikeId });
    const before = toFitmentDto({ ...f, bike: oldBike } as FitmentWithBike);
    const bike = await findOrCreateBike(em, dto.make, dto.model);
    applyFitmentInput(f, dto, bike.id);
    await saveUnique(em, f);
    const after = toFitmentDto((await findFitment(id, em))!);
    await recordAudit(em, { actorId, entityType: 'fitment', entityId: id, action: 'update', before, after });
    return after;
  });
  catalogueChanged();
  return out;
}

export async function deleteFitment(actorId: string, id: string): Promise<void> {
  await AppDataSource.transaction(async (em) => {
    const f = await findFitment(id, em);
    if (!f) throw AppError.notFound('The fitment');
    await fitments(em).delete({ id });
    await recordAudit(em, { actorId, entityType: 'fitment', entityId: id, action: 'delete', before: toFitmentDto(f), after: null });
  });
  catalogueChanged();
}

import type { EntityManager } from 'typeorm';
import type { BikeDto, BikeNicknameDto, BikeSpringDto, BikeSummaryDto, SaveBikeDto } from '../../shared/bikes';
import { bikeLabel } from '../../shared/bikes';
import type { RecommendationDto } from '../../shared/catalogue';
import type { OrderSummaryDto } from '../../shared/commerce/order.dto';
import type { User } from '../accounts/User.entity';
import { Product } from '../catalogue/Product.entity';
import { AppDataSource } from '../db/data-source';
import { AppError } from '../errors';
import { Order } from '../orders/Order.entity';
import { toOrderSummaryDto } from '../orders/order-dto';
import { recommend, type BikeCache } from '../recommendations/recommendations.service';
import { toBikeDto, toBikeSummaryDto, type BikeExtras } from './bike-dto';
import { RiderBike } from './RiderBike.entity';
import { RiderBikeSagCheck } from './RiderBikeSagCheck.entity';

const MAX_BIKES_PER_RIDER = 50;

/** The rider's own bike, or a 404 whatever the reason: another rider's id says nothing about whether it exists. */
export async function ownBike(em: EntityManager, user: User, id: string): Promise<RiderBike> {
  const bike = await em.getRepository(RiderBike).findOneBy({ id, userId: user.id });
  if (!bike) throw AppError.notFound('The bike');
  return bike;
}

async function extrasFor(em: EntityManager, bikes: RiderBike[]): Promise<Map<string, BikeExtras>> {
  const springIds = [...new Set(bikes.flatMap((b) => [b.forkSpringId, b.shockSpringId]).filter((x): x is string => !!x))];
  const products = springIds.length ? await em.getRepository(Product).createQueryBuilder('p').where('p.id IN (:...ids)', { ids: springIds }).getMany() : [];
  const springs = new Map<string, BikeSpringDto>(products.map((p) => [p.id, { id: p.id, name: p.name, sku: p.sku, rateNPerMm: p.rateNPerMm }]));
  const ids = bikes.map((b) => b.id);
  const counts = ids.length
    ? ((await em.query(`SELECT bike_id, count(*)::int AS n FROM rider_bike_sag_checks WHERE bike_id = ANY($1::uuid[]) GROUP BY bike_id`, [ids])) as { bike_id: string; n: number }[])
    : [];
  const lasts = ids.length
    ? await em
        .getRepository(RiderBikeSagCheck)
        .createQueryBuilder('c')
        .distinctOn(['c.bikeId'])
        .where('c.bikeId IN (:...ids)', { ids })
        .orderBy('c.bikeId')
        .addOrderBy('c.checkedAt', 'DESC')
        .getMany()
    : [];
  const n = new Map(counts.map((c) => [c.bike_id, c.n]));
  const last = new Map(lasts.map((c) => [c.bikeId, c]));
  return new Map(bikes.map((b) => [b.id, { springs, checkCount: n.get(b.id) ?? 0, last: last.get(b.id) ?? null }]));
}

async function bikeDto(em: EntityManager, bike: RiderBike): Promise<BikeDto> {
  return toBikeDto(bike, (await extrasFor(em, [bike])).get(bike.id)!);
}

/** The product ids the finder offers at one end for this load (in every case when there are cases). */
function offered(end: RecommendationDto['fork'] | RecommendationDto['shock']): Set<string> {
  if ('cases' in end) return new Set(end.cases.flatMap((c) => c.candidates.map((s) => s.id)));
  return new Set(end.candidates.map((s) => s.id));
}

/**
 * Runs the finder on what the rider saves, so a saved bike always reopens into an answer: the load must fit the
 * bike (problems are named under `load.`), and each chosen spring must be one the shop offers for that end.
 */
async function checkedAgainstFinder(dto: SaveBikeDto, cache: BikeCache): Promise<RecommendationDto> {
  let r: RecommendationDto;
  try {
    r = await recommend({ fitmentId: dto.fitmentId, ridingStyle: dto.ridingStyle, ...dto.load, ...(dto.cases ? { cases: dto.cases } : {}) }, cache);
  } catch (e) {
    if (e instanceof AppError && e.kind === 'not-found') throw AppError.validation('Choose a bike from the list.', { fitmentId: 'Choose a bike from the list.' });
    if (e instanceof AppError && e.kind === 'validation' && e.fields) {
      const fields = Object.fromEntries(Object.entries(e.fields).map(([k, v]) => [k.startsWith('cases.') ? k : `load.${k}`, v]));
      throw AppError.validation(e.message, fields);
    }
    throw e;
  }
  const problems: Record<string, string> = {};
  if (dto.forkSpringId && !offered(r.fork).has(dto.forkSpringId)) problems.forkSpringId = 'This spring is not one the shop offers for this bike’s fork.';
  if (dto.shockSpringId && !offered(r.shock).has(dto.shockSpringId)) problems.shockSpringId = 'This spring is not one the shop offers for this bike’s shock.';
  if (Object.keys(problems).length) throw AppError.validation(Object.values(problems)[0]!, problems);
  return r;
}

const fieldsOf = (dto: SaveBikeDto, r: RecommendationDto) => ({
  nickname: dto.nickname.trim(),
  fitmentId: dto.fitmentId,
  bikeLabel: bikeLabel(r.fitment),
  ridingStyle: dto.ridingStyle,
  load: { rider: dto.load.rider, ...(dto.load.passengerKg === undefined ? {} : { passengerKg: dto.load.passengerKg }), luggage: dto.load.luggage ?? [] },
  cases: dto.cases ?? [],
  forkSpringId: dto.forkSpringId ?? null,
  shockSpringId: dto.shockSpringId ?? null,
});

export async function saveBike(user: User, dto: SaveBikeDto, cache: BikeCache): Promise<BikeDto> {
  const r = await checkedAgainstFinder(dto, cache);
  return AppDataSource.transaction(async (em) => {
    // Serialises one rider's saves so the cap holds under double clicks.
    await em.query(`SELECT id FROM users WHERE id = $1 FOR UPDATE`, [user.id]);
    if ((await em.getRepository(RiderBike).countBy({ userId: user.id })) >= MAX_BIKES_PER_RIDER) {
      throw new AppError('conflict', `You can keep up to ${MAX_BIKES_PER_RIDER} bikes; remove one first.`);
    }
    const repo = em.getRepository(RiderBike);
    return bikeDto(em, await repo.save(repo.create({ userId: user.id, ...fieldsOf(dto, r) })));
  });
}

export async function listBikes(user: User): Promise<BikeSummaryDto[]> {
  const em = AppDataSource.manager;
  const bikes = await em.getRepository(RiderBike).find({ where: { userId: user.id }, order: { createdAt: 'DESC' } });
  const extras = await extrasFor(em, bikes);
  return bikes.map((b) => toBikeSummaryDto(b, extras.get(b.id)!));
}

export async function getBike(user: User, id: string): Promise<BikeDto> {
  return bikeDto(AppDataSource.manager, await ownBike(AppDataSource.manager, user, id));
}

export async function renameBike(user: User, id: string, dto: BikeNicknameDto): Promise<BikeDto> {
  const em = AppDataSource.manager;
  const bike = await ownBike(em, user, id);
  bike.nickname = dto.nickname.trim();
  return bikeDto(em, await em.getRepository(RiderBike).save(bike));
}

export async function updateBike(user: User, id: string, dto: SaveBikeDto, cache: BikeCache): Promise<BikeDto> {
  const bike = await ownBike(AppDataSource.manager, user, id);
  const r = await checkedAgainstFinder(dto, cache);
  Object.assign(bike, fieldsOf(dto, r));
  return bikeDto(AppDataSource.manager, await AppDataSource.getRepository(RiderBike).save(bike));
}

/** Removes the bike and, with it, its sag-check history (the foreign key cascades). */
export async function deleteBike(user: User, id: string): Promise<void> {
  const result = await AppDataSource.getRepository(RiderBike).delete({ id, userId: user.id });
  if (!result.affected) throw AppError.notFound('The bike');
}

/** The rider's own orders holding springs worked out for this bike's fitment, newest first. */
export async function ordersForBike(user: User, id: string): Promise<OrderSummaryDto[]> {
  const em = AppDataSource.manager;
  const bike = await ownBike(em, user, id);
  if (!bike.fitmentId) return [];
  const rows = (await em.query(
    `SELECT o.id, sum(l.quantity)::int AS n
       FROM orders o JOIN order_lines l ON l.order_id = o.id
      WHERE o.user_id = $1
        AND o.id IN (SELECT ol.order_id FROM order_lines ol JOIN spring_sets s ON s.id = ol.spring_set_id WHERE s.fitment_id = $2)
      GROUP BY o.id`,
    [user.id, bike.fitmentId],
  )) as { id: string; n: number }[];
  if (!rows.length) return [];
  const n = new Map(rows.map((r) => [r.id, r.n]));
  const orders = await em.getRepository(Order).createQueryBuilder('o').where('o.id IN (:...ids)', { ids: [...n.keys()] }).orderBy('o.createdAt', 'DESC').getMany();
  return orders.map((o) => toOrderSummaryDto(o, n.get(o.id) ?? 0));
}

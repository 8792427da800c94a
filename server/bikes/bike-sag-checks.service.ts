import type { BikeSagCheckDto, BikeSagCheckInputDto } from '../../shared/bikes';
import { sagCheckInputForBike, sagLoadOf } from '../../shared/bikes';
import type { SagCheckRequestDto } from '../../shared/dto/calculations.dto';
import type { User } from '../accounts/User.entity';
import { sagCheck } from '../calculations/calculations.service';
import { AppDataSource } from '../db/data-source';
import { AppError } from '../errors';
import { getFitment } from '../fitment/fitment.service';
import { recommend, type BikeCache } from '../recommendations/recommendations.service';
import { toBikeSagCheckDto } from './bike-dto';
import { ownBike } from './bikes.service';
import { RiderBikeSagCheck } from './RiderBikeSagCheck.entity';

const MAX_CHECKS_PER_BIKE = 500;

/**
 * Saves a sag check to the rider's bike. Only the readings come from the rider: the targets, the bike's figures and the
 * wheel loads come from the saved bike through the finder, and the verdict from the shared engine, here.
 */
export async function addSagCheck(user: User, bikeId: string, dto: BikeSagCheckInputDto, cache: BikeCache): Promise<BikeSagCheckDto> {
  const bike = await ownBike(AppDataSource.manager, user, bikeId);
  if (!bike.fitmentId) throw new AppError('conflict', 'This bike is no longer in the shop’s bike list, so its sag cannot be judged here.');
  const fitment = await getFitment(bike.fitmentId);
  const r = await recommend({ fitmentId: bike.fitmentId, ridingStyle: bike.ridingStyle, ...bike.load }, cache);
  if ('cases' in r.fork || 'cases' in r.shock) throw new Error('A recommendation without cases came back in the cases shape');
  const input = sagCheckInputForBike(fitment, sagLoadOf(r), dto);
  const result = sagCheck(input as SagCheckRequestDto);
  const t = dto.end === 'rear' ? r.targets.shock : r.targets.fork;
  return AppDataSource.transaction(async (em) => {
    await em.query(`SELECT id FROM rider_bikes WHERE id = $1 FOR UPDATE`, [bike.id]);
    if ((await em.getRepository(RiderBikeSagCheck).countBy({ bikeId: bike.id })) >= MAX_CHECKS_PER_BIKE) {
      throw new AppError('conflict', `A bike keeps up to ${MAX_CHECKS_PER_BIKE} sag checks.`);
    }
    const repo = em.getRepository(RiderBikeSagCheck);
    const saved = await repo.save(
      repo.create({
        bikeId: bike.id,
        end: dto.end,
        readings: { extendedMm: dto.extendedMm, staticMm: dto.staticMm, riderMm: dto.riderMm },
        targets: { staticSagMm: t.staticSagMm, riderSagMm: t.riderSagMm, toleranceMm: t.staticSagToleranceMm },
        result,
      }),
    );
    return toBikeSagCheckDto(saved);
  });
}

/** The bike's sag checks, newest first. */
export async function listSagChecks(user: User, bikeId: string): Promise<BikeSagCheckDto[]> {
  const bike = await ownBike(AppDataSource.manager, user, bikeId);
  const checks = await AppDataSource.getRepository(RiderBikeSagCheck).find({ where: { bikeId: bike.id }, order: { checkedAt: 'DESC', id: 'ASC' } });
  return checks.map(toBikeSagCheckDto);
}

export async function deleteSagCheck(user: User, bikeId: string, checkId: string): Promise<void> {
  const bike = await ownBike(AppDataSource.manager, user, bikeId);
  const result = await AppDataSource.getRepository(RiderBikeSagCheck).delete({ id: checkId, bikeId: bike.id });
  if (!result.affected) throw AppError.notFound('The sag check');
}

import type { BikeDto, BikeSagCheckDto, BikeSpringDto, BikeSummaryDto } from '../../shared/bikes';
import type { RiderBike } from './RiderBike.entity';
import type { RiderBikeSagCheck } from './RiderBikeSagCheck.entity';

export interface BikeExtras {
  springs: Map<string, BikeSpringDto>;
  checkCount: number;
  last: RiderBikeSagCheck | null;
}

const springOf = (extras: BikeExtras, id: string | null) => (id ? (extras.springs.get(id) ?? null) : null);

export function toBikeSummaryDto(b: RiderBike, extras: BikeExtras): BikeSummaryDto {
  return {
    id: b.id,
    nickname: b.nickname,
    fitmentId: b.fitmentId,
    bikeLabel: b.bikeLabel,
    ridingStyle: b.ridingStyle,
    forkSpring: springOf(extras, b.forkSpringId),
    shockSpring: springOf(extras, b.shockSpringId),
    sagCheckCount: extras.checkCount,
    lastCheck: extras.last ? { checkedAt: extras.last.checkedAt.toISOString(), end: extras.last.end, springVerdict: extras.last.result.springVerdict } : null,
    createdAt: b.createdAt.toISOString(),
    updatedAt: b.updatedAt.toISOString(),
  };
}

export function toBikeDto(b: RiderBike, extras: BikeExtras): BikeDto {
  return { ...toBikeSummaryDto(b, extras), load: b.load, cases: b.cases };
}

export function toBikeSagCheckDto(c: RiderBikeSagCheck): BikeSagCheckDto {
  return { id: c.id, checkedAt: c.checkedAt.toISOString(), end: c.end, readings: c.readings, targets: c.targets, result: c.result };
}

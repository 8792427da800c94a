import type { BikeDto } from '@shared/bikes';
import type { LuggageStation, RidingStyle } from '@shared/catalogue/constants';
import type { LoadSetBody, SaveBikeBody } from './api/bikes';
import type { RecommendationRequest } from './api/shop';

/** A load case as the finder keeps it in the rider's plan (masses in kg, luggage by station). */
export interface PlanCase {
  name: string;
  riderKg: number | null;
  gearKg: number | null;
  passengerKg: number | null;
  luggageKg: Partial<Record<LuggageStation, number | null>>;
}

/** The finder's state a saved bike restores. */
export interface BikePlan {
  fitmentId: string;
  ridingStyle: RidingStyle;
  riderKg: number | null;
  gearKg: number | null;
  passengerKg: number | null;
  luggageKg: Partial<Record<LuggageStation, number | null>>;
  chosenForkId: string | null;
  chosenShockId: string | null;
  cases: PlanCase[];
}

const luggageByStation = (l: LoadSetBody['luggage'] | undefined) => Object.fromEntries((l ?? []).map((x) => [x.station, x.massKg])) as Partial<Record<LuggageStation, number>>;

/**
 * The finder's plan for a saved bike, so the finder and the setup sheet reopen with exactly what was saved.
 * @example planFromBike(bike).riderKg // 95
 */
export function planFromBike(bike: Pick<BikeDto, 'fitmentId' | 'ridingStyle' | 'load' | 'cases' | 'forkSpring' | 'shockSpring'>): BikePlan | null {
  if (!bike.fitmentId) return null;
  return {
    fitmentId: bike.fitmentId,
    ridingStyle: bike.ridingStyle,
    riderKg: bike.load.rider.massKg,
    gearKg: bike.load.rider.gearKg,
    passengerKg: bike.load.passengerKg ?? null,
    luggageKg: luggageByStation(bike.load.luggage),
    chosenForkId: bike.forkSpring?.id ?? null,
    chosenShockId: bike.shockSpring?.id ?? null,
    cases: bike.cases.map((c) => ({ name: c.name, riderKg: c.rider.massKg, gearKg: c.rider.gearKg, passengerKg: c.passengerKg ?? null, luggageKg: luggageByStation(c.luggage) })),
  };
}

/**
 * What "Save this bike" sends: the finder's request (the same load-set shape as a recommendation), its cases and the
 * springs chosen, under the rider's nickname.
 */
export function saveBodyFrom(
  nickname: string,
  request: RecommendationRequest,
  cases: (LoadSetBody & { name: string })[],
  chosen: { fork: string | null; shock: string | null },
): SaveBikeBody {
  const { fitmentId, ridingStyle, ...load } = request;
  return {
    nickname,
    fitmentId,
    ridingStyle,
    load,
    ...(cases.length ? { cases } : {}),
    ...(chosen.fork ? { forkSpringId: chosen.fork } : {}),
    ...(chosen.shock ? { shockSpringId: chosen.shock } : {}),
  };
}

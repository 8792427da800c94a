import type { ForkSpringInput, Load, RearSpringInput } from './types';

/**
 * The worked rear-spring request used across the engine, DTO and API tests and in the API docs: an 80 kg rider
 * at 900 mm and a 12 kg top case behind the rear axle of a 1500 mm wheelbase.
 * @example computeRearSpring(rearSpringExample()).rearLoadN // 608.0123
 */
export function rearSpringExample(): RearSpringInput & { loads: Load[]; cases?: undefined } {
  return {
    wheelbaseMm: 1500,
    sprungMassKg: 95,
    loads: [
      { massKg: 80, positionMm: 900 },
      { massKg: 12, positionMm: 1750 },
    ],
    leverageRatio: 2.1,
    wheelTravelMm: 200,
    shockStrokeMm: 95,
    targets: { staticSagMm: 25, riderSagMm: 66 },
    preloadRangeMm: { min: 2, max: 20 },
    adjusterPitchMm: 1.0,
    springs: [{ id: 'R-58', rateNPerMm: 58, freeLengthMm: 229, solidLengthMm: 110 }],
  };
}

/** A fork-spring request of the same shape: an 80 kg rider on a 25° fork with two springs. */
export function forkSpringExample(): ForkSpringInput & { loads: Load[]; cases?: undefined } {
  return {
    wheelbaseMm: 1500,
    sprungMassKg: 110,
    loads: [{ massKg: 80, positionMm: 900 }],
    forkAngleDeg: 25,
    forkTravelMm: 120,
    targets: { staticSagMm: 25, riderSagMm: 35 },
    preloadRangeMm: { min: 0, max: 15 },
    springs: [{ id: 'F-9', rateNPerMm: 9, freeLengthMm: 300 }],
  };
}

import fc from 'fast-check';
import { computeForkSpring } from './fork';
import { computeRearSpring } from './rear';
import { EngineInputError } from './errors';
import type { ForkSpringInput, ForkSpringResult, LeverageRatioInput, Load, RearSpringInput, RearSpringResult } from './types';

// Random bikes for the engine's property tests only (imported by specs, never by the product).

const ratio = fc.double({ min: 1.6, max: 3.4, noNaN: true });

/** A constant ratio, or a curve of 2–6 points that mostly falls with travel (rising-rate linkages) and may rise a little. */
const leverage = (travelMm: number): fc.Arbitrary<LeverageRatioInput> =>
  fc.oneof(
    ratio,
    fc
      .record({ start: ratio, steps: fc.array(fc.double({ min: -0.2, max: 0.06, noNaN: true }), { minLength: 1, maxLength: 5 }) })
      .map(({ start, steps }) => {
        let r = start;
        return [start, ...steps.map((d) => (r = Math.max(1.1, r + d)))].map((x, i) => ({ wheelTravelMm: (i * travelMm) / steps.length, ratio: x }));
      }),
  );

const common = {
  wheelbaseMm: fc.double({ min: 1300, max: 1650, noNaN: true }),
  riderKg: fc.double({ min: 55, max: 140, noNaN: true }),
  riderShare: fc.double({ min: 0.5, max: 0.75, noNaN: true }),
  riderFrac: fc.double({ min: 0.18, max: 0.35, noNaN: true }),
  staticFrac: fc.double({ min: 0.1, max: 0.6, noNaN: true }),
  preloadMin: fc.double({ min: 0, max: 6, noNaN: true }),
  preloadSpan: fc.double({ min: 3, max: 30, noNaN: true }),
  toleranceMm: fc.double({ min: 1, max: 8, noNaN: true }),
  rateFactors: fc.array(fc.double({ min: 0.6, max: 1.6, noNaN: true }), { minLength: 1, maxLength: 8 }),
};

export type RearBike = RearSpringInput & { loads: Load[]; cases?: undefined };
export type ForkBike = ForkSpringInput & { loads: Load[]; cases?: undefined };

/** A rear end with candidates around its required rate, and its answer; null when the curve cannot meet both targets. */
export const rearBike: fc.Arbitrary<{ input: RearBike; result: RearSpringResult } | null> = fc
  .record({
    ...common,
    travelMm: fc.double({ min: 100, max: 300, noNaN: true }),
    sprungMassKg: fc.double({ min: 50, max: 150, noNaN: true }),
    shockCount: fc.constantFrom(1, 2),
  })
  .chain((b) => leverage(b.travelMm).map((leverageRatio) => ({ ...b, leverageRatio })))
  .map((b) => {
    const riderSagMm = b.travelMm * b.riderFrac;
    const input: RearBike = {
      wheelbaseMm: b.wheelbaseMm,
      sprungMassKg: b.sprungMassKg,
      loads: [{ massKg: b.riderKg, positionMm: b.wheelbaseMm * b.riderShare }],
      leverageRatio: b.leverageRatio,
      wheelTravelMm: b.travelMm,
      shockStrokeMm: b.travelMm / 2,
      targets: { staticSagMm: riderSagMm * b.staticFrac, riderSagMm },
      preloadRangeMm: { min: b.preloadMin, max: b.preloadMin + b.preloadSpan },
      adjusterPitchMm: 1,
      shockCount: b.shockCount,
      staticSagToleranceMm: b.toleranceMm,
    };
    try {
      const required = computeRearSpring(input).requiredRate.nPerMm;
      input.springs = b.rateFactors.map((f, i) => ({ id: `S${i}`, rateNPerMm: required * f, freeLengthMm: 200 }));
      return { input, result: computeRearSpring(input) };
    } catch (e) {
      if (e instanceof EngineInputError && e.field === 'leverageRatio') return null;
      throw e;
    }
  });

/** A fork with candidates around its required rate, and its answer. */
export const forkBike: fc.Arbitrary<{ input: ForkBike; result: ForkSpringResult }> = fc
  .record({
    ...common,
    travelMm: fc.double({ min: 100, max: 260, noNaN: true }),
    sprungMassKg: fc.double({ min: 40, max: 130, noNaN: true }),
    forkAngleDeg: fc.double({ min: 18, max: 32, noNaN: true }),
    springCount: fc.constantFrom(1, 2),
  })
  .map((b) => {
    const riderSagMm = b.travelMm * b.riderFrac;
    const input: ForkBike = {
      wheelbaseMm: b.wheelbaseMm,
      sprungMassKg: b.sprungMassKg,
      loads: [{ massKg: b.riderKg, positionMm: b.wheelbaseMm * b.riderShare }],
      forkAngleDeg: b.forkAngleDeg,
      springCount: b.springCount,
      forkTravelMm: b.travelMm,
      targets: { staticSagMm: riderSagMm * b.staticFrac, riderSagMm },
      preloadRangeMm: { min: b.preloadMin, max: b.preloadMin + b.preloadSpan },
      adjusterPitchMm: 1,
      staticSagToleranceMm: b.toleranceMm,
    };
    const required = computeForkSpring(input).requiredRate.nPerMm;
    input.springs = b.rateFactors.map((f, i) => ({ id: `F${i}`, rateNPerMm: required * f, freeLengthMm: 300 }));
    return { input, result: computeForkSpring(input) };
  });

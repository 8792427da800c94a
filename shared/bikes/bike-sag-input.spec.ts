import { describe, expect, it } from 'vitest';
import { checkSag } from '../engine';
import { bikeLabel, sagCheckInputForBike, type SagLoadContext } from './bike-sag-input';

// Invented demo figures (typical of a mid-size bike, from memory).
const bike = {
  rearLeverageRatio: 2.5,
  rearLeverageCurve: null,
  rearAdjusterPitchMm: 1.5,
  shockCount: 1,
  forkAngleDeg: 26,
  forkAdjusterPitchMm: 1,
  forkSpringCount: 2,
};
const load: SagLoadContext = {
  targets: { fork: { staticSagMm: 25, riderSagMm: 60, staticSagToleranceMm: 3 }, shock: { staticSagMm: 20, riderSagMm: 55, staticSagToleranceMm: 4 } },
  fork: { bikeLoadN: 1100, frontLoadN: 1500 },
  shock: { bikeLoadN: 1000, rearLoadN: 1700 },
};

describe('the sag check of a saved bike', () => {
  it('takes the rear targets, tolerance, ratio, pitch and wheel loads for the rear', () => {
    expect(sagCheckInputForBike(bike, load, { end: 'rear', extendedMm: 600, staticMm: 580, riderMm: 545 })).toEqual({
      end: 'rear',
      extendedMm: 600,
      staticMm: 580,
      riderMm: 545,
      targets: { staticSagMm: 20, riderSagMm: 55 },
      toleranceMm: 4,
      leverageRatio: 2.5,
      adjusterPitchMm: 1.5,
      shockCount: 1,
      bikeLoadN: 1000,
      riderLoadN: 1700,
    });
  });

  it('a leverage curve wins over a single ratio, so a curved linkage is checked on its curve', () => {
    const curve = [
      { wheelTravelMm: 0, ratio: 2.8 },
      { wheelTravelMm: 200, ratio: 2.2 },
    ];
    const input = sagCheckInputForBike({ ...bike, rearLeverageRatio: null, rearLeverageCurve: curve }, load, { end: 'rear', extendedMm: 600, staticMm: 580, riderMm: 545 });
    expect(input.leverageRatio).toEqual(curve);
  });

  it('takes the fork’s angle, spring count and loads for the front, and the sags are extended less loaded (common practice)', () => {
    const input = sagCheckInputForBike(bike, load, { end: 'front', extendedMm: 800, staticMm: { down: 772, up: 778 }, riderMm: 740 });
    expect(input).toMatchObject({ end: 'front', forkAngleDeg: 26, springCount: 2, adjusterPitchMm: 1, toleranceMm: 3, targets: { staticSagMm: 25, riderSagMm: 60 }, bikeLoadN: 1100, riderLoadN: 1500 });
    const r = checkSag(input);
    // Push-down 772 and let-up 778 average to 775: 800 − 775 = 25 mm static; 800 − 740 = 60 mm rider sag, both on target.
    expect(r.staticSagMm).toBeCloseTo(25, 9);
    expect(r.riderSagMm).toBeCloseTo(60, 9);
    expect(r.preloadChangeMm).toBe(0);
  });

  it('a fork without an adjuster sends no pitch', () => {
    expect('adjusterPitchMm' in sagCheckInputForBike({ ...bike, forkAdjusterPitchMm: null }, load, { end: 'front', extendedMm: 800, staticMm: 775, riderMm: 740 })).toBe(false);
  });

  it('names a bike by make, model, variant and years', () => {
    expect(bikeLabel({ make: 'Demo', model: 'Tourer 700', variant: 'S', yearFrom: 2019, yearTo: 2023 })).toBe('Demo Tourer 700 S (2019–2023)');
    expect(bikeLabel({ make: 'Demo', model: 'Tourer 700', variant: '', yearFrom: 2019, yearTo: 2023 })).toBe('Demo Tourer 700 (2019–2023)');
  });
});

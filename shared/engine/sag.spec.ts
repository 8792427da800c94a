import { describe, expect, it } from 'vitest';
import { createLeverageCurve, shockTravelAt } from './leverage';
import { averageReading, checkSag } from './sag';
import type { SagCheckInput } from './types';

const rear: SagCheckInput = {
  end: 'rear',
  extendedMm: 600,
  staticMm: 575,
  riderMm: { down: 526, up: 532 },
  targets: { staticSagMm: 25, riderSagMm: 66 },
  leverageRatio: 2,
  adjusterPitchMm: 1,
};

describe('sag check after fitting', () => {
  it('averages a push-down/let-up pair to cancel friction', () => {
    expect(averageReading({ down: 526, up: 532 })).toBe(529);
    expect(averageReading(575)).toBe(575);
  });

  it('when rider sag is too deep at the rear, advises adding (sag − target)/LR of preload', () => {
    const r = checkSag(rear);
    expect(r.staticSagMm).toBe(25);
    expect(r.riderSagMm).toBe(71);
    expect(r.preloadChangeMm).toBeCloseTo(2.5, 12);
    expect(r.adjusterTurns).toBeCloseTo(2.5, 12);
    expect(r.predictedStaticSagMm).toBeCloseTo(25 - 2 * 2.5, 12);
    expect(r.springVerdict).toBe('too-soft');
    expect(r.advice).toMatch(/^Add 2\.5 mm of preload \(about 2\.5 turns of the adjuster\)/);
    expect(r.advice).toMatch(/too soft/);
  });

  it('when rider sag is too shallow, advises removing preload', () => {
    const r = checkSag({ ...rear, staticMm: 570, riderMm: 540 });
    expect(r.riderSagMm).toBe(60);
    expect(r.preloadChangeMm).toBeCloseTo(-3, 12);
    expect(r.predictedStaticSagMm).toBeCloseTo(30 + 6, 12);
    expect(r.advice).toMatch(/^Remove 3 mm of preload \(about 3 turns of the adjuster\)/);
  });

  it('when rider sag is within tolerance and static sag is right, advises no change', () => {
    const r = checkSag({ ...rear, riderMm: 535 });
    expect(r.preloadChangeMm).toBe(0);
    expect(r.adjusterTurns).toBe(0);
    expect(r.springVerdict).toBe('ok');
    expect(r.advice).toMatch(/no change is needed/);
  });

  it('calls the spring too stiff when static sag after the change stays above target + tolerance', () => {
    const r = checkSag({ ...rear, staticMm: 560, riderMm: 534, toleranceMm: 2 });
    expect(r.staticSagMm).toBe(40);
    expect(r.riderSagMm).toBe(66);
    expect(r.springVerdict).toBe('too-stiff');
    expect(r.advice).toMatch(/too stiff/);
  });

  it('at the rear, implies a rate of LR²·W/(rider sag − static sag) from the rider’s wheel load', () => {
    const r = checkSag({ ...rear, riderLoadN: 800 });
    expect(r.impliedRateNPerMm).toBeCloseTo((4 * 800) / (71 - 25), 9);
  });

  it('with a leverage curve, converts the sag error through the curve’s own shock travel', () => {
    const curve = [
      { wheelTravelMm: 0, ratio: 2.5 },
      { wheelTravelMm: 200, ratio: 1.9 },
    ];
    const r = checkSag({ ...rear, leverageRatio: curve });
    const c = createLeverageCurve(curve);
    expect(r.preloadChangeMm).toBeCloseTo(shockTravelAt(c, 71) - shockTravelAt(c, 66), 12);
    expect(shockTravelAt(c, r.predictedStaticSagMm)).toBeCloseTo(shockTravelAt(c, 25) - r.preloadChangeMm, 9);
  });

  it('at the fork, the preload change equals the sag error and the implied rate is cos θ·W/(n·Δsag)', () => {
    const r = checkSag({
      end: 'front',
      extendedMm: 700,
      staticMm: 670,
      riderMm: 658,
      targets: { staticSagMm: 28, riderSagMm: 38 },
      forkAngleDeg: 25,
      riderLoadN: 300,
    });
    expect(r.riderSagMm).toBe(42);
    expect(r.preloadChangeMm).toBe(4);
    expect(r.predictedStaticSagMm).toBe(26);
    expect(r).not.toHaveProperty('adjusterTurns');
    expect(r.impliedRateNPerMm).toBeCloseTo((Math.cos((25 * Math.PI) / 180) * 300) / (2 * 12), 9);
    expect(r.advice).toBe('Add 4 mm of preload to bring rider sag from 42 mm to the 38 mm target.');
  });

  it('refuses a rear check without a leverage ratio', () => {
    const { leverageRatio: _lr, ...rest } = rear;
    expect(() => checkSag(rest)).toThrow(RangeError);
  });
});

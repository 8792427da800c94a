import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { createLeverageCurve, shockTravelAt, solveShockEquilibrium } from './leverage';
import { unit } from 'mathjs';
import { formatLength } from '../length-format';
import { averageReading, checkSag, sagAdviceText } from './sag';
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

  it('an lb rider reads the same advice with each length in inches first (shared/length-format), the mm beside them as the sentence gives them', () => {
    const { advice, ...r } = checkSag(rear);
    expect(sagAdviceText(r, rear.targets, 3)).toBe(advice);
    const inches = sagAdviceText(r, rear.targets, 3, (mm) => formatLength(mm, 'imperial'));
    // 2.5 mm of preload is 0.098 in (mathjs; 1 in = 25.4 mm exactly), shown as 0.1 in.
    expect(inches).toMatch(new RegExp(`^Add ${Number(unit(2.5, 'mm').toNumber('in').toFixed(2))}\u202fin \\(2\\.5\u202fmm\\) of preload`));
    expect(inches.replace(/[\d.]+\u202fin \(([\d.]+)\u202fmm\)/g, '$1 mm')).toBe(advice);
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
    expect(shockTravelAt(c, r.predictedStaticSagMm ?? NaN)).toBeCloseTo(shockTravelAt(c, 25) - r.preloadChangeMm, 9);
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

describe('sag check on a leverage curve with the wheel loads', () => {
  const points = [
    { wheelTravelMm: 0, ratio: 3.3 },
    { wheelTravelMm: 150, ratio: 3.0 },
    { wheelTravelMm: 300, ratio: 2.6 },
  ];
  const curve = createLeverageCurve(points);

  it('gives back the fitted spring’s rate and preload from readings made by the rear equilibrium, and its advice lands rider sag on target (property; consistency with the statics k·(p + y(s)) = LR(s)·F, within 0.5 % and 0.5 mm)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 15, max: 60, noNaN: true }),
        fc.double({ min: 0, max: 25, noNaN: true }),
        fc.double({ min: 400, max: 1200, noNaN: true }),
        fc.double({ min: 300, max: 1200, noNaN: true }),
        fc.double({ min: 60, max: 120, noNaN: true }),
        (k, p, bikeLoadN, riderLoadN, riderTarget) => {
          const solve = (F: number, preloadMm: number) => solveShockEquilibrium(curve, { rateNPerMm: k, preloadMm, wheelForceN: F, wheelTravelMm: 300 });
          const ss = solve(bikeLoadN, p);
          const sr = solve(bikeLoadN + riderLoadN, p);
          fc.pre(ss > 0.5 && sr > ss + 1 && sr < 290);
          const r = checkSag({
            end: 'rear',
            extendedMm: 900,
            staticMm: 900 - ss,
            riderMm: 900 - sr,
            targets: { staticSagMm: 30, riderSagMm: riderTarget },
            leverageRatio: points,
            adjusterPitchMm: 1,
            bikeLoadN,
            riderLoadN,
          });
          expect(r.approximate).toBe(false);
          expect(Math.abs((r.impliedRateNPerMm ?? NaN) / k - 1)).toBeLessThan(0.005);
          if (p > 1) expect(Math.abs((r.impliedPreloadMm ?? NaN) / p - 1)).toBeLessThan(0.005);
          const after = solve(bikeLoadN + riderLoadN, p + r.preloadChangeMm);
          const aimed = r.preloadChangeMm === 0 ? sr : riderTarget;
          if (p + r.preloadChangeMm >= 0 && r.springReason !== 'does-not-settle') expect(Math.abs(after - aimed)).toBeLessThan(0.5);
        },
      ),
      { numRuns: 300 },
    );
  });

  it('with a constant ratio, implies LR²·W/(rider − static sag) from the same full formula', () => {
    const r = checkSag({ ...rear, bikeLoadN: 900, riderLoadN: 800 });
    expect(r.impliedRateNPerMm).toBeCloseTo((4 * 800) / (71 - 25), 9);
    expect(r.approximate).toBe(false);
  });

  it('without the loads on a curve, says the answer is approximate and asks for a re-measure', () => {
    const r = checkSag({ ...rear, leverageRatio: points });
    expect(r.approximate).toBe(true);
    expect(r.advice).toMatch(/measure the sag again after the change/);
    expect(checkSag(rear).approximate).toBe(false);
  });

  it('with twin shocks, implies the rate of each spring', () => {
    const one = checkSag({ ...rear, bikeLoadN: 900, riderLoadN: 800 });
    const two = checkSag({ ...rear, bikeLoadN: 900, riderLoadN: 800, shockCount: 2 });
    expect(two.impliedRateNPerMm).toBeCloseTo((one.impliedRateNPerMm ?? NaN) / 2, 9);
  });
});

describe('sag check on a bike topped out on its own weight', () => {
  it('warns instead of judging the spring from a static sag of 0', () => {
    const r = checkSag({ ...rear, staticMm: 600, bikeLoadN: 900, riderLoadN: 800 });
    expect(r.staticSagMm).toBe(0);
    expect(r.springVerdict).toBe('unknown');
    expect(r).not.toHaveProperty('predictedStaticSagMm');
    expect(r.warning).toMatch(/topped out/);
    expect(r.advice).toMatch(/topped out/);
  });
});

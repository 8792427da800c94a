import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  createLeverageCurve,
  leverageRatioAt,
  meanLeverageRatio,
  shockTravelAt,
  solveShockEquilibrium,
  wheelTravelAtShockTravel,
} from './leverage';
import { bisectRoot, brentRoot } from './solve';

/** Composite Simpson's rule, as an independent check of the closed-form integral. */
function simpson(f: (x: number) => number, a: number, b: number, n = 2000): number {
  const h = (b - a) / n;
  let sum = f(a) + f(b);
  for (let i = 1; i < n; i++) sum += f(a + i * h) * (i % 2 === 1 ? 4 : 2);
  return (sum * h) / 3;
}

const progressive = createLeverageCurve([
  { wheelTravelMm: 0, ratio: 2.5 },
  { wheelTravelMm: 60, ratio: 2.3 },
  { wheelTravelMm: 140, ratio: 2.05 },
  { wheelTravelMm: 200, ratio: 1.9 },
]);

describe('leverage curve', () => {
  it('interpolates linearly between points and holds the end values beyond them', () => {
    expect(leverageRatioAt(progressive, 30)).toBeCloseTo(2.4, 12);
    expect(leverageRatioAt(progressive, -10)).toBe(2.5);
    expect(leverageRatioAt(progressive, 250)).toBe(1.9);
    const late = createLeverageCurve([{ wheelTravelMm: 50, ratio: 2 }, { wheelTravelMm: 100, ratio: 3 }]);
    expect(leverageRatioAt(late, 10)).toBe(2);
    expect(shockTravelAt(late, 50)).toBeCloseTo(25, 12);
  });

  it('integrates shock travel exactly per segment: matches Simpson’s rule on 1/LR to 1e-9 mm', () => {
    for (const s of [0, 17, 60, 99.5, 140, 199, 200, 230]) {
      // Simpson per segment, since 1/LR has kinks at the knots.
      const cuts = [0, ...progressive.wheelTravelMm.filter((x) => x > 0 && x < s), s];
      let numeric = 0;
      for (let i = 0; i + 1 < cuts.length; i++) {
        numeric += simpson((x) => 1 / leverageRatioAt(progressive, x), cuts[i] as number, cuts[i + 1] as number);
      }
      expect(Math.abs(shockTravelAt(progressive, s) - numeric)).toBeLessThan(1e-9);
    }
  });

  it('gives y = s / LR for a constant ratio', () => {
    const c = createLeverageCurve(2.1);
    expect(shockTravelAt(c, 63)).toBeCloseTo(30, 12);
    expect(meanLeverageRatio(c, 10, 80)).toBeCloseTo(2.1, 12);
    expect(c.flat).toBe(true);
  });

  it('inverts shock travel back to wheel travel', () => {
    fc.assert(
      fc.property(fc.double({ min: -20, max: 260, noNaN: true }), (s) => {
        const y = shockTravelAt(progressive, s);
        expect(Math.abs(wheelTravelAtShockTravel(progressive, y) - s)).toBeLessThan(1e-9);
      }),
    );
  });

  it('refuses an empty curve, a non-positive ratio and wheel travel that does not increase', () => {
    expect(() => createLeverageCurve([])).toThrow(RangeError);
    expect(() => createLeverageCurve(0)).toThrow(RangeError);
    expect(() => createLeverageCurve([{ wheelTravelMm: 0, ratio: 2 }, { wheelTravelMm: 0, ratio: 2.1 }])).toThrow(RangeError);
  });
});

describe('rear equilibrium solver', () => {
  it('keeps the wheel topped out when preload alone holds the load', () => {
    const c = createLeverageCurve(2);
    // k·p = 60·40 = 2400 N at the shock ≥ LR·F = 2·1000.
    expect(solveShockEquilibrium(c, { rateNPerMm: 60, preloadMm: 40, wheelForceN: 1000, wheelTravelMm: 200 })).toBe(0);
  });

  it('bottoms at full travel when no position balances the load', () => {
    const c = createLeverageCurve(2);
    expect(solveShockEquilibrium(c, { rateNPerMm: 5, preloadMm: 0, wheelForceN: 5000, wheelTravelMm: 200 })).toBe(200);
  });

  it('balances spring force and wheel force through the ratio on a progressive curve (to 1e-6 N)', () => {
    const k = 58;
    const p = 8;
    const F = 1800;
    const s = solveShockEquilibrium(progressive, { rateNPerMm: k, preloadMm: p, wheelForceN: F, wheelTravelMm: 200 });
    expect(s).toBeGreaterThan(0);
    expect(s).toBeLessThan(200);
    expect(Math.abs(k * (p + shockTravelAt(progressive, s)) - leverageRatioAt(progressive, s) * F)).toBeLessThan(1e-6);
  });

  it('stops at the first balance point on a rising-ratio curve with two crossings', () => {
    // Steep rising ratio: the imbalance rises then falls inside the segment, so there are two roots.
    const c = createLeverageCurve([{ wheelTravelMm: 0, ratio: 1 }, { wheelTravelMm: 100, ratio: 11 }]);
    const input = { rateNPerMm: 100, preloadMm: 1, wheelForceN: 300, wheelTravelMm: 100 };
    const s = solveShockEquilibrium(c, input);
    const f = (x: number): number => input.rateNPerMm * (input.preloadMm + shockTravelAt(c, x)) - leverageRatioAt(c, x) * input.wheelForceN;
    expect(Math.abs(f(s))).toBeLessThan(1e-6);
    for (let x = 0; x < s - 1e-6; x += s / 50) expect(f(x)).toBeLessThan(0);
    expect(f(100)).toBeLessThan(0); // the second crossing exists, and is not the answer
    expect(s).toBeLessThan(23);
  });

  it('agrees with the constant-ratio closed form s = LR²F/k − LR·p when the curve is flat (property, 1e-6 mm)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1.2, max: 3.5, noNaN: true }),
        fc.double({ min: 20, max: 200, noNaN: true }),
        fc.double({ min: 0, max: 25, noNaN: true }),
        fc.double({ min: 300, max: 4000, noNaN: true }),
        fc.integer({ min: 1, max: 9 }),
        (lr, k, p, F, n) => {
          const points = Array.from({ length: n }, (_, i) => ({ wheelTravelMm: i * 25, ratio: lr }));
          const curve = createLeverageCurve(points);
          const closed = Math.min(200, Math.max(0, (lr * lr * F) / k - lr * p));
          const solved = solveShockEquilibrium(curve, { rateNPerMm: k, preloadMm: p, wheelForceN: F, wheelTravelMm: 200 });
          expect(Math.abs(solved - closed)).toBeLessThan(1e-6);
        },
      ),
    );
  });
});

describe('root finders', () => {
  it('find √2 with Brent’s method and by bisection', () => {
    expect(brentRoot((x) => x * x - 2, 0, 2)).toBeCloseTo(Math.SQRT2, 9);
    expect(bisectRoot((x) => x * x - 2, 0, 2)).toBeCloseTo(Math.SQRT2, 8);
  });

  it('refuse an interval that does not bracket a root', () => {
    expect(() => brentRoot((x) => x * x + 1, -1, 1)).toThrow(RangeError);
    expect(() => bisectRoot((x) => x * x + 1, -1, 1)).toThrow(RangeError);
  });
});

import { describe, expect, it } from 'vitest';
import { computeForkSpring } from './fork';
import { adjusterTurnsFromFullyOut, bandPreloadRange, forkSpacerLength, springPreload } from './preload';
import { computeRearSpring } from './rear';
import { rearSpringExample } from './examples';

// Facts of the trade (common practice, no published source): the adjuster sets the spring's installed length, so
// preload = free length − installed length, and the turns are counted from the adjuster's fully-out position.

describe('preload from the spring’s free length', () => {
  const window = { adjusterInstalledLengthMm: { min: 154, max: 168 } };

  it('a 180 mm spring in a window set for a 170 mm stock spring runs 10 mm more preload', () => {
    expect(springPreload(window, 170).range).toEqual({ min: 2, max: 16 });
    expect(springPreload(window, 180).range).toEqual({ min: 12, max: 26 });
    expect(springPreload(window, 180).fullyOutMm).toBe(12);
  });

  it('a spring shorter than the window cannot take negative preload, and its turns still count from fully out', () => {
    const p = springPreload(window, 160);
    expect(p.range).toEqual({ min: 0, max: 6 });
    expect(adjusterTurnsFromFullyOut(0, p.fullyOutMm, 1.5)).toBeCloseTo(8 / 1.5, 12);
  });

  it('counts turns from the range minimum when a fixed range is given', () => {
    expect(springPreload({ preloadRangeMm: { min: 2, max: 20 } }, 229).fullyOutMm).toBe(2);
    expect(adjusterTurnsFromFullyOut(10, 2, 1)).toBe(8);
  });

  it('works the band out only for a named free length when the range follows the free length', () => {
    expect(bandPreloadRange(window)).toBeUndefined();
    expect(bandPreloadRange(window, 170)).toEqual({ min: 2, max: 16 });
    expect(bandPreloadRange({ preloadRangeMm: { min: 1, max: 9 } })).toEqual({ min: 1, max: 9 });
  });

  it('in a rear calculation each spring is judged with its own range, and the band needs bandFreeLengthMm', () => {
    const { preloadRangeMm: _r, ...rest } = rearSpringExample();
    const input = {
      ...rest,
      adjusterInstalledLengthMm: { min: 209, max: 227 },
      springs: [
        { id: 'stock-length', rateNPerMm: 65, freeLengthMm: 229 },
        { id: 'ten-longer', rateNPerMm: 65, freeLengthMm: 239 },
      ],
    };
    const r = computeRearSpring(input);
    const [a, b] = ['stock-length', 'ten-longer'].map((id) => r.candidates.find((c) => c.id === id));
    expect(a?.preloadRangeMm).toEqual({ min: 2, max: 20 });
    expect(b?.preloadRangeMm).toEqual({ min: 12, max: 30 });
    expect(a?.preloadMm).toBe(b?.preloadMm);
    expect((a?.adjusterTurns ?? NaN) - (b?.adjusterTurns ?? NaN)).toBeCloseTo(10, 9);
    expect(r).not.toHaveProperty('rateBand');
    expect(computeRearSpring({ ...input, bandFreeLengthMm: 229 }).rateBand).toEqual(computeRearSpring(rearSpringExample()).rateBand);
  });
});

describe('fork spacer for a fork without an adjuster', () => {
  it('is stock spacer + (stock free − new free) + (new preload − stock preload)', () => {
    expect(forkSpacerLength({ stockSpacerMm: 100, stockFreeLengthMm: 300, stockPreloadMm: 10 }, 290, 15)).toBe(115);
  });

  it('is given per candidate when the stock spacer is known and there is no adjuster', () => {
    const r = computeForkSpring({
      wheelbaseMm: 1500,
      sprungMassKg: 80,
      loads: [{ massKg: 90, positionMm: 850 }],
      forkAngleDeg: 25,
      forkTravelMm: 130,
      targets: { staticSagMm: 25, riderSagMm: 40 },
      preloadRangeMm: { min: 0, max: 30 },
      spacer: { stockSpacerMm: 120, stockFreeLengthMm: 300, stockPreloadMm: 12 },
      springs: [{ id: 'F', rateNPerMm: 8, freeLengthMm: 290 }],
    });
    const c = r.candidates[0];
    expect(c).not.toHaveProperty('adjusterTurns');
    expect(c?.spacerLengthMm).toBeCloseTo(120 + 10 + ((c?.preloadMm ?? NaN) - 12), 9);
  });
});

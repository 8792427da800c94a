import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { curveRateBand, linearRateBand } from './band';
import { computeForkSpring } from './fork';
import { createLeverageCurve } from './leverage';
import { computeRearSpring } from './rear';
import { forkBike, rearBike } from './test-arbitraries';
import type { RateBand, SpringCandidateResult } from './types';

const within = (actual: number, expected: number, share: number) => expect(Math.abs(actual / expected - 1)).toBeLessThanOrEqual(share);

describe('rate band against the closed form', () => {
  // A wide preload range leaves the static-sag tolerance as the binding bound at both ends.
  const rear = {
    wheelbaseMm: 1500,
    sprungMassKg: 95,
    loads: [{ massKg: 90, positionMm: 850 }],
    leverageRatio: 2.4,
    wheelTravelMm: 150,
    shockStrokeMm: 62.5,
    targets: { staticSagMm: 12, riderSagMm: 40 },
    preloadRangeMm: { min: 0, max: 60 },
    adjusterPitchMm: 1,
    staticSagToleranceMm: 3,
  };

  it('at the rear with a constant ratio, the ends are where rider − static sag = LR²·W/k, static at target ± tolerance (statics of a linear spring behind a constant lever, within 0.1 %)', () => {
    const r = computeRearSpring(rear);
    const W = r.rearLoadN;
    within(r.rateBand?.min.nPerMm ?? NaN, (2.4 ** 2 * W) / (40 - (12 - 3)), 0.001);
    within(r.rateBand?.max.nPerMm ?? NaN, (2.4 ** 2 * W) / (40 - (12 + 3)), 0.001);
  });

  it('with twin shocks each spring’s band is half the single shock’s', () => {
    const one = computeRearSpring(rear).rateBand;
    const two = computeRearSpring({ ...rear, shockCount: 2 }).rateBand;
    within(two?.min.nPerMm ?? NaN, (one?.min.nPerMm ?? NaN) / 2, 1e-12);
    within(two?.max.nPerMm ?? NaN, (one?.max.nPerMm ?? NaN) / 2, 1e-12);
    within(computeRearSpring({ ...rear, shockCount: 2 }).requiredRate.nPerMm, computeRearSpring(rear).requiredRate.nPerMm / 2, 1e-12);
  });

  it('at the fork, the ends are where rider − static sag = cos θ·W/(n·k) along the tubes (within 0.1 %)', () => {
    const fork = { ...rear, sprungMassKg: 80, forkAngleDeg: 25, springCount: 2, forkTravelMm: 130, targets: { staticSagMm: 25, riderSagMm: 46 } };
    const r = computeForkSpring(fork);
    const cW = Math.cos((25 * Math.PI) / 180) * r.frontLoadN;
    within(r.rateBand?.min.nPerMm ?? NaN, cW / (2 * (46 - (25 - 3))), 0.001);
    within(r.rateBand?.max.nPerMm ?? NaN, cW / (2 * (46 - (25 + 3))), 0.001);
  });

  it('bisection on a flat curve finds the same band as the closed form (within 0.1 %)', () => {
    const conditions = { bikeLoadN: 930, totalLoadN: 1500, targets: { staticSagMm: 20, riderSagMm: 55 }, preloadRangeMm: { min: 2, max: 18 }, staticSagToleranceMm: 4 };
    const closed = linearRateBand(2.1 ** 2, 2.1, conditions);
    const searched = curveRateBand(createLeverageCurve([{ wheelTravelMm: 0, ratio: 2.1 }, { wheelTravelMm: 200, ratio: 2.1 }]), 200, conditions);
    within(searched?.min ?? NaN, closed?.min ?? NaN, 0.001);
    within(searched?.max ?? NaN, closed?.max ?? NaN, 0.001);
  });

  it('leaves the band out when no rate meets both the preload range and the static-sag tolerance', () => {
    expect(computeRearSpring({ ...rear, preloadRangeMm: { min: 0, max: 1 } })).not.toHaveProperty('rateBand');
  });
});

/** Candidates at random rates inside the band and just outside each end. */
function probes(band: RateBand, u: number) {
  const lo = band.min.nPerMm;
  const hi = band.max.nPerMm;
  return [
    { id: 'inside', rateNPerMm: lo + (0.001 + 0.998 * u) * (hi - lo), freeLengthMm: 250 },
    { id: 'below', rateNPerMm: lo * (1 - 1e-4), freeLengthMm: 250 },
    { id: 'above', rateNPerMm: hi * (1 + 1e-4), freeLengthMm: 250 },
  ];
}
const verdicts = (cs: SpringCandidateResult[]) => Object.fromEntries(cs.map((c) => [c.id, c.verdict]));

describe('rate band and the spring rule agree (property, fast-check)', () => {
  it('at the rear: a rate inside the band is ok and one just outside either end is not', () => {
    fc.assert(
      fc.property(rearBike, fc.double({ min: 0, max: 1, noNaN: true }), (bike, u) => {
        fc.pre(bike?.result.rateBand !== undefined);
        const band = bike?.result.rateBand;
        if (!bike || !band) return;
        const v = verdicts(computeRearSpring({ ...bike.input, springs: probes(band, u) }).candidates);
        expect(v).toMatchObject({ inside: 'ok' });
        expect(v.below).not.toBe('ok');
        expect(v.above).not.toBe('ok');
      }),
      { numRuns: 300 },
    );
  });

  it('at the fork likewise', () => {
    fc.assert(
      fc.property(forkBike, fc.double({ min: 0, max: 1, noNaN: true }), (bike, u) => {
        fc.pre(bike.result.rateBand !== undefined);
        const band = bike.result.rateBand;
        if (!band) return;
        const v = verdicts(computeForkSpring({ ...bike.input, springs: probes(band, u) }).candidates);
        expect(v).toMatchObject({ inside: 'ok' });
        expect(v.below).not.toBe('ok');
        expect(v.above).not.toBe('ok');
      }),
      { numRuns: 300 },
    );
  });

  it('when no band exists, no candidate is ok', () => {
    fc.assert(
      fc.property(rearBike, (bike) => {
        fc.pre(bike !== null && bike.result.rateBand === undefined);
        for (const c of bike?.result.candidates ?? []) expect(c.verdict).not.toBe('ok');
      }),
      { numRuns: 200 },
    );
  });
});

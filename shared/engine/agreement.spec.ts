import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { checkSag } from './sag';
import { forkBike, rearBike } from './test-arbitraries';
import type { SagCheckInput, SpringCandidateResult } from './types';

// The finder and the sag check share one verdict (judgeSpring): a spring fitted and measured exactly as the finder
// predicts must get the same word back. Consistency checks of the engine with itself, over random bikes.

const extendedMm = 600;
const readings = (c: SpringCandidateResult) => ({ extendedMm, staticMm: extendedMm - c.staticSagMm, riderMm: extendedMm - c.riderSagMm });
const preloadInRange = (c: SpringCandidateResult) => c.preloadNeededMm >= c.preloadRangeMm.min && c.preloadNeededMm <= c.preloadRangeMm.max;

/** The candidates whose word the sag check must repeat, and what it must say. */
function expectAgreement(c: SpringCandidateResult, sagCheck: SagCheckInput, toleranceMm: number, pitchMm: number) {
  const r = checkSag(sagCheck);
  if (c.verdict === 'ok') {
    expect(r.springVerdict).toBe('ok');
    expect(Math.abs(r.preloadChangeMm)).toBeLessThanOrEqual(pitchMm / 2);
    return;
  }
  if (c.reason === 'topped-out') {
    // Topped out: the sag check cannot read a static sag, so it warns instead of judging.
    expect(r.springVerdict).toBe('unknown');
    expect(r.warning).toMatch(/topped out/);
    return;
  }
  if ((c.verdict === 'too-soft' || c.verdict === 'too-stiff') && preloadInRange(c)) {
    // A spring that cannot rest on the target but lands within the tolerance of it is not chased by the sag check.
    if (c.reason === 'does-not-settle' && Math.abs(c.riderSagMm - sagCheck.targets.riderSagMm) <= toleranceMm) return;
    expect(r.springVerdict).toBe(c.verdict);
  }
}

describe('finder and sag check agree (property, fast-check)', () => {
  it('at the rear, on constant ratios and curves, with and without the wheel loads', () => {
    fc.assert(
      fc.property(rearBike, (bike) => {
        fc.pre(bike !== null);
        if (bike === null) return;
        const { input, result } = bike;
        const tol = input.staticSagToleranceMm ?? 3;
        for (const c of result.candidates) {
          const base: SagCheckInput = {
            end: 'rear',
            ...readings(c),
            targets: input.targets,
            toleranceMm: tol,
            leverageRatio: input.leverageRatio,
            adjusterPitchMm: input.adjusterPitchMm,
            shockCount: input.shockCount,
          };
          expectAgreement(c, { ...base, bikeLoadN: result.bikeLoadN, riderLoadN: result.rearLoadN }, tol, input.adjusterPitchMm);
          expectAgreement(c, base, tol, input.adjusterPitchMm);
        }
      }),
      { numRuns: 400 },
    );
  });

  it('at the fork', () => {
    fc.assert(
      fc.property(forkBike, ({ input, result }) => {
        const tol = input.staticSagToleranceMm ?? 3;
        for (const c of result.candidates) {
          expectAgreement(
            c,
            {
              end: 'front',
              ...readings(c),
              targets: input.targets,
              toleranceMm: tol,
              forkAngleDeg: input.forkAngleDeg,
              springCount: input.springCount,
              adjusterPitchMm: input.adjusterPitchMm,
              bikeLoadN: result.bikeLoadN,
              riderLoadN: result.frontLoadN,
            },
            tol,
            input.adjusterPitchMm ?? 1,
          );
        }
      }),
      { numRuns: 400 },
    );
  });
});

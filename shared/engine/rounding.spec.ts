import { describe, expect, it } from 'vitest';
import { decimalsFor, roundAnswer } from './rounding';

describe('rounding at the API edge', () => {
  it('rounds lengths to 0.01 mm, rates to 0.01 N/mm and 0.001 kgf/mm, forces to 0.1 N and turns to 0.01', () => {
    expect(
      roundAnswer({
        rearLoadN: 608.01234,
        requiredRate: { nPerMm: 17.899999999999977, kgfPerMm: 1.8252091, lbfPerIn: 102.20999 },
        candidates: [{ id: 'R-1.23456', riderSagMm: 66.00000000001, adjusterTurns: 3.14159, preloadRangeMm: { min: 2.0049, max: 19.996 } }],
      }),
    ).toEqual({
      rearLoadN: 608,
      requiredRate: { nPerMm: 17.9, kgfPerMm: 1.825, lbfPerIn: 102.21 },
      candidates: [{ id: 'R-1.23456', riderSagMm: 66, adjusterTurns: 3.14, preloadRangeMm: { min: 2, max: 20 } }],
    });
  });

  it('leaves fields without a rule (prices, ids, flags) alone and writes no negative zero', () => {
    expect(roundAnswer({ priceCents: 12345, approximate: true, preloadChangeMm: -0.001 })).toEqual({ priceCents: 12345, approximate: true, preloadChangeMm: 0 });
    expect(Object.is(roundAnswer({ preloadChangeMm: -0.001 }).preloadChangeMm, 0)).toBe(true);
    expect(decimalsFor('priceCents')).toBeUndefined();
  });
});

import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { g } from '../units';
import { isCasesResult } from './candidates';
import { computeForkSpring } from './fork';
import { EngineInputError } from './errors';
import type { ForkSpringInput, Load } from './types';

const base = {
  wheelbaseMm: 1500,
  sprungMassKg: 110,
  loads: [{ massKg: 80, positionMm: 900 }],
  forkAngleDeg: 25,
  forkTravelMm: 120,
  targets: { staticSagMm: 25, riderSagMm: 35 },
  preloadRangeMm: { min: 0, max: 15 },
  adjusterPitchMm: 1.5,
  springs: [
    { id: 'F-8', rateNPerMm: 8, freeLengthMm: 300 },
    { id: 'F-14', rateNPerMm: 14, freeLengthMm: 300, solidLengthMm: 150 },
    { id: 'F-16', rateNPerMm: 16, freeLengthMm: 300 },
  ],
} satisfies ForkSpringInput & { loads: Load[] };

const cos25 = Math.cos((25 * Math.PI) / 180);

describe('fork springs', () => {
  const r = computeForkSpring(base);

  it('puts the front share of the rider on the front: W_f = g·m·(1 − x/L)', () => {
    expect(r.frontLoadN).toBeCloseTo(g * 80 * (1 - 900 / 1500), 9);
    expect(r.bikeLoadN).toBeCloseTo(g * 110, 9);
  });

  it('needs cos θ·W_f/(n·(x_r − x_s)) N/mm per spring, two springs by default', () => {
    expect(r.requiredRate.nPerMm).toBeCloseTo((cos25 * r.frontLoadN) / (2 * 10), 9);
  });

  it('needs cos θ·F_t/(n·k) − x_r of preload and predicts sag along the tubes from the preload set', () => {
    const c = r.candidates.find((x) => x.id === 'F-14');
    const Ft = r.bikeLoadN + r.frontLoadN;
    expect(c?.preloadNeededMm).toBeCloseTo((cos25 * Ft) / (2 * 14) - 35, 9);
    expect(c?.verdict).toBe('ok');
    expect(c?.riderSagMm).toBeCloseTo(35, 9);
    expect(c?.staticSagMm).toBeCloseTo((cos25 * r.bikeLoadN) / 28 - (c?.preloadMm ?? 0), 9);
    expect(c?.adjusterTurns).toBeCloseTo((c?.preloadMm ?? 0) / 1.5, 12);
    expect(c?.coilBindMarginMm).toBeCloseTo(300 - 150 - ((c?.preloadMm ?? 0) + 120), 9);
  });

  it('calls a spring too soft when it needs more preload than the fork allows, and too stiff below the minimum', () => {
    expect(r.candidates.find((x) => x.id === 'F-8')?.verdict).toBe('too-soft');
    const stiff = computeForkSpring({ ...base, preloadRangeMm: { min: 5, max: 15 }, springs: [{ id: 'F-30', rateNPerMm: 30, freeLengthMm: 300 }] });
    expect(stiff.candidates[0]?.verdict).toBe('too-stiff');
    expect(stiff.candidates[0]?.staticSagMm).toBeGreaterThanOrEqual(0);
  });

  it('omits adjuster turns for a fork without an adjuster', () => {
    const { adjusterPitchMm: _p, ...noAdjuster } = base;
    expect(computeForkSpring(noAdjuster).candidates[0]).not.toHaveProperty('adjusterTurns');
  });

  it('when the luggage sits behind the rear axle, the front wheel unloads and needs less spring', () => {
    const loaded = computeForkSpring({ ...base, loads: [...base.loads, { massKg: 20, positionMm: 1800 }] });
    expect(loaded.frontLoadN).toBeLessThan(r.frontLoadN);
    expect(loaded.requiredRate.nPerMm).toBeLessThan(r.requiredRate.nPerMm);
  });

  it('handles load cases like the rear', () => {
    const { loads: _l, ...rest } = base;
    const res = computeForkSpring({ ...rest, cases: [{ name: 'solo', loads: base.loads }] });
    expect(isCasesResult(res)).toBe(true);
    if (isCasesResult(res)) expect(res.coversAllCases).toEqual(['F-14', 'F-16']);
  });
});

describe('fork spring properties (fast-check)', () => {
  it('with preload inside the range, predicted rider sag equals the target within 0.05 mm; more load never gives less sag', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 35, noNaN: true }),
        fc.integer({ min: 1, max: 2 }),
        fc.double({ min: 3, max: 30, noNaN: true }),
        fc.double({ min: 40, max: 160, noNaN: true }),
        fc.double({ min: 0, max: 60, noNaN: true }),
        (angle, n, k, rider, extraKg) => {
          const input = {
            ...base,
            forkAngleDeg: angle,
            springCount: n,
            loads: [{ massKg: rider, positionMm: 900 }],
            preloadRangeMm: { min: 0, max: 100 },
            springs: [{ id: 'S', rateNPerMm: k, freeLengthMm: 300 }],
          };
          const c = computeForkSpring(input).candidates[0];
          if (c !== undefined && c.verdict === 'ok') expect(Math.abs(c.riderSagMm - 35)).toBeLessThan(0.05);
          const heavier = computeForkSpring({
            ...input,
            preloadRangeMm: { min: c?.preloadMm ?? 0, max: c?.preloadMm ?? 0 },
            loads: [...input.loads, { massKg: extraKg, positionMm: 500 }],
          }).candidates[0];
          expect(heavier?.riderSagMm ?? NaN).toBeGreaterThanOrEqual((c?.riderSagMm ?? NaN) - 1e-9);
        },
      ),
    );
  });
});

describe('fork spring: loads that take the weight off the front wheel', () => {
  const fieldAndMessage = (input: ForkSpringInput): [string, string] | undefined => {
    try {
      computeForkSpring(input);
    } catch (e) {
      if (e instanceof EngineInputError) return [e.field, e.message];
      throw e;
    }
    return undefined;
  };

  it('when the only load sits exactly on the rear axle, the front gains nothing, so the request is refused on the loads', () => {
    expect(fieldAndMessage({ ...base, loads: [{ massKg: 80, positionMm: 1500 }] })?.[0]).toBe('loads');
  });

  it('when a top case behind the rear axle outweighs the front share of everything else, the request is refused on the loads instead of asking for a negative rate', () => {
    // Statics: W_f = g·(80·(1500 − 900) + 150·(1500 − 1900))/1500 = −8·g N < 0.
    expect(fieldAndMessage({ ...base, loads: [{ massKg: 80, positionMm: 900 }, { massKg: 150, positionMm: 1900 }] })?.[0]).toBe('loads');
  });

  it('when the loads lift the front wheel off the ground, says so', () => {
    const [field, message] = fieldAndMessage({ ...base, loads: [{ massKg: 300, positionMm: 5000 }] }) ?? ['', ''];
    expect(field).toBe('loads');
    expect(message).toMatch(/lift the front wheel/);
  });

  it('with load cases, names the case that unloads the front', () => {
    const { loads: _l, ...rest } = base;
    const input = { ...rest, cases: [{ name: 'solo', loads: base.loads }, { name: 'top case only', loads: [{ massKg: 20, positionMm: 1800 }] }] };
    const [field, message] = fieldAndMessage(input) ?? ['', ''];
    expect(field).toBe('cases.1.loads');
    expect(message).toMatch(/top case only/);
  });

  it('a load exactly on the front axle goes wholly to the fork', () => {
    const r = computeForkSpring({ ...base, loads: [{ massKg: 80, positionMm: 0 }] });
    expect(r.frontLoadN).toBeCloseTo(g * 80, 9);
  });
});

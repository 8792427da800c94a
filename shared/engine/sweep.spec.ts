import { describe, expect, it } from 'vitest';
import { g } from '../units';
import { computeForkSpring } from './fork';
import { computeRearSpring } from './rear';
import { forkSpringExample, rearSpringExample } from './examples';
import { loadSplit } from './statics';
import { forkSagSweep, loadSteps, rearSagSweep } from './sweep';

const springs = [
  { id: 'R-50', rateNPerMm: 50, freeLengthMm: 229, solidLengthMm: 110 },
  { id: 'R-58', rateNPerMm: 58, freeLengthMm: 229, solidLengthMm: 110 },
  { id: 'R-66', rateNPerMm: 66, freeLengthMm: 229, solidLengthMm: 110 },
];

describe('rear sag sweep', () => {
  it('follows the constant-ratio closed form: rider sag − static sag = LR²·W/k', () => {
    // A spring of rate k behind a constant motion ratio gives a wheel rate k/LR², so a wheel load W compresses the
    // wheel LR²·W/k beyond the static sag. Source: Milliken & Milliken, Race Car Vehicle Dynamics (SAE, 1995),
    // ch. 16, wheel rate = spring rate × (installation ratio)² (chapter from memory); the ratio here is wheel/shock travel.
    const input = { ...rearSpringExample(), springs };
    const LR = 2.1;
    const perKg = loadSplit(input.wheelbaseMm, input.loads).rearN / 92;
    const curves = rearSagSweep(input, [0, 20, 46, 92, 120]);
    expect(curves).toHaveLength(3);
    for (const c of curves) {
      const staticSag = c.points[0]!.riderSagMm;
      for (const p of c.points) {
        expect(p.riderSagMm - staticSag).toBeCloseTo((LR * LR * perKg * p.addedKg) / c.rateNPerMm, 6);
      }
    }
  });

  it('meets the engine at both ends: no added load is the static sag, the rider’s own load is the rider sag', () => {
    const input = { ...rearSpringExample(), springs };
    const total = input.loads.reduce((s, l) => s + l.massKg, 0);
    const engine = computeRearSpring(input);
    for (const c of rearSagSweep(input, [0, total])) {
      const e = engine.candidates.find((x) => x.id === c.id)!;
      expect(c.preloadMm).toBe(e.preloadMm);
      expect(c.points[0]!.riderSagMm).toBeCloseTo(e.staticSagMm, 6);
      expect(c.points[1]!.riderSagMm).toBeCloseTo(e.riderSagMm, 6);
    }
  });

  it('with twin shocks the wheel sees both springs: half the sag gain of one', () => {
    const one = rearSagSweep({ ...rearSpringExample(), springs }, [0, 92], ['R-58'])[0]!;
    const two = rearSagSweep({ ...rearSpringExample(), springs, shockCount: 2 }, [0, 92], ['R-58'])[0]!;
    const gain = (c: typeof one) => c.points[1]!.riderSagMm - c.points[0]!.riderSagMm;
    expect(gain(two)).toBeCloseTo(gain(one) / 2, 6);
  });

  it('returns only the springs asked for, in the order asked', () => {
    const ids = rearSagSweep({ ...rearSpringExample(), springs }, [0], ['R-66', 'R-50']).map((c) => c.id);
    expect(ids).toEqual(['R-66', 'R-50']);
  });

  it('refuses a sweep with no added load to place', () => {
    expect(() => rearSagSweep({ ...rearSpringExample(), loads: [] }, [0])).toThrow(RangeError);
  });
});

describe('fork sag sweep', () => {
  it('follows cos θ·W_f/(n·k) beyond the static sag along the tubes', () => {
    // Axial deflection of n parallel springs under a vertical load W on a fork at θ from vertical: cos θ·W/(n·k)
    // (spring statics, Hooke's law with springs in parallel; the engine's forkSpringDeflection).
    const input = { ...forkSpringExample(), springs: [{ id: 'F-8', rateNPerMm: 8, freeLengthMm: 300 }, { id: 'F-9', rateNPerMm: 9, freeLengthMm: 300 }] };
    const perKg = loadSplit(input.wheelbaseMm, input.loads).frontN / 80;
    const cos = Math.cos((25 * Math.PI) / 180);
    for (const c of forkSagSweep(input, [0, 40, 80])) {
      const s0 = c.points[0]!.riderSagMm;
      for (const p of c.points) expect(p.riderSagMm - s0).toBeCloseTo((cos * perKg * p.addedKg) / (2 * c.rateNPerMm), 6);
    }
  });

  it('meets the engine’s predicted sags for the rider’s own load', () => {
    const input = forkSpringExample();
    const e = computeForkSpring(input).candidates[0]!;
    const c = forkSagSweep(input, [0, 80])[0]!;
    expect(c.points[0]!.riderSagMm).toBeCloseTo(e.staticSagMm, 6);
    expect(c.points[1]!.riderSagMm).toBeCloseTo(e.riderSagMm, 6);
  });

  it('the bike’s own weight alone is g·sprung mass: with no added load the sag is the static sag', () => {
    const input = forkSpringExample();
    const c = forkSagSweep(input, [0])[0]!;
    const expected = (Math.cos((25 * Math.PI) / 180) * g * 110) / (2 * 9) - c.preloadMm;
    expect(c.points[0]!.riderSagMm).toBeCloseTo(Math.max(0, expected), 6);
  });
});

describe('load steps', () => {
  it('spans 0 to the maximum evenly', () => {
    expect(loadSteps(120, 4)).toEqual([0, 30, 60, 90, 120]);
  });
});

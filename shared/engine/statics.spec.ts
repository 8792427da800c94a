import { describe, expect, it } from 'vitest';
import { g } from '../units';
import { loadSplit, rearShare } from './statics';

// The textbooks below use g = 9.80 m/s²; their answers are rescaled to the engine's exact g.
const BOOK_G = 9.8;
const toBookG = (n: number): number => (n * BOOK_G) / g;
const within = (actual: number, expected: number, rel: number): void => {
  expect(Math.abs(actual - expected) / Math.abs(expected)).toBeLessThanOrEqual(rel);
};

describe('load split between the axles (statics of a beam on two supports)', () => {
  it('splits a 1500 kg car with its centre of mass 1.20 m behind the front axle of a 3.00 m wheelbase into 4.41 kN per front wheel and 2.94 kN per rear wheel (Serway & Jewett, Physics for Scientists and Engineers, ch. 12 problem, from memory; tolerance 0.5% for 3 significant figures)', () => {
    const split = loadSplit(3000, [{ massKg: 1500, positionMm: 1200 }]);
    within(toBookG(split.frontN) / 2, 4410, 0.005);
    within(toBookG(split.rearN) / 2, 2940, 0.005);
  });

  it('puts 4.4e4 N and 1.18e5 N on the supports of a 20.0 m, 1500 kg beam carrying a 15 000 kg press 5.0 m from the right support (Giancoli, Physics: Principles with Applications, 6th ed., ch. 9 problem, from memory; tolerance 1% for the book’s rounding)', () => {
    const split = loadSplit(20_000, [
      { massKg: 1500, positionMm: 10_000 },
      { massKg: 15_000, positionMm: 15_000 },
    ]);
    within(toBookG(split.frontN), 4.4e4, 0.01);
    within(toBookG(split.rearN), 1.18e5, 0.01);
  });

  it('when the luggage sits behind the rear axle, the front wheel unloads: a 52 kg diver at the tip of a 4.0 m board held at 0 and 1.0 m pulls the end support down with 1.5e3 N and pushes the other up with 2.0e3 N (Giancoli, 6th ed., ch. 9 diving-board problem, from memory; tolerance 5% for 2 significant figures)', () => {
    const split = loadSplit(1000, [{ massKg: 52, positionMm: 4000 }]);
    within(toBookG(split.rearN), 2.0e3, 0.05);
    within(toBookG(split.frontN), -1.5e3, 0.05);
    expect(split.frontN).toBeLessThan(0);
    expect(split.rearN).toBeGreaterThan(split.totalN);
  });

  it('when a 12 kg top case sits 250 mm behind the rear axle of a 1500 mm bike, the rear carries more than the case weighs and the front less than nothing', () => {
    const split = loadSplit(1500, [{ massKg: 12, positionMm: 1750 }]);
    expect(rearShare(1500, 1750)).toBeCloseTo(1750 / 1500, 12);
    expect(split.rearN).toBeCloseTo((g * 12 * 1750) / 1500, 9);
    expect(split.frontN).toBeCloseTo(g * 12 * (1 - 1750 / 1500), 9);
  });

  it('always conserves the total weight across both axles', () => {
    const split = loadSplit(1450, [
      { massKg: 80, positionMm: 900 },
      { massKg: 65, positionMm: 1300 },
      { massKg: 10, positionMm: -100 },
    ]);
    expect(split.frontN + split.rearN).toBeCloseTo(split.totalN, 9);
    expect(split.totalN).toBeCloseTo(g * 155, 9);
  });

  it('a load exactly on the rear axle puts exactly nothing on the front, and one exactly on the front axle nothing on the rear (moments about each axle)', () => {
    expect(loadSplit(1500, [{ massKg: 80, positionMm: 1500 }]).frontN).toBe(0);
    expect(loadSplit(1500, [{ massKg: 80, positionMm: 0 }]).rearN).toBe(0);
  });
});

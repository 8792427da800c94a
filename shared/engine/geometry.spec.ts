import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { inToMm, nPerMmToLbfPerIn } from '../units';
import { EngineInputError } from './errors';
import { bergstrasserFactor, computeSpringGeometry, endCoils, shearModulusFor, wahlFactor } from './geometry';

const within = (actual: number, expected: number, rel: number): void => {
  expect(Math.abs(actual - expected) / Math.abs(expected)).toBeLessThanOrEqual(rel);
};

describe('spring geometry: Shigley, Mechanical Engineering Design, 10th ed., Problem 10-3', () => {
  // Music wire, d = 2.5 mm, OD = 31 mm, plain-ground ends, Nt = 14 (values as quoted in the issue).
  const r = computeSpringGeometry({
    wireDiameterMm: 2.5,
    outsideDiameterMm: 31,
    totalCoils: 14,
    endType: 'plain-ground',
    material: 'music-wire',
  });

  it('finds D = 28.5 mm, C = 11.4 and Na = 13 exactly', () => {
    expect(r.meanDiameterMm).toBeCloseTo(28.5, 12);
    expect(r.springIndex).toBeCloseTo(11.4, 12);
    expect(r.activeCoils).toBe(13);
  });

  it('finds a solid length of 35 mm (d·Nt for plain-ground ends)', () => {
    expect(r.solidLengthMm).toBeCloseTo(35, 12);
  });

  it('finds k ≈ 1.314 N/mm with G = 81.0 GPa for 2.5 mm music wire (tolerance 0.1%, book rounding)', () => {
    expect(shearModulusFor('music-wire', 2.5)).toBe(81_000);
    within(r.rateNPerMm, 1.314, 0.001);
  });

  it('finds K_B ≈ 1.117 (tolerance 0.1%, book rounding)', () => {
    within(r.bergstrasserFactor, 1.117, 0.001);
  });

  it('reaches the torsional yield strength at solid when the free length is the book’s 162.8 mm (from memory of the solution: Ssy ≈ 871 MPa, tolerance 0.5%)', () => {
    const withFree = computeSpringGeometry({
      wireDiameterMm: 2.5,
      outsideDiameterMm: 31,
      totalCoils: 14,
      endType: 'plain-ground',
      material: 'music-wire',
      freeLengthMm: 162.8,
    });
    expect(withFree.travelToSolidMm).toBeCloseTo(127.8, 9);
    within(withFree.shearStressAtSolidMPa ?? NaN, 871.2, 0.005);
  });
});

describe('spring geometry: Shigley, 10th ed., Example 10-1 (US units)', () => {
  // No. 16 music wire d = 0.037 in, OD = 7/16 in, squared ends, Nt = 12.5; the book gives k ≈ 4.13 lbf/in.
  const r = computeSpringGeometry({
    wireDiameterMm: inToMm(0.037),
    outsideDiameterMm: inToMm(7 / 16),
    totalCoils: 12.5,
    endType: 'squared',
    material: 'music-wire',
  });

  it('uses Na = Nt − 2 = 10.5 for squared ends and G = 81.7 GPa (11.85 Mpsi) for this wire size', () => {
    expect(r.activeCoils).toBe(10.5);
    expect(shearModulusFor('music-wire', inToMm(0.037))).toBe(81_700);
  });

  it('finds k ≈ 4.13 lbf/in (tolerance 0.5%: the book rounds D to 0.400 in)', () => {
    within(nPerMmToLbfPerIn(r.rateNPerMm), 4.13, 0.005);
  });

  it('finds C ≈ 10.82, K_B ≈ 1.124 and Ls = d(Nt + 1) ≈ 0.50 in (from memory of the example, tolerance 0.5%)', () => {
    within(r.springIndex, 10.82, 0.005);
    within(r.bergstrasserFactor, 1.124, 0.005);
    within(r.solidLengthMm, inToMm(0.037 * 13.5), 1e-12);
  });
});

describe('end types per Shigley Table 10-1', () => {
  it('counts active coils and solid length for each end type', () => {
    expect(endCoils('plain', 10, 2)).toEqual({ activeCoils: 10, solidLengthMm: 22 });
    expect(endCoils('plain-ground', 10, 2)).toEqual({ activeCoils: 9, solidLengthMm: 20 });
    expect(endCoils('squared', 10, 2)).toEqual({ activeCoils: 8, solidLengthMm: 22 });
    expect(endCoils('squared-ground', 10, 2)).toEqual({ activeCoils: 8, solidLengthMm: 20 });
  });
});

describe('stress factors (Shigley, 10th ed., §10-2)', () => {
  it('gives Wahl and Bergsträsser factors about 1% apart for a usual index (Shigley §10-2, from memory; tolerance 1.5%)', () => {
    within(wahlFactor(8), bergstrasserFactor(8), 0.015);
    expect(wahlFactor(8)).toBeCloseTo((32 - 1) / (32 - 4) + 0.615 / 8, 12);
    expect(bergstrasserFactor(8)).toBeCloseTo(34 / 29, 12);
  });

  it('computes shear stress at a given load as K_B·8FD/(πd³)', () => {
    const r = computeSpringGeometry({
      wireDiameterMm: 2.5,
      outsideDiameterMm: 31,
      totalCoils: 14,
      endType: 'plain-ground',
      shearModulusMPa: 81_000,
      loadN: 100,
    });
    expect(r.shearStressAtLoadMPa).toBeCloseTo((r.bergstrasserFactor * 8 * 100 * 28.5) / (Math.PI * 2.5 ** 3), 9);
    expect(r.shearStressAtSolidMPa).toBeUndefined();
  });
});

describe('a load the spring cannot reach', () => {
  // Shigley's Mechanical Engineering Design, 10th ed., Problem 10-3 spring (k ≈ 1.314 N/mm, Ls = 35 mm) with an 80 mm free length.
  const spring = { wireDiameterMm: 2.5, outsideDiameterMm: 31, totalCoils: 14, endType: 'plain-ground', material: 'music-wire', freeLengthMm: 80 } as const;

  it('refuses, on the load, more force than closes the spring to solid, k·(L0 − Ls)', () => {
    const solidForceN = computeSpringGeometry(spring).rateNPerMm * 45;
    let field: string | undefined;
    try {
      computeSpringGeometry({ ...spring, loadN: solidForceN + 1 });
    } catch (e) {
      if (e instanceof EngineInputError) field = e.field;
      else throw e;
    }
    expect(field).toBe('loadN');
  });

  it('never reports a stress at load above the stress at solid (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 200, noNaN: true }), (loadN) => {
        let r;
        try {
          r = computeSpringGeometry({ ...spring, loadN });
        } catch (e) {
          if (e instanceof EngineInputError) return;
          throw e;
        }
        expect(r.shearStressAtLoadMPa ?? NaN).toBeLessThanOrEqual((r.shearStressAtSolidMPa ?? NaN) * (1 + 1e-12));
      }),
    );
  });
});

describe('materials (Shigley Table 10-5)', () => {
  it('picks the music-wire shear modulus by wire size', () => {
    expect(shearModulusFor('music-wire', 0.5)).toBe(82_700);
    expect(shearModulusFor('music-wire', 1.2)).toBe(81_700);
    expect(shearModulusFor('music-wire', 3.0)).toBe(81_000);
    expect(shearModulusFor('music-wire', 6.0)).toBe(80_000);
  });

  it('uses 77.2 GPa for chrome-silicon, the usual suspension-spring wire (from memory)', () => {
    expect(shearModulusFor('chrome-silicon', 12)).toBe(77_200);
  });

  it('prefers an explicit shear modulus over the material', () => {
    const a = computeSpringGeometry({ wireDiameterMm: 10, outsideDiameterMm: 70, totalCoils: 10, endType: 'squared-ground', material: 'chrome-silicon', shearModulusMPa: 80_000 });
    const b = computeSpringGeometry({ wireDiameterMm: 10, outsideDiameterMm: 70, totalCoils: 10, endType: 'squared-ground', shearModulusMPa: 80_000 });
    expect(a.rateNPerMm).toBe(b.rateNPerMm);
  });

  it('refuses an unknown material instead of guessing', () => {
    expect(shearModulusFor('__proto__', 2)).toBeUndefined();
    expect(() => computeSpringGeometry({ wireDiameterMm: 2, outsideDiameterMm: 20, totalCoils: 10, endType: 'plain', material: 'cheese' })).toThrow(RangeError);
  });
});

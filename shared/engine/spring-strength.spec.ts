import { describe, expect, it } from 'vitest';
import { computeSpringGeometry, springShearStress } from './geometry';
import { ALLOWABLE_SHARE_SET_REMOVED, catalogueSolidStress, checkSolidStress, minTensileStrength } from './spring-strength';

const IN = 25.4;
const KPSI = 6.894757; // MPa per kpsi (NIST SP 811)

describe('minimum tensile strength of spring wire, Sut = A / d^m', () => {
  it('music wire of 0.037 in comes to about 324 kpsi, as in Shigley 10th ed. Example 10-1 (from memory), within 0.5 %', () => {
    const sut = minTensileStrength('music-wire', 0.037 * IN)!;
    expect(sut.withinTableSizes).toBe(true);
    expect(Math.abs(sut.sutMPa / KPSI - 324) / 324).toBeLessThan(0.005);
  });

  it('the SI constants of Table 10-4 (Shigley 10th ed., from memory) agree with its inch constants: music wire 201 kpsi·in^0.145, chrome-silicon 202 kpsi·in^0.108, chrome-vanadium 169 kpsi·in^0.168, within 0.5 %', () => {
    // A_SI = A_in × 6.894757 × 25.4^m, so both columns of the table give the same Sut for the same wire.
    for (const [material, aKpsi, m, dIn] of [['music-wire', 201, 0.145, 0.1], ['chrome-silicon', 202, 0.108, 0.25], ['chrome-vanadium', 169, 0.168, 0.25]] as const) {
      const fromInch = (aKpsi / dIn ** m) * KPSI;
      const si = minTensileStrength(material, dIn * IN)!.sutMPa;
      expect(Math.abs(si - fromInch) / fromInch, material).toBeLessThan(0.005);
    }
  });

  it('a wire beyond the table’s sizes is extrapolated and says so; a material the table lacks has no strength', () => {
    expect(minTensileStrength('chrome-silicon', 12)).toMatchObject({ withinTableSizes: false });
    expect(minTensileStrength('valve-spring', 3)).toBeUndefined();
  });

  it('stainless 302 takes the band its wire falls in (Table 10-4 lists three)', () => {
    expect(minTensileStrength('stainless-302', 1)!.sutMPa).toBeCloseTo(1867 / 1 ** 0.146, 6);
    expect(minTensileStrength('stainless-302', 4)!.sutMPa).toBeCloseTo(2065 / 4 ** 0.263, 6);
    expect(minTensileStrength('stainless-302', 8)!.sutMPa).toBeCloseTo(2911 / 8 ** 0.478, 6);
  });
});

describe('stress with the spring closed to solid', () => {
  const spring = { material: 'chrome-silicon', wireDiameterMm: 5.5, outerDiameterMm: 38.5, totalCoils: 25.4 } as const;
  const geometry = computeSpringGeometry({ wireDiameterMm: 5.5, outsideDiameterMm: 38.5, totalCoils: 25.4, endType: 'squared-ground', material: 'chrome-silicon', freeLengthMm: 300 });

  it('is the geometry module’s Bergsträsser-corrected stress at the force that closes it, k·(free − solid)', () => {
    const c = catalogueSolidStress({ ...spring, computedRateNPerMm: geometry.rateNPerMm, freeLengthMm: 300, solidLengthMm: geometry.solidLengthMm })!;
    expect(c.shearStressAtSolidMPa).toBeCloseTo(geometry.shearStressAtSolidMPa!, 9);
    expect(c.shearStressAtSolidMPa).toBeCloseTo(springShearStress(geometry.rateNPerMm * (300 - geometry.solidLengthMm), 5.5, 33), 9);
  });

  it('is held against 65 % of Sut for hardened and tempered alloy wire, the set-removed share of Shigley 10th ed. Table 10-6 (from memory)', () => {
    expect(ALLOWABLE_SHARE_SET_REMOVED['chrome-silicon']).toBe(0.65);
    expect(ALLOWABLE_SHARE_SET_REMOVED['music-wire']).toBe(0.6);
    expect(ALLOWABLE_SHARE_SET_REMOVED['stainless-302']).toBe(0.55);
    const c = catalogueSolidStress({ ...spring, computedRateNPerMm: geometry.rateNPerMm, freeLengthMm: 300, solidLengthMm: geometry.solidLengthMm })!;
    expect(c.allowableMPa).toBeCloseTo(0.65 * minTensileStrength('chrome-silicon', 5.5)!.sutMPa, 9);
  });

  it('flags a spring once closing it passes the allowable, and not before', () => {
    const at = (freeLengthMm: number) => checkSolidStress({ material: 'chrome-silicon', wireDiameterMm: 5.5, meanDiameterMm: 33, rateNPerMm: 10, freeLengthMm, solidLengthMm: 140 })!;
    // τ grows with the travel to solid; find where it crosses the allowable and step either side.
    const allowable = at(200).allowableMPa;
    const perMm = at(141).shearStressAtSolidMPa;
    const crossing = 140 + allowable / perMm;
    expect(at(crossing - 0.5).exceeds).toBe(false);
    expect(at(crossing + 0.5).exceeds).toBe(true);
  });

  it('has nothing to say for a material Table 10-4 does not list', () => {
    expect(checkSolidStress({ material: 'beryllium-copper', wireDiameterMm: 2, meanDiameterMm: 20, rateNPerMm: 5, freeLengthMm: 80, solidLengthMm: 30 })).toBeUndefined();
  });
});

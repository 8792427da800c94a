import { bergstrasserFactor } from './geometry';

/** Sut = A / d^m over a wire-size band (d in mm, Sut and A in MPa). */
interface StrengthBand {
  fromMm: number;
  toMm: number;
  m: number;
  aMPa: number;
}

/**
 * Minimum tensile strength constants after Shigley's Mechanical Engineering Design, 10th ed., Table 10-4
 * (values from memory). Valve-spring wire, 17-7 PH and beryllium copper are not in that table.
 */
export const TENSILE_STRENGTH_BANDS: Readonly<Record<string, readonly StrengthBand[]>> = {
  'music-wire': [{ fromMm: 0.1, toMm: 6.5, m: 0.145, aMPa: 2211 }],
  'oil-tempered': [{ fromMm: 0.5, toMm: 12.7, m: 0.187, aMPa: 1855 }],
  'hard-drawn': [{ fromMm: 0.7, toMm: 12.7, m: 0.19, aMPa: 1783 }],
  'chrome-vanadium': [{ fromMm: 0.8, toMm: 11.1, m: 0.168, aMPa: 2005 }],
  'chrome-silicon': [{ fromMm: 1.6, toMm: 9.5, m: 0.108, aMPa: 1974 }],
  'stainless-302': [
    { fromMm: 0.3, toMm: 2.5, m: 0.146, aMPa: 1867 },
    { fromMm: 2.5, toMm: 5, m: 0.263, aMPa: 2065 },
    { fromMm: 5, toMm: 10, m: 0.478, aMPa: 2911 },
  ],
  'phosphor-bronze': [
    { fromMm: 0.1, toMm: 0.6, m: 0, aMPa: 1000 },
    { fromMm: 0.6, toMm: 2, m: 0.028, aMPa: 913 },
    { fromMm: 2, toMm: 7.5, m: 0.064, aMPa: 932 },
  ],
};

/**
 * Largest static torsional stress as a share of Sut, Shigley 10th ed. Table 10-6, for springs with the set
 * removed (the lower end of each range: suspension springs are preset when made, from memory).
 */
export const ALLOWABLE_SHARE_SET_REMOVED: Readonly<Record<string, number>> = {
  'music-wire': 0.6, // cold-drawn carbon steel: 60–70 %
  'hard-drawn': 0.6,
  'oil-tempered': 0.65, // hardened and tempered carbon and low-alloy steel: 65–75 %
  'chrome-vanadium': 0.65,
  'chrome-silicon': 0.65,
  'stainless-302': 0.55, // austenitic stainless: 55–65 %
  'phosphor-bronze': 0.55, // nonferrous: 55–65 %
};

/**
 * Minimum tensile strength of a spring wire, MPa (Shigley 10th ed. Table 10-4); undefined when the table has no
 * row for the material. A wire outside the table's sizes takes the nearest band, extrapolated.
 * @example minTensileStrength('music-wire', 2.5) // 1929.6... (2211 / 2.5^0.145)
 */
export function minTensileStrength(material: string, wireDiameterMm: number): { sutMPa: number; withinTableSizes: boolean } | undefined {
  const bands = Object.hasOwn(TENSILE_STRENGTH_BANDS, material) ? TENSILE_STRENGTH_BANDS[material] : undefined;
  if (!bands?.length) return undefined;
  const inside = bands.find((b) => wireDiameterMm >= b.fromMm && wireDiameterMm <= b.toMm);
  const band = inside ?? (wireDiameterMm < bands[0]!.fromMm ? bands[0]! : bands[bands.length - 1]!);
  return { sutMPa: band.aMPa / wireDiameterMm ** band.m, withinTableSizes: inside !== undefined };
}

export interface SolidStressCheck {
  /** Bergsträsser-corrected shear stress with the spring closed to solid, MPa. */
  shearStressAtSolidMPa: number;
  minTensileStrengthMPa: number;
  /** Table 10-6 share (set removed) × Sut, MPa. */
  allowableMPa: number;
  /** True when closing the spring would stress it past the allowable, so it takes a set. */
  exceeds: boolean;
  /** False when the wire is outside Table 10-4's size range and its strength is extrapolated. */
  withinTableSizes: boolean;
}

/**
 * Shear stress at solid (τ = K_B·8·F·D/(π·d³) with F = k·(free − solid)) against the allowable for the
 * material; undefined for a material Table 10-4 does not list.
 * @example checkSolidStress({ material: 'chrome-silicon', wireDiameterMm: 5, meanDiameterMm: 32, rateNPerMm: 9, freeLengthMm: 300, solidLengthMm: 150 })
 */
export function checkSolidStress(s: {
  material: string;
  wireDiameterMm: number;
  meanDiameterMm: number;
  rateNPerMm: number;
  freeLengthMm: number;
  solidLengthMm: number;
}): SolidStressCheck | undefined {
  const strength = minTensileStrength(s.material, s.wireDiameterMm);
  const share = Object.hasOwn(ALLOWABLE_SHARE_SET_REMOVED, s.material) ? ALLOWABLE_SHARE_SET_REMOVED[s.material] : undefined;
  if (!strength || share === undefined) return undefined;
  const forceN = s.rateNPerMm * Math.max(0, s.freeLengthMm - s.solidLengthMm);
  const d = s.wireDiameterMm;
  const tau = (bergstrasserFactor(s.meanDiameterMm / d) * 8 * forceN * s.meanDiameterMm) / (Math.PI * d ** 3);
  const allowableMPa = share * strength.sutMPa;
  return { shearStressAtSolidMPa: tau, minTensileStrengthMPa: strength.sutMPa, allowableMPa, exceeds: tau > allowableMPa, withinTableSizes: strength.withinTableSizes };
}

/**
 * `checkSolidStress` from a spring as the catalogue keeps it: outer diameter, the geometry's own rate and the solid
 * length (stated or computed). The product API and the back-office editor both call this one function.
 * @example catalogueSolidStress({ material: 'chrome-silicon', wireDiameterMm: 5, outerDiameterMm: 37, computedRateNPerMm: 9, freeLengthMm: 300, solidLengthMm: 150 })
 */
export function catalogueSolidStress(s: {
  material: string;
  wireDiameterMm: number;
  outerDiameterMm: number;
  computedRateNPerMm: number;
  freeLengthMm: number;
  solidLengthMm: number;
}): SolidStressCheck | null {
  return (
    checkSolidStress({
      material: s.material,
      wireDiameterMm: s.wireDiameterMm,
      meanDiameterMm: s.outerDiameterMm - s.wireDiameterMm,
      rateNPerMm: s.computedRateNPerMm,
      freeLengthMm: s.freeLengthMm,
      solidLengthMm: s.solidLengthMm,
    }) ?? null
  );
}

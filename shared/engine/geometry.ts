import { EngineInputError } from './errors';
import type { SpringEndType, SpringGeometryInput, SpringGeometryResult } from './types';

/** Shear modulus by wire size: `upToMm` is the largest wire diameter the value applies to. */
interface ModulusBand {
  upToMm: number;
  shearModulusMPa: number;
}

export interface SpringMaterial {
  label: string;
  bands: readonly ModulusBand[];
}

const IN = 25.4;
const any = (shearModulusMPa: number): ModulusBand[] => [{ upToMm: Infinity, shearModulusMPa }];

/**
 * Shear moduli after Shigley's Mechanical Engineering Design, Table 10-5 ("Mechanical properties of some
 * spring wires"). Music wire and hard-drawn bands were checked against a copy of the table; the other rows
 * are the book's values from memory. Size bands are the book's inch limits (0.032, 0.063, 0.125 in).
 */
export const SPRING_MATERIALS = {
  'music-wire': {
    label: 'Music wire (ASTM A228)',
    bands: [
      { upToMm: 0.032 * IN, shearModulusMPa: 82_700 },
      { upToMm: 0.063 * IN, shearModulusMPa: 81_700 },
      { upToMm: 0.125 * IN, shearModulusMPa: 81_000 },
      { upToMm: Infinity, shearModulusMPa: 80_000 },
    ],
  },
  'hard-drawn': {
    label: 'Hard-drawn spring wire (ASTM A227)',
    bands: [
      { upToMm: 0.032 * IN, shearModulusMPa: 80_700 },
      { upToMm: 0.063 * IN, shearModulusMPa: 80_000 },
      { upToMm: 0.125 * IN, shearModulusMPa: 79_300 },
      { upToMm: Infinity, shearModulusMPa: 78_600 },
    ],
  },
  'oil-tempered': { label: 'Oil-tempered wire (ASTM A229)', bands: any(77_200) },
  'valve-spring': { label: 'Valve-spring wire (ASTM A230)', bands: any(77_200) },
  'chrome-vanadium': { label: 'Chrome-vanadium (ASTM A231)', bands: any(77_200) },
  'chrome-silicon': { label: 'Chrome-silicon (ASTM A401)', bands: any(77_200) },
  'stainless-302': { label: 'Stainless steel 302 (ASTM A313)', bands: any(69_000) },
  'stainless-17-7ph': { label: 'Stainless steel 17-7 PH', bands: any(75_800) },
  'phosphor-bronze': { label: 'Phosphor bronze (ASTM B159)', bands: any(41_400) },
  'beryllium-copper': { label: 'Beryllium copper (ASTM B197)', bands: any(44_800) },
} as const satisfies Record<string, SpringMaterial>;

export type SpringMaterialKey = keyof typeof SPRING_MATERIALS;

/** Keys of `SPRING_MATERIALS`, for forms and validators. */
export const SPRING_MATERIAL_KEYS = Object.keys(SPRING_MATERIALS) as SpringMaterialKey[];

/** The end types of Shigley Table 10-1. */
export const SPRING_END_TYPES: readonly SpringEndType[] = ['plain', 'plain-ground', 'squared', 'squared-ground'];

/**
 * Handbook shear modulus of a material for a wire diameter, MPa; undefined for an unknown material.
 * @example shearModulusFor('music-wire', 2.5) // 81000
 */
export function shearModulusFor(material: string, wireDiameterMm: number): number | undefined {
  if (!Object.hasOwn(SPRING_MATERIALS, material)) return undefined;
  const bands: readonly ModulusBand[] = SPRING_MATERIALS[material as SpringMaterialKey].bands;
  return bands.find((b) => wireDiameterMm <= b.upToMm)?.shearModulusMPa;
}

/**
 * Active coils and solid length per end type (Shigley Table 10-1).
 * @example endCoils('plain-ground', 14, 2.5) // { activeCoils: 13, solidLengthMm: 35 }
 */
export function endCoils(endType: SpringEndType, totalCoils: number, wireDiameterMm: number): { activeCoils: number; solidLengthMm: number } {
  const d = wireDiameterMm;
  const n = totalCoils;
  switch (endType) {
    case 'plain':
      return { activeCoils: n, solidLengthMm: d * (n + 1) };
    case 'plain-ground':
      return { activeCoils: n - 1, solidLengthMm: d * n };
    case 'squared':
      return { activeCoils: n - 2, solidLengthMm: d * (n + 1) };
    case 'squared-ground':
      return { activeCoils: n - 2, solidLengthMm: d * n };
  }
}

/**
 * Wahl factor K_W = (4C − 1)/(4C − 4) + 0.615/C.
 * @example wahlFactor(11.4) // 1.1261...
 */
export function wahlFactor(springIndex: number): number {
  const c = springIndex;
  return (4 * c - 1) / (4 * c - 4) + 0.615 / c;
}

/**
 * Bergsträsser factor K_B = (4C + 2)/(4C − 3).
 * @example bergstrasserFactor(11.4) // 1.1174...
 */
export function bergstrasserFactor(springIndex: number): number {
  const c = springIndex;
  return (4 * c + 2) / (4 * c - 3);
}

/**
 * Rate of a helical compression spring, k = G·d⁴ / (8·D³·Na), N/mm with G in MPa and lengths in mm.
 * @example helicalSpringRate(81000, 2.5, 28.5, 13) // 1.3142...
 */
export function helicalSpringRate(shearModulusMPa: number, wireDiameterMm: number, meanDiameterMm: number, activeCoils: number): number {
  return (shearModulusMPa * wireDiameterMm ** 4) / (8 * meanDiameterMm ** 3 * activeCoils);
}

/**
 * Corrected shear stress τ = K_B·8·F·D / (π·d³), MPa, as Shigley uses it.
 * @example springShearStress(100, 2.5, 28.5) // 518.99...
 */
export function springShearStress(forceN: number, wireDiameterMm: number, meanDiameterMm: number): number {
  const kB = bergstrasserFactor(meanDiameterMm / wireDiameterMm);
  return (kB * 8 * forceN * meanDiameterMm) / (Math.PI * wireDiameterMm ** 3);
}

/**
 * Geometry, rate and stresses of a helical compression spring from its wire, coils, ends and material
 * (or an explicit shear modulus). Stress at solid and travel to solid need the free length.
 * Throws RangeError for an unknown material, a spring with no active coils or an index ≤ 1, and EngineInputError
 * (on `loadN`) for a load above the force that closes the spring to solid when the free length is given.
 * @example
 * computeSpringGeometry({ wireDiameterMm: 2.5, outsideDiameterMm: 31, totalCoils: 14, endType: 'plain-ground',
 *   material: 'music-wire' }).rateNPerMm // 1.3142...
 */
export function computeSpringGeometry(input: SpringGeometryInput): SpringGeometryResult {
  const d = input.wireDiameterMm;
  const G =
    input.shearModulusMPa ?? (input.material === undefined ? undefined : shearModulusFor(input.material, d));
  if (G === undefined) throw new RangeError('Give a known material or a shear modulus');
  const D = input.outsideDiameterMm - d;
  const C = D / d;
  if (!(C > 1)) throw new RangeError('Outside diameter must be more than twice the wire diameter');
  const { activeCoils, solidLengthMm } = endCoils(input.endType, input.totalCoils, d);
  if (!(activeCoils > 0)) throw new RangeError('The spring has no active coils');
  const rateNPerMm = helicalSpringRate(G, d, D, activeCoils);
  const kB = bergstrasserFactor(C);
  const tau = (forceN: number): number => (kB * 8 * forceN * D) / (Math.PI * d ** 3);
  const result: SpringGeometryResult = {
    meanDiameterMm: D,
    springIndex: C,
    activeCoils,
    solidLengthMm,
    rateNPerMm,
    wahlFactor: wahlFactor(C),
    bergstrasserFactor: kB,
  };
  const travelToSolidMm = input.freeLengthMm === undefined ? undefined : input.freeLengthMm - solidLengthMm;
  const solidForceN = travelToSolidMm === undefined ? undefined : rateNPerMm * travelToSolidMm;
  // Past solid the coils sit on each other and carry the load in contact, so no torsional stress above the solid one exists.
  if (input.loadN !== undefined && solidForceN !== undefined && solidForceN > 0 && input.loadN > solidForceN) {
    throw new EngineInputError('loadN', `The spring is solid at ${Math.round(solidForceN * 10) / 10} N, so it cannot carry a load of ${input.loadN} N.`);
  }
  if (input.loadN !== undefined) result.shearStressAtLoadMPa = tau(input.loadN);
  if (travelToSolidMm !== undefined && solidForceN !== undefined) {
    result.travelToSolidMm = travelToSolidMm;
    result.shearStressAtSolidMPa = tau(solidForceN);
  }
  return result;
}

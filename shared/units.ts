import { unitFactors } from './unit-factors';

export type { UnitName } from './unit-factors';

/** Standard gravity in m/s², exact by definition (CGPM 1901). */
export const g = 9.80665;

// Factors come from mathjs (unit-factors.ts), so these only multiply; the client gets them without mathjs itself.
const { kgToLb: KG_TO_LB, mmToIn: MM_TO_IN, nToLbf: N_TO_LBF, nPerMmToKgfPerMm: N_PER_MM_TO_KGF_PER_MM, nPerMmToLbfPerIn: N_PER_MM_TO_LBF_PER_IN, nmToFtLbf: NM_TO_FT_LBF } = unitFactors;

/** @example kgToLb(1) // 2.20462... */
export const kgToLb = (kg: number): number => kg * KG_TO_LB;
/** @example lbToKg(1) // 0.45359237 */
export const lbToKg = (lb: number): number => lb / KG_TO_LB;
/** @example mmToIn(25.4) // 1 */
export const mmToIn = (mm: number): number => mm * MM_TO_IN;
/** @example inToMm(1) // 25.4 */
export const inToMm = (inches: number): number => inches / MM_TO_IN;
/** @example nToLbf(4.4482216152605) // 1 */
export const nToLbf = (n: number): number => n * N_TO_LBF;
/** @example lbfToN(1) // 4.4482216152605 */
export const lbfToN = (lbf: number): number => lbf / N_TO_LBF;
/** @example nPerMmToKgfPerMm(9.80665) // 1 */
export const nPerMmToKgfPerMm = (nPerMm: number): number => nPerMm * N_PER_MM_TO_KGF_PER_MM;
/** @example kgfPerMmToNPerMm(1) // 9.80665 */
export const kgfPerMmToNPerMm = (kgfPerMm: number): number => kgfPerMm / N_PER_MM_TO_KGF_PER_MM;
/** @example nPerMmToLbfPerIn(1) // 5.71014... */
export const nPerMmToLbfPerIn = (nPerMm: number): number => nPerMm * N_PER_MM_TO_LBF_PER_IN;
/** @example lbfPerInToNPerMm(1) // 0.175126835... */
export const lbfPerInToNPerMm = (lbfPerIn: number): number => lbfPerIn / N_PER_MM_TO_LBF_PER_IN;
/** @example nmToFtLbf(44.7) // 32.97... */
export const nmToFtLbf = (nm: number): number => nm * NM_TO_FT_LBF;
/** @example ftLbfToNm(33) // 44.74... */
export const ftLbfToNm = (ftLbf: number): number => ftLbf / NM_TO_FT_LBF;
/** @example weightN(80) // 784.532 */
export const weightN = (massKg: number): number => massKg * g;

/** A spring rate in the three units riders quote. */
export interface RateInUnits {
  nPerMm: number;
  kgfPerMm: number;
  lbfPerIn: number;
}

/**
 * Expresses one spring rate in N/mm, kgf/mm and lbf/in.
 * @example rateInUnits(9.80665) // { nPerMm: 9.80665, kgfPerMm: 1, lbfPerIn: 55.997... }
 */
export function rateInUnits(nPerMm: number): RateInUnits {
  return { nPerMm, kgfPerMm: nPerMmToKgfPerMm(nPerMm), lbfPerIn: nPerMmToLbfPerIn(nPerMm) };
}

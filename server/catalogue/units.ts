import type { RateInUnitsDto } from '../../shared/catalogue';

// Exact by definition: standard gravity (CGPM 1901), the international pound-force and inch (1959).
const g = 9.80665;
const lbfInN = 4.4482216152605;
const ftInM = 0.3048;

/** One rate in N/mm, kgf/mm and lbf/in. */
export function rateInUnits(nPerMm: number): RateInUnitsDto {
  return { nPerMm, kgfPerMm: nPerMm / g, lbfPerIn: (nPerMm * 25.4) / lbfInN };
}

export const nmToFtLbf = (nm: number): number => nm / (lbfInN * ftInM);

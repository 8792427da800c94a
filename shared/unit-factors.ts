import { create, unitDependencies } from 'mathjs';

// mathjs types its dependency maps as an index signature, hence the check.
if (unitDependencies === undefined) throw new Error('mathjs unit dependencies are missing');
// A private mathjs instance with only the unit machinery.
const math = create({ unitDependencies });

/** Units the product shows to riders and staff. `lb` is mass, `lbf` is force (mathjs naming). */
export type UnitName =
  | 'kg'
  | 'lb'
  | 'mm'
  | 'in'
  | 'N'
  | 'lbf'
  | 'kgf'
  | 'N/mm'
  | 'kgf/mm'
  | 'lbf/in'
  | 'N*m'
  | 'ft*lbf';

/**
 * Converts a value between two units of the same dimension through mathjs.
 * Throws when the dimensions differ (e.g. `lb` to `lbf`).
 * @example convert(1, 'lbf/in', 'N/mm') // 0.175126835...
 */
export function convert(value: number, from: UnitName, to: UnitName): number {
  return math.unit(value, from).toNumber(to);
}

/**
 * The factors every conversion in `units.ts` multiplies by, taken from mathjs. The client build replaces this
 * module with these numbers as evaluated here (see vite.config.ts), so browsers never download mathjs.
 */
export const unitFactors = {
  kgToLb: convert(1, 'kg', 'lb'),
  mmToIn: convert(1, 'mm', 'in'),
  nToLbf: convert(1, 'N', 'lbf'),
  nPerMmToKgfPerMm: convert(1, 'N/mm', 'kgf/mm'),
  nPerMmToLbfPerIn: convert(1, 'N/mm', 'lbf/in'),
  nmToFtLbf: convert(1, 'N*m', 'ft*lbf'),
};

/** The module the client build ships in place of this one: the same factors as literals. */
export const unitFactorsModule = (): string => `export const unitFactors = ${JSON.stringify(unitFactors)};\n`;

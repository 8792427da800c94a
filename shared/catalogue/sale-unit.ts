import type { SpringEnd } from './constants';

/**
 * How the shop sells springs: fork springs come as a matched pair (one product, one price, both legs);
 * shock springs one at a time (a bike with twin shocks takes two).
 */
export const saleUnits = {
  fork: { springsPerUnit: 2, unit: 'pair', perUnit: 'per pair' },
  shock: { springsPerUnit: 1, unit: 'spring', perUnit: 'per spring' },
} as const satisfies Record<SpringEnd, { springsPerUnit: number; unit: string; perUnit: string }>;

/**
 * Units of the product to buy for the springs an end holds.
 * @example unitsToBuy('fork', 2) // 1 (one pair)
 * @example unitsToBuy('shock', 2) // 2 (twin shocks)
 */
export function unitsToBuy(end: SpringEnd, springCount: number): number {
  return Math.max(1, Math.ceil(springCount / saleUnits[end].springsPerUnit));
}

/**
 * The quantity as a rider reads it, so a fork set is never taken for two pairs.
 * @example quantityWords('fork', 1) // "1 pair (2 springs)"
 */
export function quantityWords(end: SpringEnd, units: number): string {
  const u = saleUnits[end];
  const springs = units * u.springsPerUnit;
  if (u.springsPerUnit === 1) return `${units} ${units === 1 ? 'spring' : 'springs'}`;
  return `${units} ${units === 1 ? u.unit : `${u.unit}s`} (${springs} springs)`;
}

/**
 * What one unit's price buys, as a cart or order line says it.
 * @example perUnitWords('spring', 'fork') // "per pair"
 */
export function perUnitWords(kind: string, end: SpringEnd | null): string {
  return kind === 'spring' && end ? saleUnits[end].perUnit : 'each';
}

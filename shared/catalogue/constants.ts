// The catalogue contract's plain values and types; no class-validator here, so the client bundle can load them.
import { SPRING_END_TYPES } from '../engine/geometry';
import type { SpringEndType } from '../engine/types';

/** How a rider rides; each picks its own sag targets on a fitment. */
export const ridingStyles = ['road', 'adventure', 'off-road'] as const;
export type RidingStyle = (typeof ridingStyles)[number];

/** Which end of the bike a spring goes in. */
export const springEnds = ['fork', 'shock'] as const;
export type SpringEnd = (typeof springEnds)[number];

export const productKinds = ['spring', 'adapter', 'tool', 'accessory'] as const;
export type ProductKind = (typeof productKinds)[number];

/** The engine's end types (Shigley Table 10-1): validation, forms and the solver share this one list. */
export const springEndTypes = SPRING_END_TYPES;
export type { SpringEndType };

/** Where an added mass sits on a bike; positions are measured rearward from the front axle. */
export const loadStationKinds = ['rider', 'passenger', 'tank-bag', 'panniers', 'top-case'] as const;
export type LoadStationKind = (typeof loadStationKinds)[number];

/** The stations that carry luggage rather than people. */
export const luggageStations = ['tank-bag', 'panniers', 'top-case'] as const satisfies readonly LoadStationKind[];
export type LuggageStation = (typeof luggageStations)[number];

export const currency = 'EUR' as const;
export type CurrencyCode = typeof currency;

/** One page of a server-side paginated, sorted and filtered list. */
export interface Page<T> {
  items: T[];
  total: number;
  page: number;
  pageSize: number;
}

/** Spring rate in the three units riders and staff use. */
export interface RateInUnitsDto {
  nPerMm: number;
  kgfPerMm: number;
  lbfPerIn: number;
}

export const maxPageSize = 100;

/**
 * Sort keys are `field` (ascending) or `-field` (descending).
 * @example sortValues(['name', 'price']) // ['name', '-name', 'price', '-price']
 */
export function sortValues<T extends string>(fields: readonly T[]): string[] {
  return fields.flatMap((f) => [f, `-${f}`]);
}

export const productSortFields = ['name', 'sku', 'price', 'rate', 'stock', 'updatedAt'] as const;
export const fitmentSortFields = ['make', 'model', 'yearFrom', 'yearTo', 'updatedAt'] as const;

/** A SKU: 3 to 40 capital letters, digits and dashes, not starting with a dash. */
export const skuPattern = /^[A-Z0-9][A-Z0-9-]{2,39}$/;

/** The largest single stock change, either way; a bigger one is a typo, not a delivery. */
export const maxStockChange = 100_000;

/** A spring fits a fitment's window when its inner diameter is within this of the fitment's, mm. */
export const springFitToleranceMm = 0.5;

export const auditEntityTypes = ['fitment', 'product', 'compatibility', 'shop-settings', 'order'] as const;
export type AuditEntityType = (typeof auditEntityTypes)[number];

/** How far a predicted static sag may sit from its target when a fitment names no tolerance, mm: the engine's default. */
export { DEFAULT_STATIC_SAG_TOLERANCE_MM as defaultStaticSagToleranceMm } from '../engine/verdict';

/** The name the rider's own load takes among load cases. */
export const asEnteredCaseName = 'as entered';

import { Type } from 'class-transformer';
import { IsIn, IsInt, IsOptional, Max, Min } from 'class-validator';

/** How a rider rides; each picks its own sag targets on a fitment. */
export const ridingStyles = ['road', 'adventure', 'off-road'] as const;
export type RidingStyle = (typeof ridingStyles)[number];

/** Which end of the bike a spring goes in. */
export const springEnds = ['fork', 'shock'] as const;
export type SpringEnd = (typeof springEnds)[number];

export const productKinds = ['spring', 'adapter', 'tool', 'accessory'] as const;
export type ProductKind = (typeof productKinds)[number];

export const springEndTypes = ['plain', 'plain-ground', 'squared', 'squared-ground'] as const;
export type SpringEndType = (typeof springEndTypes)[number];

/** Where an added mass sits on a bike; positions are measured rearward from the front axle. */
export const loadStationKinds = ['rider', 'passenger', 'tank-bag', 'panniers', 'top-case'] as const;
export type LoadStationKind = (typeof loadStationKinds)[number];

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

/** page (from 1) and pageSize (1..100); list query DTOs extend it. */
export class PageQueryDto {
  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: 'Page is a whole number.' })
  @Min(1, { message: 'Page starts at 1.' })
  @Max(100_000, { message: 'Page is at most 100000.' })
  page?: number;

  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: 'Page size is a whole number.' })
  @Min(1, { message: 'Page size is at least 1.' })
  @Max(maxPageSize, { message: `Page size is at most ${maxPageSize}.` })
  pageSize?: number;
}

/** Sort keys are `field` (ascending) or `-field` (descending). */
export function sortValues<T extends string>(fields: readonly T[]): string[] {
  return fields.flatMap((f) => [f, `-${f}`]);
}

export const isIn = <T extends readonly string[]>(values: T, what: string) =>
  IsIn(values as unknown as string[], { message: `${what} must be one of ${values.join(', ')}.` });

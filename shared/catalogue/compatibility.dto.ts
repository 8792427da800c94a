import { Type } from 'class-transformer';
import { ArrayMaxSize, IsArray, IsBoolean, IsInt, IsOptional, IsString, IsUUID, Max, MaxLength, Min, ValidateNested } from 'class-validator';
import type { CurrencyCode, SpringEnd } from './common';

export { springFitToleranceMm } from './constants';

/** An adapter a spring needs on a fitment; it goes in the cart with the spring. */
export interface AdapterNeedDto {
  id: string;
  sku: string;
  name: string;
  priceCents: number;
  currency: CurrencyCode;
  quantity: number;
  inStock: boolean;
}

/** One spring's standing on one fitment, as the staff compatibility table shows it. */
export interface SpringFitDto {
  productId: string;
  sku: string;
  name: string;
  end: SpringEnd;
  rateNPerMm: number;
  freeLengthMm: number;
  innerDiameterMm: number;
  active: boolean;
  /** What the fitment's diameter and free-length window say. */
  derivedFits: boolean;
  /** Staff override: true forces a fit, false excludes; null follows the window. */
  override: boolean | null;
  overrideNote: string;
  /** The answer used: the override when there is one, else the derived one. */
  fits: boolean;
  adapters: AdapterNeedDto[];
}

/** GET /api/staff/fitments/:id/compatibility: every spring of the catalogue against this fitment. */
export interface FitmentCompatibilityDto {
  fitmentId: string;
  springs: SpringFitDto[];
}

/** PUT /api/staff/fitments/:fitmentId/springs/:productId/override body. */
export class CompatibilityOverrideDto {
  @IsBoolean({ message: 'Fits is true (force a fit) or false (exclude).' })
  fits!: boolean;

  @IsOptional()
  @IsString({ message: 'The note is text.' })
  @MaxLength(500, { message: 'A note has at most 500 characters.' })
  note?: string;
}

export class AdapterNeedInputDto {
  @IsUUID('all', { message: 'Adapter id is a UUID.' })
  productId!: string;

  @IsInt({ message: 'Quantity is a whole number.' })
  @Min(1, { message: 'Quantity is at least 1.' })
  @Max(10, { message: 'Quantity is at most 10.' })
  quantity!: number;
}

/** PUT /api/staff/fitments/:fitmentId/springs/:productId/adapters body: the whole list, replacing the old one. */
export class AdapterNeedsDto {
  @IsArray({ message: 'Adapters are a list.' })
  @ArrayMaxSize(10, { message: 'At most 10 adapters.' })
  @ValidateNested({ each: true })
  @Type(() => AdapterNeedInputDto)
  adapters!: AdapterNeedInputDto[];
}

/** A bike a spring fits, with the adapters it needs there (GET /api/products/:id/bikes). */
export interface SpringBikeFitDto {
  fitmentId: string;
  make: string;
  model: string;
  variant: string;
  yearFrom: number;
  yearTo: number | null;
  adapters: AdapterNeedDto[];
}

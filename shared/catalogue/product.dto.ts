import { Type } from 'class-transformer';
import {
  IsArray,
  IsBoolean,
  IsIn,
  IsInt,
  IsObject,
  IsNumber,
  IsOptional,
  IsString,
  IsUUID,
  Length,
  Matches,
  Max,
  MaxLength,
  Min,
  ValidateBy,
  ValidateIf,
  ValidateNested,
  type ValidationArguments,
  ArrayMaxSize,
} from 'class-validator';
import {
  isIn,
  maxStockChange,
  PageQueryDto,
  productKinds,
  productSortFields,
  skuPattern,
  sortValues,
  springEnds,
  springEndTypes,
  currency,
  type CurrencyCode,
  type ProductKind,
  type RateInUnitsDto,
  type SpringEnd,
  type SpringEndType,
} from './common';
import { springRanges, withUnit, type FieldRange } from './ranges';
import type { SolidStressCheck } from '../engine/spring-strength';

// ---------- responses ----------

export interface ProductImageDto {
  id: string;
  /** Absolute path on this server, e.g. /files/product-images/3f…c2.jpg (long-cached, immutable). */
  url: string;
  contentType: string;
  sizeBytes: number;
  position: number;
}

/** What the engine's spring-geometry function says about a spring's wire, coils and ends. */
export interface SpringGeometryCheckDto {
  computedRateNPerMm: number;
  computedSolidLengthMm: number;
  /** (stated − computed) / computed, %. */
  rateDeviationPct: number;
  /** True when the stated rate and the computed one differ by more than 5 %. */
  rateMismatch: boolean;
  springIndex: number;
  activeCoils: number;
  /**
   * Shear stress with the spring closed to solid against the allowable for its wire (Shigley 10th ed. Tables 10-4 and
   * 10-6, set removed); null for a material those tables do not list. `exceeds` flags a spring that takes a set if closed.
   */
  solidStress: SolidStressCheck | null;
}

export interface SpringDetailsDto {
  end: SpringEnd;
  /** The rate staff stated (from the maker's sheet), N/mm; this is the one the engine uses. */
  rateNPerMm: number;
  rate: RateInUnitsDto;
  freeLengthMm: number;
  innerDiameterMm: number;
  outerDiameterMm: number;
  wireDiameterMm: number;
  totalCoils: number;
  endType: SpringEndType;
  material: string;
  /** Stated by staff or, when not stated, computed from the geometry. */
  solidLengthMm: number;
  geometry: SpringGeometryCheckDto;
}

/** A product as riders see it; descriptionHtml is rendered from markdown with raw HTML escaped (safe for v-html). */
export interface ProductDto {
  id: string;
  sku: string;
  name: string;
  kind: ProductKind;
  description: string;
  descriptionHtml: string;
  priceCents: number;
  currency: CurrencyCode;
  inStock: boolean;
  images: ProductImageDto[];
  spring: SpringDetailsDto | null;
}

/** A product as staff see it in the back office. */
export interface StaffProductDto extends ProductDto {
  stockOnHand: number;
  binLocation: string;
  active: boolean;
  createdAt: string;
  updatedAt: string;
}

export interface SpringMaterialOptionDto {
  key: string;
  label: string;
}

/** GET /api/staff/spring-options: what the spring form's selects offer. */
export interface SpringOptionsDto {
  materials: SpringMaterialOptionDto[];
  endTypes: SpringEndType[];
  ends: SpringEnd[];
}

// ---------- requests ----------

const boolString = (what: string) => IsIn(['true', 'false'], { message: `${what} is true or false.` });

/** GET /api/products query; the staff list takes the same plus `active`. */
export class ProductListQueryDto extends PageQueryDto {
  @IsOptional()
  @isIn(productKinds, 'Kind')
  kind?: ProductKind;

  @IsOptional()
  @isIn(springEnds, 'End')
  end?: SpringEnd;

  /** Only springs that fit this fitment (derived window plus staff overrides). */
  @IsOptional()
  @IsUUID('all', { message: 'Fitment id is a UUID.' })
  fitmentId?: string;

  @IsOptional()
  @Type(() => Number)
  @IsNumber({ allowNaN: false, allowInfinity: false }, { message: 'Minimum rate is a number (N/mm).' })
  @Min(0, { message: 'Minimum rate is at least 0 N/mm.' })
  @Max(1000, { message: 'Minimum rate is at most 1000 N/mm.' })
  minRate?: number;

  @IsOptional()
  @Type(() => Number)
  @IsNumber({ allowNaN: false, allowInfinity: false }, { message: 'Maximum rate is a number (N/mm).' })
  @Min(0, { message: 'Maximum rate is at least 0 N/mm.' })
  @Max(1000, { message: 'Maximum rate is at most 1000 N/mm.' })
  maxRate?: number;

  @IsOptional()
  @boolString('In stock')
  inStock?: 'true' | 'false';

  @IsOptional()
  @IsString({ message: 'Search is text.' })
  @MaxLength(100, { message: 'Search has at most 100 characters.' })
  q?: string;

  @IsOptional()
  @IsIn(sortValues(productSortFields), { message: `Sort is one of ${sortValues(productSortFields).join(', ')}.` })
  sort?: string;
}

export class StaffProductListQueryDto extends ProductListQueryDto {
  @IsOptional()
  @boolString('Active')
  active?: 'true' | 'false';
}

const num = (what: string) => IsNumber({ allowNaN: false, allowInfinity: false }, { message: `${what} is a number.` });

/** A spring field's range from the shared table, worded "Wire diameter is at most 25 mm." as the form words it. */
function NamedRange(label: string, range: FieldRange): PropertyDecorator {
  return (target, key) => {
    Min(range.min, { message: `${label} is at least ${withUnit(range.min, range.unit)}.` })(target, key);
    Max(range.max, { message: `${label} is at most ${withUnit(range.max, range.unit)}.` })(target, key);
  };
}

/** The spring's wire, coils, ends and free length. */
export class SpringGeometryFieldsDto {
  @num('Wire diameter')
  @NamedRange('Wire diameter', springRanges.wireDiameterMm)
  wireDiameterMm!: number;

  @num('Outer diameter')
  @NamedRange('Outer diameter', springRanges.outerDiameterMm)
  outerDiameterMm!: number;

  @num('Total coils')
  @NamedRange('Total coils', springRanges.totalCoils)
  totalCoils!: number;

  @isIn(springEndTypes, 'End type')
  endType!: SpringEndType;

  @IsString({ message: 'Choose a material.' })
  @Matches(/^[a-z0-9-]{2,40}$/, { message: 'Choose a material from the list.' })
  material!: string;

  @num('Free length')
  @NamedRange('Free length', springRanges.freeLengthMm)
  freeLengthMm!: number;
}

/** POST /api/staff/spring-geometry body: the spring form as staff type. */
export class SpringGeometryInputDto extends SpringGeometryFieldsDto {
  /** When given, the reply says how far it is from the computed rate. */
  @IsOptional()
  @num('Rate')
  @NamedRange('Rate', springRanges.rateNPerMm)
  rateNPerMm?: number;
}

export class SpringDetailsInputDto extends SpringGeometryFieldsDto {
  @isIn(springEnds, 'End')
  end!: SpringEnd;

  @num('Rate')
  @NamedRange('Rate', springRanges.rateNPerMm)
  rateNPerMm!: number;

  /** When omitted it is outer diameter − 2 × wire diameter. */
  @IsOptional()
  @num('Inner diameter')
  @NamedRange('Inner diameter', springRanges.innerDiameterMm)
  innerDiameterMm?: number | null;

  /** When omitted the engine's computed solid length is used. */
  @IsOptional()
  @num('Solid length')
  @NamedRange('Solid length', springRanges.solidLengthMm)
  solidLengthMm?: number | null;
}

/** POST /api/staff/products and PUT /api/staff/products/:id body (a full replacement; images are separate). */
export class ProductInputDto {
  @IsString({ message: 'Enter a SKU.' })
  @Matches(skuPattern, { message: 'A SKU has 3 to 40 capital letters, digits and dashes.' })
  sku!: string;

  @IsString({ message: 'Enter a name.' })
  @Length(1, 120, { message: 'A name has 1 to 120 characters.' })
  @Matches(/\S/, { message: 'Enter a name.' })
  name!: string;

  @isIn(productKinds, 'Kind')
  kind!: ProductKind;

  @IsOptional()
  @IsString({ message: 'The description is text (markdown).' })
  @MaxLength(10_000, { message: 'A description has at most 10000 characters.' })
  description?: string;

  @IsInt({ message: 'Price is a whole number of cents.' })
  @Min(0, { message: 'Price is not negative.' })
  @Max(10_000_000, { message: 'Price is at most 100000.00.' })
  priceCents!: number;

  @IsOptional()
  @IsIn([currency], { message: `Currency is ${currency}.` })
  currency?: CurrencyCode;

  @IsInt({ message: 'Stock on hand is a whole number.' })
  @Min(0, { message: 'Stock on hand is not negative.' })
  @Max(100_000, { message: 'Stock on hand is at most 100000.' })
  stockOnHand!: number;

  @IsOptional()
  @IsString({ message: 'Bin location is text.' })
  @MaxLength(20, { message: 'A bin location has at most 20 characters.' })
  binLocation?: string;

  @IsBoolean({ message: 'Active is true or false.' })
  active!: boolean;

  /** Required for kind 'spring', refused for the others. */
  @ValidateIf((o: ProductInputDto) => o.kind === 'spring' || o.spring != null)
  @IsObject({ message: 'Give the spring details.' })
  @ValidateNested()
  @Type(() => SpringDetailsInputDto)
  spring?: SpringDetailsInputDto | null;
}

/**
 * PATCH /api/staff/products/:id/stock: exactly one of `stockOnHand` (set the count after a stock take) or
 * `change` (add a delivery, take out a breakage: applied on the server, so a sale in between is kept).
 */
export class StockUpdateDto {
  @ValidateIf((o: StockUpdateDto) => o.change === undefined)
  @ValidateBy(
    { name: 'stockOnHand', validator: { validate: (v: unknown) => Number.isInteger(v) && (v as number) >= 0 && (v as number) <= 100_000 } },
    {
      message: (args: ValidationArguments) =>
        args.value === undefined
          ? 'Give the count on the shelf, or a change by an amount.'
          : !Number.isInteger(args.value)
            ? 'Stock on hand is a whole number.'
            : (args.value as number) < 0
              ? 'Stock on hand is not negative.'
              : 'Stock on hand is at most 100000.',
    },
  )
  stockOnHand?: number;

  @ValidateIf((o: StockUpdateDto) => o.change !== undefined)
  @ValidateBy(
    {
      name: 'stockChange',
      validator: {
        validate: (v: unknown, args?: ValidationArguments) =>
          (args?.object as StockUpdateDto | undefined)?.stockOnHand === undefined && Number.isInteger(v) && v !== 0 && Math.abs(v as number) <= maxStockChange,
      },
    },
    {
      message: (args: ValidationArguments) =>
        (args.object as StockUpdateDto).stockOnHand !== undefined
          ? 'Give either a change or the count on the shelf, not both.'
          : !Number.isInteger(args.value)
            ? 'The change is a whole number of pieces.'
            : args.value === 0
              ? 'A change of 0 changes nothing.'
              : `A change is at most ${maxStockChange} pieces either way.`,
    },
  )
  change?: number;

  /** Why the stock moved (delivery, breakage, count); kept in the audit log. */
  @IsOptional()
  @IsString({ message: 'The reason is text.' })
  @MaxLength(200, { message: 'A reason has at most 200 characters.' })
  reason?: string;

  // Left out keeps the bin; null is not a bin, so it is refused rather than reaching the service.
  @ValidateIf((_o: StockUpdateDto, v: unknown) => v !== undefined)
  @IsString({ message: 'Bin location is text.' })
  @MaxLength(20, { message: 'A bin location has at most 20 characters.' })
  binLocation?: string;
}

/** PUT /api/staff/products/:id/images/order: every image id of the product, in the new order. */
export class ImageOrderDto {
  @IsArray({ message: 'Give the image ids as a list.' })
  @ArrayMaxSize(50, { message: 'At most 50 images.' })
  @IsUUID('all', { each: true, message: 'Each image id is a UUID.' })
  imageIds!: string[];
}

/** POST /api/staff/spring-geometry reply. */
export interface SpringGeometryPreviewDto extends SpringGeometryCheckDto {
  meanDiameterMm: number;
  innerDiameterMm: number;
  wahlFactor: number;
  travelToSolidMm: number;
}

import { Type } from 'class-transformer';
import { ArrayMaxSize, ArrayMinSize, IsArray, IsIn, IsInt, IsOptional, IsString, IsUUID, Matches, Max, MaxLength, Min, MinLength, ValidateNested } from 'class-validator';
import { PageQueryDto } from '../catalogue';
import { stockReasons, type LowStockItemDto, type StockMovementDto, type StockReason } from './stock';

export const maxDeliveryUnits = 10_000;

export class DeliveryLineDto {
  @IsUUID('all', { message: 'Choose a product.' })
  productId!: string;

  @IsInt({ message: 'Quantity is a whole number.' })
  @Min(1, { message: 'Quantity is at least 1.' })
  @Max(maxDeliveryUnits, { message: `Quantity is at most ${maxDeliveryUnits}.` })
  quantity!: number;
}

/** POST /api/staff/stock/deliveries: a supplier's delivery note and what came with it. */
export class ReceiveDeliveryDto {
  @IsString({ message: 'Give the delivery reference.' })
  @MinLength(1, { message: 'Give the delivery reference.' })
  @MaxLength(60, { message: 'The delivery reference has at most 60 characters.' })
  @Matches(/\S/, { message: 'Give the delivery reference.' })
  deliveryRef!: string;

  @IsArray({ message: 'List the lines of the delivery.' })
  @ArrayMinSize(1, { message: 'A delivery has at least one line.' })
  @ArrayMaxSize(200, { message: 'A delivery has at most 200 lines.' })
  @ValidateNested({ each: true })
  @Type(() => DeliveryLineDto)
  lines!: DeliveryLineDto[];

  @IsOptional()
  @IsString({ message: 'The note is text.' })
  @MaxLength(500, { message: 'The note has at most 500 characters.' })
  note?: string;
}

export interface DeliveryReceivedDto {
  deliveryRef: string;
  lines: { productId: string; sku: string; name: string; quantity: number; stockAfter: number }[];
}

/** GET /api/staff/stock/movements */
export class StockMovementQueryDto extends PageQueryDto {
  @IsOptional()
  @IsUUID('all', { message: 'Choose a product.' })
  productId?: string;

  @IsOptional()
  @IsIn(stockReasons as unknown as string[], { message: `Reason is one of ${stockReasons.join(', ')}.` })
  reason?: StockReason;
}

export interface StockMovementPageDto {
  items: StockMovementDto[];
  total: number;
  page: number;
  pageSize: number;
}

/** PUT /api/staff/stock/products/:id/threshold: null goes back to the shop's default. */
export class LowStockThresholdDto {
  @IsOptional()
  @IsInt({ message: 'The threshold is a whole number.' })
  @Min(0, { message: 'The threshold is at least 0.' })
  @Max(10_000, { message: 'The threshold is at most 10000.' })
  threshold!: number | null;
}

export interface LowStockListDto {
  defaultThreshold: number;
  items: LowStockItemDto[];
}

/** A product as the stock pages pick it: enough to find it by SKU and see its shelf. */
export interface StockProductDto {
  id: string;
  sku: string;
  name: string;
  binLocation: string;
  stockOnHand: number;
}

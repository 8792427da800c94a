import { IsIn, IsInt, IsOptional, IsString, Matches, Max, MaxLength, Min, MinLength } from 'class-validator';
import type { ShippingAddressDto } from '../commerce/checkout.dto';
import type { FulfilmentStatus } from '../order-status';
import { queueStates } from './fulfilment';

export interface ShipmentDto {
  id: string;
  carrier: string;
  trackingNumber: string;
  backOrdered: boolean;
  lines: { orderLineId: string; sku: string; name: string; quantity: number }[];
  shippedAt: string;
}

export interface WarehouseQueueItemDto {
  id: string;
  number: string;
  customerName: string;
  fulfilmentStatus: FulfilmentStatus;
  paidAt: string | null;
  units: number;
  unitsPicked: number;
}

export interface WarehouseQueueDto {
  counts: Record<FulfilmentStatus, number>;
  items: WarehouseQueueItemDto[];
}

/** GET /api/warehouse/orders: open work by default, or one state. */
export class WarehouseQueueQueryDto {
  @IsOptional()
  @IsIn(queueStates as unknown as string[], { message: `State is one of ${queueStates.join(', ')}.` })
  state?: FulfilmentStatus;
}

export interface PickLineDto {
  id: string;
  productId: string | null;
  sku: string;
  name: string;
  binLocation: string;
  quantity: number;
  refundedQuantity: number;
  pickedQuantity: number;
  shippedQuantity: number;
  due: number;
  /** Code 128 of the SKU as an SVG data URI, for the printed pick list and the scanner. */
  barcode: string;
}

export interface PickListDto {
  id: string;
  number: string;
  customerName: string;
  shippingAddress: ShippingAddressDto;
  fulfilmentStatus: FulfilmentStatus;
  paidAt: string | null;
  packedAt: string | null;
  shippedAt: string | null;
  deliveredAt: string | null;
  lines: PickLineDto[];
  shipments: ShipmentDto[];
  mayPick: boolean;
  mayPack: boolean;
  /** The state a parcel sent now would leave the order in, if one can leave. */
  shipWouldLeave: FulfilmentStatus | null;
  mayDeliver: boolean;
}

/** POST /api/warehouse/orders/:id/scan: the code read off a shelf label or typed in. */
export class ScanDto {
  @IsString({ message: 'Scan or type a code.' })
  @MinLength(1, { message: 'Scan or type a code.' })
  @MaxLength(60, { message: 'A code has at most 60 characters.' })
  code!: string;
}

/** PUT /api/warehouse/orders/:id/lines/:lineId/picked: how many of the line are in the tote (a tick sets all). */
export class SetPickedDto {
  @IsInt({ message: 'Picked is a whole number.' })
  @Min(0, { message: 'Picked is at least 0.' })
  @Max(10_000, { message: 'Picked is at most 10000.' })
  pickedQuantity!: number;
}

/** POST /api/warehouse/orders/:id/ship */
export class ShipDto {
  @IsString({ message: 'Give the carrier.' })
  @MinLength(2, { message: 'Give the carrier.' })
  @MaxLength(60, { message: 'The carrier has at most 60 characters.' })
  @Matches(/\S/, { message: 'Give the carrier.' })
  carrier!: string;

  @IsString({ message: 'Give the tracking number.' })
  @MaxLength(60, { message: 'The tracking number has at most 60 characters.' })
  @Matches(/^[A-Za-z0-9][A-Za-z0-9 -]{3,59}$/, { message: 'A tracking number is 4 to 60 letters, digits, spaces or dashes.' })
  trackingNumber!: string;
}

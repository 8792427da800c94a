import { Type } from 'class-transformer';
import { ArrayMaxSize, ArrayMinSize, IsArray, IsBoolean, IsIn, IsInt, IsOptional, IsString, IsUUID, MaxLength, Min, ValidateNested } from 'class-validator';
import { PageQueryDto, type ProductKind } from '../catalogue';
import type { CurrencyCode } from '../money';
import { fulfilmentStatuses, orderStatuses, paymentStatuses, type CancelReason, type FulfilmentStatus, type OrderStatus, type PaymentStatus } from '../order-status';
import type { SpringSetDto, SpringSetupDto } from './cart.dto';
import type { ShippingAddressDto } from './checkout.dto';
import type { ShipmentDto } from '../warehouse/fulfilment.dto';

export interface OrderLineDto {
  id: string;
  productId: string | null;
  sku: string;
  name: string;
  kind: ProductKind;
  unitPriceCents: number;
  quantity: number;
  lineTotalCents: number;
  refundedQuantity: number;
  restockedQuantity: number;
  /** Units that have left in a parcel. */
  shippedQuantity: number;
  springSetId: string | null;
  setup: SpringSetupDto | null;
}

export interface OrderSummaryDto {
  id: string;
  number: string;
  email: string;
  customerName: string;
  status: OrderStatus;
  paymentStatus: PaymentStatus;
  fulfilmentStatus: FulfilmentStatus;
  cancelReason: CancelReason | null;
  currency: CurrencyCode;
  totalCents: number;
  refundedCents: number;
  itemCount: number;
  createdAt: string;
}

export interface OrderDto extends OrderSummaryDto {
  shippingAddress: ShippingAddressDto;
  subtotalCents: number;
  shippingCents: number;
  vatCents: number;
  vatRateBasisPoints: number;
  paymentUrl: string | null;
  paymentFailure: string | null;
  reservedUntil: string;
  lines: OrderLineDto[];
  sets: SpringSetDto[];
  milestones: { paidAt: string | null; paymentFailedAt: string | null; confirmedAt: string | null; cancelledAt: string | null; refundedAt: string | null; packedAt: string | null; shippedAt: string | null; deliveredAt: string | null; completedAt: string | null };
  refunds: { id: string; amountCents: number; reason: string; createdAt: string }[];
  mayCancel: boolean;
  /** Staff may cancel it: pending and not paid. */
  mayStaffCancel: boolean;
  mayRefund: boolean;
  /** Parcels sent, with carrier and tracking number. */
  shipments: ShipmentDto[];
}

/** GET /api/staff/orders */
export class StaffOrderQueryDto extends PageQueryDto {
  @IsOptional()
  @IsIn(orderStatuses as unknown as string[], { message: `Status is one of ${orderStatuses.join(', ')}.` })
  status?: OrderStatus;

  @IsOptional()
  @IsIn(paymentStatuses as unknown as string[], { message: `Payment status is one of ${paymentStatuses.join(', ')}.` })
  paymentStatus?: PaymentStatus;

  @IsOptional()
  @IsIn(fulfilmentStatuses as unknown as string[], { message: `Fulfilment status is one of ${fulfilmentStatuses.join(', ')}.` })
  fulfilmentStatus?: FulfilmentStatus;

  @IsOptional()
  @IsString({ message: 'Search is text.' })
  @MaxLength(100, { message: 'Search has at most 100 characters.' })
  q?: string;
}

export class RefundLineDto {
  @IsUUID('all', { message: 'Choose an order line.' })
  orderLineId!: string;

  @IsInt({ message: 'Quantity is a whole number.' })
  @Min(1, { message: 'Refund at least 1.' })
  quantity!: number;

  /** The item came back to the shelf. */
  @IsBoolean({ message: 'Say whether the item came back (true or false).' })
  restock!: boolean;
}

/** POST /api/staff/orders/:id/refunds: no lines means the whole order. */
export class RefundDto {
  @IsOptional()
  @IsArray({ message: 'Lines are a list.' })
  @ArrayMinSize(1, { message: 'Choose at least one line, or leave lines out to refund the whole order.' })
  @ArrayMaxSize(100, { message: 'At most 100 lines.' })
  @ValidateNested({ each: true })
  @Type(() => RefundLineDto)
  lines?: RefundLineDto[];

  /** For a whole-order refund: did the items come back? */
  @IsOptional()
  @IsBoolean({ message: 'Say whether the items came back (true or false).' })
  restock?: boolean;

  @IsOptional()
  @IsString({ message: 'The reason is text.' })
  @MaxLength(500, { message: 'The reason has at most 500 characters.' })
  reason?: string;
}

/** The guest link's token, for opening or cancelling an order without signing in. */
export class OrderAccessQueryDto {
  @IsOptional()
  @IsString()
  @MaxLength(100)
  token?: string;
}

import { Type } from 'class-transformer';
import { IsBoolean, IsIn, IsInt, IsOptional, IsString, IsUUID, Max, MaxLength, Min, MinLength, ValidateIf, ValidateNested } from 'class-validator';
import type { SagCheckResult, SpringReason, SpringVerdict } from '../engine/types';
import { SagCheckRequestDto } from '../dto/calculations.dto';
import { exchangeKinds, exchangeReasons, exchangeStates, type ExchangeKind, type ExchangeReason, type ExchangeState, type Settlement } from '../exchange-status';
import type { CurrencyCode } from '../money';

/** A spring the engine judged for the order's saved load, with its price now. */
export interface ExchangeReplacementDto {
  productId: string;
  name: string;
  sku: string;
  rateNPerMm: number;
  priceCents: number;
  inStock: boolean;
  verdict: SpringVerdict;
  reason: SpringReason;
  staticSagMm: number;
  riderSagMm: number;
  preloadMm: number;
  preloadNeededMm: number;
  preloadRangeMm: { min: number; max: number };
  coilBindMarginMm?: number;
}

/** A sag check attached to a request: the readings as sent and the verdict the server worked out from them. */
export interface ExchangeSagCheckDto {
  input: SagCheckRequestDto;
  result: SagCheckResult;
}

/** GET /api/exchanges/proposal?orderLineId=…: what the request page offers for one spring line. */
export interface ExchangeProposalDto {
  orderId: string;
  orderNumber: string;
  orderLineId: string;
  /** Null for a line that is not a spring: it can be returned, not exchanged. */
  end: 'fork' | 'shock' | null;
  bought: { productId: string | null; name: string; sku: string; rateNPerMm: number | null; quantity: number; unitPriceCents: number };
  targets: { staticSagMm: number; riderSagMm: number; staticSagToleranceMm: number } | null;
  currency: CurrencyCode;
  /** The best-ranked rate the engine calls ok for the saved load, other than the one bought; null when there is none. */
  proposed: ExchangeReplacementDto | null;
  /** Every other spring the engine judged for that end, best first. */
  options: ExchangeReplacementDto[];
  windowEndsAt: string | null;
  /** Why no request can be made now (window closed, not delivered, already asked); null when one can. */
  blockedBy: string | null;
}

export class ExchangeProposalQueryDto {
  @IsUUID('all', { message: 'Choose a spring line of the order.' })
  orderLineId!: string;

  @IsOptional()
  @IsIn(exchangeReasons as unknown as string[], { message: `Reason is one of ${exchangeReasons.join(', ')}.` })
  reason?: ExchangeReason;
}

/** POST /api/exchanges */
export class ExchangeRequestDto {
  @IsUUID('all', { message: 'Choose a spring line of the order.' })
  orderLineId!: string;

  @IsIn(exchangeKinds as unknown as string[], { message: 'Ask for an exchange or a return.' })
  kind!: ExchangeKind;

  @IsIn(exchangeReasons as unknown as string[], { message: 'Say whether the spring is too soft, too stiff or something else.' })
  reason!: ExchangeReason;

  @ValidateIf((o: ExchangeRequestDto) => o.reason === 'other' || o.reasonText !== undefined)
  @IsString({ message: 'Tell us what is wrong in a few words.' })
  @MinLength(3, { message: 'Tell us what is wrong in a few words.' })
  @MaxLength(1000, { message: 'At most 1000 characters.' })
  reasonText?: string;

  /** Another rate for this end; the proposed one when left out. Only for an exchange. */
  @ValidateIf((o: ExchangeRequestDto) => o.replacementProductId !== undefined)
  @IsUUID('all', { message: 'Choose a spring the shop offers for this bike.' })
  replacementProductId?: string;

  @IsOptional()
  @ValidateNested()
  @Type(() => SagCheckRequestDto)
  sagCheck?: SagCheckRequestDto;
}

/** POST /api/staff/exchanges/:id/decision */
export class ExchangeDecisionDto {
  @IsBoolean({ message: 'Approve (true) or refuse (false).' })
  approve!: boolean;

  @IsString({ message: 'Write a message to the rider.' })
  @MinLength(3, { message: 'Write a message to the rider.' })
  @MaxLength(1000, { message: 'At most 1000 characters.' })
  message!: string;
}

/** POST /api/warehouse/exchanges/:id/ship */
export class ExchangeShipDto {
  @IsString({ message: 'Name the carrier.' })
  @MinLength(2, { message: 'Name the carrier.' })
  @MaxLength(60, { message: 'At most 60 characters.' })
  carrier!: string;

  @IsString({ message: 'Give the tracking number.' })
  @MinLength(4, { message: 'Give the tracking number.' })
  @MaxLength(80, { message: 'At most 80 characters.' })
  trackingNumber!: string;
}

/** GET /api/staff/exchanges and /api/warehouse/exchanges */
export class ExchangeQueryDto {
  @IsOptional()
  @IsIn(exchangeStates as unknown as string[], { message: `State is one of ${exchangeStates.join(', ')}.` })
  state?: ExchangeState;

  @IsOptional()
  @IsIn(exchangeReasons as unknown as string[], { message: `Reason is one of ${exchangeReasons.join(', ')}.` })
  reason?: ExchangeReason;

  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: 'Limit is a whole number.' })
  @Min(1, { message: 'Limit is at least 1.' })
  @Max(200, { message: 'Limit is at most 200.' })
  limit?: number;
}

export interface ExchangeDto {
  id: string;
  number: string;
  kind: ExchangeKind;
  state: ExchangeState;
  settlement: Settlement;
  orderId: string;
  orderNumber: string;
  orderLineId: string;
  email: string;
  bought: { productId: string | null; name: string; sku: string; rateNPerMm: number | null; quantity: number; unitPriceCents: number };
  replacement: ExchangeReplacementDto | null;
  currency: CurrencyCode;
  /** Positive: the rider pays; negative: the shop refunds. */
  differenceCents: number;
  reason: ExchangeReason;
  reasonText: string;
  sagCheck: ExchangeSagCheckDto | null;
  staffMessage: string;
  paymentUrl: string | null;
  carrier: string | null;
  trackingNumber: string | null;
  createdAt: string;
  decidedAt: string | null;
  receivedAt: string | null;
  settledAt: string | null;
  shippedAt: string | null;
}

/** Open exchanges and returns counted by state and reason (for the dashboard). */
export interface ExchangeCountDto {
  state: ExchangeState;
  reason: ExchangeReason;
  kind: ExchangeKind;
  count: number;
}

import { IsBoolean, IsInt, IsOptional, IsUUID, Max, Min, ValidateIf } from 'class-validator';
import { RecommendationRequestDto, type ProductKind, type ResolvedLoadDto, type RidingStyle } from '../catalogue';
import type { SpringVerdict } from '../engine/types';
import type { CartTotals, PricingSettings } from '../cart-totals';
import type { CurrencyCode } from '../money';

import { maxLineQuantity } from './limits';

export { maxLineQuantity };

const quantity = () => [
  IsInt({ message: 'Quantity is a whole number.' }),
  Min(1, { message: 'Quantity is at least 1.' }),
  Max(maxLineQuantity, { message: `Quantity is at most ${maxLineQuantity}.` }),
];
const applyAll = (ds: PropertyDecorator[]): PropertyDecorator => (t, k) => ds.forEach((d) => d(t, k));

/** POST /api/cart/lines */
export class AddCartLineDto {
  @IsUUID('all', { message: 'Choose a product.' })
  productId!: string;

  @applyAll(quantity())
  quantity!: number;
}

/** PATCH /api/cart/lines/:id */
export class UpdateCartLineDto {
  @applyAll(quantity())
  quantity!: number;
}

/**
 * POST /api/cart/spring-set: the recommendation's load plus the springs chosen. The server runs the engine again, so the
 * set, its figures and its prices are the engine's and the catalogue's, never the client's.
 */
export class AddSpringSetDto extends RecommendationRequestDto {
  @ValidateIf((o: AddSpringSetDto) => o.forkProductId !== undefined || o.shockProductId === undefined)
  @IsUUID('all', { message: 'Choose a fork spring, a shock spring or both.' })
  forkProductId?: string;

  @IsOptional()
  @IsUUID('all', { message: 'Choose a shock spring from the list.' })
  shockProductId?: string;

  /** Needed to add a spring the engine does not call ok for this load. */
  @IsOptional()
  @IsBoolean({ message: 'acceptVerdict is true or false.' })
  acceptVerdict?: boolean;
}

/** The setup figures of one end of a spring set, as the engine gave them; kept with the cart and the order. */
export interface SpringSetupDto {
  end: 'fork' | 'shock';
  productId: string;
  springName: string;
  sku: string;
  rateNPerMm: number;
  /** Springs at this end (2 for most forks). */
  springCount: number;
  preloadMm: number;
  adjusterTurns?: number;
  staticSagMm: number;
  riderSagMm: number;
  targets: { staticSagMm: number; riderSagMm: number };
  toleranceMm: number;
  verdict: SpringVerdict;
}

export interface SpringSetDto {
  id: string;
  fitmentId: string | null;
  bikeLabel: string;
  ridingStyle: RidingStyle;
  loads: ResolvedLoadDto[];
  setup: SpringSetupDto[];
}

export interface CartLineDto {
  id: string;
  productId: string;
  sku: string;
  name: string;
  kind: ProductKind;
  quantity: number;
  /** The price copied when the line was added: what checkout charges unless it changed since. */
  unitPriceCents: number;
  /** The catalogue's price now; differs from unitPriceCents when it changed since the line was added. */
  currentPriceCents: number;
  lineTotalCents: number;
  stockOnHand: number;
  available: boolean;
  springSetId: string | null;
  verdict: SpringVerdict | null;
  /** Why the rider should look again (a spring the engine does not call ok, a changed price, too few in stock). */
  warnings: string[];
}

export interface ShopPublicDto extends PricingSettings {
  shopName: string;
  shopAddress: string;
  reservationMinutes: number;
}

export interface CartDto {
  lines: CartLineDto[];
  sets: SpringSetDto[];
  totals: CartTotals;
  shop: ShopPublicDto;
  itemCount: number;
  currency: CurrencyCode;
}

import type { ExchangeReason } from '../exchange-status';
import type { CurrencyCode } from '../money';

/** The longest range the dashboard sums over in one request. */
export const maxDashboardDays = 366;

export interface DashboardDayDto {
  /** YYYY-MM-DD in the shop's time zone (UTC). */
  day: string;
  orders: number;
  revenueCents: number;
}

export interface TopSpringDto {
  productId: string | null;
  sku: string;
  name: string;
  unitsSold: number;
  revenueCents: number;
}

export interface RecommendationShareDto {
  /** Recommendation answers the API served in the range. */
  served: number;
  /** Distinct spring sets (a recommendation taken to the cart) on lines of orders paid in the range. */
  purchased: number;
  /** purchased / served in basis points (10000 = every recommendation bought); null when none were served. */
  shareBasisPoints: number | null;
}

/** Exchanges and returns not yet finished (requested, approved, or received and waiting for the replacement), whenever asked. */
export interface OpenExchangesDto {
  total: number;
  /** Every reason, in the order of `exchangeReasons`, zero included. */
  byReason: { reason: ExchangeReason; count: number }[];
}

export interface LowStockDto {
  productId: string;
  sku: string;
  name: string;
  stockOnHand: number;
}

export interface DashboardDto {
  from: string;
  to: string;
  currency: CurrencyCode;
  lowStockThreshold: number;
  days: DashboardDayDto[];
  totals: { orders: number; revenueCents: number };
  topSprings: TopSpringDto[];
  recommendations: RecommendationShareDto;
  exchanges: OpenExchangesDto;
  lowStock: LowStockDto[];
}

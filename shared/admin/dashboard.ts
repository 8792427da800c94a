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

export const exchangeReasons = ['too-soft', 'too-stiff', 'other'] as const;
export type ExchangeReason = (typeof exchangeReasons)[number];

export interface OpenExchangesDto {
  /** False while no exchange records exist in this build: the figures are then zero, not measured. */
  available: boolean;
  total: number;
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

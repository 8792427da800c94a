import type { CurrencyCode } from '../money';

// The allowed range of every numeric shop setting, in one decorator-free table: the request DTO enforces it and the
// settings page checks it before saving, so the two cannot drift apart.

export interface SettingRange {
  min: number;
  max: number;
  /** As written after the number in messages and beside the field. */
  unit: string;
}

export const shopSettingRanges = {
  /** Basis points: 2000 is 20 %. */
  vatRateBasisPoints: { min: 0, max: 5000, unit: 'bp' },
  shippingFlatCents: { min: 0, max: 100_000, unit: 'cents' },
  freeShippingThresholdCents: { min: 0, max: 10_000_000, unit: 'cents' },
  reservationMinutes: { min: 1, max: 1440, unit: 'minutes' },
  exchangeWindowDays: { min: 0, max: 365, unit: 'days' },
  lowStockThreshold: { min: 0, max: 10_000, unit: 'units' },
} as const satisfies Record<string, SettingRange>;
export type RangedSetting = keyof typeof shopSettingRanges;

export const shopNameLength = { min: 2, max: 120 } as const;
export const shopAddressLength = { min: 5, max: 400 } as const;
/** Prices are stored without a currency, so the shop keeps the one its prices were entered in. */
export const shopCurrencies = ['EUR'] as const satisfies readonly CurrencyCode[];

/** Every setting as the admin page shows and sends it. */
export interface ShopSettingsDto {
  shopName: string;
  shopAddress: string;
  currency: CurrencyCode;
  vatRateBasisPoints: number;
  shippingFlatCents: number;
  freeShippingThresholdCents: number;
  /** Null: the server's RESERVATION_MINUTES stands. */
  reservationMinutes: number | null;
  exchangeWindowDays: number;
  lowStockThreshold: number;
  updatedAt: string;
}

/** What a signed-out visitor may read: the shop's identity for the setup sheet and receipts. */
export interface ShopIdentityDto {
  shopName: string;
  shopAddress: string;
}

/**
 * The message for a value outside its range, shared by the DTO and the page's early check.
 * @example rangeMessage('Reservation minutes', 'reservationMinutes') // "Reservation minutes is a whole number from 1 to 1440 minutes."
 */
export function rangeMessage(label: string, key: RangedSetting): string {
  const r = shopSettingRanges[key];
  return `${label} is a whole number from ${r.min} to ${r.max} ${r.unit}.`;
}

/** The early check the page runs; undefined when the value fits. */
export function checkRange(label: string, key: RangedSetting, value: number | null | undefined): string | undefined {
  if (value === null || value === undefined) return key === 'reservationMinutes' ? undefined : `Enter ${label.toLowerCase()}.`;
  const r = shopSettingRanges[key];
  return Number.isInteger(value) && value >= r.min && value <= r.max ? undefined : rangeMessage(label, key);
}

export const shopSettingLabels: Record<RangedSetting, string> = {
  vatRateBasisPoints: 'VAT rate (basis points)',
  shippingFlatCents: 'Shipping flat rate (cents)',
  freeShippingThresholdCents: 'Free shipping from (cents)',
  reservationMinutes: 'Reservation minutes',
  exchangeWindowDays: 'Exchange window (days)',
  lowStockThreshold: 'Low-stock threshold',
};

/** Why a product's on-hand count changed; every change is one ledger row with one of these. */
export const stockReasons = ['sale', 'expiry', 'cancel', 'refund', 'receipt', 'return', 'adjustment'] as const;
export type StockReason = (typeof stockReasons)[number];

/** Which way each reason may move the count: a sale takes off the shelf, an adjustment goes either way, the rest put back. */
export const stockReasonSign: Record<StockReason, -1 | 1 | 0> = {
  sale: -1,
  expiry: 1,
  cancel: 1,
  refund: 1,
  receipt: 1,
  return: 1,
  adjustment: 0,
};

/**
 * Tells whether a quantity change fits its reason (never zero).
 * @example fitsReason('sale', -2) // true
 * @example fitsReason('receipt', -1) // false
 */
export function fitsReason(reason: StockReason, quantity: number): boolean {
  if (!Number.isInteger(quantity) || quantity === 0) return false;
  const sign = stockReasonSign[reason];
  return sign === 0 || Math.sign(quantity) === sign;
}

/** Low stock when the count is at or under the threshold (common practice: a reorder point). Default until the shop sets one. */
export const defaultLowStockThreshold = 3;

/**
 * @example isLowStock(3, 3) // true
 * @example isLowStock(4, 3) // false
 */
export function isLowStock(onHand: number, threshold: number): boolean {
  return onHand <= threshold;
}

export interface StockMovementDto {
  id: string;
  productId: string;
  sku: string;
  productName: string;
  quantity: number;
  reason: StockReason;
  orderId: string | null;
  orderNumber: string | null;
  exchangeId: string | null;
  deliveryRef: string | null;
  note: string;
  actorName: string | null;
  stockAfter: number;
  createdAt: string;
}

export interface LowStockItemDto {
  productId: string;
  sku: string;
  name: string;
  binLocation: string;
  stockOnHand: number;
  threshold: number;
  thresholdIsDefault: boolean;
}

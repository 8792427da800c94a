/** Everything an order mail may show, copied from the order when the mail is queued (amounts in integer cents). */
export interface OrderMailData {
  orderNumber: string;
  /** Where the customer follows the order; for a guest it carries the order's unguessable token. */
  orderUrl: string;
  setupSheetUrl?: string;
  customerName: string;
  shop: { name: string; address: string };
  /** ISO 4217 code, e.g. "EUR". */
  currency: string;
  lines: OrderMailLine[];
  subtotalCents: number;
  shippingCents: number;
  /** The VAT included in the total (prices include VAT). */
  vatCents: number;
  totalCents: number;
  setup: OrderMailSetup[];
  /** Why a payment failed or an order was cancelled, in words for the customer. */
  reason?: string;
  refundCents?: number;
  carrier?: string;
  trackingNumber?: string;
}

export interface OrderMailLine {
  name: string;
  sku: string;
  quantity: number;
  unitPriceCents: number;
  lineTotalCents: number;
}

/** The setup figures of one spring line, as the engine computed them for the rider's load. */
export interface OrderMailSetup {
  end: 'fork' | 'shock';
  springName: string;
  rateNPerMm: number;
  preloadMm: number;
  adjusterTurns?: number;
  staticSagMm: number;
  riderSagMm: number;
  toleranceMm: number;
}

import type { ExchangeReason, ExchangeState, Settlement } from '@shared/exchange-status';

/** Our own words for exchange states, reasons and the money, shown to riders, staff and the warehouse alike. */
export const exchangeStateLabels: Record<ExchangeState, string> = {
  requested: 'Waiting for the shop',
  approved: 'Approved: send the spring back',
  refused: 'Not accepted',
  received: 'Spring received',
  shipped: 'Replacement shipped',
  refunded: 'Refunded',
};

export const exchangeReasonLabels: Record<ExchangeReason, string> = {
  'too-soft': 'Too soft',
  'too-stiff': 'Too stiff',
  other: 'Something else',
};

export const settlementLabels: Record<Settlement, string> = {
  none: 'No difference to settle',
  'awaiting-payment': 'Difference to pay',
  paid: 'Difference paid',
  'refund-due': 'Refund on receipt',
  refunded: 'Refunded',
};

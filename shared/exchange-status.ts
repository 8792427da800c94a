/** An exchange swaps a bought spring for another rate; a return gives the money back. Both travel one path. */
export const exchangeKinds = ['exchange', 'return'] as const;
export type ExchangeKind = (typeof exchangeKinds)[number];

export const exchangeStates = ['requested', 'approved', 'refused', 'received', 'shipped', 'refunded'] as const;
export type ExchangeState = (typeof exchangeStates)[number];

export const exchangeReasons = ['too-soft', 'too-stiff', 'other'] as const;
export type ExchangeReason = (typeof exchangeReasons)[number];

/** Where the price difference stands: charged through a new payment page, or refunded on receipt. */
export const settlements = ['none', 'awaiting-payment', 'paid', 'refund-due', 'refunded'] as const;
export type Settlement = (typeof settlements)[number];

/** Every allowed move per kind; anything not listed is refused. A return ends refunded, an exchange ends shipped. */
export const exchangeMoves = {
  exchange: { requested: ['approved', 'refused'], approved: ['received'], received: ['shipped'], refused: [], shipped: [], refunded: [] },
  return: { requested: ['approved', 'refused'], approved: ['received'], received: ['refunded'], refused: [], shipped: [], refunded: [] },
} as const satisfies Record<ExchangeKind, Record<ExchangeState, readonly ExchangeState[]>>;

/** States a request can still move on from: the ones waiting on staff, the warehouse or a payment. */
export const openExchangeStates: readonly ExchangeState[] = exchangeStates.filter((s) => exchangeKinds.some((k) => exchangeMoves[k][s].length > 0));

export interface ExchangeStates {
  kind: ExchangeKind;
  state: ExchangeState;
  settlement: Settlement;
}

/**
 * Tells whether an exchange or return may move to a state. The replacement ships only once any difference owed is paid.
 * @example canMoveExchange({ kind: 'exchange', state: 'requested', settlement: 'none' }, 'approved') // true
 * @example canMoveExchange({ kind: 'exchange', state: 'received', settlement: 'awaiting-payment' }, 'shipped') // false
 */
export function canMoveExchange(e: ExchangeStates, to: ExchangeState): boolean {
  if (!(exchangeMoves[e.kind][e.state] as readonly ExchangeState[]).includes(to)) return false;
  if (to === 'shipped') return e.settlement !== 'awaiting-payment';
  return true;
}

/** Why a move is refused, in words for the person who tried it. */
export function exchangeMoveRefusal(e: ExchangeStates, to: ExchangeState): string | null {
  if (canMoveExchange(e, to)) return null;
  if (to === 'shipped' && e.settlement === 'awaiting-payment' && e.state === 'received') return 'The price difference is not paid yet, so the replacement cannot ship.';
  return `A ${e.kind} that is ${e.state} cannot become ${to}.`;
}

const dayMs = 86_400_000;

/**
 * The last moment a rider may ask for an exchange or return: the given number of days after delivery; null before delivery.
 * @example exchangeWindowEnd(new Date('2026-01-01T10:00:00Z'), 30)?.toISOString() // '2026-01-31T10:00:00.000Z'
 */
export function exchangeWindowEnd(deliveredAt: Date | string | null, windowDays: number): Date | null {
  if (!deliveredAt) return null;
  return new Date(new Date(deliveredAt).getTime() + windowDays * dayMs);
}

/** True while the window after delivery is open. */
export function exchangeWindowOpen(deliveredAt: Date | string | null, windowDays: number, now: Date = new Date()): boolean {
  const end = exchangeWindowEnd(deliveredAt, windowDays);
  return end !== null && now.getTime() <= end.getTime();
}

/**
 * What the rider pays (positive) or gets back (negative) for swapping units, in integer cents; a return gets the whole price back.
 * @example exchangeDifferenceCents('exchange', 6_450, 6_950, 2) // 1_000
 * @example exchangeDifferenceCents('return', 6_450, null, 2) // -12_900
 */
export function exchangeDifferenceCents(kind: ExchangeKind, paidUnitCents: number, replacementUnitCents: number | null, quantity: number): number {
  if (kind === 'return' || replacementUnitCents === null) return -paidUnitCents * quantity;
  return (replacementUnitCents - paidUnitCents) * quantity;
}

/** The settlement a difference starts in when staff approve. */
export function settlementFor(differenceCents: number): Settlement {
  return differenceCents > 0 ? 'awaiting-payment' : differenceCents < 0 ? 'refund-due' : 'none';
}

import { describe, expect, it } from 'vitest';
import { canMoveExchange, exchangeDifferenceCents, exchangeMoveRefusal, exchangeStates, exchangeWindowEnd, exchangeWindowOpen, settlementFor } from './exchange-status';

describe('exchange states', () => {
  it('an exchange goes requested → approved → received → shipped and a return ends refunded', () => {
    const ex = { kind: 'exchange', settlement: 'none' } as const;
    expect(canMoveExchange({ ...ex, state: 'requested' }, 'approved')).toBe(true);
    expect(canMoveExchange({ ...ex, state: 'approved' }, 'received')).toBe(true);
    expect(canMoveExchange({ ...ex, state: 'received' }, 'shipped')).toBe(true);
    expect(canMoveExchange({ ...ex, state: 'received' }, 'refunded')).toBe(false);
    expect(canMoveExchange({ kind: 'return', settlement: 'refund-due', state: 'received' }, 'refunded')).toBe(true);
    expect(canMoveExchange({ kind: 'return', settlement: 'refund-due', state: 'received' }, 'shipped')).toBe(false);
  });

  it('refuses skipping a step, leaving an end state and shipping before the difference is paid', () => {
    const ex = { kind: 'exchange', settlement: 'none' } as const;
    expect(canMoveExchange({ ...ex, state: 'requested' }, 'received')).toBe(false);
    expect(canMoveExchange({ ...ex, state: 'approved' }, 'shipped')).toBe(false);
    for (const to of exchangeStates) {
      expect(canMoveExchange({ ...ex, state: 'refused' }, to)).toBe(false);
      expect(canMoveExchange({ ...ex, state: 'shipped' }, to)).toBe(false);
    }
    const owing = { kind: 'exchange', state: 'received', settlement: 'awaiting-payment' } as const;
    expect(canMoveExchange(owing, 'shipped')).toBe(false);
    expect(exchangeMoveRefusal(owing, 'shipped')).toMatch(/not paid/);
    expect(canMoveExchange({ ...owing, settlement: 'paid' }, 'shipped')).toBe(true);
  });
});

describe('exchange window', () => {
  it('is open until the set number of days after delivery, and closed before delivery', () => {
    const delivered = new Date('2026-03-01T12:00:00Z');
    // 30 days after 1 March 12:00 UTC is 31 March 12:00 UTC (calendar arithmetic, UTC has no daylight shift).
    expect(exchangeWindowEnd(delivered, 30)?.toISOString()).toBe('2026-03-31T12:00:00.000Z');
    expect(exchangeWindowOpen(delivered, 30, new Date('2026-03-31T12:00:00Z'))).toBe(true);
    expect(exchangeWindowOpen(delivered, 30, new Date('2026-03-31T12:00:01Z'))).toBe(false);
    expect(exchangeWindowOpen(null, 30)).toBe(false);
  });
});

describe('price difference', () => {
  it('is whole cents: a dearer rate is charged, a cheaper one refunded, a return refunds the price paid', () => {
    expect(exchangeDifferenceCents('exchange', 6_450, 6_950, 2)).toBe(1_000);
    expect(exchangeDifferenceCents('exchange', 15_900, 14_900, 1)).toBe(-1_000);
    expect(exchangeDifferenceCents('exchange', 6_450, 6_450, 2)).toBe(0);
    expect(exchangeDifferenceCents('return', 6_450, null, 2)).toBe(-12_900);
    expect([settlementFor(1), settlementFor(-1), settlementFor(0)]).toEqual(['awaiting-payment', 'refund-due', 'none']);
  });
});

import { describe, expect, it } from 'vitest';
import { exchangeMail, type ExchangeMailData } from './exchange-mail';

const base: ExchangeMailData = {
  step: 'approved',
  kind: 'exchange',
  number: 'EX-1001',
  orderNumber: 'LL-1001',
  customerName: 'Test Rider',
  shop: { name: 'Test Spring Shop', address: '1 Coil Lane\n10115 Eastbrook' },
  currency: 'EUR',
  bought: 'Shock 85',
  replacement: 'Shock 95',
  quantity: 1,
  differenceCents: 2_000,
  staffMessage: 'Send it back <b>clean</b>',
  paymentUrl: 'http://127.0.0.1:21500/pay/cs_test_1',
  refundedCents: null,
  carrier: null,
  trackingNumber: null,
  exchangeUrl: 'http://127.0.0.1:8115/exchanges?open=1',
};

describe('exchange mails', () => {
  it('each step has its own subject and names the exchange', () => {
    const steps = ['requested', 'approved', 'refused', 'received', 'paid', 'shipped'] as const;
    const subjects = steps.map((step) => exchangeMail({ ...base, step }).subject);
    expect(new Set(subjects).size).toBe(steps.length);
    for (const step of steps) expect(exchangeMail({ ...base, step }).text).toContain('EX-1001');
  });

  it('an approval of a dearer rate carries the payment link and the amount; the staff message is escaped in HTML', () => {
    const m = exchangeMail(base);
    expect(m.text).toContain('€20.00');
    expect(m.text).toContain(base.paymentUrl);
    expect(m.html).toContain('Send it back &lt;b&gt;clean&lt;/b&gt;');
    expect(m.html).not.toContain('<b>clean</b>');
    // Taking a spring off carries the usual caution.
    expect(m.text).toMatch(/qualified technician/);
  });

  it('a return tells what comes back, and the receipt tells what was refunded', () => {
    const r = exchangeMail({ ...base, kind: 'return', replacement: null, differenceCents: -12_900, paymentUrl: null, step: 'received', refundedCents: 12_900 });
    expect(r.text).toContain('€129.00');
    expect(r.text).not.toContain('replacement ships');
  });
});

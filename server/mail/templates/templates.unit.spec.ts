import { describe, expect, it } from 'vitest';
import { formatMoney } from '../../../shared/money-format';
import { esc } from './layout';
import type { MailBody, OrderMailData } from './index';
import { orderCancelledMail, orderConfirmationMail, passwordResetMail, paymentFailedMail, refundMail, shippedMail } from './index';

const hostileName = '<script>alert("name")</script> & "Rider"';
const hostileAddress = 'Flat 2 <img src=x onerror=alert(1)>\n7 Coil Street';

// Invented demo order; the figures only need to be distinct so each can be found in the mail.
const order: OrderMailData = {
  orderNumber: 'LL-2026-0042',
  orderUrl: 'https://shop.example.test/orders/abc?token=t0k3n',
  setupSheetUrl: 'https://shop.example.test/orders/abc/setup-sheet?token=t0k3n',
  customerName: hostileName,
  shop: { name: 'Demo <b>Springs</b>', address: hostileAddress },
  currency: 'EUR',
  lines: [
    { name: 'Fork spring pair <9.5>', sku: 'FS-95-<X>', quantity: 1, unitPriceCents: 13999, lineTotalCents: 13999 },
    { name: 'Shock spring 95 N/mm', sku: 'SS-95', quantity: 2, unitPriceCents: 8950, lineTotalCents: 17900 },
  ],
  subtotalCents: 31899,
  shippingCents: 695,
  vatCents: 5202,
  totalCents: 32594,
  setup: [
    { end: 'fork', springName: 'Fork spring pair <9.5>', rateNPerMm: 9.5, preloadMm: 12.25, adjusterTurns: 3.5, staticSagMm: 30, riderSagMm: 38.4, toleranceMm: 3 },
    { end: 'shock', springName: 'Shock spring 95 N/mm', rateNPerMm: 95, preloadMm: 8, staticSagMm: 28, riderSagMm: 95.04, toleranceMm: 4 },
  ],
  reason: 'Card <declined> & "expired"',
  refundCents: 13999,
  carrier: 'Parcel <Co>',
  trackingNumber: 'TRK-001&2',
};

const orderTemplates: [string, (d: OrderMailData) => MailBody][] = [
  ['order confirmation', orderConfirmationMail],
  ['payment failed', paymentFailedMail],
  ['order cancelled', orderCancelledMail],
  ['refund', refundMail],
  ['shipped', shippedMail],
];
const resetMail = passwordResetMail({
  displayName: hostileName,
  resetUrl: 'https://shop.example.test/reset-password?token=abc',
  validForMinutes: 60,
  shop: { name: 'Demo <b>Springs</b>', address: hostileAddress },
});
const allMails: [string, MailBody][] = [...orderTemplates.map(([n, t]) => [n, t(order)] as [string, MailBody]), ['password reset', resetMail]];
const euros = (cents: number) => formatMoney(cents, 'EUR');

/** A figure must read the same in both parts: literally in the text, HTML-escaped in the html. */
function expectInBothParts(m: MailBody, figure: string) {
  expect(m.text).toContain(figure);
  expect(m.html).toContain(esc(figure));
}

describe('mail templates escape what people typed', () => {
  it.each(allMails)('%s: names, addresses and reasons appear as text, never as markup', (_name, m) => {
    expect(m.html).not.toMatch(/<script|<img|<b>Springs/i);
    expect(m.html).toContain('&lt;script&gt;alert(&quot;name&quot;)&lt;/script&gt; &amp; &quot;Rider&quot;');
    expect(m.html).toContain('Flat 2 &lt;img src=x onerror=alert(1)&gt;<br>7 Coil Street');
    // The text part is not markup: it carries the words as typed.
    expect(m.text).toContain(hostileName);
    expect(m.text).toContain('7 Coil Street');
  });

  it.each(allMails)('%s: uses no style attributes or style sheets, so it renders under a strict Content-Security-Policy', (_name, m) => {
    expect(m.html).not.toMatch(/\sstyle=|<style/i);
  });

  it('a link that is not http(s) is made inert', () => {
    const m = orderConfirmationMail({ ...order, orderUrl: 'javascript:alert(1)' });
    expect(m.html).not.toContain('javascript:');
    expect(m.html).toContain('href="#"');
  });
});

describe('mail templates carry the same figures in html and text', () => {
  it('order confirmation: every line, the totals, the VAT and the setup figures', () => {
    const m = orderConfirmationMail(order);
    expect(m.subject).toBe('Order LL-2026-0042 is confirmed');
    for (const cents of [13999, 8950, 17900, 31899, 695, 5202, 32594]) expectInBothParts(m, euros(cents));
    expectInBothParts(m, '€325.94');
    for (const l of order.lines) {
      expectInBothParts(m, l.name);
      expectInBothParts(m, l.sku);
    }
    // Setup figures to one decimal as the setup sheet shows them; turns to the quarter.
    for (const f of ['9.5 N/mm', '12.3 mm', '3.5 turns', '30.0 mm ± 3.0 mm', '38.4 mm ± 3.0 mm', '95.0 N/mm', '8.0 mm', '95.0 mm ± 4.0 mm']) {
      expectInBothParts(m, f);
    }
    expectInBothParts(m, order.setupSheetUrl!);
    expectInBothParts(m, order.orderUrl);
    expect(m.text).toMatch(/spring compressor.*qualified suspension technician/s);
  });

  it('payment failed: the amount not charged and the reason', () => {
    const m = paymentFailedMail(order);
    expectInBothParts(m, euros(order.totalCents));
    expectInBothParts(m, order.reason!);
    expectInBothParts(m, 'nothing has been charged');
  });

  it('order cancelled: the refund when money was taken, "nothing was charged" when not', () => {
    const refunded = orderCancelledMail(order);
    expectInBothParts(refunded, euros(13999));
    expectInBothParts(refunded, order.reason!);
    const unpaid = orderCancelledMail({ ...order, refundCents: undefined });
    expectInBothParts(unpaid, 'Nothing was charged for this order.');
  });

  it('refund: the refunded amount in the subject and both parts, part or whole', () => {
    const part = refundMail(order);
    expect(part.subject).toBe('Refund of €139.99 for order LL-2026-0042');
    expectInBothParts(part, '€139.99');
    expectInBothParts(part, 'for part of your order');
    const whole = refundMail({ ...order, refundCents: order.totalCents });
    expectInBothParts(whole, 'for your whole order');
    expectInBothParts(whole, '€325.94');
  });

  it('shipped: carrier and tracking number', () => {
    const m = shippedMail(order);
    expectInBothParts(m, 'Parcel <Co>');
    expectInBothParts(m, 'TRK-001&2');
  });

  it('password reset: the link, how long it works, and what to do if it was not you', () => {
    expectInBothParts(resetMail, 'https://shop.example.test/reset-password?token=abc');
    expectInBothParts(resetMail, 'for 60 minutes');
    expectInBothParts(resetMail, 'ignore this mail');
  });

  it('free shipping says so and still shows the amount', () => {
    const m = orderConfirmationMail({ ...order, shippingCents: 0 });
    expectInBothParts(m, 'free (€0.00)');
  });
});

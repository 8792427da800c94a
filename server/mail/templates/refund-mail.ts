import { button, esc, htmlMail, paragraph, textMail, type MailBody } from './layout';
import type { OrderMailData } from './order-mail-data';
import { money } from './order-parts';

/** Sent when the shop refunds all or part of an order; `refundCents` is the amount of this refund. */
export function refundMail(d: OrderMailData): MailBody {
  const amount = money(d, d.refundCents ?? 0);
  const whole = d.refundCents === d.totalCents;
  const subject = `Refund of ${amount} for order ${d.orderNumber}`;
  const intro = `Hello ${d.customerName}, we have refunded ${amount} ${whole ? 'for your whole order' : 'for part of your order'} ${d.orderNumber} (order total ${money(d, d.totalCents)}).`;
  const reason = d.reason ? `Reason: ${d.reason}` : '';
  const when = 'The money goes back to the card you paid with; banks usually show it within a few working days.';
  const html = htmlMail(
    d.shop,
    subject,
    [`<h1>${esc(subject)}</h1>`, paragraph(intro), reason ? paragraph(reason) : '', paragraph(when), button('View the order', d.orderUrl)].join('\n'),
  );
  const text = textMail(d.shop, [subject.toUpperCase(), intro, reason, when, `The order: ${d.orderUrl}`]);
  return { subject, text, html };
}

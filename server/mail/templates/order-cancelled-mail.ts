import { button, esc, htmlMail, paragraph, textMail, type MailBody } from './layout';
import type { OrderMailData } from './order-mail-data';
import { linesHtml, linesText, money, totalsHtml, totalsText } from './order-parts';

/** Sent when an order is cancelled, by the rider, the shop or an unpaid reservation running out. */
export function orderCancelledMail(d: OrderMailData): MailBody {
  const subject = `Order ${d.orderNumber} is cancelled`;
  const intro = `Hello ${d.customerName}, your order ${d.orderNumber} has been cancelled.`;
  const reason = d.reason ? `Reason: ${d.reason}` : '';
  const refund = d.refundCents
    ? `We are refunding ${money(d, d.refundCents)} to the card you paid with; banks usually show it within a few working days.`
    : 'Nothing was charged for this order.';
  const html = htmlMail(
    d.shop,
    subject,
    [`<h1>${esc(subject)}</h1>`, paragraph(intro), reason ? paragraph(reason) : '', paragraph(refund), linesHtml(d), totalsHtml(d), button('View the order', d.orderUrl)].join('\n'),
  );
  const text = textMail(d.shop, [subject.toUpperCase(), intro, reason, refund, linesText(d), totalsText(d), `The order: ${d.orderUrl}`]);
  return { subject, text, html };
}

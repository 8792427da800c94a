import { button, esc, htmlMail, paragraph, textMail, type MailBody } from './layout';
import type { OrderMailData } from './order-mail-data';
import { linesHtml, linesText, money, totalsHtml, totalsText } from './order-parts';

/** Sent when the payment for an order was declined or failed: nothing was charged, the cart is still there. */
export function paymentFailedMail(d: OrderMailData): MailBody {
  const subject = `Payment for order ${d.orderNumber} did not go through`;
  const intro = `Hello ${d.customerName}, the payment of ${money(d, d.totalCents)} for your order was not completed, so nothing has been charged.`;
  const reason = d.reason ? `What the payment service told us: ${d.reason}` : '';
  const next = 'Your cart is kept as it was. You can try again with another card from your order page.';
  const html = htmlMail(
    d.shop,
    subject,
    [`<h1>${esc(subject)}</h1>`, paragraph(intro), reason ? paragraph(reason) : '', linesHtml(d), totalsHtml(d), paragraph(next), button('Try the payment again', d.orderUrl)].join('\n'),
  );
  const text = textMail(d.shop, [subject.toUpperCase(), intro, reason, linesText(d), totalsText(d), next, `Your order: ${d.orderUrl}`]);
  return { subject, text, html };
}

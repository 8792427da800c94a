import { button, esc, htmlMail, paragraph, textMail, type MailBody } from './layout';
import type { OrderMailData } from './order-mail-data';
import { linesHtml, linesText, money, setupHtml, setupText, totalsHtml, totalsText } from './order-parts';

/** Sent once the payment for an order is confirmed: what was bought, what it cost, and how to set it up. */
export function orderConfirmationMail(d: OrderMailData): MailBody {
  const subject = `Order ${d.orderNumber} is confirmed`;
  const intro = `Hello ${d.customerName}, thank you for your order. We have received your payment of ${money(d, d.totalCents)} and will pack your parts next.`;
  const html = htmlMail(
    d.shop,
    subject,
    [
      `<h1>Order ${esc(d.orderNumber)} is confirmed</h1>`,
      paragraph(intro),
      linesHtml(d),
      totalsHtml(d),
      setupHtml(d),
      button('View your order', d.orderUrl),
    ].join('\n'),
  );
  const text = textMail(d.shop, [
    subject.toUpperCase(),
    intro,
    linesText(d),
    totalsText(d),
    setupText(d),
    `View your order: ${d.orderUrl}`,
  ]);
  return { subject, text, html };
}

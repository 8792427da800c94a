import { button, esc, htmlMail, paragraph, textMail, type MailBody } from './layout';
import type { OrderMailData } from './order-mail-data';
import { linesHtml, linesText, setupHtml, setupText } from './order-parts';

/** Sent when the warehouse hands an order to the carrier. */
export function shippedMail(d: OrderMailData): MailBody {
  const subject = `Order ${d.orderNumber} is on its way`;
  const intro = `Hello ${d.customerName}, your parts have left our workshop.`;
  const tracking =
    d.carrier && d.trackingNumber
      ? `Carrier: ${d.carrier}, tracking number ${d.trackingNumber}.`
      : d.carrier
        ? `Carrier: ${d.carrier}.`
        : '';
  const html = htmlMail(
    d.shop,
    subject,
    [`<h1>${esc(subject)}</h1>`, paragraph(intro), tracking ? paragraph(tracking) : '', linesHtml(d), setupHtml(d), button('View your order', d.orderUrl)].join('\n'),
  );
  const text = textMail(d.shop, [subject.toUpperCase(), intro, tracking, linesText(d), setupText(d), `Your order: ${d.orderUrl}`]);
  return { subject, text, html };
}

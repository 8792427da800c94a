import { formatMoney } from '../../../shared/money-format';
import { button, esc, htmlMail, paragraph, textMail, type MailBody, type Shop } from './layout';

export type ExchangeMailStep = 'requested' | 'approved' | 'refused' | 'received' | 'paid' | 'shipped';

/** What every exchange or return mail shows, copied from the exchange at the moment of the step. */
export interface ExchangeMailData {
  step: ExchangeMailStep;
  kind: 'exchange' | 'return';
  number: string;
  orderNumber: string;
  customerName: string;
  shop: Shop;
  currency: string;
  bought: string;
  replacement: string | null;
  quantity: number;
  differenceCents: number;
  staffMessage: string;
  paymentUrl: string | null;
  refundedCents: number | null;
  carrier: string | null;
  trackingNumber: string | null;
  exchangeUrl: string;
}

function lines(d: ExchangeMailData): { subject: string; blocks: string[]; action?: { label: string; url: string } } {
  const what = d.kind === 'exchange' ? `exchange ${d.number}` : `return ${d.number}`;
  const swap = d.replacement ? `${d.quantity} × ${d.bought} for ${d.replacement}` : `${d.quantity} × ${d.bought}`;
  const money = (c: number) => formatMoney(c, d.currency);
  const difference =
    d.kind === 'return'
      ? `You get ${money(-d.differenceCents)} back once the spring reaches us.`
      : d.differenceCents > 0
        ? `The new rate costs ${money(d.differenceCents)} more.`
        : d.differenceCents < 0
          ? `The new rate costs ${money(-d.differenceCents)} less; we refund that once your spring reaches us.`
          : 'The new rate costs the same.';
  switch (d.step) {
    case 'requested':
      return { subject: `We have your ${what} request (order ${d.orderNumber})`, blocks: [`You asked to ${d.kind === 'exchange' ? 'exchange' : 'return'} ${swap}.`, 'We look at it and reply by mail, usually within two working days.'] };
    case 'approved':
      return {
        subject: `Your ${what} is approved`,
        blocks: [
          `We approved ${swap}.`,
          d.staffMessage ? `From the shop: ${d.staffMessage}` : '',
          difference,
          'Send the spring back clean and packed so it cannot knock about; a compressed spring stores a lot of energy, so take it off the bike as the maker’s manual describes, or have a qualified technician do it.',
        ],
        ...(d.paymentUrl && d.differenceCents > 0 ? { action: { label: `Pay the difference (${money(d.differenceCents)})`, url: d.paymentUrl } } : {}),
      };
    case 'refused':
      return { subject: `About your ${what}`, blocks: [`We cannot accept ${swap}.`, `From the shop: ${d.staffMessage}`] };
    case 'received':
      return {
        subject: `Your returned spring has arrived (${what})`,
        blocks: [
          'The spring you sent back is with us and back on our shelf.',
          d.refundedCents ? `We refunded ${money(d.refundedCents)} to the card you paid with; banks usually show it within a few working days.` : '',
          d.kind === 'exchange' ? 'Your replacement ships next; we mail you its tracking number.' : '',
        ],
      };
    case 'paid':
      return { subject: `Thank you: the difference for ${what} is paid`, blocks: [`We received ${money(d.differenceCents)}. Your replacement ships once your returned spring reaches us.`] };
    case 'shipped':
      return {
        subject: `Your replacement spring is on its way (${what})`,
        blocks: [`${d.replacement} has left our workshop.`, d.carrier ? `Carrier: ${d.carrier}, tracking number ${d.trackingNumber}.` : '', 'Check your sag after fitting; the setup figures are on your order page.'],
      };
  }
}

/** One template per step of an exchange or return, from request to the replacement shipped. */
export function exchangeMail(d: ExchangeMailData): MailBody {
  const { subject, blocks, action } = lines(d);
  const body = [`Hello ${d.customerName},`, ...blocks].filter(Boolean);
  const html = htmlMail(
    d.shop,
    subject,
    [`<h1>${esc(subject)}</h1>`, ...body.map(paragraph), action ? button(action.label, action.url) : '', button(`View ${d.kind} ${d.number}`, d.exchangeUrl)].join('\n'),
  );
  const text = textMail(d.shop, [subject.toUpperCase(), ...body, action ? `${action.label}: ${action.url}` : '', `Your ${d.kind}: ${d.exchangeUrl}`].filter(Boolean));
  return { subject, text, html };
}

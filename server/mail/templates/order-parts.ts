import { formatMoney } from '../../../shared/money-format';
import { esc, safeHref } from './layout';
import type { OrderMailData, OrderMailSetup } from './order-mail-data';

// Figures in mails read like the setup sheet: one decimal for rates and lengths, whole turns to a quarter.
const oneDecimal = (n: number) => (Math.round(n * 10) / 10).toFixed(1);
const turns = (n: number) => String(Math.round(n * 4) / 4);

export const money = (d: Pick<OrderMailData, 'currency'>, cents: number) => formatMoney(cents, d.currency);

const endLabel = (end: OrderMailSetup['end']) => (end === 'fork' ? 'Fork' : 'Shock');

export function linesHtml(d: OrderMailData): string {
  const rows = d.lines
    .map(
      (l) =>
        `<tr><td>${esc(l.name)}<br><font size="2" color="#44545a">${esc(l.sku)}</font></td>` +
        `<td align="right">${esc(l.quantity)}</td><td align="right">${esc(money(d, l.unitPriceCents))}</td>` +
        `<td align="right">${esc(money(d, l.lineTotalCents))}</td></tr>`,
    )
    .join('');
  return (
    '<table role="presentation" width="100%" cellpadding="6" cellspacing="0" border="0">' +
    '<tr bgcolor="#eef2f3"><th align="left">Item</th><th align="right">Qty</th><th align="right">Each</th><th align="right">Total</th></tr>' +
    rows +
    '</table>'
  );
}

export function linesText(d: OrderMailData): string {
  return d.lines.map((l) => `${l.quantity} x ${l.name} (${l.sku}) at ${money(d, l.unitPriceCents)} = ${money(d, l.lineTotalCents)}`).join('\n');
}

function totalsRows(d: OrderMailData): [string, string][] {
  return [
    ['Subtotal', money(d, d.subtotalCents)],
    ['Shipping', d.shippingCents === 0 ? `free (${money(d, 0)})` : money(d, d.shippingCents)],
    ['Total', money(d, d.totalCents)],
    ['of which VAT', money(d, d.vatCents)],
  ];
}

export function totalsHtml(d: OrderMailData): string {
  const rows = totalsRows(d)
    .map(([k, v]) => (k === 'Total' ? `<tr><td align="right"><b>${k}</b></td><td align="right"><b>${esc(v)}</b></td></tr>` : `<tr><td align="right">${k}</td><td align="right">${esc(v)}</td></tr>`))
    .join('');
  return `<table role="presentation" width="100%" cellpadding="4" cellspacing="0" border="0">${rows}</table>`;
}

export function totalsText(d: OrderMailData): string {
  return totalsRows(d)
    .map(([k, v]) => `${k}: ${v}`)
    .join('\n');
}

function setupFacts(s: OrderMailSetup): [string, string][] {
  return [
    ['Spring', s.springName],
    ['Rate', `${oneDecimal(s.rateNPerMm)} N/mm`],
    ['Preload', `${oneDecimal(s.preloadMm)} mm`],
    ...(s.adjusterTurns === undefined ? [] : ([['Adjuster', `${turns(s.adjusterTurns)} turns`]] as [string, string][])),
    ['Static sag', `${oneDecimal(s.staticSagMm)} mm ± ${oneDecimal(s.toleranceMm)} mm`],
    ['Rider sag', `${oneDecimal(s.riderSagMm)} mm ± ${oneDecimal(s.toleranceMm)} mm`],
  ];
}

const caution =
  'Fitting springs means compressing them and lifting the bike: use a proper spring compressor and stand, follow the ' +
  "bike maker's manual and local rules, and let a qualified suspension technician do the work when in doubt.";

export function setupHtml(d: OrderMailData): string {
  if (!d.setup.length) return '';
  const blocks = d.setup
    .map(
      (s) =>
        `<h3>${endLabel(s.end)}</h3><table role="presentation" cellpadding="3" cellspacing="0" border="0">` +
        setupFacts(s)
          .map(([k, v]) => `<tr><td>${k}</td><td><b>${esc(v)}</b></td></tr>`)
          .join('') +
        '</table>',
    )
    .join('');
  const sheet = d.setupSheetUrl ? `<p><a href="${safeHref(d.setupSheetUrl)}">Open the setup sheet</a></p>` : '';
  return `<h2>Your setup</h2>${blocks}${sheet}<p><font size="2">${esc(caution)}</font></p>`;
}

export function setupText(d: OrderMailData): string {
  if (!d.setup.length) return '';
  const blocks = d.setup.map((s) => [endLabel(s.end).toUpperCase(), ...setupFacts(s).map(([k, v]) => `  ${k}: ${v}`)].join('\n'));
  return ['YOUR SETUP', ...blocks, ...(d.setupSheetUrl ? [`Setup sheet: ${d.setupSheetUrl}`] : []), caution].join('\n\n');
}

import escapeHtml from 'escape-html';

/** What every mail template returns; the caller adds the recipient. */
export interface MailBody {
  subject: string;
  text: string;
  html: string;
}

export const esc = (value: string | number): string => escapeHtml(String(value));

/** Only our own http(s) links go into an href; anything else becomes inert. */
export function safeHref(url: string): string {
  return /^https?:\/\//i.test(url) ? esc(url) : '#';
}

export interface Shop {
  name: string;
  address: string;
}

/**
 * The HTML frame of every mail: a single centred table and presentational attributes only (no style attributes or
 * style sheets), so it reads the same in mail programs that strip CSS and under a strict Content-Security-Policy.
 */
export function htmlMail(shop: Shop, title: string, body: string): string {
  return [
    '<!doctype html>',
    '<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width">',
    `<title>${esc(title)}</title></head>`,
    '<body>',
    '<table role="presentation" width="100%" cellpadding="0" cellspacing="0" border="0"><tr><td align="center">',
    '<table role="presentation" width="600" cellpadding="16" cellspacing="0" border="0">',
    `<tr><td bgcolor="#12343b"><font color="#ffffff" face="Arial, sans-serif" size="4"><b>${esc(shop.name)}</b></font></td></tr>`,
    `<tr><td><font face="Arial, sans-serif">${body}</font></td></tr>`,
    `<tr><td bgcolor="#eef2f3"><font face="Arial, sans-serif" size="2" color="#44545a">${esc(shop.name)}<br>${multiline(shop.address)}</font></td></tr>`,
    '</table>',
    '</td></tr></table>',
    '</body></html>',
  ].join('\n');
}

/** The plain-text frame: the same words, the shop's name and address at the foot. */
export function textMail(shop: Shop, blocks: string[]): string {
  return [...blocks, '--', shop.name, shop.address].join('\n\n').replace(/\n{3,}/g, '\n\n') + '\n';
}

/** Escapes text and keeps its line breaks (addresses are written over several lines). */
export function multiline(text: string): string {
  return text
    .split(/\r?\n/)
    .map((l) => esc(l))
    .join('<br>');
}

export const paragraph = (text: string): string => `<p>${esc(text)}</p>`;
export const button = (label: string, url: string): string =>
  `<p><a href="${safeHref(url)}"><b>${esc(label)}</b></a></p>`;

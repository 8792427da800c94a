import type { Response } from 'express';
import type { IncomingMessage, ServerResponse } from 'node:http';
import { randomUUID } from 'node:crypto';

/** Stands in client/index.html for the nonce of each response (`<meta name="csp-nonce">`). */
export const nonceSlot = 'loadline-csp-nonce';

/**
 * The style-src source of one response: a fresh nonce, kept in res.locals for the page that carries it, so the
 * component library's run-time <style> elements are allowed and no other inline style is.
 */
export function styleNonce(_req: IncomingMessage, res: ServerResponse): string {
  // 122 random bits from Node's buffered pool: every API answer pays for this too, so not a syscall each time.
  const nonce = randomUUID();
  (res as Response).locals.cspNonce = nonce;
  return `'nonce-${nonce}'`;
}

/** The app's page with this response's nonce in its slot. */
export function pageWithNonce(html: string, res: Response): string {
  return html.replaceAll(nonceSlot, String(res.locals.cspNonce ?? ''));
}

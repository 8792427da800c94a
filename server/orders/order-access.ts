import { createHmac, timingSafeEqual } from 'node:crypto';
import type { Config } from '../config';

// Derived from the server's secret, so the link in a mail can be rebuilt anywhere and cannot be guessed.
export function orderAccessToken(config: Pick<Config, 'jwtSecret'>, orderId: string): string {
  return createHmac('sha256', config.jwtSecret).update(`order-access:${orderId}`).digest('base64url');
}

export function isOrderAccessToken(config: Pick<Config, 'jwtSecret'>, orderId: string, token: unknown): boolean {
  if (typeof token !== 'string' || token.length > 100) return false;
  const want = Buffer.from(orderAccessToken(config, orderId));
  const got = Buffer.from(token);
  return got.length === want.length && timingSafeEqual(got, want);
}

/** The order's page for its buyer; with the token it opens without signing in. */
export const orderUrl = (config: Pick<Config, 'jwtSecret' | 'publicOrigin'>, orderId: string) =>
  `${config.publicOrigin}/orders/${orderId}?token=${orderAccessToken(config, orderId)}`;

export const orderSetupSheetUrl = (config: Pick<Config, 'jwtSecret' | 'publicOrigin'>, orderId: string) =>
  `${config.publicOrigin}/orders/${orderId}/setup-sheet?token=${orderAccessToken(config, orderId)}`;

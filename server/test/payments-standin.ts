import { randomBytes } from 'node:crypto';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { Express } from 'express';
import Stripe from 'stripe';
import type { Config } from '../config';
import { testApp } from './factories';
import { onTestFinished } from 'vitest';

/** The payment stand-in npm test runs (standins/payments), on STRIPE_API_PORT. */
export const standinPort = Number(process.env.STRIPE_API_PORT ?? 8471);

/**
 * An app on a real port with its own account at the stand-in: its own secret key and a webhook endpoint pointing
 * at it, so the stand-in's events for this test reach this app and no other.
 */
export async function paymentsApp(overrides: Partial<Config> = {}) {
  const key = `sk_test_api_${randomBytes(8).toString('hex')}`;
  const admin = new Stripe(key, { host: '127.0.0.1', port: standinPort, protocol: 'http', maxNetworkRetries: 0, telemetry: false });
  const first = testApp({ stripeSecretKey: key, stripeApiPort: standinPort, ...overrides });
  const server: Server = await new Promise((resolve) => {
    const s = first.app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const port = (server.address() as AddressInfo).port;
  const endpoint = await admin.webhookEndpoints.create({ url: `http://127.0.0.1:${port}/api/payments/webhook`, enabled_events: ['*'] });
  // Rebuilt with the endpoint's secret and its own origin; the listening server serves the new app.
  const t = testApp({ stripeSecretKey: key, stripeApiPort: standinPort, stripeWebhookSecret: endpoint.secret!, publicOrigin: `http://127.0.0.1:${port}`, ...overrides });
  server.removeAllListeners('request');
  server.on('request', t.app as unknown as (req: unknown, res: unknown) => void);
  let closing: Promise<void> | undefined;
  const close = () =>
    (closing ??= (async () => {
      await admin.webhookEndpoints.del(endpoint.id).catch(() => undefined);
      server.closeAllConnections();
      await new Promise((r) => server.close(r));
    })());
  // Closed when the test that opened it ends, so spec files keep no list of their own.
  onTestFinished(close);
  return { ...t, server, port, stripe: admin, secretKey: key, webhookSecret: endpoint.secret!, close };
}

/** Pays on the stand-in's page as a browser without JavaScript would: posts the form and reads the redirect. */
export async function payOnPage(paymentUrl: string, cardNumber: string): Promise<{ status: number; location: string | null; html: string }> {
  const res = await fetch(paymentUrl, {
    method: 'POST',
    headers: { 'Content-Type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ cardNumber }).toString(),
    redirect: 'manual',
  });
  return { status: res.status, location: res.headers.get('location'), html: await res.text() };
}

/** Waits until `check` gives a value (the stand-in's webhooks arrive on their own time). */
export async function eventually<T>(check: () => Promise<T | undefined | null | false>, what: string, timeoutMs = 10_000): Promise<T> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const v = await check();
    if (v) return v;
    if (Date.now() > until) throw new Error(`Timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

export type PaymentsApp = Awaited<ReturnType<typeof paymentsApp>>;
export type { Express };

import { randomBytes } from 'node:crypto';
import Stripe from 'stripe';
import type { Delivery, Store } from './store';

// Only its offline webhook helpers are used; it never makes a request.
const signer = new Stripe('sk_test_signer_only', { telemetry: false });
export const apiVersion = '2026-10-28.endive';

export const newId = (prefix: string) => `${prefix}_${randomBytes(12).toString('base64url')}`;

/** Queues one event for every endpoint of the account, like the service's account-wide webhook endpoints. */
export function emitEvent(store: Store, account: string, type: string, object: object): string {
  const event = { id: newId('evt'), object: 'event', type, created: Math.floor(Date.now() / 1000), api_version: apiVersion, livemode: false, pending_webhooks: 0, data: { object: publicView(object) } };
  const targets = Object.values(store.state.endpoints).filter((e) => e.account === account);
  event.pending_webhooks = targets.length;
  const payload = JSON.stringify(event, null, 2);
  for (const e of targets) store.state.deliveries.push({ eventId: event.id, endpointId: e.id, payload, attempt: 0, nextAt: Date.now() });
  store.changed();
  return event.id;
}

/** Drops the stand-in's private fields (prefixed _) from an object before it leaves. */
export function publicView<T extends object>(o: T): Record<string, unknown> {
  return Object.fromEntries(Object.entries(o).filter(([k]) => !k.startsWith('_')));
}

export interface DeliveryOptions {
  retryBaseMs: number;
  retryMaxMs: number;
  log: (msg: string) => void;
}

const inFlight = new Set<Delivery>();

/** Sends every due delivery, signed like the service; a non-2xx or no answer is tried again later, with a growing wait. */
export function deliverDue(store: Store, opts: DeliveryOptions): void {
  const now = Date.now();
  for (const d of store.state.deliveries) {
    if (d.nextAt > now || inFlight.has(d)) continue;
    const endpoint = store.state.endpoints[d.endpointId];
    if (!endpoint) {
      finish(store, d);
      continue;
    }
    inFlight.add(d);
    const header = signer.webhooks.generateTestHeaderString({ payload: d.payload, secret: endpoint.secret });
    fetch(endpoint.url, { method: 'POST', headers: { 'Content-Type': 'application/json', 'Stripe-Signature': header }, body: d.payload, signal: AbortSignal.timeout(10_000) })
      .then((res) => {
        if (res.ok) {
          opts.log(`delivered ${d.eventId} to ${endpoint.url} (${res.status})`);
          finish(store, d);
        } else retry(store, d, opts, `answered ${res.status}`);
      })
      .catch((e: unknown) => retry(store, d, opts, (e as Error).message))
      .finally(() => inFlight.delete(d));
  }
}

function finish(store: Store, d: Delivery): void {
  store.state.deliveries = store.state.deliveries.filter((x) => x !== d);
  store.changed();
}

function retry(store: Store, d: Delivery, opts: DeliveryOptions, why: string): void {
  d.attempt += 1;
  const wait = Math.min(opts.retryMaxMs, opts.retryBaseMs * 2 ** (d.attempt - 1));
  d.nextAt = Date.now() + wait;
  opts.log(`delivery of ${d.eventId} failed (${why}); attempt ${d.attempt + 1} in ${wait} ms`);
  store.changed();
}

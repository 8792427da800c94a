import { createHash, randomBytes } from 'node:crypto';
import express, { type Request, type Response, type Router } from 'express';
import { ApiError, invalid, missing, sendError } from './api-error';
import { emitEvent, newId, publicView } from './events';
import type { SessionRecord, Store } from './store';

type Form = Record<string, unknown>;

const str = (v: unknown): string | undefined => (typeof v === 'string' ? v : undefined);
function int(v: unknown, param: string): number {
  const n = Number(v);
  if (typeof v !== 'string' || !/^\d+$/.test(v) || !Number.isSafeInteger(n)) throw invalid(`Invalid integer: ${String(v)}`, param);
  return n;
}
const record = (v: unknown): Record<string, string> =>
  v && typeof v === 'object' && !Array.isArray(v) ? Object.fromEntries(Object.entries(v).filter(([, x]) => typeof x === 'string')) as Record<string, string> : {};

/** The account is the secret key the request came with, as with the service: each key sees only its own objects. */
function account(req: Request): string {
  const h = req.headers.authorization ?? '';
  const key = h.startsWith('Bearer ') ? h.slice(7) : '';
  if (!/^(sk|rk)_test_\w+$/.test(key)) throw new ApiError(401, 'invalid_request_error', `Invalid API Key provided: ${key.slice(0, 12)}…`);
  return key;
}

/** Answers a repeated Idempotency-Key with the first answer; the same key with other parameters is refused. */
function idempotent(store: Store, req: Request, res: Response, produce: () => { status: number; body: unknown }): void {
  const key = req.headers['idempotency-key'];
  if (typeof key !== 'string' || !key) {
    const out = produce();
    res.status(out.status).json(out.body);
    return;
  }
  const slot = `${account(req)}:${req.path}:${key}`;
  const fingerprint = createHash('sha256').update(JSON.stringify(req.body ?? {})).digest('hex');
  const seen = store.state.idempotency[slot];
  if (seen) {
    if (seen.fingerprint !== fingerprint) {
      throw new ApiError(400, 'idempotency_error', `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${key}' if you meant to execute a different request.`);
    }
    res.setHeader('Idempotent-Replayed', 'true');
    res.status(seen.status).json(seen.body);
    return;
  }
  const out = produce();
  store.state.idempotency[slot] = { fingerprint, ...out };
  store.changed();
  res.status(out.status).json(out.body);
}

function createSession(store: Store, publicUrl: string, acct: string, f: Form): SessionRecord {
  if (str(f.mode) !== 'payment') throw invalid('Only mode=payment is supported here.', 'mode');
  const successUrl = str(f.success_url);
  if (!successUrl || !/^https?:\/\//.test(successUrl)) throw invalid('Not a valid URL', 'success_url');
  const rawLines = Array.isArray(f.line_items) ? (f.line_items as Form[]) : [];
  if (!rawLines.length) throw invalid('line_items is required in payment mode.', 'line_items');
  let currency = '';
  const lines = rawLines.map((l, i) => {
    const pd = (l.price_data ?? {}) as Form;
    const c = str(pd.currency);
    if (!c) throw invalid('Missing required param: currency.', `line_items[${i}][price_data][currency]`);
    if (currency && c !== currency) throw invalid('All line items must use the same currency.', `line_items[${i}][price_data][currency]`);
    currency = c;
    const name = str((pd.product_data as Form | undefined)?.name);
    if (!name) throw invalid('Missing required param: name.', `line_items[${i}][price_data][product_data][name]`);
    return { name, quantity: int(l.quantity, `line_items[${i}][quantity]`), unit_amount: int(pd.unit_amount, `line_items[${i}][price_data][unit_amount]`) };
  });
  const now = Math.floor(Date.now() / 1000);
  const expiresAt = f.expires_at === undefined ? now + 24 * 3600 : int(f.expires_at, 'expires_at');
  if (expiresAt <= now) throw invalid('The expires_at timestamp must be in the future.', 'expires_at');
  const total = lines.reduce((s, l) => s + l.quantity * l.unit_amount, 0);
  const id = `cs_test_${randomBytes(24).toString('base64url')}`;
  const s: SessionRecord = {
    id,
    object: 'checkout.session',
    url: `${publicUrl}/pay/${id}`,
    status: 'open',
    payment_status: 'unpaid',
    mode: 'payment',
    amount_subtotal: total,
    amount_total: total,
    currency,
    client_reference_id: str(f.client_reference_id) ?? null,
    customer_email: str(f.customer_email) ?? null,
    customer_details: null,
    metadata: record(f.metadata),
    payment_intent: null,
    expires_at: expiresAt,
    success_url: successUrl,
    cancel_url: str(f.cancel_url) ?? null,
    created: now,
    livemode: false,
    _account: acct,
    _lineItems: lines,
    _paymentIntentMetadata: record((f.payment_intent_data as Form | undefined)?.metadata),
  };
  store.state.sessions[id] = s;
  store.changed();
  return s;
}

function ownSession(store: Store, acct: string, id: string): SessionRecord {
  const s = store.state.sessions[id];
  if (!s || s._account !== acct) throw missing('checkout.session', id);
  return s;
}

/** Closes an open session and tells the account; shared by the API's expire and the clock. */
export function expireSession(store: Store, s: SessionRecord): void {
  s.status = 'expired';
  s.url = null;
  store.changed();
  emitEvent(store, s._account, 'checkout.session.expired', s);
}

/**
 * Refunds some or all of a paid payment and tells the account with charge.refunded (the charge's running refunded
 * total and its refunds, newest first); shared by the API and the stand-in's dashboard.
 */
export function refundPayment(store: Store, acct: string, piId: string, amountCents: number | undefined, metadata: Record<string, string>): Record<string, unknown> {
  const pi = store.state.paymentIntents[piId];
  if (!pi || store.state.sessions[pi._session]?._account !== acct) throw missing('payment_intent', piId, 'payment_intent');
  if (pi.status !== 'succeeded') throw invalid(`This PaymentIntent (${piId}) does not have a successful charge to refund.`, 'payment_intent');
  const left = pi.amount_received - pi._refunded;
  const amount = amountCents ?? left;
  if (amount <= 0 || amount > left) throw new ApiError(400, 'invalid_request_error', `Refund amount (${amount}) is greater than unrefunded amount on charge (${left})`, 'amount_too_large', 'amount');
  pi._refunded += amount;
  const refund = { id: newId('re'), object: 'refund', amount, currency: pi.currency, payment_intent: pi.id, charge: pi.latest_charge, status: 'succeeded', metadata, created: Math.floor(Date.now() / 1000) };
  store.state.refunds[refund.id] = refund;
  const ofCharge = Object.values(store.state.refunds).filter((x) => x.payment_intent === pi.id).reverse();
  emitEvent(store, acct, 'charge.refunded', {
    id: pi.latest_charge, object: 'charge', amount: pi.amount, amount_captured: pi.amount, amount_refunded: pi._refunded, currency: pi.currency,
    payment_intent: pi.id, refunded: pi._refunded >= pi.amount, status: 'succeeded', metadata: pi.metadata, livemode: false,
    refunds: { object: 'list', data: ofCharge, has_more: false, url: `/v1/charges/${pi.latest_charge}/refunds` },
  });
  store.changed();
  return refund;
}

/**
 * What the service's own dashboard does and no API the shop calls: a person refunding a payment by hand. Tests and
 * demos use it to see what the shop makes of a refund it did not start.
 */
export function dashboardRoutes(store: Store): Router {
  const r = express.Router();
  r.use(express.json(), express.urlencoded({ extended: false }));
  r.post('/payment_intents/:id/refund', (req, res) => {
    try {
      const f = (req.body ?? {}) as Form;
      const amount = f.amount === undefined ? undefined : int(String(f.amount), 'amount');
      res.json(refundPayment(store, account(req), String(req.params.id), amount, { refundedFrom: 'dashboard' }));
    } catch (e) {
      if (e instanceof ApiError) sendError(res, e);
      else throw e;
    }
  });
  return r;
}

/** The service's REST API, as far as the shop uses it: form-encoded bodies, Bearer key, Idempotency-Key. */
export function apiRoutes(store: Store, publicUrl: string): Router {
  const r = express.Router();
  r.use(express.urlencoded({ extended: true, limit: '1mb', parameterLimit: 5000 }));
  const handle = (fn: (req: Request, res: Response) => void) => (req: Request, res: Response) => {
    try {
      fn(req, res);
    } catch (e) {
      if (e instanceof ApiError) sendError(res, e);
      else throw e;
    }
  };

  r.post('/checkout/sessions', handle((req, res) => {
    const acct = account(req);
    idempotent(store, req, res, () => ({ status: 200, body: publicView(createSession(store, publicUrl, acct, req.body as Form)) }));
  }));

  r.get('/checkout/sessions/:id', handle((req, res) => {
    res.json(publicView(ownSession(store, account(req), String(req.params.id))));
  }));

  r.post('/checkout/sessions/:id/expire', handle((req, res) => {
    const s = ownSession(store, account(req), String(req.params.id));
    if (s.status !== 'open') throw invalid(`Only Checkout Sessions with a status in ["open"] can be expired. This Checkout Session has a status of "${s.status}".`);
    expireSession(store, s);
    res.json(publicView(s));
  }));

  r.post('/refunds', handle((req, res) => {
    const acct = account(req);
    const f = req.body as Form;
    idempotent(store, req, res, () => ({ status: 200, body: refundPayment(store, acct, str(f.payment_intent) ?? '', f.amount === undefined ? undefined : int(f.amount, 'amount'), record(f.metadata)) }));
  }));

  // Where events go: the service keeps these per account; tests register their own server here.
  r.post('/webhook_endpoints', handle((req, res) => {
    const acct = account(req);
    const url = str((req.body as Form).url);
    if (!url || !/^https?:\/\//.test(url)) throw invalid('Invalid URL', 'url');
    const e = { id: newId('we'), account: acct, url, secret: `whsec_${randomBytes(24).toString('base64url')}` };
    store.state.endpoints[e.id] = e;
    store.changed();
    res.json({ id: e.id, object: 'webhook_endpoint', url, secret: e.secret, status: 'enabled', enabled_events: ['*'], livemode: false });
  }));

  r.delete('/webhook_endpoints/:id', handle((req, res) => {
    const e = store.state.endpoints[String(req.params.id)];
    if (!e || e.account !== account(req)) throw missing('webhook_endpoint', String(req.params.id));
    delete store.state.endpoints[e.id];
    store.state.deliveries = store.state.deliveries.filter((d) => d.endpointId !== e.id);
    store.changed();
    res.json({ id: e.id, object: 'webhook_endpoint', deleted: true });
  }));

  r.use(handle((req) => {
    throw new ApiError(404, 'invalid_request_error', `Unrecognized request URL (${req.method}: ${req.originalUrl}).`);
  }));
  return r;
}

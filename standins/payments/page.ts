import express, { type Router } from 'express';
import { expireSession } from './api';
import { emitEvent, newId } from './events';
import type { PaymentIntentRecord, SessionRecord, Store } from './store';

// The standard test card numbers of hosted card payments.
export const testCards = { succeeds: '4242424242424242', declines: '4000000000000002' } as const;

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
const money = (cents: number, currency: string) => new Intl.NumberFormat('en-GB', { style: 'currency', currency: currency.toUpperCase() }).format(cents / 100);

function page(s: SessionRecord, message?: { kind: 'error' | 'info'; text: string }): string {
  const rows = s._lineItems
    .map((l) => `<tr><td>${l.quantity} × ${esc(l.name)}</td><td class="n">${money(l.quantity * l.unit_amount, s.currency)}</td></tr>`)
    .join('');
  const open = s.status === 'open';
  const note = message ? `<p role="${message.kind === 'error' ? 'alert' : 'status'}" class="${message.kind}">${esc(message.text)}</p>` : '';
  const form = open
    ? `<form method="post" action="/pay/${esc(s.id)}">
        <label for="cardNumber">Card number</label>
        <input id="cardNumber" name="cardNumber" inputmode="numeric" autocomplete="cc-number" required placeholder="4242 4242 4242 4242">
        <label for="cardExpiry">Expiry (MM/YY)</label>
        <input id="cardExpiry" name="cardExpiry" autocomplete="cc-exp" placeholder="12/34">
        <button type="submit">Pay ${money(s.amount_total, s.currency)}</button>
      </form>
      ${s.cancel_url ? `<p><a href="/pay/${esc(s.id)}/cancel">Cancel and go back to the shop</a></p>` : ''}`
    : `<p role="status">This payment page is ${s.status === 'complete' ? 'paid' : 'closed'}.</p>`;
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>Payment · local test stand-in</title>
<style>body{font:16px/1.5 system-ui,sans-serif;max-width:28rem;margin:2rem auto;padding:0 1rem;color:#222}
h1{font-size:1.3rem}table{width:100%;border-collapse:collapse}td{padding:.3rem 0;border-bottom:1px solid #ddd}.n{text-align:right}
label{display:block;margin-top:.8rem;font-weight:600}input{width:100%;padding:.5rem;font-size:1rem;box-sizing:border-box}
button{margin-top:1rem;width:100%;padding:.7rem;font-size:1rem;background:#2d5f3f;color:#fff;border:0;border-radius:6px}
.error{background:#fde8e8;border-left:4px solid #b42318;padding:.6rem}.info{background:#eef;padding:.6rem}.hint{color:#666;font-size:.85rem}</style></head>
<body><p class="hint">Local payment stand-in — no real money moves. Test cards: 4242 4242 4242 4242 pays, 4000 0000 0000 0002 is declined.</p>
<h1>Pay for your order</h1>
<table><tbody>${rows}<tr><td><strong>Total</strong></td><td class="n"><strong>${money(s.amount_total, s.currency)}</strong></td></tr></tbody></table>
${note}${form}</body></html>`;
}

/** The hosted payment page: a plain HTML form that works without JavaScript. */
export function pageRoutes(store: Store): Router {
  const r = express.Router();
  r.use(express.urlencoded({ extended: false, limit: '16kb' }));
  const find = (id: string) => store.state.sessions[id];

  r.get('/:id', (req, res) => {
    const s = find(req.params.id);
    if (!s) return void res.status(404).type('html').send('<!doctype html><title>Not found</title><p>No such payment page.</p>');
    res.type('html').send(page(s));
  });

  r.get('/:id/cancel', (req, res) => {
    const s = find(req.params.id);
    if (!s?.cancel_url) return void res.status(404).send('No such payment page.');
    res.redirect(303, s.cancel_url);
  });

  r.post('/:id', (req, res) => {
    const s = find(req.params.id);
    if (!s) return void res.status(404).send('No such payment page.');
    if (s.status !== 'open') return void res.status(409).type('html').send(page(s));
    const card = String((req.body as Record<string, unknown>).cardNumber ?? '').replace(/[\s-]/g, '');
    if (card !== testCards.succeeds && card !== testCards.declines) {
      return void res.status(400).type('html').send(page(s, { kind: 'error', text: 'Use a test card number: 4242 4242 4242 4242 pays, 4000 0000 0000 0002 is declined.' }));
    }
    const pi = intentFor(store, s);
    if (card === testCards.declines) {
      pi.status = 'requires_payment_method';
      pi.last_payment_error = { code: 'card_declined', decline_code: 'generic_decline', message: 'Your card was declined.' };
      emitEvent(store, s._account, 'payment_intent.payment_failed', pi);
      return void res.status(402).type('html').send(page(s, { kind: 'error', text: 'Your card was declined. Try another card, or go back to the shop.' }));
    }
    pi.status = 'succeeded';
    pi.amount_received = pi.amount;
    pi.latest_charge = newId('ch');
    pi.last_payment_error = null;
    s.status = 'complete';
    s.payment_status = 'paid';
    s.customer_details = { email: s.customer_email };
    s.url = null;
    store.changed();
    emitEvent(store, s._account, 'checkout.session.completed', s);
    res.redirect(303, s.success_url.replace('{CHECKOUT_SESSION_ID}', s.id));
  });
  return r;
}

function intentFor(store: Store, s: SessionRecord): PaymentIntentRecord {
  if (s.payment_intent) return store.state.paymentIntents[s.payment_intent]!;
  const pi: PaymentIntentRecord = {
    id: newId('pi'),
    object: 'payment_intent',
    amount: s.amount_total,
    amount_received: 0,
    currency: s.currency,
    status: 'requires_payment_method',
    metadata: s._paymentIntentMetadata,
    latest_charge: null,
    last_payment_error: null,
    created: Math.floor(Date.now() / 1000),
    livemode: false,
    _refunded: 0,
    _session: s.id,
  };
  store.state.paymentIntents[pi.id] = pi;
  s.payment_intent = pi.id;
  return pi;
}

/** Closes every open session whose expires_at has passed, as the service does. */
export function expireDue(store: Store): void {
  const now = Date.now() / 1000;
  for (const s of Object.values(store.state.sessions)) if (s.status === 'open' && s.expires_at <= now) expireSession(store, s);
}

import { randomBytes } from 'node:crypto';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import Stripe from 'stripe';
import { afterEach, describe, expect, it } from 'vitest';
import { eventually, payOnPage, standinPort } from '../test/payments-standin';

// The local payment stand-in (standins/payments) as the SDK and a webhook endpoint see it.
const sdk = () => new Stripe(`sk_test_standin_${randomBytes(6).toString('hex')}`, { host: '127.0.0.1', port: standinPort, protocol: 'http', maxNetworkRetries: 0, telemetry: false });
const params = (expiresInS = 3600) => ({
  mode: 'payment' as const,
  success_url: 'http://127.0.0.1:9/done?session={CHECKOUT_SESSION_ID}',
  cancel_url: 'http://127.0.0.1:9/back',
  client_reference_id: 'order-1',
  expires_at: Math.floor(Date.now() / 1000) + expiresInS,
  line_items: [{ quantity: 2, price_data: { currency: 'eur', unit_amount: 6_450, product_data: { name: 'Fork spring' } } }],
});

let servers: Server[] = [];
afterEach(async () => {
  for (const s of servers) await new Promise((r) => s.close(r));
  servers = [];
});

/** A webhook endpoint that refuses the first `failFirst` deliveries, then takes them; it checks each signature as the app does. */
async function endpoint(stripe: Stripe, failFirst = 0) {
  const got: { type: string; verified: boolean; status: number }[] = [];
  let secret = '';
  const server = createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (c: Buffer) => chunks.push(c));
    req.on('end', () => {
      let type = '?';
      let verified = false;
      try {
        type = stripe.webhooks.constructEvent(Buffer.concat(chunks), String(req.headers['stripe-signature']), secret).type;
        verified = true;
      } catch {
        /* recorded as unverified */
      }
      const status = got.length < failFirst ? 500 : 200;
      got.push({ type, verified, status });
      res.writeHead(status).end();
    });
  });
  servers.push(server);
  await new Promise<void>((r) => server.listen(0, '127.0.0.1', () => r()));
  const made = await stripe.webhookEndpoints.create({ url: `http://127.0.0.1:${(server.address() as AddressInfo).port}/hook`, enabled_events: ['*'] });
  secret = made.secret!;
  return got;
}

describe('payment stand-in', () => {
  it('answers a repeated Idempotency-Key with the first session, and refuses the key with other parameters in the service\'s error shape', async () => {
    const stripe = sdk();
    const a = await stripe.checkout.sessions.create(params(), { idempotencyKey: 'k-1' });
    const b = await stripe.checkout.sessions.create({ ...params(), expires_at: a.expires_at }, { idempotencyKey: 'k-1' });
    expect(b.id).toBe(a.id);
    expect(a).toMatchObject({ object: 'checkout.session', status: 'open', payment_status: 'unpaid', amount_total: 12_900, currency: 'eur', client_reference_id: 'order-1' });
    await expect(stripe.checkout.sessions.create({ ...params(), client_reference_id: 'other' }, { idempotencyKey: 'k-1' })).rejects.toMatchObject({ type: 'StripeIdempotencyError', statusCode: 400 });
    await expect(stripe.checkout.sessions.retrieve('cs_test_nothing')).rejects.toMatchObject({ type: 'StripeInvalidRequestError', code: 'resource_missing', statusCode: 404 });
    // Another key is another account: it cannot see this session.
    await expect(sdk().checkout.sessions.retrieve(a.id)).rejects.toMatchObject({ statusCode: 404 });
  });

  it('a paid session sends checkout.session.completed, signed, and retries with a growing wait until the endpoint answers 2xx', async () => {
    const stripe = sdk();
    const got = await endpoint(stripe, 2);
    const s = await stripe.checkout.sessions.create(params());
    const paid = await payOnPage(s.url!, '4242 4242 4242 4242');
    expect(paid).toMatchObject({ status: 303, location: `http://127.0.0.1:9/done?session=${s.id}` });
    await eventually(async () => got.some((g) => g.status === 200), 'the third delivery', 15_000);
    expect(got.map((g) => [g.type, g.verified, g.status])).toEqual([
      ['checkout.session.completed', true, 500],
      ['checkout.session.completed', true, 500],
      ['checkout.session.completed', true, 200],
    ]);
    expect(await stripe.checkout.sessions.retrieve(s.id)).toMatchObject({ status: 'complete', payment_status: 'paid', payment_intent: expect.stringMatching(/^pi_/) });
    // Paid once: the refund API gives it back, in part and then the rest, never more.
    const pi = (await stripe.checkout.sessions.retrieve(s.id)).payment_intent as string;
    expect((await stripe.refunds.create({ payment_intent: pi, amount: 6_450 })).amount).toBe(6_450);
    await expect(stripe.refunds.create({ payment_intent: pi, amount: 6_451 })).rejects.toMatchObject({ statusCode: 400, code: 'amount_too_large' });
  });

  it('a declined card sends payment_intent.payment_failed and leaves the page open; an unknown card number is refused on the page', async () => {
    const stripe = sdk();
    const got = await endpoint(stripe);
    const s = await stripe.checkout.sessions.create(params());
    const declined = await payOnPage(s.url!, '4000000000000002');
    expect(declined.status).toBe(402);
    expect(declined.html).toContain('Your card was declined');
    expect((await payOnPage(s.url!, '1234 5678')).status).toBe(400);
    await eventually(async () => got.length > 0, 'the failure event');
    expect(got[0]).toMatchObject({ type: 'payment_intent.payment_failed', verified: true });
    expect((await stripe.checkout.sessions.retrieve(s.id)).status).toBe('open');
  });

  it('a session expires at its expires_at and says so; an expired one cannot be expired again', async () => {
    const stripe = sdk();
    const got = await endpoint(stripe);
    const s = await stripe.checkout.sessions.create(params(2));
    await eventually(async () => got.some((g) => g.type === 'checkout.session.expired'), 'the expiry event', 10_000);
    expect((await stripe.checkout.sessions.retrieve(s.id)).status).toBe('expired');
    await expect(stripe.checkout.sessions.expire(s.id)).rejects.toMatchObject({ statusCode: 400 });
  });
});

import Stripe from 'stripe';
import type { Config } from '../config';
import {
  PaymentRefusedError,
  PaymentSignatureError,
  PaymentUnavailableError,
  type CheckoutSessionInput,
  type PaymentProvider,
  type PaymentSession,
  type ProviderEvent,
  type ProviderRefund,
  type RefundInput,
} from './payment-provider';

type Session = Awaited<ReturnType<Stripe['checkout']['sessions']['retrieve']>>;

function toSession(s: Session): PaymentSession {
  return {
    id: s.id,
    url: s.url ?? null,
    status: (s.status ?? 'open') as PaymentSession['status'],
    paymentStatus: s.payment_status as PaymentSession['paymentStatus'],
    paymentIntentId: typeof s.payment_intent === 'string' ? s.payment_intent : (s.payment_intent?.id ?? null),
    amountTotalCents: s.amount_total ?? null,
    clientReferenceId: s.client_reference_id ?? null,
  };
}

/**
 * The SDK captures a stack trace on every request to decorate its errors with the caller's site; with source maps on
 * (tsx) that costs more CPU than building the request, and ours are mapped in `call` anyway, so the capture is left empty.
 */
function withoutCallSiteStack<T>(fn: () => Promise<T>): Promise<T> {
  const limit = Error.stackTraceLimit;
  Error.stackTraceLimit = 0;
  try {
    return fn();
  } finally {
    Error.stackTraceLimit = limit;
  }
}

/** Connection failures become PaymentUnavailableError; the provider's own refusals PaymentRefusedError. */
async function call<T>(what: string, fn: () => Promise<T>): Promise<T> {
  try {
    return await withoutCallSiteStack(fn);
  } catch (e) {
    if (e instanceof Stripe.errors.StripeConnectionError || e instanceof Stripe.errors.StripeAPIError || e instanceof Stripe.errors.StripeRateLimitError) {
      throw new PaymentUnavailableError(`${what}: ${(e as Error).message}`);
    }
    if (e instanceof Stripe.errors.StripeError) throw new PaymentRefusedError(`${what}: ${e.message}`);
    throw e;
  }
}

/** The official SDK; the same code talks to the real service or to the local stand-in, by host and port. */
export class StripePaymentProvider implements PaymentProvider {
  private readonly stripe: Stripe;

  constructor(
    config: Pick<Config, 'stripeSecretKey' | 'stripeWebhookSecret' | 'stripeApiHost' | 'stripeApiPort' | 'stripeApiProtocol'>,
    private readonly webhookSecret = config.stripeWebhookSecret,
  ) {
    this.stripe = new Stripe(config.stripeSecretKey, {
      host: config.stripeApiHost,
      port: config.stripeApiPort,
      protocol: config.stripeApiProtocol,
      // Retries are ours to decide (with the same idempotency key); a checkout must answer promptly either way.
      maxNetworkRetries: 0,
      timeout: 10_000,
      telemetry: false,
    });
  }

  async createCheckoutSession(input: CheckoutSessionInput, idempotencyKey: string): Promise<PaymentSession> {
    const s = await call('creating the payment page', () =>
      this.stripe.checkout.sessions.create(
        {
          mode: 'payment',
          client_reference_id: input.orderId,
          customer_email: input.email,
          success_url: input.successUrl,
          cancel_url: input.cancelUrl,
          expires_at: Math.floor(input.expiresAt.getTime() / 1000),
          metadata: { orderId: input.orderId, orderNumber: input.orderNumber },
          payment_intent_data: { metadata: { orderId: input.orderId, orderNumber: input.orderNumber } },
          line_items: input.lines.map((l) => ({
            quantity: l.quantity,
            price_data: { currency: input.currency.toLowerCase(), unit_amount: l.unitAmountCents, product_data: { name: l.name, metadata: { sku: l.sku } } },
          })),
        },
        { idempotencyKey },
      ),
    );
    return toSession(s);
  }

  async retrieveCheckoutSession(id: string): Promise<PaymentSession> {
    return toSession(await call('reading the payment page', () => this.stripe.checkout.sessions.retrieve(id)));
  }

  async expireCheckoutSession(id: string): Promise<PaymentSession> {
    try {
      return toSession(await call('closing the payment page', () => this.stripe.checkout.sessions.expire(id)));
    } catch (e) {
      // Already paid or already expired: the session says which.
      if (e instanceof PaymentRefusedError) return this.retrieveCheckoutSession(id);
      throw e;
    }
  }

  async refund(input: RefundInput, idempotencyKey: string): Promise<ProviderRefund> {
    const r = await call('refunding', () =>
      this.stripe.refunds.create({ payment_intent: input.paymentIntentId, amount: input.amountCents, metadata: { orderId: input.orderId } }, { idempotencyKey }),
    );
    return { id: r.id, amountCents: r.amount, status: r.status ?? 'succeeded' };
  }

  verifyEvent(rawBody: Buffer, signatureHeader: string | undefined): ProviderEvent {
    if (!signatureHeader) throw new PaymentSignatureError('No signature header');
    try {
      const e = this.stripe.webhooks.constructEvent(rawBody, signatureHeader, this.webhookSecret);
      // A signed event without an object is still acknowledged, as one that concerns no order.
      return { id: e.id, type: e.type, object: ((e.data as { object?: unknown } | undefined)?.object ?? {}) as Record<string, unknown> };
    } catch (e) {
      throw new PaymentSignatureError((e as Error).message);
    }
  }
}

const byKey = new Map<string, PaymentProvider>();

/** One provider per configuration, shared by the routes and jobs of an app. */
export function paymentProviderFor(config: Config): PaymentProvider {
  const key = [config.stripeSecretKey, config.stripeWebhookSecret, config.stripeApiHost, config.stripeApiPort, config.stripeApiProtocol].join('|');
  let p = byKey.get(key);
  if (!p) byKey.set(key, (p = new StripePaymentProvider(config)));
  return p;
}

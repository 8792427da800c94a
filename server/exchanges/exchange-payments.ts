import type { EntityManager } from 'typeorm';
import type { Config } from '../config';
import { AppError } from '../errors';
import { PaymentRefusedError, PaymentUnavailableError, type PaymentProvider, type ProviderEvent } from '../payments/payment-provider';
import { exchangeUrl, mailExchangeStep } from './exchange-mail';
import { lockExchange } from './exchange-moves';
import { Exchange } from './Exchange.entity';

// The provider wants a payment page to close within a day.
const payWithinMs = 23 * 3_600_000;

/**
 * Opens a payment page for the difference a dearer rate costs. The key is the exchange, so a retried approval
 * finds the same page; the page's reference is the exchange, which is how its payment event finds it again.
 */
export async function openDifferencePayment(config: Config, provider: PaymentProvider, e: Exchange, currency: string, what: string): Promise<void> {
  try {
    const session = await provider.createCheckoutSession(
      {
        orderId: e.id,
        orderNumber: e.number,
        email: e.email,
        currency,
        lines: [{ name: `Price difference, ${what}`, sku: 'EXCHANGE-DIFFERENCE', unitAmountCents: e.differenceCents, quantity: 1 }],
        successUrl: `${exchangeUrl(config, e.id)}&paid=1`,
        cancelUrl: exchangeUrl(config, e.id),
        expiresAt: new Date(Date.now() + payWithinMs),
      },
      `exchange-difference:${e.id}`,
    );
    e.paymentSessionId = session.id;
    e.paymentUrl = session.url;
  } catch (err) {
    if (err instanceof PaymentUnavailableError) throw new AppError('unavailable', 'The payment service cannot be reached, so nothing was approved. Please try again shortly.');
    if (err instanceof PaymentRefusedError) throw new AppError('conflict', `The payment service refused the payment page: ${err.message}`);
    throw err;
  }
}

export type ExchangeEventOutcome = 'exchange-paid' | 'exchange-already-paid' | 'exchange-not-yet-paid' | 'exchange-no-change';

const str = (v: unknown) => (typeof v === 'string' ? v : null);

/**
 * A payment event for an exchange's difference, or null when the event is about something else. Runs inside the
 * webhook's once-only transaction: the difference is marked paid and the rider mailed at most once.
 */
export async function applyExchangePaymentEvent(em: EntityManager, config: Config, event: ProviderEvent): Promise<ExchangeEventOutcome | null> {
  if (!event.type.startsWith('checkout.session.')) return null;
  const obj = event.object;
  const ref = str(obj.client_reference_id);
  const [row] = (await em.query(`SELECT id FROM exchanges WHERE payment_session_id = $1 OR id::text = $2 LIMIT 1`, [str(obj.id) ?? '', ref && /^[0-9a-f-]{36}$/i.test(ref) ? ref.toLowerCase() : ''])) as { id: string }[];
  if (!row) return null;
  const e = await lockExchange(em, row.id);
  if (event.type !== 'checkout.session.completed' && event.type !== 'checkout.session.async_payment_succeeded') return 'exchange-no-change';
  if (obj.payment_status !== 'paid') return 'exchange-not-yet-paid';
  if (e.settlement !== 'awaiting-payment') return 'exchange-already-paid';
  e.settlement = 'paid';
  e.settledAt = new Date();
  e.paymentIntentId = str(obj.payment_intent);
  await em.getRepository(Exchange).save(e);
  await mailExchangeStep(em, config, e, 'paid');
  return 'exchange-paid';
}

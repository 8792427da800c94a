import type { EntityManager } from 'typeorm';
import { User } from '../server/accounts/User.entity';
import { addLine } from '../server/cart/cart.service';
import { findCart } from '../server/cart/cart-identity';
import { checkout } from '../server/checkout/checkout.service';
import type { Config } from '../server/config';
import { AppDataSource } from '../server/db/data-source';
import type { PaymentProvider, PaymentSession } from '../server/payments/payment-provider';
import { paymentProviderFor } from '../server/payments/stripe-provider';
import { handlePaymentEvent } from '../server/payments/webhook.service';

/**
 * Takes the demo's payments in-process, when no local payment stand-in answers (db:seed run on its own): a page id
 * per order and nothing else, so refunds of those orders are refused.
 */
const offlinePayments: PaymentProvider = {
  async createCheckoutSession(input): Promise<PaymentSession> {
    return { id: `cs_demo_${input.orderId}`, url: null, status: 'open', paymentStatus: 'unpaid', paymentIntentId: `pi_demo_${input.orderId}`, amountTotalCents: null, clientReferenceId: input.orderId };
  },
  retrieveCheckoutSession: () => Promise.reject(new Error('demo seed payments only open pages')),
  expireCheckoutSession: () => Promise.reject(new Error('demo seed payments only open pages')),
  refund: () => Promise.reject(new Error('demo seed payments do not refund')),
  verifyEvent: () => {
    throw new Error('demo seed payments send no events');
  },
};

// Invented: two riders' baskets from the demo catalogue, bought by the demo rider to a made-up address.
const baskets: { sku: string; quantity: number }[][] = [
  [{ sku: 'LL-AC-OIL-1', quantity: 2 }, { sku: 'LL-TL-SAG-1', quantity: 1 }],
  [{ sku: 'LL-AD-FSPC-20', quantity: 1 }, { sku: 'LL-TL-CAP-24', quantity: 1 }],
];
const address = { name: 'Mira Quenby', line1: '3 Rebound Lane', postalCode: '10999', city: 'Eastbrook', country: 'DE' };

/**
 * Paid demo orders for the warehouse queue, placed as a rider places them: cart lines, checkout (reservation and
 * ledger rows) and the provider's paid event through the webhook's own handler, so states, stock and mails agree.
 */
/**
 * The local payment stand-in, when it answers: test keys on this machine only, so a seed never opens a page on the
 * real service. npm start and npm test start it before seeding.
 */
async function localStandin(config: Config): Promise<PaymentProvider | null> {
  if (!config.stripeSecretKey.startsWith('sk_test_') || !['127.0.0.1', 'localhost'].includes(config.stripeApiHost)) return null;
  try {
    const res = await fetch(`${config.stripeApiProtocol}://${config.stripeApiHost}:${config.stripeApiPort}/health`, { signal: AbortSignal.timeout(2_000) });
    return res.ok ? paymentProviderFor(config) : null;
  } catch {
    return null;
  }
}

/** Pays on the stand-in's page with the test card that succeeds, as a buyer's browser would, and reads the payment's id. */
async function payWithTestCard(provider: PaymentProvider, orderId: string): Promise<string> {
  const [o] = (await AppDataSource.query(`SELECT payment_session_id, payment_url FROM orders WHERE id = $1`, [orderId])) as { payment_session_id: string; payment_url: string }[];
  const res = await fetch(o!.payment_url, { method: 'POST', headers: { 'Content-Type': 'application/x-www-form-urlencoded' }, body: 'cardNumber=4242424242424242', redirect: 'manual' });
  if (res.status !== 303) throw new Error(`The payment stand-in did not take the demo payment (${res.status})`);
  const session = await provider.retrieveCheckoutSession(o!.payment_session_id);
  if (!session.paymentIntentId) throw new Error('The paid demo session names no payment');
  return session.paymentIntentId;
}

/**
 * Paid demo orders for the warehouse queue, placed as a rider places them: cart lines, checkout (reservation and
 * ledger rows) and the provider's paid event through the webhook's own handler, so states, stock and mails agree.
 * With the local payment stand-in up, each is paid there with the test card, so staff can refund it like any order;
 * the stand-in's own event for it reaches the app later and changes nothing (already paid).
 */
export async function seedDemoOrders(config: Config): Promise<number> {
  const rider = await AppDataSource.getRepository(User).findOneBy({ email: 'rider@demo.test' });
  if (!rider) throw new Error('The demo rider is missing; seed the accounts first.');
  const owner = { userId: rider.id, guestCartId: null };
  const standin = await localStandin(config);
  if (!standin) console.warn('loadline: no local payment stand-in answers; demo orders are paid offline and cannot be refunded');
  let placed = 0;
  for (const basket of baskets) {
    await AppDataSource.transaction(async (em: EntityManager) => {
      const { cartId } = await findCart(em, owner, true);
      for (const line of basket) {
        const [p] = (await em.query(`SELECT id FROM products WHERE sku = $1`, [line.sku])) as { id: string }[];
        if (!p) throw new Error(`Demo order names a missing product ${line.sku}`);
        await addLine(em, config, cartId!, { productId: p.id, quantity: line.quantity });
      }
    });
    const placedOrder = await checkout(config, standin ?? offlinePayments, owner, { email: rider.email, shippingAddress: { ...address } });
    const [o] = (await AppDataSource.query(`SELECT payment_session_id FROM orders WHERE id = $1`, [placedOrder.orderId])) as { payment_session_id: string }[];
    const paymentIntentId = standin ? await payWithTestCard(standin, placedOrder.orderId) : `pi_demo_${placedOrder.orderId}`;
    const paid = await handlePaymentEvent(config, {
      id: `evt_demo_paid_${placedOrder.orderId}`,
      type: 'checkout.session.completed',
      object: { id: o!.payment_session_id, payment_status: 'paid', payment_intent: paymentIntentId, client_reference_id: placedOrder.orderId },
    });
    if (paid.outcome !== 'paid' && paid.outcome !== 'already-paid') throw new Error(`Demo order ${placedOrder.orderNumber} was not marked paid (${paid.outcome})`);
    placed += 1;
  }
  return placed;
}

import type { EntityManager } from 'typeorm';
import { User } from '../server/accounts/User.entity';
import { addLine } from '../server/cart/cart.service';
import { findCart } from '../server/cart/cart-identity';
import { checkout } from '../server/checkout/checkout.service';
import type { Config } from '../server/config';
import { AppDataSource } from '../server/db/data-source';
import type { PaymentProvider, PaymentSession } from '../server/payments/payment-provider';
import { handlePaymentEvent } from '../server/payments/webhook.service';

/**
 * Takes the demo's payments in-process: a page id per order and nothing else. Seeding runs before any payment service
 * may be up; refunds of these demo orders are therefore refused, which the demo notes say.
 */
const seedPayments: PaymentProvider = {
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
export async function seedDemoOrders(config: Config): Promise<number> {
  const rider = await AppDataSource.getRepository(User).findOneBy({ email: 'rider@demo.test' });
  if (!rider) throw new Error('The demo rider is missing; seed the accounts first.');
  const owner = { userId: rider.id, guestCartId: null };
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
    const placedOrder = await checkout(config, seedPayments, owner, { email: rider.email, shippingAddress: { ...address } });
    const paid = await handlePaymentEvent(config, {
      id: `evt_demo_paid_${placedOrder.orderId}`,
      type: 'checkout.session.completed',
      object: { id: `cs_demo_${placedOrder.orderId}`, payment_status: 'paid', payment_intent: `pi_demo_${placedOrder.orderId}`, client_reference_id: placedOrder.orderId },
    });
    if (paid.outcome !== 'paid') throw new Error(`Demo order ${placedOrder.orderNumber} was not marked paid (${paid.outcome})`);
    placed += 1;
  }
  return placed;
}

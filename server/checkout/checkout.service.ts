import { randomUUID } from 'node:crypto';
import type { EntityManager } from 'typeorm';
import type { CheckoutDto, CheckoutResultDto } from '../../shared/commerce/checkout.dto';
import type { CartLineRow } from '../cart/cart-dto';
import type { CartOwner } from '../cart/cart-identity';
import { Gate } from './gate';
import type { Config } from '../config';
import { AppDataSource } from '../db/data-source';
import { preparedQuery } from '../db/prepared';
import { AppError } from '../errors';
import { orderAccessToken } from '../orders/order-access';
import { lockOrder, moveOrder } from '../orders/order-moves';
import { outOfStock, releaseStock, uncoveredSale } from '../orders/order-stock';
import { placeOrder, readCart, type CartRead, type PlaceOrderInput, type PlaceOrderResult } from './place-order';
import { PaymentRefusedError, PaymentUnavailableError, type PaymentProvider } from '../payments/payment-provider';
import { getShopSettings, reservationMinutesOf } from '../shop/shop-settings.service';
import { cartTotalsFor } from '../cart/cart-pricing';

// The hot row is now locked only inside one statement, so a few more may wait on it in the database; more than this
// only hold pooled connections the rest of the app needs (4 and 16 measured alike with bench/checkout.bench.ts).
const gate = new Gate(8);

/** A price that moved since the line was added is brought up to date and shown; checkout never charges it silently. */
async function refusePriceChanges(cartId: string, rows: CartLineRow[]): Promise<void> {
  const changed = rows.filter((r) => r.price_cents !== r.unit_price_cents);
  if (!changed.length) return;
  await AppDataSource.transaction(async (em) => {
    for (const r of changed) await em.query(`UPDATE cart_lines SET unit_price_cents = $2 WHERE id = $1 AND cart_id = $3`, [r.id, r.price_cents, cartId]);
  });
  const list = changed.map((r) => `${r.name} (${(r.unit_price_cents / 100).toFixed(2)} → ${(r.price_cents / 100).toFixed(2)})`).join(', ');
  throw new AppError('conflict', `Prices changed since you added them: ${list}. Your cart shows the new prices; check it and place the order again.`, undefined, {
    reason: 'price-changed',
    lines: changed.map((r) => ({ lineId: r.id, name: r.name, was: r.unit_price_cents, now: r.price_cents })),
  });
}

function shortOfStock(rows: CartLineRow[]): (CartLineRow & { wanted: number }) | undefined {
  const wanted = new Map<string, number>();
  for (const r of rows) wanted.set(r.product_id, (wanted.get(r.product_id) ?? 0) + r.quantity);
  const r = rows.find((x) => wanted.get(x.product_id)! > x.stock_on_hand);
  return r && { ...r, wanted: wanted.get(r.product_id)! };
}

/** Cancels this cart's earlier unpaid orders (a second checkout replaces the first), so they hold no stock. */
async function replaceEarlierOrders(em: EntityManager, cartId: string, actorId: string | null): Promise<string[]> {
  const earlier = (await em.query(`SELECT id FROM orders WHERE cart_id = $1 AND status = 'pending' AND payment_status <> 'paid' ORDER BY id`, [cartId])) as { id: string }[];
  const sessions: string[] = [];
  for (const { id } of earlier) {
    const o = await lockOrder(em, { id });
    if (!o || o.status !== 'pending') continue;
    await releaseStock(em, o, { reason: 'cancel', actorId });
    await moveOrder(em, o, { status: 'cancelled' }, { cancelReason: 'replaced' });
    if (o.paymentSessionId) sessions.push(o.paymentSessionId);
  }
  return sessions;
}

/** What a checkout refuses before writing anything: an empty cart, a part no longer sold, a changed price, a shelf already short. */
async function refuseUnplaceable(cart: CartRead): Promise<string> {
  const { cartId, rows } = cart;
  if (!cartId || !rows.length) throw new AppError('conflict', 'Your cart is empty.', undefined, { reason: 'empty-cart' });
  const gone = rows.find((r) => !r.active);
  if (gone) throw new AppError('conflict', `${gone.name} is no longer sold; remove it from your cart to check out.`, undefined, { reason: 'not-sold', productId: gone.product_id });
  await refusePriceChanges(cartId, rows);
  // What the shelf showed a moment ago already says no to most buyers of a sold-out part, without waiting on its row lock.
  const short = shortOfStock(rows);
  if (short) throw outOfStock(short.name, short.product_id, short.stock_on_hand, short.wanted);
  return cartId;
}

/**
 * Places an order from the cart: the order, its lines (name, SKU and unit price copied) and the stock reservation
 * commit together; then the provider opens the payment page with the order's idempotency key. The provider is
 * called after that commit, so no row lock waits on the network; if it cannot be reached, the same path that
 * expires a reservation gives the stock back and the cart stays as it was.
 */
export async function checkout(config: Config, provider: PaymentProvider, owner: CartOwner, dto: CheckoutDto): Promise<CheckoutResultDto> {
  const settings = await getShopSettings();
  const orderFrom = (cartId: string, rows: CartLineRow[]): PlaceOrderInput => ({
    orderId: randomUUID(), owner, cartId, rows,
    email: dto.email.trim().toLowerCase(), customerName: dto.shippingAddress.name.trim(), shippingAddress: { ...dto.shippingAddress },
    totals: cartTotalsFor(rows.map((r) => ({ unitPriceCents: r.unit_price_cents, quantity: r.quantity })), settings),
    vatRateBasisPoints: settings.vatRateBasisPoints, reservationMinutes: reservationMinutesOf(settings, config),
  });
  const refused = (input: PlaceOrderInput, r: Extract<PlaceOrderResult, { placed: false }>) =>
    (r.covered ? null : uncoveredSale(input.rows.map((x) => ({ productId: x.product_id, name: x.name, quantity: x.quantity })), r.shelf)) ??
    new AppError('conflict', 'Your cart changed while the order was being placed; check it and place the order again.', undefined, { reason: 'cart-changed' });

  const { order, replaced, rows } = await gate.run(async () => {
    // Most checkouts: read the cart, then place the order in one statement that commits on its own.
    const first = await readCart(AppDataSource.manager, owner, false);
    if (!first.hasPending) {
      const input = orderFrom(await refuseUnplaceable(first), first.rows);
      const r = await placeOrder(AppDataSource.manager, input);
      if (r.placed) return { order: r.order, replaced: [] as string[], rows: input.rows };
      if (r.cartUnchanged) throw refused(input, r);
    }
    // An earlier checkout of this cart is still open (or the cart changed meanwhile): with the cart locked, the earlier
    // orders are cancelled and the new one placed in one transaction, so a double click cannot reserve twice.
    return AppDataSource.transaction(async (em) => {
      const cart = await readCart(em, owner, true);
      const input = orderFrom(await refuseUnplaceable(cart), cart.rows);
      const replaced = cart.hasPending ? await replaceEarlierOrders(em, input.cartId, owner.userId ?? null) : [];
      const r = await placeOrder(em, input);
      if (!r.placed) throw refused(input, r);
      return { order: r.order, replaced, rows: input.rows };
    });
  });

  for (const id of replaced) await provider.expireCheckoutSession(id).catch(() => undefined);

  const token = orderAccessToken(config, order.id);
  let session;
  try {
    session = await provider.createCheckoutSession(
      {
        orderId: order.id,
        orderNumber: order.number,
        email: order.email,
        currency: order.currency,
        lines: [
          ...rows.map((l) => ({ name: l.name, sku: l.sku, unitAmountCents: l.unit_price_cents, quantity: l.quantity })),
          ...(order.shippingCents > 0 ? [{ name: 'Shipping', sku: 'SHIPPING', unitAmountCents: order.shippingCents, quantity: 1 }] : []),
        ],
        successUrl: `${config.publicOrigin}/checkout/done?order=${order.id}&token=${token}`,
        cancelUrl: `${config.publicOrigin}/checkout/done?order=${order.id}&token=${token}&back=1`,
        expiresAt: order.reservedUntil,
      },
      `checkout-session:${order.id}`,
    );
  } catch (e) {
    if (!(e instanceof PaymentUnavailableError) && !(e instanceof PaymentRefusedError)) throw e;
    await cancelUnpayable(order.id);
    throw new AppError('unavailable', 'Payment is not available right now, so nothing was charged and nothing is held. Your cart is kept; please try again in a few minutes.', undefined, {
      reason: 'payment-unavailable',
    });
  }
  await preparedQuery(
    AppDataSource.manager,
    'checkout-save-payment-page',
    `UPDATE orders SET payment_session_id = $2, payment_url = $3, payment_intent_id = coalesce($4, payment_intent_id), updated_at = now() WHERE id = $1`,
    [order.id, session.id, session.url, session.paymentIntentId],
  );
  return { orderId: order.id, orderNumber: order.number, paymentUrl: session.url!, accessToken: token };
}

/** The payment page could not be opened: the order is cancelled and its stock goes back, in one transaction. */
async function cancelUnpayable(orderId: string): Promise<void> {
  await AppDataSource.transaction(async (em) => {
    const o = await lockOrder(em, { id: orderId });
    if (!o || o.status !== 'pending') return;
    await releaseStock(em, o, { reason: 'cancel', actorId: null });
    await moveOrder(em, o, { status: 'cancelled' }, { cancelReason: 'payment-unavailable' });
  });
}

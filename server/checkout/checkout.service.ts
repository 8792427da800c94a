import type { EntityManager } from 'typeorm';
import type { CheckoutDto, CheckoutResultDto } from '../../shared/commerce/checkout.dto';
import { lineTotalCents } from '../../shared/money';
import type { CartLineRow } from '../cart/cart-dto';
import type { CartOwner } from '../cart/cart-identity';
import { Gate } from './gate';
import { SpringSet } from '../cart/SpringSet.entity';
import type { Config } from '../config';
import { AppDataSource } from '../db/data-source';
import { AppError } from '../errors';
import { orderAccessToken } from '../orders/order-access';
import { lockOrder, moveOrder } from '../orders/order-moves';
import { outOfStock, refuseUncoveredSale, releaseStock, saleMovesCte } from '../orders/order-stock';
import { stockMovementCtes } from '../stock/stock-ledger';
import { PaymentRefusedError, PaymentUnavailableError, type PaymentProvider } from '../payments/payment-provider';
import { getShopSettings, reservationMinutesOf } from '../shop/shop-settings.service';
import { cartTotalsFor } from '../cart/cart-pricing';

// A few at a time: more only wait on the hot row lock while holding pooled connections (measured with bench/checkout.bench.ts).
const gate = new Gate(4);

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

/**
 * Places an order from the cart: the order, its lines (name, SKU and unit price copied) and the stock reservation
 * commit together; then the provider opens the payment page with the order's idempotency key. The provider is
 * called after that commit, so no row lock waits on the network; if it cannot be reached, the same path that
 * expires a reservation gives the stock back and the cart stays as it was.
 */
export async function checkout(config: Config, provider: PaymentProvider, owner: CartOwner, dto: CheckoutDto): Promise<CheckoutResultDto> {
  const settings = await getShopSettings();
  const minutes = reservationMinutesOf(settings, config);

  const { order, replaced, rows } = await gate.run(() => AppDataSource.transaction(async (em) => {
    // The guest's or rider's cart, locked (checkouts of one cart take turns, so a double click cannot reserve twice),
    // its lines, and whether an earlier checkout of it is still open: one round trip.
    const found = (await em.query(
      `WITH c AS (SELECT id FROM carts WHERE ${owner.userId ? 'user_id = $1' : 'id = $1 AND user_id IS NULL'} FOR UPDATE)
       SELECT c.id AS cart_id, EXISTS (SELECT 1 FROM orders o WHERE o.cart_id = c.id AND o.status = 'pending') AS has_pending,
              l.id, l.product_id, l.quantity, l.unit_price_cents, l.spring_set_id, l.verdict,
              p.sku, p.name, p.kind, p.price_cents, p.stock_on_hand, p.active
         FROM c LEFT JOIN cart_lines l ON l.cart_id = c.id LEFT JOIN products p ON p.id = l.product_id
        ORDER BY l.spring_set_id NULLS LAST, l.created_at, p.sku`,
      [owner.userId ?? owner.guestCartId],
    )) as (CartLineRow & { cart_id: string; has_pending: boolean })[];
    const cartId = owner.userId || owner.guestCartId ? found[0]?.cart_id : undefined;
    const rows: CartLineRow[] = found.filter((r) => r.id !== null);
    if (!cartId || !rows.length) throw new AppError('conflict', 'Your cart is empty.', undefined, { reason: 'empty-cart' });
    const gone = rows.find((r) => !r.active);
    if (gone) throw new AppError('conflict', `${gone.name} is no longer sold; remove it from your cart to check out.`, undefined, { reason: 'not-sold', productId: gone.product_id });
    await refusePriceChanges(cartId, rows);
    // What the shelf showed a moment ago already says no to most buyers of a sold-out part, without waiting on its row lock.
    const short = shortOfStock(rows);
    if (short) throw outOfStock(short.name, short.product_id, short.stock_on_hand, short.wanted);

    const replaced = found[0]!.has_pending ? await replaceEarlierOrders(em, cartId, owner.userId ?? null) : [];
    const totals = cartTotalsFor(rows.map((r) => ({ unitPriceCents: r.unit_price_cents, quantity: r.quantity })), settings);
    const setIds = [...new Set(rows.map((r) => r.spring_set_id).filter((x): x is string => !!x))];
    const sets = setIds.length ? await em.getRepository(SpringSet).createQueryBuilder('s').where('s.id IN (:...setIds)', { setIds }).getMany() : [];
    const setupOf = (r: CartLineRow) => sets.find((s) => s.id === r.spring_set_id)?.setup.find((x) => x.productId === r.product_id) ?? null;
    const lines = rows.map((r, i) => ({
      position: i + 1, product_id: r.product_id, sku: r.sku, name: r.name, kind: r.kind, unit_price_cents: r.unit_price_cents, quantity: r.quantity,
      line_total_cents: lineTotalCents(r.unit_price_cents, r.quantity), spring_set_id: r.spring_set_id, setup: setupOf(r),
    }));
    // The order (its number and reservation time from the database), its lines, the stock taken off the shelf and
    // the ledger rows: one statement, so the hot product's row is locked only for the end of it and the commit.
    const [order] = (await em.query(
      `WITH new_order AS (
         INSERT INTO orders (user_id, cart_id, email, customer_name, shipping_address, status, payment_status, fulfilment_status, currency,
                             subtotal_cents, shipping_cents, vat_cents, total_cents, vat_rate_bp, reserved_until, stock_held)
         VALUES ($1, $2, $3, $4, $5, 'pending', 'awaiting', 'unfulfilled', $6, $7, $8, $9, $10, $11, now() + make_interval(mins => $12), true)
         RETURNING id, number, email, currency, shipping_cents, reserved_until
       ), new_lines AS (
         INSERT INTO order_lines (order_id, position, product_id, sku, name, kind, unit_price_cents, quantity, line_total_cents, spring_set_id, setup)
         SELECT o.id, l.position, l.product_id, l.sku, l.name, l.kind, l.unit_price_cents, l.quantity, l.line_total_cents, l.spring_set_id, l.setup
           FROM new_order o, jsonb_to_recordset($13::jsonb) AS l(position int, product_id uuid, sku varchar, name varchar, kind varchar,
                unit_price_cents int, quantity int, line_total_cents int, spring_set_id uuid, setup jsonb)
         RETURNING order_id, product_id, quantity
       ), ${saleMovesCte('new_lines', '$1')}, ${stockMovementCtes({ requireActive: true })}
       SELECT o.id, o.number, o.email, o.currency, o.shipping_cents AS "shippingCents", o.reserved_until AS "reservedUntil",
              ARRAY(SELECT id FROM stock_moved)::text[] AS "movedIds"
         FROM new_order o`,
      [owner.userId, cartId, dto.email.trim().toLowerCase(), dto.shippingAddress.name.trim(), JSON.stringify({ ...dto.shippingAddress }), totals.currency,
        totals.subtotalCents, totals.shippingCents, totals.vatCents, totals.totalCents, settings.vatRateBasisPoints, minutes, JSON.stringify(lines)],
    )) as { id: string; number: string; email: string; currency: string; shippingCents: number; reservedUntil: Date; movedIds: string[] }[];
    if (!order) throw new Error('The order insert returned nothing');
    await refuseUncoveredSale(em, rows.map((r) => ({ productId: r.product_id, name: r.name, quantity: r.quantity })), order.movedIds);
    return { order, replaced, rows };
  }));

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
  await AppDataSource.query(
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

import type { EntityManager } from 'typeorm';
import type { CartTotals } from '../../shared/cart-totals';
import type { SpringSetupDto } from '../../shared/commerce/cart.dto';
import { lineTotalCents } from '../../shared/money';
import type { CartLineRow } from '../cart/cart-dto';
import type { CartOwner } from '../cart/cart-identity';
import { SpringSet } from '../cart/SpringSet.entity';
import { preparedQuery } from '../db/prepared';
import { saleMovesCte } from '../orders/order-stock';
import { lockedShelfJson, stockMovementCtes, type LockedShelf } from '../stock/stock-ledger';

export interface CartRead {
  cartId: string | undefined;
  hasPending: boolean;
  rows: CartLineRow[];
}

/**
 * The guest's or rider's cart, its lines with their products as they are now, and whether an earlier checkout of it
 * is still open: one round trip. With `lock` the cart row is locked (checkouts of one cart take turns). The cart id
 * is looked up once, so the open-order check is an index lookup however many orders are pending.
 */
export async function readCart(em: EntityManager, owner: CartOwner, lock: boolean): Promise<CartRead> {
  const found = await preparedQuery<CartLineRow & { cart_id: string; has_pending: boolean }>(
    em,
    `checkout-read-cart-${owner.userId ? 'rider' : 'guest'}${lock ? '-locked' : ''}`,
    `WITH c AS (SELECT id FROM carts WHERE ${owner.userId ? 'user_id = $1' : 'id = $1 AND user_id IS NULL'} ${lock ? 'FOR UPDATE' : ''})
     SELECT c.id AS cart_id, EXISTS (SELECT 1 FROM orders o WHERE o.cart_id = (SELECT id FROM c) AND o.status = 'pending') AS has_pending,
            l.id, l.product_id, l.quantity, l.unit_price_cents, l.spring_set_id, l.verdict,
            p.sku, p.name, p.kind, p.price_cents, p.stock_on_hand, p.active
       FROM c LEFT JOIN cart_lines l ON l.cart_id = c.id LEFT JOIN products p ON p.id = l.product_id
      ORDER BY l.spring_set_id NULLS LAST, l.created_at, p.sku`,
    [owner.userId ?? owner.guestCartId],
  );
  return {
    cartId: owner.userId || owner.guestCartId ? found[0]?.cart_id : undefined,
    hasPending: !!found[0]?.has_pending,
    rows: found.filter((r) => r.id !== null),
  };
}

export interface PlaceOrderInput {
  orderId: string;
  owner: CartOwner;
  cartId: string;
  rows: CartLineRow[];
  email: string;
  customerName: string;
  shippingAddress: object;
  totals: CartTotals;
  vatRateBasisPoints: number;
  reservationMinutes: number;
}

export interface PlacedOrder {
  id: string;
  number: string;
  email: string;
  currency: string;
  shippingCents: number;
  reservedUntil: Date;
}

export type PlaceOrderResult =
  | { placed: true; order: PlacedOrder }
  | { placed: false; cartUnchanged: boolean; covered: boolean; shelf: LockedShelf[] };

/**
 * Places the order in one statement: the cart locked and checked to be as read (same lines, quantities and prices,
 * no other open checkout), the order, its lines (name, SKU and unit price copied), the stock taken off the shelf with
 * its ledger rows (stockMovementCtes: all products or none, never below zero). Run on its own it commits with no
 * round trip to the app in between, so the hot product's row is locked only while the database works; inside a
 * transaction it is one step of it. Nothing is written unless the cart is as read and the shelf covers every line.
 */
export async function placeOrder(em: EntityManager, input: PlaceOrderInput): Promise<PlaceOrderResult> {
  const { rows } = input;
  const setIds = [...new Set(rows.map((r) => r.spring_set_id).filter((x): x is string => !!x))];
  const sets = setIds.length ? await em.getRepository(SpringSet).createQueryBuilder('s').where('s.id IN (:...setIds)', { setIds }).getMany() : [];
  const setupOf = (r: CartLineRow): SpringSetupDto | null => sets.find((s) => s.id === r.spring_set_id)?.setup.find((x) => x.productId === r.product_id) ?? null;
  const lines = rows.map((r, i) => ({
    position: i + 1, product_id: r.product_id, sku: r.sku, name: r.name, kind: r.kind, unit_price_cents: r.unit_price_cents, quantity: r.quantity,
    line_total_cents: lineTotalCents(r.unit_price_cents, r.quantity), spring_set_id: r.spring_set_id, setup: setupOf(r),
  }));
  const asRead = rows.map((r) => `${r.id}:${r.quantity}:${r.unit_price_cents}`);
  const { totals } = input;
  const [out] = await preparedQuery<{ cartOk: boolean; covered: boolean; shelf: LockedShelf[]; order: (Omit<PlacedOrder, 'reservedUntil'> & { reservedUntil: string }) | null }>(
    em,
    'checkout-place-order',
    `WITH cart AS (
       SELECT id FROM carts WHERE id = $2 FOR UPDATE
     ), cart_ok AS (
       SELECT NOT EXISTS (SELECT 1 FROM orders o WHERE o.cart_id = $2 AND o.status = 'pending')
          AND coalesce((SELECT array_agg(x ORDER BY x COLLATE "C") FROM (SELECT l.id::text || ':' || l.quantity || ':' || l.unit_price_cents AS x
                          FROM cart_lines l WHERE l.cart_id = (SELECT id FROM cart)) AS now_in_cart), '{}')
            = coalesce((SELECT array_agg(x ORDER BY x COLLATE "C") FROM unnest($15::text[]) AS x), '{}') AS ok
     ), lines AS (
       SELECT l.* FROM jsonb_to_recordset($13::jsonb) AS l(position int, product_id uuid, sku varchar, name varchar, kind varchar,
              unit_price_cents int, quantity int, line_total_cents int, spring_set_id uuid, setup jsonb)
        WHERE (SELECT ok FROM cart_ok)
     ), ${saleMovesCte('lines', '$14', '$16')}, ${stockMovementCtes({ requireActive: true })},
     new_order AS (
       INSERT INTO orders (id, user_id, cart_id, email, customer_name, shipping_address, status, payment_status, fulfilment_status, currency,
                           subtotal_cents, shipping_cents, vat_cents, total_cents, vat_rate_bp, reserved_until, stock_held)
       SELECT $14::uuid, $1::uuid, $2::uuid, $3, $4, $5::jsonb, 'pending', 'awaiting', 'unfulfilled', $6, $7::int, $8::int, $9::int, $10::int, $11::int,
              now() + make_interval(mins => $12::int), true
        WHERE (SELECT ok FROM cart_ok) AND (SELECT ok FROM stock_covered)
       RETURNING id, number, email, currency, shipping_cents, reserved_until
     ), new_lines AS (
       INSERT INTO order_lines (order_id, position, product_id, sku, name, kind, unit_price_cents, quantity, line_total_cents, spring_set_id, setup)
       SELECT o.id, l.position, l.product_id, l.sku, l.name, l.kind, l.unit_price_cents, l.quantity, l.line_total_cents, l.spring_set_id, l.setup
         FROM new_order o, lines l
     )
     SELECT (SELECT ok FROM cart_ok) AS "cartOk", (SELECT ok FROM stock_covered) AS covered, ${lockedShelfJson} AS shelf,
            (SELECT json_build_object('id', id, 'number', number, 'email', email, 'currency', currency, 'shippingCents', shipping_cents, 'reservedUntil', reserved_until) FROM new_order) AS "order"`,
    [input.owner.userId, input.cartId, input.email, input.customerName, JSON.stringify(input.shippingAddress), totals.currency,
      totals.subtotalCents, totals.shippingCents, totals.vatCents, totals.totalCents, input.vatRateBasisPoints, input.reservationMinutes,
      JSON.stringify(lines), input.orderId, asRead, input.owner.userId],
  );
  if (out!.order) return { placed: true, order: { ...out!.order, reservedUntil: new Date(out!.order.reservedUntil) } };
  return { placed: false, cartUnchanged: out!.cartOk, covered: out!.covered, shelf: out!.shelf };
}

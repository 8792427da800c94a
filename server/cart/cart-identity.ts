import type { Request, Response } from 'express';
import type { EntityManager } from 'typeorm';
import { maxLineQuantity } from '../../shared/commerce/cart.dto';
import type { Config } from '../config';
import { AppDataSource } from '../db/data-source';
import { Cart } from './Cart.entity';

export const cartCookie = 'loadline_cart';
const uuid = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Who owns a cart: a signed-in rider, or the guest whose cookie names it (and who may have just signed in). */
export interface CartOwner {
  userId: string | null;
  guestCartId: string | null;
}

export function cartOwnerOf(req: Request): CartOwner {
  const c = (req.cookies as Record<string, string> | undefined)?.[cartCookie];
  return { userId: req.user?.id ?? null, guestCartId: c && uuid.test(c) ? c.toLowerCase() : null };
}

export function setCartCookie(res: Response, config: Config, cartId: string): void {
  res.cookie(cartCookie, cartId, { httpOnly: true, sameSite: 'lax', secure: config.secureCookies, maxAge: 30 * 24 * 3600 * 1000, path: '/' });
}

export function clearCartCookie(res: Response, config: Config): void {
  res.clearCookie(cartCookie, { httpOnly: true, sameSite: 'lax', secure: config.secureCookies, path: '/' });
}

/**
 * Finds the owner's cart (creating one when `create`); a guest cart brought to a sign-in is merged into the
 * rider's own: spring sets move whole, the same plain product adds up. Returns the cart id and whether the guest
 * cookie is now spent.
 */
export async function findCart(em: EntityManager, owner: CartOwner, create: boolean): Promise<{ cartId: string | null; guestCookieSpent: boolean; createdGuestCart: boolean }> {
  const carts = em.getRepository(Cart);
  const guest = owner.guestCartId ? await carts.findOneBy({ id: owner.guestCartId }) : null;
  if (!owner.userId) {
    if (guest && guest.userId === null) return { cartId: guest.id, guestCookieSpent: false, createdGuestCart: false };
    if (!create) return { cartId: null, guestCookieSpent: !!owner.guestCartId, createdGuestCart: false };
    const made = await carts.save(carts.create({ userId: null }));
    return { cartId: made.id, guestCookieSpent: false, createdGuestCart: true };
  }
  await em.query(`INSERT INTO carts (user_id) VALUES ($1) ON CONFLICT (user_id) DO NOTHING`, [owner.userId]);
  const mine = await carts.findOneByOrFail({ userId: owner.userId });
  if (guest && guest.userId === null) await mergeCarts(em, guest.id, mine.id);
  return { cartId: mine.id, guestCookieSpent: !!owner.guestCartId, createdGuestCart: false };
}

async function mergeCarts(em: EntityManager, fromId: string, intoId: string): Promise<void> {
  // Both carts locked in id order, so two merges or a merge and a checkout cannot deadlock.
  await em.query(`SELECT id FROM carts WHERE id = ANY($1::uuid[]) ORDER BY id FOR UPDATE`, [[fromId, intoId]]);
  await em.query(
    `INSERT INTO cart_lines (cart_id, product_id, quantity, unit_price_cents, spring_set_id, verdict, created_at)
     SELECT $2, product_id, quantity, unit_price_cents, spring_set_id, verdict, created_at FROM cart_lines WHERE cart_id = $1
     ON CONFLICT (cart_id, product_id, spring_set_id) DO UPDATE SET quantity = LEAST(cart_lines.quantity + EXCLUDED.quantity, $3)`,
    [fromId, intoId, maxLineQuantity],
  );
  await em.query(`DELETE FROM carts WHERE id = $1`, [fromId]);
}

/** Runs a cart use case in one transaction, then sets or clears the guest cookie to match. */
export async function withCart<T>(
  req: Request,
  res: Response,
  config: Config,
  opts: { create: boolean },
  fn: (em: EntityManager, cartId: string | null) => Promise<T>,
): Promise<T> {
  const owner = cartOwnerOf(req);
  const { out, found } = await AppDataSource.transaction(async (em) => {
    const found = await findCart(em, owner, opts.create);
    // Writes to one cart take turns (two tabs, a double click); reads need no lock.
    if (found.cartId && req.method !== 'GET') await em.query(`SELECT id FROM carts WHERE id = $1 FOR UPDATE`, [found.cartId]);
    return { out: await fn(em, found.cartId), found };
  });
  if (found.createdGuestCart && found.cartId) setCartCookie(res, config, found.cartId);
  else if (found.guestCookieSpent) clearCartCookie(res, config);
  return out;
}

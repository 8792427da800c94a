import type { EntityManager } from 'typeorm';
import { maxLineQuantity, type AddCartLineDto, type CartDto, type UpdateCartLineDto } from '../../shared/commerce/cart.dto';
import type { Config } from '../config';
import { AppError } from '../errors';
import { toCartDto } from './cart-dto';
import { CartLine } from './CartLine.entity';

interface ProductRow {
  id: string;
  name: string;
  price_cents: number;
  stock_on_hand: number;
  active: boolean;
}

async function productFor(em: EntityManager, productId: string): Promise<ProductRow> {
  const [p] = (await em.query(`SELECT id, name, price_cents, stock_on_hand, active FROM products WHERE id = $1`, [productId])) as ProductRow[];
  if (!p || !p.active) throw AppError.notFound('The product');
  return p;
}

/** How many of a product the cart already holds, over all its lines (plain and spring-set ones). */
export async function quantityInCart(em: EntityManager, cartId: string, productId: string, exceptLineId?: string): Promise<number> {
  const [r] = (await em.query(`SELECT COALESCE(sum(quantity), 0)::int AS n FROM cart_lines WHERE cart_id = $1 AND product_id = $2 AND id IS DISTINCT FROM $3`, [cartId, productId, exceptLineId ?? null])) as { n: number }[];
  return r?.n ?? 0;
}

/** Refuses more than the shelf holds, naming the product; the cart stays as it was. */
export function checkStock(p: { name: string; stock_on_hand: number }, total: number, field = 'quantity'): void {
  if (total > p.stock_on_hand) {
    const msg = p.stock_on_hand === 0 ? `${p.name} is out of stock.` : `Only ${p.stock_on_hand} of ${p.name} in stock; the cart would hold ${total}.`;
    throw new AppError('conflict', msg, { [field]: msg }, { reason: 'out-of-stock', name: p.name, available: p.stock_on_hand });
  }
}

export async function viewCart(em: EntityManager, config: Config, cartId: string | null): Promise<CartDto> {
  return toCartDto(em, config, cartId);
}

/** Adds a product at today's price; the same product added again adds up in its line. */
export async function addLine(em: EntityManager, config: Config, cartId: string, dto: AddCartLineDto): Promise<CartDto> {
  const p = await productFor(em, dto.productId);
  const plain = await em
    .getRepository(CartLine)
    .createQueryBuilder('l')
    .setLock('pessimistic_write')
    .where('l.cart_id = :cartId AND l.product_id = :pid AND l.spring_set_id IS NULL', { cartId, pid: p.id })
    .getOne();
  const newQty = (plain?.quantity ?? 0) + dto.quantity;
  if (newQty > maxLineQuantity) throw AppError.validation(`At most ${maxLineQuantity} of one product per order.`, { quantity: `At most ${maxLineQuantity} of one product per order.` });
  checkStock(p, (await quantityInCart(em, cartId, p.id)) + dto.quantity);
  if (plain) await em.getRepository(CartLine).update({ id: plain.id }, { quantity: newQty });
  else await em.getRepository(CartLine).insert({ cartId, productId: p.id, quantity: dto.quantity, unitPriceCents: p.price_cents, springSetId: null, verdict: null });
  return toCartDto(em, config, cartId);
}

async function ownLine(em: EntityManager, cartId: string | null, lineId: string): Promise<CartLine> {
  const line = cartId ? await em.getRepository(CartLine).findOne({ where: { id: lineId, cartId }, lock: { mode: 'pessimistic_write' } }) : null;
  if (!line) throw AppError.notFound('The cart line');
  return line;
}

export async function updateLine(em: EntityManager, config: Config, cartId: string | null, lineId: string, dto: UpdateCartLineDto): Promise<CartDto> {
  const line = await ownLine(em, cartId, lineId);
  const p = await productFor(em, line.productId);
  checkStock(p, (await quantityInCart(em, line.cartId, p.id, line.id)) + dto.quantity);
  await em.getRepository(CartLine).update({ id: line.id }, { quantity: dto.quantity });
  return toCartDto(em, config, line.cartId);
}

export async function removeLine(em: EntityManager, config: Config, cartId: string | null, lineId: string): Promise<CartDto> {
  const line = await ownLine(em, cartId, lineId);
  await em.getRepository(CartLine).delete({ id: line.id });
  return toCartDto(em, config, line.cartId);
}

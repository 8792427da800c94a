import type { EntityManager } from 'typeorm';
import type { CartDto, CartLineDto, SpringSetDto } from '../../shared/commerce/cart.dto';
import type { ProductKind } from '../../shared/catalogue';
import type { SpringVerdict } from '../../shared/engine/types';
import { lineTotalCents } from '../../shared/money';
import type { Config } from '../config';
import { getShopSettings, toShopPublicDto } from '../shop/shop-settings.service';
import { cartTotalsFor } from './cart-pricing';
import { SpringSet } from './SpringSet.entity';

export const toSpringSetDto = (s: SpringSet): SpringSetDto => ({
  id: s.id,
  fitmentId: s.fitmentId,
  bikeLabel: s.bikeLabel,
  ridingStyle: s.ridingStyle,
  loads: s.loads,
  setup: s.setup,
});

export interface CartLineRow {
  id: string;
  product_id: string;
  quantity: number;
  unit_price_cents: number;
  spring_set_id: string | null;
  verdict: SpringVerdict | null;
  sku: string;
  name: string;
  kind: ProductKind;
  price_cents: number;
  stock_on_hand: number;
  active: boolean;
}

/** A cart's lines with their products as they are now (price, stock, still sold). */
export async function cartLineRows(em: EntityManager, cartId: string): Promise<CartLineRow[]> {
  return em.query(
    `SELECT l.id, l.product_id, l.quantity, l.unit_price_cents, l.spring_set_id, l.verdict,
            p.sku, p.name, p.kind, p.price_cents, p.stock_on_hand, p.active
       FROM cart_lines l JOIN products p ON p.id = l.product_id
      WHERE l.cart_id = $1
      ORDER BY l.spring_set_id NULLS LAST, l.created_at, p.sku`,
    [cartId],
  );
}

const verdictWords: Partial<Record<SpringVerdict, string>> = {
  'too-soft': 'The engine calls this spring too soft for your load; you chose it anyway.',
  'too-stiff': 'The engine calls this spring too stiff for your load; you chose it anyway.',
  'coil-bind': 'This spring may reach coil bind on this bike; you chose it anyway.',
};

function toLine(r: CartLineRow, inCart: Map<string, number>): CartLineDto {
  const warnings: string[] = [];
  if (r.verdict && verdictWords[r.verdict]) warnings.push(verdictWords[r.verdict]!);
  if (r.price_cents !== r.unit_price_cents) warnings.push('The price has changed since you added this; checkout uses the new price once you confirm.');
  const wanted = inCart.get(r.product_id) ?? 0;
  if (!r.active) warnings.push('No longer sold; remove it to check out.');
  else if (wanted > r.stock_on_hand) warnings.push(r.stock_on_hand === 0 ? 'Out of stock at the moment.' : `Only ${r.stock_on_hand} in stock.`);
  return {
    id: r.id,
    productId: r.product_id,
    sku: r.sku,
    name: r.name,
    kind: r.kind,
    quantity: r.quantity,
    unitPriceCents: r.unit_price_cents,
    currentPriceCents: r.price_cents,
    lineTotalCents: lineTotalCents(r.unit_price_cents, r.quantity),
    stockOnHand: r.stock_on_hand,
    available: r.active && wanted <= r.stock_on_hand,
    springSetId: r.spring_set_id,
    verdict: r.verdict,
    warnings,
  };
}

/** The cart as the rider sees it; its totals come from the shared computation the client uses too. */
export async function toCartDto(em: EntityManager, config: Config, cartId: string | null): Promise<CartDto> {
  const rows = cartId ? await cartLineRows(em, cartId) : [];
  const settings = await getShopSettings(em);
  const inCart = new Map<string, number>();
  for (const r of rows) inCart.set(r.product_id, (inCart.get(r.product_id) ?? 0) + r.quantity);
  const lines = rows.map((r) => toLine(r, inCart));
  const setIds = [...new Set(rows.map((r) => r.spring_set_id).filter((x): x is string => !!x))];
  const sets = setIds.length ? await em.getRepository(SpringSet).createQueryBuilder('s').where('s.id IN (:...setIds)', { setIds }).getMany() : [];
  return {
    lines,
    sets: sets.map(toSpringSetDto),
    totals: cartTotalsFor(lines, settings),
    shop: toShopPublicDto(settings, config),
    itemCount: lines.reduce((s, l) => s + l.quantity, 0),
    currency: settings.currency,
  };
}

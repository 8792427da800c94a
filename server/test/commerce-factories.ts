import type { StaffProductDto } from '../../shared/catalogue';
import { AppDataSource } from '../db/data-source';
import { recordStockMovement } from '../stock/stock-ledger';
import { fitmentInput, productInput, springInput } from './catalogue-factories';
import { userWithToken } from './factories';
import type request from 'supertest';
import type { Config } from '../config';

/**
 * A bike with fork and shock spring ladders and an adapter kit, made through the staff
 * API as the back office would (the same ladders as the recommendation tests; figures invented for tests).
 */
export async function shopWithSprings(t: { http: ReturnType<typeof request>; config: Config }) {
  const staff = await userWithToken(t.config, 'staff');
  const post = async (path: string, body: object) => (await t.http.post(path).set(staff.auth).send(body).expect(201)).body;
  const fitment = await post('/api/staff/fitments', fitmentInput());
  const shocks: StaffProductDto[] = [];
  for (const [rate, coils] of [[75, 8.9], [85, 8], [95, 7.4], [105, 7]] as const) {
    shocks.push(await post('/api/staff/products', springInput({ name: `Shock ${rate}`, sku: `LL-SHOCK-${rate}`, priceCents: 15_900, stockOnHand: 6 }, { rateNPerMm: rate, totalCoils: coils })));
  }
  const forks: StaffProductDto[] = [];
  for (const [rate, coils] of [[8, 31.3], [9, 28], [10, 25.4], [11, 23.3], [12, 21.5]] as const) {
    forks.push(
      await post('/api/staff/products', springInput({ name: `Fork ${rate}`, sku: `LL-FORK-${rate}`, priceCents: 6_450, stockOnHand: 8 }, { end: 'fork', rateNPerMm: rate, freeLengthMm: 460, innerDiameterMm: 28, outerDiameterMm: 39, wireDiameterMm: 5.5, totalCoils: coils })),
    );
  }
  const adapter: StaffProductDto = await post('/api/staff/products', productInput({ name: 'Seat adapter', sku: 'LL-AD-1', priceCents: 1_200, stockOnHand: 10 }));
  /** Staff say a spring needs the adapter on this bike (as the compatibility table does). */
  const needsAdapter = async (springId: string) =>
    t.http.put(`/api/staff/fitments/${fitment.id}/springs/${springId}/adapters`).set(staff.auth).send({ adapters: [{ productId: adapter.id, quantity: 1 }] }).expect(200);
  return { staff, fitment, shocks, forks, adapter, needsAdapter };
}

/** A plain product written straight to the table (for stock races, where the staff API is beside the point); its stock arrives through the ledger. */
export async function plainProduct(stock: number, priceCents = 2_500, name = 'Sag measuring tool'): Promise<{ id: string; name: string }> {
  return AppDataSource.transaction(async (em) => {
    const [row] = (await em.query(
      `INSERT INTO products (sku, name, kind, price_cents, stock_on_hand, bin_location) VALUES ($1, $2, 'tool', $3, 0, 'T-01') RETURNING id, name`,
      [`LL-T-${Math.random().toString(36).slice(2, 10)}`, name, priceCents],
    )) as { id: string; name: string }[];
    if (stock > 0) await recordStockMovement(em, { productId: row!.id, quantity: stock, reason: 'receipt', deliveryRef: 'TEST-OPENING', actorId: null });
    return row!;
  });
}

/** The sum of a product's ledger rows, which must equal its on-hand count. */
export const ledgerSumOf = async (id: string): Promise<number> =>
  ((await AppDataSource.query(`SELECT COALESCE(sum(quantity), 0)::int AS s FROM stock_movements WHERE product_id = $1`, [id])) as { s: number }[])[0]!.s;

export const stockOf = async (id: string): Promise<number> =>
  ((await AppDataSource.query(`SELECT stock_on_hand FROM products WHERE id = $1`, [id])) as { stock_on_hand: number }[])[0]!.stock_on_hand;

// A 95 kg rider in 8 kg of gear: the test ladders hold springs the engine calls ok at both ends for it.
export const load = { ridingStyle: 'road', rider: { massKg: 95, gearKg: 8 }, luggage: [] } as const;

export const address = { name: 'Test Rider', line1: '1 Spring Street', postalCode: '10115', city: 'Eastbrook', country: 'DE' };

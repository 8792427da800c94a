import { expect, type Browser, type Page } from '@playwright/test';
import pg from 'pg';
import type { RecommendationDto, ShockRecommendationDto } from '../shared/catalogue';
import type { ExchangeDto, ExchangeProposalDto } from '../shared/commerce/exchange.dto';
import type { PickListDto } from '../shared/warehouse/fulfilment.dto';
import type { StockMovementDto } from '../shared/warehouse/stock';
import { demo, demoPassword, test } from './fixtures';
import { PaymentStandinPage } from './pages/shop.pages';
import { SignInPage } from './pages/sign-in.page';

const databaseUrl = process.env.E2E_DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54339/loadline_e2e';
const load = { ridingStyle: 'road', rider: { massKg: 85, gearKg: 8 }, luggage: [] };

async function sql<T>(text: string, values: unknown[] = []): Promise<T[]> {
  const c = new pg.Client({ connectionString: databaseUrl });
  await c.connect();
  try {
    return (await c.query(text, values)).rows as T[];
  } finally {
    await c.end();
  }
}
const onHand = async (id: string) => (await sql<{ n: number }>(`SELECT stock_on_hand AS n FROM products WHERE id = $1`, [id]))[0]!.n;

/** Another person in a browser of their own, signed in. */
async function personIn(browser: Browser, baseURL: string, who: keyof typeof demo, size = { width: 1440, height: 900 }): Promise<Page> {
  const ctx = await browser.newContext({ baseURL, viewport: size });
  const page = await ctx.newPage();
  const s = new SignInPage(page);
  await s.open();
  await s.signIn(demo[who], demoPassword);
  await expect(page.getByTestId('signed-in-as')).toContainText(who);
  return page;
}

/** A demo bike whose shock ladder has, for this load, a spring the engine calls too soft and a stiffer one it calls ok. */
async function bikeWithSoftShock(page: Page) {
  const list = (await (await page.request.get('/api/fitments?pageSize=100')).json()) as { items: { id: string }[] };
  for (const f of list.items) {
    const res = await page.request.post('/api/recommendations', { data: { fitmentId: f.id, ...load } });
    if (!res.ok()) continue;
    const rec = (await res.json()) as RecommendationDto;
    if (!('candidates' in rec.shock) || !('candidates' in rec.fork)) continue;
    const shock = rec.shock as ShockRecommendationDto;
    const soft = shock.candidates.find((c) => c.verdict === 'too-soft' && c.inStock && shock.candidates.some((o) => o.verdict === 'ok' && o.inStock && o.rateNPerMm > c.rateNPerMm));
    if (soft) return { fitmentId: f.id, shock: soft };
  }
  throw new Error('No demo bike has a too-soft shock with a stiffer ok one for this load');
}

test('a rider exchanges a too-soft shock spring with a sag check attached; staff approve, the warehouse receives and ships, the difference is paid on the stand-in, the ledger shows each movement', async ({ page, browser, signIn }, testInfo) => {
  test.setTimeout(120_000);
  const baseURL = String(testInfo.project.use.baseURL);
  await page.setViewportSize({ width: 390, height: 844 });
  await signIn('rider');

  // The rider bought the set with a shock the engine called too soft (they confirmed it anyway), paid on the stand-in's page.
  const { fitmentId, shock } = await bikeWithSoftShock(page);
  expect((await page.request.post('/api/cart/spring-set', { data: { fitmentId, ...load, shockProductId: shock.id, acceptVerdict: true } })).ok()).toBe(true);
  const placed = (await (await page.request.post('/api/checkout', {
    data: { email: demo.rider, shippingAddress: { name: 'Demo Rider', line1: '9 Rebound Lane', postalCode: '10115', city: 'Eastbrook', country: 'DE' } },
  })).json()) as { orderId: string; paymentUrl: string };
  await page.goto(placed.paymentUrl);
  await new PaymentStandinPage(page).pay('4242424242424242');
  await expect(page.getByText('Thank you — your payment is in.')).toBeVisible({ timeout: 20_000 });
  // The warehouse picks, packs, ships and marks the order delivered through its own API (its pages are another journey).
  const warehouse = await personIn(browser, baseURL, 'warehouse');
  const w = warehouse.request;
  const pickList = (await (await w.get(`/api/warehouse/orders/${placed.orderId}`)).json()) as PickListDto;
  for (const l of pickList.lines) expect((await w.put(`/api/warehouse/orders/${placed.orderId}/lines/${l.id}/picked`, { data: { pickedQuantity: l.quantity } })).ok()).toBe(true);
  expect((await w.post(`/api/warehouse/orders/${placed.orderId}/pack`)).ok()).toBe(true);
  expect((await w.post(`/api/warehouse/orders/${placed.orderId}/ship`, { data: { carrier: 'Parcel Express', trackingNumber: 'PX-20260000' } })).ok()).toBe(true);
  expect((await w.post(`/api/warehouse/orders/${placed.orderId}/deliver`)).ok()).toBe(true);

  // The order page offers the exchange; the request page proposes the stiffer rate the engine calls ok.
  await page.goto(`/orders/${placed.orderId}`);
  await page.getByRole('link', { name: `Exchange or return ${shock.name}` }).click();
  await expect(page.getByRole('heading', { name: 'The rate we propose' })).toBeVisible();
  await page.getByLabel('What is wrong with it?').selectOption('too-soft');
  const proposal = (await (await page.request.get(`/api/exchanges/proposal?orderLineId=${new URL(page.url()).searchParams.get('line')}&reason=too-soft`)).json()) as ExchangeProposalDto;
  const proposed = proposal.proposed!;
  expect(proposed.rateNPerMm).toBeGreaterThan(shock.rateNPerMm);
  await expect(page.getByText(proposed.name, { exact: false }).first()).toBeVisible();
  await expect(page.getByRole('region', { name: 'The rate we propose' }).getByText('Suits your load', { exact: true })).toBeVisible();
  await page.getByLabel('Attach my sag readings').check();
  await page.getByLabel('Fully extended (mm)').fill('600');
  await page.getByLabel("On the bike's own weight (mm)").fill('575');
  await page.getByLabel('With you aboard (mm)').fill('524');
  await page.getByLabel('Leverage ratio').fill('2');
  await page.getByLabel('Adjuster pitch (mm per turn)').fill('1');
  await page.getByRole('button', { name: 'Check these readings' }).click();
  await expect(page.getByText(/^Sag check:/)).toBeVisible();
  await page.screenshot({ path: testInfo.outputPath('exchange-request-390.png'), fullPage: true });
  // The stiffer spring costs 20.00 more than the one bought by the time the rider asks, so there is a difference to pay.
  await sql(`UPDATE products SET price_cents = price_cents + 2000 WHERE id = $1`, [proposed.productId]);
  await page.getByRole('button', { name: 'Ask for the exchange' }).click();
  await expect(page.getByRole('heading', { name: 'My exchanges and returns' })).toBeVisible();
  await expect(page.getByText('Waiting for the shop')).toBeVisible();
  await expect(page.getByText('Sag check attached')).toBeVisible();
  const ex = ((await (await page.request.get('/api/exchanges')).json()) as { items: ExchangeDto[] }).items[0]!;
  expect(ex.sagCheck?.result.springVerdict).toBeTruthy();

  // 20.00 more per spring, for each spring bought (twin-shock bikes take two).
  expect(ex.differenceCents).toBe(2_000 * ex.bought.quantity);
  const returnedBefore = await onHand(shock.id);
  const replacementBefore = await onHand(proposed.productId);
  try {

    const staff = await personIn(browser, baseURL, 'staff');
    await staff.goto('/staff/exchanges');
    await staff.getByLabel(`Message to the rider about ${ex.number}`).fill('Approved: a stiffer spring suits your readings.');
    await staff.screenshot({ path: testInfo.outputPath('staff-exchanges-1440.png'), fullPage: true });
    await staff.getByRole('button', { name: `Approve ${ex.number}` }).click();
    await expect(staff.getByRole('listitem').getByText('Approved: send the spring back')).toBeVisible();

    await warehouse.goto('/warehouse/returns');
    await warehouse.getByRole('button', { name: `Receive ${ex.number} and restock` }).click();
    await expect(warehouse.getByText('Waiting for the rider to pay the difference.')).toBeVisible();
    expect(await onHand(shock.id)).toBe(returnedBefore + ex.bought.quantity);

    // The rider pays the difference on the stand-in's page; its event marks it paid.
    await page.goto('/exchanges');
    await page.getByRole('link', { name: 'Pay the difference' }).click();
    await new PaymentStandinPage(page).pay('4242424242424242');
    await expect(page.getByRole('heading', { name: 'My exchanges and returns' })).toBeVisible({ timeout: 20_000 });
    await expect(async () => {
      await page.reload();
      await expect(page.getByText('Difference paid')).toBeVisible({ timeout: 1_000 });
    }).toPass({ timeout: 20_000 });

    await warehouse.reload();
    await warehouse.getByLabel(`Carrier for ${ex.number}`).fill('Parcel Express');
    await warehouse.getByLabel(`Tracking number for ${ex.number}`).fill('PX-20260001');
    await warehouse.screenshot({ path: testInfo.outputPath('warehouse-returns-1440.png'), fullPage: true });
    await warehouse.getByRole('button', { name: `Ship the replacement for ${ex.number}` }).click();
    await expect(warehouse.getByText('No replacements waiting.')).toBeVisible();
    expect(await onHand(proposed.productId)).toBe(replacementBefore - ex.bought.quantity);

    await page.reload();
    await expect(page.getByText('Replacement shipped')).toBeVisible();
    await expect(page.getByText('Shipped with Parcel Express, tracking PX-20260001')).toBeVisible();
    await page.screenshot({ path: testInfo.outputPath('my-exchanges-390.png'), fullPage: true });
    await page.setViewportSize({ width: 1440, height: 900 });
    await page.screenshot({ path: testInfo.outputPath('my-exchanges-1440.png'), fullPage: true });

    // The stock ledger shows the return and the replacement, each naming the exchange, and still sums to on-hand.
    for (const [productId, quantity, reason] of [[shock.id, ex.bought.quantity, 'return'], [proposed.productId, -ex.bought.quantity, 'sale']] as const) {
      const rows = ((await (await staff.request.get(`/api/staff/stock/movements?productId=${productId}&reason=${reason}`)).json()) as { items: StockMovementDto[] }).items;
      expect(rows.filter((m) => m.exchangeId === ex.id).map((m) => m.quantity)).toEqual([quantity]);
      const [sum] = await sql<{ n: number }>(`SELECT coalesce(sum(quantity), 0)::int AS n FROM stock_movements WHERE product_id = $1`, [productId]);
      expect(sum!.n).toBe(await onHand(productId));
    }

    // One mail per step, each promised once.
    const mails = await sql<{ dedupe_key: string }>(`SELECT dedupe_key FROM mail_outbox WHERE dedupe_key LIKE '%' || $1 ORDER BY created_at`, [ex.id]);
    expect(mails.map((m) => m.dedupe_key.split(':')[0])).toEqual(['exchange-requested', 'exchange-approved', 'exchange-received', 'exchange-paid', 'exchange-shipped']);
  } finally {
    // The demo price is put back for the journeys that follow.
    await sql(`UPDATE products SET price_cents = price_cents - 2000 WHERE id = $1`, [proposed.productId]);
  }
});

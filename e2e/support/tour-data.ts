import { expect, type APIRequestContext, type APIResponse, type Browser, type BrowserContext } from '@playwright/test';
import type { BikeDto } from '../../shared/bikes';
import type { FitmentSummaryDto, ForkRecommendationDto, RecommendationDto, ShockRecommendationDto } from '../../shared/catalogue';
import type { ExchangeDto } from '../../shared/commerce/exchange.dto';
import type { OrderDto, OrderSummaryDto } from '../../shared/commerce/order.dto';
import type { PickListDto, WarehouseQueueDto } from '../../shared/warehouse/fulfilment.dto';
import { demo, demoPassword, type DemoRole } from '../fixtures';

/** The demo bike the tour shows: one no other journey buys for, so its springs' stock is the tour's own to give back. */
export const tourBike = { make: 'Kestrune', model: 'Meridian 700', variant: '', years: /2019–2025$/ } as const;
export const tourLoad = { ridingStyle: 'road', rider: { massKg: 95, gearKg: 8 }, luggage: [] as { station: string; massKg: number }[] };
export const tourNickname = 'Page-tour bike';
// The shipping name marks the tour's own order, so a later run against the same data finds it instead of buying again.
const shipTo = { name: 'Tour Rider', line1: '5 Damper Street', postalCode: '10117', city: 'Eastbrook', country: 'DE' };

async function json<T>(what: string, res: APIResponse): Promise<T> {
  if (!res.ok()) throw new Error(`${what}: ${res.status()} ${await res.text()}`);
  return (await res.json()) as T;
}

/** A browser context signed in as a demo account; the tour keeps one per role and reuses its cookie for every page. */
export async function signedInContext(browser: Browser, baseURL: string, role: DemoRole | 'guest'): Promise<BrowserContext> {
  const ctx = await browser.newContext({ baseURL, viewport: { width: 1440, height: 900 } });
  if (role !== 'guest') await json('sign in', await ctx.request.post('/api/auth/login', { data: { email: demo[role], password: demoPassword } }));
  return ctx;
}

export interface TourData {
  fitmentId: string;
  forkId: string;
  shockId: string;
  bikeId: string;
  orderId: string;
  orderNumber: string;
  /** A spring line of the delivered order that is still open for an exchange request. */
  openLineId: string;
  exchangeNumber: string;
  shockName: string;
  /** What the finder's "Add this set to the cart" sends for the tour bike and load. */
  springSet: Record<string, unknown>;
  /** A paid order still waiting to be picked, for the pick list. */
  pickOrderId: string;
  setupSheetQuery: string;
}

export async function findTourFitment(api: APIRequestContext): Promise<string> {
  const list = await json<{ items: FitmentSummaryDto[] }>('fitments', await api.get('/api/fitments?pageSize=100'));
  const f = list.items.find((i) => i.make === tourBike.make && i.model === tourBike.model && i.variant === tourBike.variant);
  if (!f) throw new Error(`The demo bike ${tourBike.make} ${tourBike.model} is missing`);
  return f.id;
}

/** The rider's saved tour bike, with one sag check in its history; made on the first run. */
async function tourBikeId(rider: APIRequestContext, fitmentId: string, forkId: string, shockId: string): Promise<string> {
  const found = (await json<{ items: BikeDto[] }>('bikes', await rider.get('/api/bikes'))).items.find((b) => b.nickname === tourNickname);
  if (found) return found.id;
  const bike = await json<BikeDto>('save bike', await rider.post('/api/bikes', {
    data: { nickname: tourNickname, fitmentId, ridingStyle: tourLoad.ridingStyle, load: { rider: tourLoad.rider, luggage: [] }, forkSpringId: forkId, shockSpringId: shockId },
  }));
  await json('sag check', await rider.post(`/api/bikes/${bike.id}/sag-checks`, { data: { end: 'rear', extendedMm: 600, staticMm: 575, riderMm: 530 } }));
  return bike.id;
}

/** A spring set bought, paid on the payment stand-in and delivered by the warehouse, as people do it. */
async function deliveredOrder(rider: APIRequestContext, warehouse: APIRequestContext, set: Record<string, unknown>): Promise<string> {
  await emptyCart(rider);
  await json('spring set', await rider.post('/api/cart/spring-set', { data: set }));
  const placed = await json<{ orderId: string; paymentUrl: string }>('checkout', await rider.post('/api/checkout', { data: { email: demo.rider, shippingAddress: shipTo } }));
  const paid = await rider.post(placed.paymentUrl, { form: { cardNumber: '4242424242424242' }, maxRedirects: 0 });
  expect(paid.status(), 'the payment stand-in takes the test card').toBeLessThan(400);
  await expect.poll(async () => (await json<OrderDto>('order', await rider.get(`/api/orders/${placed.orderId}`))).paymentStatus, { timeout: 30_000 }).toBe('paid');
  const pick = await json<PickListDto>('pick list', await warehouse.get(`/api/warehouse/orders/${placed.orderId}`));
  for (const l of pick.lines) await json('pick', await warehouse.put(`/api/warehouse/orders/${placed.orderId}/lines/${l.id}/picked`, { data: { pickedQuantity: l.quantity } }));
  await json('pack', await warehouse.post(`/api/warehouse/orders/${placed.orderId}/pack`));
  await json('ship', await warehouse.post(`/api/warehouse/orders/${placed.orderId}/ship`, { data: { carrier: 'Parcel Express', trackingNumber: 'PX-TOUR-0001' } }));
  await json('deliver', await warehouse.post(`/api/warehouse/orders/${placed.orderId}/deliver`));
  return placed.orderId;
}

/**
 * One of everything the pages show: a saved bike with a sag check; a spring set bought, delivered, with an exchange
 * asked for its shock spring and approved by staff. Made once and found again on later runs against the same data,
 * so the tour buys one set per database.
 */
export async function tourData(rider: APIRequestContext, staff: APIRequestContext, warehouse: APIRequestContext): Promise<TourData> {
  const fitmentId = await findTourFitment(rider);
  const orders = (await json<{ items: OrderSummaryDto[] }>('orders', await rider.get('/api/orders'))).items;
  let orderId = orders.find((o) => o.customerName === shipTo.name && o.fulfilmentStatus === 'delivered')?.id;
  let forkId: string, shockId: string;
  if (orderId) {
    const lines = (await json<OrderDto>('order', await rider.get(`/api/orders/${orderId}`))).lines;
    forkId = lines.find((l) => l.setup?.end === 'fork')!.productId!;
    shockId = lines.find((l) => l.setup?.end === 'shock')!.productId!;
  } else {
    const rec = await json<RecommendationDto>('recommendation', await rider.post('/api/recommendations', { data: { fitmentId, ...tourLoad } }));
    const fork = (rec.fork as ForkRecommendationDto).candidates.find((c) => c.verdict === 'ok' && c.inStock);
    const shock = (rec.shock as ShockRecommendationDto).candidates.find((c) => c.verdict === 'ok' && c.inStock);
    if (!fork || !shock) throw new Error('The tour bike has no suiting spring in stock for the tour load');
    forkId = fork.id;
    shockId = shock.id;
  }
  const springSet = { fitmentId, ...tourLoad, forkProductId: forkId, shockProductId: shockId };
  orderId ??= await deliveredOrder(rider, warehouse, springSet);
  const order = await json<OrderDto>('order', await rider.get(`/api/orders/${orderId}`));
  const shockLine = order.lines.find((l) => l.productId === shockId)!;
  const forkLine = order.lines.find((l) => l.productId === forkId)!;

  let ex = (await json<{ items: ExchangeDto[] }>('exchanges', await rider.get('/api/exchanges'))).items.find((e) => e.orderLineId === shockLine.id);
  if (!ex) {
    ex = await json<ExchangeDto>('exchange', await rider.post('/api/exchanges', { data: { orderLineId: shockLine.id, kind: 'exchange', reason: 'too-soft', reasonText: 'Sits low with luggage.' } }));
    await json('decision', await staff.post(`/api/staff/exchanges/${ex.id}/decision`, { data: { approve: true, message: 'Approved: send the spring back.' } }));
  }
  const queue = await json<WarehouseQueueDto>('queue', await warehouse.get('/api/warehouse/orders'));
  const q = new URLSearchParams({ fitmentId, ridingStyle: tourLoad.ridingStyle, riderKg: String(tourLoad.rider.massKg), gearKg: String(tourLoad.rider.gearKg), forkId, shockId });
  return {
    fitmentId,
    forkId,
    shockId,
    bikeId: await tourBikeId(rider, fitmentId, forkId, shockId),
    orderId: order.id,
    orderNumber: order.number,
    openLineId: forkLine.id,
    exchangeNumber: ex.number,
    shockName: shockLine.name,
    springSet,
    pickOrderId: queue.items.find((o) => o.fulfilmentStatus === 'unfulfilled')?.id ?? order.id,
    setupSheetQuery: q.toString(),
  };
}

export async function fillCart(api: APIRequestContext, data: TourData): Promise<void> {
  await emptyCart(api);
  await json('spring set', await api.post('/api/cart/spring-set', { data: data.springSet }));
}

/** The rider's cart is left empty, as the other journeys expect it. */
export async function emptyCart(api: APIRequestContext): Promise<void> {
  const cart = (await (await api.get('/api/cart')).json()) as { lines?: { id: string }[] };
  for (const l of cart.lines ?? []) await api.delete(`/api/cart/lines/${l.id}`);
}

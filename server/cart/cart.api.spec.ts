import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { cartTotals } from '../../shared/cart-totals';
import type { CartDto } from '../../shared/commerce/cart.dto';
import type { RecommendationDto, ShockRecommendationDto, ForkRecommendationDto } from '../../shared/catalogue';
import { address, load, plainProduct, shopWithSprings } from '../test/commerce-factories';
import { createUser, testApp, testPassword } from '../test/factories';

const cookieOf = (res: request.Response) => ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith('loadline_cart='));

describe('cart', () => {
  it('a guest adds a product: an httpOnly cookie names the cart, the price is copied and the totals are the shared computation', async () => {
    const { http } = testApp();
    const p = await plainProduct(5, 4_900);
    const res = await http.post('/api/cart/lines').send({ productId: p.id, quantity: 2 });
    expect(res.status).toBe(201);
    const cookie = cookieOf(res)!;
    expect(cookie).toMatch(/HttpOnly/i);
    const cart = res.body as CartDto;
    expect(cart.lines).toHaveLength(1);
    expect(cart.lines[0]).toMatchObject({ productId: p.id, quantity: 2, unitPriceCents: 4_900, lineTotalCents: 9_800 });
    // Client and server agree because both call cartTotals with the shop's figures.
    expect(cart.totals).toEqual(cartTotals([{ unitPriceCents: 4_900, quantity: 2 }], cart.shop));
    expect(cart.totals).toMatchObject({ subtotalCents: 9_800, shippingCents: 690, totalCents: 10_490 });

    const again = await http.get('/api/cart').set('Cookie', cookie.split(';')[0]!);
    expect(again.body.lines).toHaveLength(1);
    // Another visitor without the cookie sees an empty cart.
    expect((await http.get('/api/cart')).body.lines).toEqual([]);
  });

  it('more than the shelf holds is refused with the product named, and the cart stays as it was', async () => {
    const { app } = testApp();
    const agent = request.agent(app);
    const p = await plainProduct(3, 2_000, 'Preload spanner');
    await agent.post('/api/cart/lines').send({ productId: p.id, quantity: 2 }).expect(201);
    const res = await agent.post('/api/cart/lines').send({ productId: p.id, quantity: 2 });
    expect(res.status).toBe(409);
    expect(res.body.message).toContain('Preload spanner');
    expect((await agent.get('/api/cart')).body.lines[0].quantity).toBe(2);
  });

  it('quantities are whole numbers from 1 to 20, refused per field', async () => {
    const { http } = testApp();
    const p = await plainProduct(50);
    const res = await http.post('/api/cart/lines').send({ productId: p.id, quantity: 0.5 });
    expect(res.status).toBe(400);
    expect(res.body.fields.quantity).toBeTruthy();
    expect((await http.post('/api/cart/lines').send({ productId: 'nope', quantity: 1 })).body.fields.productId).toBeTruthy();
  });

  it('a spring set is the engine\'s own: springs with the adapters that bike needs, and the bike, load and setup figures kept with them', async () => {
    const t = testApp();
    const { fitment, forks, adapter, needsAdapter } = await shopWithSprings(t);
    const first = (await t.http.post('/api/recommendations').send({ fitmentId: fitment.id, ...load }).expect(200)).body as RecommendationDto;
    await needsAdapter((first.shock as ShockRecommendationDto).candidates.find((c) => c.verdict === 'ok')!.id);
    const rec = (await t.http.post('/api/recommendations').send({ fitmentId: fitment.id, ...load }).expect(200)).body as RecommendationDto;
    const shock = rec.shock as ShockRecommendationDto;
    const fork = rec.fork as ForkRecommendationDto;
    const okFork = fork.candidates.find((c) => c.verdict === 'ok')!;
    const shock85 = shock.candidates.find((c) => c.verdict === 'ok')!;
    expect(shock85.adapters.map((a) => a.id)).toEqual([adapter.id]);

    const agent = request.agent(t.app);
    const res = await agent.post('/api/cart/spring-set').send({ fitmentId: fitment.id, ...load, forkProductId: okFork.id, shockProductId: shock85.id });
    expect(res.status).toBe(201);
    const cart = res.body as CartDto;
    const byProduct = new Map(cart.lines.map((l) => [l.productId, l]));
    // A pair of fork springs (the fitment's spring count), one shock spring, and the adapter the 85 N/mm spring needs here.
    expect(byProduct.get(okFork.id)?.quantity).toBe(2);
    expect(byProduct.get(shock85.id)?.quantity).toBe(1);
    expect(byProduct.get(adapter.id)?.quantity).toBe(1);
    expect(byProduct.get(shock85.id)?.unitPriceCents).toBe(15_900);
    expect(cart.sets).toHaveLength(1);
    const set = cart.sets[0]!;
    expect(set.bikeLabel).toContain(fitment.model);
    expect(set.loads.map((l) => l.station)).toEqual(['rider']);
    const shockSetup = set.setup.find((s) => s.end === 'shock')!;
    // The figures are the engine's for this load, exactly as the recommendation gave them.
    expect(shockSetup).toMatchObject({ preloadMm: shock85.preloadMm, staticSagMm: shock85.staticSagMm, riderSagMm: shock85.riderSagMm, rateNPerMm: shock85.rateNPerMm, verdict: 'ok' });
    expect(forks.map((f) => f.id)).toContain(okFork.id);
  });

  it('a spring the shop does not offer for that bike cannot be put in the cart, whatever the client sends', async () => {
    const t = testApp();
    const { fitment } = await shopWithSprings(t);
    const stranger = await plainProduct(5);
    const res = await t.http.post('/api/cart/spring-set').send({ fitmentId: fitment.id, ...load, shockProductId: stranger.id });
    expect(res.status).toBe(400);
    expect(res.body.fields.shockProductId).toMatch(/not one the shop offers/);
  });

  it('a spring the engine does not call ok needs acceptVerdict, and then carries its warning', async () => {
    const t = testApp();
    const { fitment } = await shopWithSprings(t);
    const rec = (await t.http.post('/api/recommendations').send({ fitmentId: fitment.id, ...load }).expect(200)).body as RecommendationDto;
    const notOk = (rec.shock as ShockRecommendationDto).candidates.find((c) => c.verdict !== 'ok')!;
    const refused = await t.http.post('/api/cart/spring-set').send({ fitmentId: fitment.id, ...load, shockProductId: notOk.id });
    expect(refused.status).toBe(409);
    expect(refused.body.fields.shockProductId).toMatch(/anyway/);
    const agent = request.agent(t.app);
    const ok = await agent.post('/api/cart/spring-set').send({ fitmentId: fitment.id, ...load, shockProductId: notOk.id, acceptVerdict: true });
    expect(ok.status).toBe(201);
    const line = (ok.body as CartDto).lines.find((l) => l.productId === notOk.id)!;
    expect(line.verdict).toBe(notOk.verdict);
    expect(line.warnings.join(' ')).toMatch(/you chose it anyway/);
  });

  it('a guest cart merges into the rider\'s own on sign-in; the same product adds up', async () => {
    const { app } = testApp();
    const rider = await createUser();
    const p = await plainProduct(10);
    const q = await plainProduct(10, 1_000, 'Fork oil');
    const signedIn = request.agent(app);
    await signedIn.post('/api/auth/login').send({ email: rider.email, password: testPassword }).expect(200);
    await signedIn.post('/api/cart/lines').send({ productId: p.id, quantity: 1 }).expect(201);

    const guest = request.agent(app);
    await guest.post('/api/cart/lines').send({ productId: p.id, quantity: 2 }).expect(201);
    await guest.post('/api/cart/lines').send({ productId: q.id, quantity: 1 }).expect(201);
    await guest.post('/api/auth/login').send({ email: rider.email, password: testPassword }).expect(200);
    const merged = (await guest.get('/api/cart').expect(200)).body as CartDto;
    expect(merged.lines.map((l) => [l.productId, l.quantity]).sort()).toEqual([[p.id, 3], [q.id, 1]].sort());
    // The same cart from the rider's other session, and the guest cart is gone.
    expect((await signedIn.get('/api/cart')).body.itemCount).toBe(4);
    void address;
  });
});

import request from 'supertest';
import { describe, expect, it } from 'vitest';
import type { BikeDto, BikeSagCheckDto, BikeSummaryDto } from '../../shared/bikes';
import type { FitmentDto, ForkRecommendationDto, RecommendationDto, ShockRecommendationDto } from '../../shared/catalogue';
import type { OrderSummaryDto } from '../../shared/commerce/order.dto';
import { checkSag, roundAnswer } from '../../shared/engine';
import { address, load, shopWithSprings } from '../test/commerce-factories';
import { createUser, testApp, testPassword, userWithToken } from '../test/factories';
import { paymentsApp } from '../test/payments-standin';

type T = ReturnType<typeof testApp>;

/** A shop with one bike and spring ladders, a rider, and the finder's answer for the test load. */
async function riderWithFinderAnswer(t: T) {
  const shop = await shopWithSprings(t);
  const rider = await userWithToken(t.config);
  const rec = (await t.http.post('/api/recommendations').send({ fitmentId: shop.fitment.id, ...load }).expect(200)).body as RecommendationDto;
  const fork = (rec.fork as ForkRecommendationDto).candidates.find((c) => c.verdict === 'ok')!;
  const shock = (rec.shock as ShockRecommendationDto).candidates.find((c) => c.verdict === 'ok')!;
  const body = {
    nickname: 'Weekday commuter',
    fitmentId: shop.fitment.id as string,
    ridingStyle: load.ridingStyle,
    load: { rider: load.rider, luggage: [] },
    forkSpringId: fork.id,
    shockSpringId: shock.id,
  };
  return { ...shop, rider, rec, fork, shock, body };
}

describe('my bikes', () => {
  it('a rider saves a bike with its load and springs, lists it, reads it back, renames, updates and deletes it', async () => {
    const t = testApp();
    const { rider, body, fork, shock, fitment } = await riderWithFinderAnswer(t);
    const twoUp = { name: 'two-up touring', rider: load.rider, passengerKg: 70, luggage: [] };
    const created = await t.http.post('/api/bikes').set(rider.auth).send({ ...body, cases: [twoUp] });
    expect(created.status).toBe(201);
    const bike = created.body as BikeDto;
    expect(bike).toMatchObject({ nickname: 'Weekday commuter', fitmentId: fitment.id, ridingStyle: 'road', sagCheckCount: 0, lastCheck: null });
    expect(bike.bikeLabel).toContain(fitment.model);
    expect(bike.forkSpring).toMatchObject({ id: fork.id, rateNPerMm: fork.rateNPerMm });
    expect(bike.shockSpring).toMatchObject({ id: shock.id });
    expect(bike.load).toEqual({ rider: load.rider, luggage: [] });
    expect(bike.cases).toEqual([twoUp]);

    const list = (await t.http.get('/api/bikes').set(rider.auth).expect(200)).body.items as BikeSummaryDto[];
    expect(list.map((b) => b.id)).toEqual([bike.id]);
    // Entities never leave the server: no owner id in the reply.
    expect(Object.keys(list[0]!)).not.toContain('userId');
    expect((await t.http.get(`/api/bikes/${bike.id}`).set(rider.auth).expect(200)).body).toEqual(bike);

    const renamed = await t.http.patch(`/api/bikes/${bike.id}`).set(rider.auth).send({ nickname: '  Sunday bike ' });
    expect(renamed.status).toBe(200);
    expect(renamed.body.nickname).toBe('Sunday bike');

    const updated = await t.http.put(`/api/bikes/${bike.id}`).set(rider.auth).send({ ...body, nickname: 'Sunday bike', ridingStyle: 'adventure', forkSpringId: undefined });
    expect(updated.status).toBe(200);
    expect(updated.body).toMatchObject({ ridingStyle: 'adventure', forkSpring: null, cases: [] });

    await t.http.delete(`/api/bikes/${bike.id}`).set(rider.auth).expect(204);
    expect((await t.http.get(`/api/bikes/${bike.id}`).set(rider.auth)).status).toBe(404);
    expect((await t.http.get('/api/bikes').set(rider.auth)).body.items).toEqual([]);
  });

  it('bad input is refused per field with a 400, never a 500', async () => {
    const t = testApp();
    const { rider, body, shock, fork } = await riderWithFinderAnswer(t);
    const refused = async (payload: object, field: string) => {
      const res = await t.http.post('/api/bikes').set(rider.auth).send(payload);
      expect(res.status, field).toBe(400);
      expect(res.body.fields?.[field], `${field}: ${JSON.stringify(res.body)}`).toBeTruthy();
    };
    await refused({ ...body, nickname: '' }, 'nickname');
    await refused({ ...body, nickname: '   ' }, 'nickname');
    await refused({ ...body, nickname: 'x'.repeat(61) }, 'nickname');
    await refused({ ...body, fitmentId: 'not-an-id' }, 'fitmentId');
    await refused({ ...body, fitmentId: '00000000-0000-4000-8000-000000000000' }, 'fitmentId');
    await refused({ ...body, ridingStyle: 'racing' }, 'ridingStyle');
    await refused({ ...body, load: undefined }, 'load');
    await refused({ ...body, load: { rider: { massKg: 'heavy', gearKg: 8 } } }, 'load.rider.massKg');
    await refused({ ...body, load: { rider: { massKg: 95, gearKg: -1 } } }, 'load.rider.gearKg');
    await refused({ ...body, cases: [] }, 'cases');
    await refused({ ...body, cases: [{ name: '', rider: load.rider }] }, 'cases.0.name');
    await refused({ ...body, forkSpringId: 'nope' }, 'forkSpringId');
    // A real spring, but at the other end: not one the shop offers for the fork.
    await refused({ ...body, forkSpringId: shock.id }, 'forkSpringId');
    await refused({ ...body, shockSpringId: fork.id }, 'shockSpringId');
    await refused({ ...body, ownerId: rider.user.id }, 'ownerId');
    const rename = await t.http.patch(`/api/bikes/${(await t.http.post('/api/bikes').set(rider.auth).send(body)).body.id}`).set(rider.auth).send({ nickname: 7 });
    expect(rename.status).toBe(400);
    expect(rename.body.fields.nickname).toBeTruthy();
  });

  it('guests are refused, and another account guessing a bike id gets a 404 for every route, so ids leak nothing', async () => {
    const t = testApp();
    const { rider, body } = await riderWithFinderAnswer(t);
    const bike = (await t.http.post('/api/bikes').set(rider.auth).send(body).expect(201)).body as BikeDto;
    const reading = { end: 'rear', extendedMm: 600, staticMm: 580, riderMm: 545 };
    const check = (await t.http.post(`/api/bikes/${bike.id}/sag-checks`).set(rider.auth).send(reading).expect(201)).body as BikeSagCheckDto;

    expect((await t.http.get('/api/bikes')).status).toBe(401);
    expect((await t.http.post('/api/bikes').send(body)).status).toBe(401);
    expect((await t.http.get(`/api/bikes/${bike.id}`)).status).toBe(401);

    // Staff and admins have no way into a rider's bikes either: the garage is private.
    for (const role of ['rider', 'staff', 'admin'] as const) {
      const other = await userWithToken(t.config, role);
      const as = (r: request.Test) => r.set(other.auth);
      const missing = '00000000-0000-4000-8000-000000000000';
      for (const id of [bike.id, missing]) {
        expect((await as(t.http.get(`/api/bikes/${id}`))).status, `${role} get ${id}`).toBe(404);
        expect((await as(t.http.patch(`/api/bikes/${id}`).send({ nickname: 'Mine now' }))).status).toBe(404);
        expect((await as(t.http.put(`/api/bikes/${id}`).send(body))).status).toBe(404);
        expect((await as(t.http.get(`/api/bikes/${id}/sag-checks`))).status).toBe(404);
        expect((await as(t.http.post(`/api/bikes/${id}/sag-checks`).send(reading))).status).toBe(404);
        expect((await as(t.http.get(`/api/bikes/${id}/orders`))).status).toBe(404);
        expect((await as(t.http.delete(`/api/bikes/${id}/sag-checks/${check.id}`))).status).toBe(404);
        expect((await as(t.http.delete(`/api/bikes/${id}`))).status).toBe(404);
      }
      expect((await as(t.http.get('/api/bikes'))).body.items).toEqual([]);
    }
    // A check id on another of the rider's own bikes does not reach this one either.
    const second = (await t.http.post('/api/bikes').set(rider.auth).send({ ...body, nickname: 'Spare' }).expect(201)).body as BikeDto;
    expect((await t.http.delete(`/api/bikes/${second.id}/sag-checks/${check.id}`).set(rider.auth)).status).toBe(404);
    expect((await t.http.get(`/api/bikes/not-a-uuid`).set(rider.auth)).status).toBe(404);
    // Everything still there, unchanged.
    const mine = (await t.http.get(`/api/bikes/${bike.id}`).set(rider.auth).expect(200)).body as BikeDto;
    expect(mine.nickname).toBe('Weekday commuter');
    expect((await t.http.get(`/api/bikes/${bike.id}/sag-checks`).set(rider.auth)).body.items).toHaveLength(1);
  });

  it('a sag check is judged by the server from the readings and the saved bike, and agrees with the shared checkSag', async () => {
    const t = testApp();
    const { rider, body, rec } = await riderWithFinderAnswer(t);
    const bike = (await t.http.post('/api/bikes').set(rider.auth).send(body).expect(201)).body as BikeDto;
    const fitment = (await t.http.get(`/api/fitments/${body.fitmentId}`).expect(200)).body as FitmentDto;
    const shockRec = rec.shock as ShockRecommendationDto;
    const forkRec = rec.fork as ForkRecommendationDto;

    // Rear: 20 mm static sag on target, 70 mm rider sag against a 55 mm target (road targets of the test bike).
    const rear = { end: 'rear' as const, extendedMm: 600, staticMm: 580, riderMm: { down: 528, up: 532 } };
    // A client's own verdict is not a field the server takes.
    const forged = await t.http.post(`/api/bikes/${bike.id}/sag-checks`).set(rider.auth).send({ ...rear, result: { springVerdict: 'ok' } });
    expect(forged.status).toBe(400);
    const saved = (await t.http.post(`/api/bikes/${bike.id}/sag-checks`).set(rider.auth).send(rear).expect(201)).body as BikeSagCheckDto;
    // Built here by hand from the fitment and the finder's answer, not through the server's helper.
    const expectedRear = roundAnswer(
      checkSag({
        ...rear,
        targets: { staticSagMm: rec.targets.shock.staticSagMm, riderSagMm: rec.targets.shock.riderSagMm },
        toleranceMm: rec.targets.shock.staticSagToleranceMm,
        leverageRatio: fitment.rearLeverageRatio!,
        adjusterPitchMm: fitment.rearAdjusterPitchMm,
        shockCount: fitment.shockCount,
        bikeLoadN: shockRec.bikeLoadN,
        riderLoadN: shockRec.rearLoadN,
      }),
    );
    expect(saved.result).toEqual(expectedRear);
    // Sag is the fully extended length less the loaded length (common practice); pairs are averaged to cancel friction.
    expect(saved.result.staticSagMm).toBeCloseTo(20, 2);
    expect(saved.result.riderSagMm).toBeCloseTo(70, 2);
    expect(saved.result.preloadChangeMm).toBeGreaterThan(0);
    expect(saved.targets).toEqual({ staticSagMm: 20, riderSagMm: 55, toleranceMm: rec.targets.shock.staticSagToleranceMm });

    const front = { end: 'front' as const, extendedMm: 800, staticMm: 770, riderMm: 745 };
    const savedFront = (await t.http.post(`/api/bikes/${bike.id}/sag-checks`).set(rider.auth).send(front).expect(201)).body as BikeSagCheckDto;
    const expectedFront = roundAnswer(
      checkSag({
        ...front,
        targets: { staticSagMm: rec.targets.fork.staticSagMm, riderSagMm: rec.targets.fork.riderSagMm },
        toleranceMm: rec.targets.fork.staticSagToleranceMm,
        forkAngleDeg: fitment.forkAngleDeg,
        springCount: fitment.forkSpringCount,
        adjusterPitchMm: fitment.forkAdjusterPitchMm!,
        bikeLoadN: forkRec.bikeLoadN,
        riderLoadN: forkRec.frontLoadN,
      }),
    );
    expect(savedFront.result).toEqual(expectedFront);

    const history = (await t.http.get(`/api/bikes/${bike.id}/sag-checks`).set(rider.auth).expect(200)).body.items as BikeSagCheckDto[];
    expect(history.map((c) => c.end)).toEqual(['front', 'rear']);
    const card = (await t.http.get(`/api/bikes/${bike.id}`).set(rider.auth)).body as BikeDto;
    expect(card.sagCheckCount).toBe(2);
    expect(card.lastCheck).toMatchObject({ end: 'front', springVerdict: expectedFront.springVerdict });

    await t.http.delete(`/api/bikes/${bike.id}/sag-checks/${saved.id}`).set(rider.auth).expect(204);
    expect((await t.http.get(`/api/bikes/${bike.id}/sag-checks`).set(rider.auth)).body.items).toHaveLength(1);
  });

  it('sag readings are refused per field', async () => {
    const t = testApp();
    const { rider, body } = await riderWithFinderAnswer(t);
    const bike = (await t.http.post('/api/bikes').set(rider.auth).send(body).expect(201)).body as BikeDto;
    const ok = { end: 'rear', extendedMm: 600, staticMm: 580, riderMm: 540 };
    const refused = async (payload: object, field: string) => {
      const res = await t.http.post(`/api/bikes/${bike.id}/sag-checks`).set(rider.auth).send(payload);
      expect(res.status, field).toBe(400);
      expect(res.body.fields?.[field], `${field}: ${JSON.stringify(res.body)}`).toBeTruthy();
    };
    await refused({ ...ok, end: 'middle' }, 'end');
    await refused({ ...ok, extendedMm: 0 }, 'extendedMm');
    await refused({ ...ok, extendedMm: '600' }, 'extendedMm');
    await refused({ ...ok, staticMm: 610 }, 'staticMm');
    await refused({ ...ok, staticMm: { down: 580 } }, 'staticMm');
    await refused({ ...ok, riderMm: 590 }, 'riderMm');
    await refused({ ...ok, riderMm: undefined }, 'riderMm');
    await refused({ ...ok, targets: { staticSagMm: 1, riderSagMm: 2 } }, 'targets');
  });

  it('the bike lists the rider’s own orders holding springs worked out for its fitment, and no one else’s', async () => {
    const a = await paymentsApp();
    try {
      const t = { http: a.http, config: a.config, app: a.app } as T;
      const { body, fork, shock } = await riderWithFinderAnswer(t);
      const buyer = await createUser();
      const agent = request.agent(a.app);
      await agent.post('/api/auth/login').send({ email: buyer.email, password: testPassword }).expect(200);
      const bike = (await agent.post('/api/bikes').send(body).expect(201)).body as BikeDto;
      expect((await agent.get(`/api/bikes/${bike.id}/orders`).expect(200)).body.items).toEqual([]);

      await agent.post('/api/cart/spring-set').send({ fitmentId: body.fitmentId, ...load, forkProductId: fork.id, shockProductId: shock.id }).expect(201);
      const { orderId } = (await agent.post('/api/checkout').send({ email: buyer.email, shippingAddress: address }).expect(201)).body;

      // Another rider buys springs for the same bike: their order is theirs alone.
      const other = await createUser();
      const otherAgent = request.agent(a.app);
      await otherAgent.post('/api/auth/login').send({ email: other.email, password: testPassword }).expect(200);
      await otherAgent.post('/api/cart/spring-set').send({ fitmentId: body.fitmentId, ...load, shockProductId: shock.id }).expect(201);
      await otherAgent.post('/api/checkout').send({ email: other.email, shippingAddress: address }).expect(201);

      const orders = (await agent.get(`/api/bikes/${bike.id}/orders`).expect(200)).body.items as OrderSummaryDto[];
      // One fork pair and one shock spring: a two-leg fork buys one pair, not two.
      expect(orders.map((o) => [o.id, o.itemCount])).toEqual([[orderId, 2]]);
    } finally {
      await a.close();
    }
  });
});

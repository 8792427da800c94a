import { describe, expect, it } from 'vitest';
import type { ForkRecommendationDto, RecommendationDto, ShockRecommendationDto, StaffProductDto } from '../../shared/catalogue';
import { isCasesRecommendation } from '../../shared/catalogue';
import { computeRearSpring, loadSplit } from '../../shared/engine';
import { AppDataSource } from '../db/data-source';
import { fitmentInput, productInput, springInput } from '../test/catalogue-factories';
import { testApp, userWithToken } from '../test/factories';
import { expectShownDecimals } from '../test/shown-decimals';

async function shop() {
  const t = testApp();
  const staff = await userWithToken(t.config, 'staff');
  const post = async (path: string, body: object) => (await t.http.post(path).set(staff.auth).send(body).expect(201)).body;
  const fitment = await post('/api/staff/fitments', fitmentInput());
  const shocks = [];
  for (const [rate, coils] of [[75, 8.9], [85, 8], [95, 7.4], [105, 7]] as const) {
    shocks.push(await post('/api/staff/products', springInput({ name: `Shock ${rate}`, sku: `LL-SHOCK-${rate}` }, { rateNPerMm: rate, totalCoils: coils })));
  }
  const forks = [];
  for (const [rate, coils] of [[8, 31.3], [9, 28], [10, 25.4], [11, 23.3], [12, 21.5]] as const) {
    forks.push(
      await post('/api/staff/products', springInput({ name: `Fork ${rate}`, sku: `LL-FORK-${rate}` }, { end: 'fork', rateNPerMm: rate, freeLengthMm: 460, innerDiameterMm: 28, outerDiameterMm: 39, wireDiameterMm: 5.5, totalCoils: coils })),
    );
  }
  const adapter = await post('/api/staff/products', productInput({ name: 'Seat adapter', sku: 'LL-AD-1' }));
  await t.http.put(`/api/staff/fitments/${fitment.id}/springs/${shocks[1].id}/adapters`).set(staff.auth).send({ adapters: [{ productId: adapter.id, quantity: 1 }] }).expect(200);
  return { ...t, staff, fitment, shocks, forks, adapter };
}

const single = (r: RecommendationDto) => {
  if (isCasesRecommendation(r.fork) || isCasesRecommendation(r.shock)) throw new Error('expected one load');
  return { fork: r.fork as ForkRecommendationDto, shock: r.shock as ShockRecommendationDto };
};

describe('recommendations', () => {
  it('answers fork and shock in the engine shape, with the catalogue springs that fit, their SKU, price, adapters and the stock spring', async () => {
    const { http, fitment, shocks, adapter } = await shop();
    // A 95 kg rider: the 95 N/mm spring leaves static sag within 20 ± 3 mm (the 85 would bind its coils).
    const res = await http.post('/api/recommendations').send({ fitmentId: fitment.id, ridingStyle: 'road', rider: { massKg: 95, gearKg: 8 }, luggage: [] });
    expect(res.status).toBe(200);
    const r = res.body as RecommendationDto;
    const { fork, shock } = single(r);
    expect(r.fitment).toMatchObject({ id: fitment.id, make: 'Corvane', model: 'Ridgeline 800' });
    expect(r.targets.shock).toEqual({ staticSagMm: 20, riderSagMm: 55, staticSagToleranceMm: 3 });
    expect(r.loads).toEqual([{ station: 'rider', massKg: 103, positionMm: 760 }]);
    expect(shock.candidates).toHaveLength(4);
    expect(fork.candidates).toHaveLength(5);
    expect(shock.requiredRate.nPerMm).toBeGreaterThan(0);
    // Rounded at the edge: 0.01 N/mm and 0.001 kgf/mm.
    expect(Math.abs(shock.requiredRate.kgfPerMm - shock.requiredRate.nPerMm / 9.80665)).toBeLessThanOrEqual(0.0005 + 0.005 / 9.80665);
    expect(shock.rateBand!.min.nPerMm).toBeLessThanOrEqual(shock.rateBand!.max.nPerMm);
    expect(shock.stock).toMatchObject({ id: 'stock', rateNPerMm: 85 });
    expect(fork.stock).toMatchObject({ id: 'stock', rateNPerMm: 8 });
    const withAdapter = shock.candidates.find((c) => c.id === shocks[1].id)!;
    expect(withAdapter).toMatchObject({ sku: 'LL-SHOCK-85', name: 'Shock 85', priceCents: 14900, currency: 'EUR' });
    expect(withAdapter.adapters).toMatchObject([{ id: adapter.id, sku: 'LL-AD-1', quantity: 1, priceCents: 2900 }]);
    // Best first: ok ones, closest to the required rate.
    const ok = shock.candidates.filter((c) => c.verdict === 'ok');
    expect(ok.length).toBeGreaterThan(0);
    expect(shock.candidates.slice(0, ok.length).every((c) => c.verdict === 'ok')).toBe(true);
  });

  it('when the luggage sits behind the rear axle, the front wheel unloads', async () => {
    const { http, fitment } = await shop();
    const ask = async (luggage: object[]) => single((await http.post('/api/recommendations').send({ fitmentId: fitment.id, ridingStyle: 'adventure', rider: { massKg: 80, gearKg: 8 }, luggage }).expect(200)).body);
    const without = await ask([]);
    const withTopCase = await ask([{ station: 'top-case', massKg: 10 }]);
    expect(withTopCase.fork.frontLoadN).toBeLessThan(without.fork.frontLoadN);
    // The top case at 1650 mm on a 1520 mm wheelbase: the front loses g·10·130/1520 = 8.39 N (moments about the rear axle).
    // Each load is shown to 0.1 N, so their difference is good to 0.1 N.
    expect(Math.abs(without.fork.frontLoadN - withTopCase.fork.frontLoadN - (9.80665 * 10 * 130) / 1520)).toBeLessThanOrEqual(0.1 + 1e-9);
    expect(withTopCase.shock.rearLoadN).toBeGreaterThan(without.shock.rearLoadN);
  });

  it('staff change a fitment leverage ratio and the recommendation changes as the engine says it should', async () => {
    const { http, staff, fitment, shocks } = await shop();
    const body = { fitmentId: fitment.id, ridingStyle: 'road', rider: { massKg: 90, gearKg: 8 } };
    const before = single((await http.post('/api/recommendations').send(body).expect(200)).body).shock;
    await http.put(`/api/staff/fitments/${fitment.id}`).set(staff.auth).send(fitmentInput({ rearLeverageRatio: 3.0 })).expect(200);
    const after = single((await http.post('/api/recommendations').send(body).expect(200)).body).shock;
    // With a constant ratio the required rate is LR²·W_r/(s_r − s_s), so it grows by (3.0/2.6)².
    expect(after.requiredRate.nPerMm / before.requiredRate.nPerMm).toBeCloseTo((3.0 / 2.6) ** 2, 3);
    const engine = computeRearSpring({
      wheelbaseMm: 1520, sprungMassKg: 90, loads: [{ massKg: 98, positionMm: 760 }], leverageRatio: 3.0, wheelTravelMm: 200, shockStrokeMm: 77,
      // The adjuster window follows from the 190 mm stock spring and its 2–22 mm preload range.
      targets: { staticSagMm: 20, riderSagMm: 55 }, adjusterInstalledLengthMm: { min: 190 - 22, max: 190 - 2 }, adjusterPitchMm: 1.5,
      springs: shocks.map((p: StaffProductDto) => ({ id: p.id, rateNPerMm: p.spring!.rateNPerMm, freeLengthMm: p.spring!.freeLengthMm, solidLengthMm: p.spring!.solidLengthMm })),
    });
    expect(after.candidates.map((c) => [c.id, c.verdict, c.preloadMm])).toEqual(engine.candidates.map((c) => [c.id, c.verdict, Math.round(c.preloadMm * 100) / 100]));
    expect(after.candidates.map((c) => c.verdict)).not.toEqual(before.candidates.map((c) => c.verdict));
  });

  it('a leverage curve no spring can meet is refused to staff on save, and one already stored is a 409 for the shop, not a rider-load error', async () => {
    const { http, staff, fitment } = await shop();
    // Falling from 3.5 to 1.0 by 70 mm, the shock would have to push less at rider sag (55 mm) than at static sag (20 mm).
    const steep = [{ wheelTravelMm: 0, ratio: 3.5 }, { wheelTravelMm: 70, ratio: 1 }, { wheelTravelMm: 200, ratio: 1 }];
    const save = await http.put(`/api/staff/fitments/${fitment.id}`).set(staff.auth).send(fitmentInput({ rearLeverageRatio: null, rearLeverageCurve: steep }));
    expect(save.status).toBe(400);
    expect(save.body.fields.rearLeverageCurve).toMatch(/falls too steeply/);
    // As data stored before that check existed would be.
    await AppDataSource.query('UPDATE fitments SET rear_leverage_ratio = NULL, rear_leverage_curve = $2 WHERE id = $1', [fitment.id, JSON.stringify(steep)]);
    const res = await http.post('/api/recommendations').send({ fitmentId: fitment.id, ridingStyle: 'road', rider: { massKg: 90, gearKg: 8 } });
    expect(res.status).toBe(409);
    expect(res.body.code).toBe('conflict');
    expect(res.body.message).toMatch(/shop needs to check/);
    expect(res.body.fields).toBeUndefined();
  });

  it('with load cases, fork and shock come in the cases shape and name the springs that cover every case', async () => {
    const { http, fitment } = await shop();
    const res = await http.post('/api/recommendations').send({
      fitmentId: fitment.id, ridingStyle: 'adventure', rider: { massKg: 75, gearKg: 8 },
      cases: [{ name: 'two-up touring', rider: { massKg: 75, gearKg: 8 }, passengerKg: 60, luggage: [{ station: 'panniers', massKg: 30 }] }],
    });
    expect(res.status).toBe(200);
    const r = res.body as RecommendationDto;
    if (!isCasesRecommendation(r.shock)) throw new Error('expected cases');
    expect(r.shock.cases.map((c) => c.name)).toEqual(['as entered', 'two-up touring']);
    expect(r.shock.cases[1]!.rearLoadN).toBeGreaterThan(r.shock.cases[0]!.rearLoadN);
    expect(r.shock.cases[0]!.stock.id).toBe('stock');
    expect(r.shock.coversAllCases).not.toContain('stock');
    expect(r.shock.uncoveredBy).not.toHaveProperty('stock');
  });

  it('the engine answers for the loads placed, by statics', async () => {
    const { http, fitment } = await shop();
    const r = single((await http.post('/api/recommendations').send({ fitmentId: fitment.id, ridingStyle: 'road', rider: { massKg: 70, gearKg: 5 }, passengerKg: 55, luggage: [{ station: 'panniers', massKg: 20 }] }).expect(200)).body);
    const split = loadSplit(1520, [{ massKg: 75, positionMm: 760 }, { massKg: 55, positionMm: 1050 }, { massKg: 20, positionMm: 1350 }]);
    expect(Math.abs(r.shock.rearLoadN - split.rearN)).toBeLessThanOrEqual(0.05);
    expect(Math.abs(r.fork.frontLoadN - split.frontN)).toBeLessThanOrEqual(0.05);
  });

  it('judges a spring 10 mm longer than the stock one with 10 mm more preload, since the adjuster sets the installed length', async () => {
    const { http, staff, fitment } = await shop();
    const long = await (async () => (await http.post('/api/staff/products').set(staff.auth).send(springInput({ name: 'Shock long', sku: 'LL-SHOCK-LONG' }, { rateNPerMm: 85, freeLengthMm: 200, totalCoils: 8 })).expect(201)).body)();
    const r = single((await http.post('/api/recommendations').send({ fitmentId: fitment.id, ridingStyle: 'road', rider: { massKg: 80, gearKg: 8 } }).expect(200)).body);
    const stockLength = r.shock.candidates.find((c) => c.rateNPerMm === 85 && c.id !== long.id)!;
    const longer = r.shock.candidates.find((c) => c.id === long.id)!;
    expect(stockLength.preloadRangeMm).toEqual({ min: 2, max: 22 });
    expect(longer.preloadRangeMm).toEqual({ min: 12, max: 32 });
    expect(r.shock.stock.preloadRangeMm).toEqual({ min: 2, max: 22 });
  });

  it('rounds every figure of the answer at the edge, single load and cases alike', async () => {
    const { http, fitment } = await shop();
    const body = { fitmentId: fitment.id, ridingStyle: 'adventure', rider: { massKg: 83.3, gearKg: 7.7 }, luggage: [{ station: 'panniers', massKg: 11.3 }] };
    expectShownDecimals((await http.post('/api/recommendations').send(body).expect(200)).body);
    expectShownDecimals((await http.post('/api/recommendations').send({ ...body, cases: [{ name: 'two-up', rider: { massKg: 83.3, gearKg: 7.7 }, passengerKg: 61.3 }] }).expect(200)).body);
  });

  it('uses the fitment’s static-sag tolerance and number of shocks', async () => {
    const { http, staff, fitment } = await shop();
    const body = { fitmentId: fitment.id, ridingStyle: 'road', rider: { massKg: 80, gearKg: 8 } };
    const one = single((await http.post('/api/recommendations').send(body).expect(200)).body);
    await http.put(`/api/staff/fitments/${fitment.id}`).set(staff.auth).send(fitmentInput({ shockCount: 2, rearStaticSagToleranceMm: 5 })).expect(200);
    const r = (await http.post('/api/recommendations').send(body).expect(200)).body as RecommendationDto;
    const two = single(r);
    expect(r.targets.shock.staticSagToleranceMm).toBe(5);
    expect(two.shock.staticSagToleranceMm).toBe(5);
    // Twin shocks: each spring needs half the rate (shown to 0.01 N/mm).
    expect(Math.abs(two.shock.requiredRate.nPerMm - one.shock.requiredRate.nPerMm / 2)).toBeLessThanOrEqual(0.01);
  });
});

describe('loads the bike cannot take are refused with a clear message', () => {
  it.each([
    ['a tank bag over its limit', { luggage: [{ station: 'tank-bag', massKg: 12 }] }, 'luggage.0.massKg', /tank bag takes at most 8 kg/],
    ['two pannier loads that together exceed the limit', { luggage: [{ station: 'panniers', massKg: 25 }, { station: 'panniers', massKg: 25 }] }, 'luggage.1.massKg', /at most 40 kg/],
    ['more than the rated load', { rider: { massKg: 110, gearKg: 10 }, passengerKg: 100 }, 'load', /rated for 210 kg/],
    ['a rider over the seat limit', { rider: { massKg: 150, gearKg: 10 } }, 'rider.massKg', /at most 150 kg/],
  ])('%s', async (_name, over, field, message) => {
    const { http, fitment } = await shop();
    const res = await http.post('/api/recommendations').send({ fitmentId: fitment.id, ridingStyle: 'road', rider: { massKg: 80, gearKg: 8 }, ...over });
    expect(res.status).toBe(400);
    expect(res.body.fields[field]).toMatch(message);
    expect(res.body.message).toMatch(message);
  });

  it('a station the bike does not have is refused', async () => {
    const t = testApp();
    const staff = await userWithToken(t.config, 'staff');
    const solo = (await t.http.post('/api/staff/fitments').set(staff.auth).send(fitmentInput({ loadStations: [{ station: 'rider', positionMm: 700, maxLoadKg: 140 }] })).expect(201)).body;
    const res = await t.http.post('/api/recommendations').send({ fitmentId: solo.id, ridingStyle: 'road', rider: { massKg: 80, gearKg: 8 }, passengerKg: 60, luggage: [{ station: 'top-case', massKg: 5 }] });
    expect(res.status).toBe(400);
    expect(res.body.fields.passengerKg).toMatch(/no passenger seat/);
    expect(res.body.fields['luggage.0.station']).toMatch(/no top case/);
  });

  it.each([
    ['no bike', { ridingStyle: 'road', rider: { massKg: 80, gearKg: 8 } }, 'fitmentId'],
    ['an unknown riding style', { fitmentId: '00000000-0000-4000-8000-000000000000', ridingStyle: 'track', rider: { massKg: 80, gearKg: 8 } }, 'ridingStyle'],
    ['a rider mass as text', { fitmentId: '00000000-0000-4000-8000-000000000000', ridingStyle: 'road', rider: { massKg: 'eighty', gearKg: 8 } }, 'rider.massKg'],
    ['luggage on the rider seat', { fitmentId: '00000000-0000-4000-8000-000000000000', ridingStyle: 'road', rider: { massKg: 80, gearKg: 8 }, luggage: [{ station: 'rider', massKg: 5 }] }, 'luggage.0.station'],
    ['the rider given as a list', { fitmentId: '00000000-0000-4000-8000-000000000000', ridingStyle: 'road', rider: [] }, 'rider'],
    ['a case’s rider given as a list', { fitmentId: '00000000-0000-4000-8000-000000000000', ridingStyle: 'road', rider: { massKg: 80, gearKg: 8 }, cases: [{ name: 'two-up', rider: [] }] }, 'cases.0.rider'],
  ])('a body with %s is a 400 on its field', async (_name, body, field) => {
    const res = await testApp().http.post('/api/recommendations').send(body);
    expect(res.status).toBe(400);
    expect(typeof res.body.fields[field], JSON.stringify(res.body.fields)).toBe('string');
  });

  it('a bike that is not in the table is a 404', async () => {
    const res = await testApp().http.post('/api/recommendations').send({ fitmentId: '00000000-0000-4000-8000-000000000000', ridingStyle: 'road', rider: { massKg: 80, gearKg: 8 } });
    expect(res.status).toBe(404);
  });
});

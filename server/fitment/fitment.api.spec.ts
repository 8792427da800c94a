import { describe, expect, it } from 'vitest';
import type { FitmentDto } from '../../shared/catalogue';
import { AppDataSource } from '../db/data-source';
import { fitmentInput } from '../test/catalogue-factories';
import { testApp, userWithToken } from '../test/factories';

async function staffApp() {
  const t = testApp();
  const staff = await userWithToken(t.config, 'staff');
  return { ...t, staff };
}

describe('staff keep the fitment table', () => {
  it('staff create a fitment and the picker finds it by make, model and year', async () => {
    const { http, staff } = await staffApp();
    const res = await http.post('/api/staff/fitments').set(staff.auth).send(fitmentInput());
    expect(res.status).toBe(201);
    const f = res.body as FitmentDto;
    expect(f).toMatchObject({ make: 'Corvane', model: 'Ridgeline 800', yearFrom: 2019, yearTo: 2023, rearLeverageRatio: 2.6, rearLeverageCurve: null });
    expect(f.torques[0]).toMatchObject({ fastener: 'Fork cap', torqueNm: 23 });
    // 23 N·m = 16.96 ft·lbf (1 ft·lbf = 1.3558 N·m exactly by the 1959 definitions).
    expect(f.torques[0]!.torqueFtLbf).toBeCloseTo(16.964, 2);

    const found = await http.get('/api/fitments').query({ make: 'corvane', model: 'RIDGELINE 800', year: 2021 });
    expect(found.status).toBe(200);
    expect(found.body.total).toBe(1);
    expect(found.body.items[0]).toMatchObject({ id: f.id, make: 'Corvane', model: 'Ridgeline 800', yearFrom: 2019, yearTo: 2023 });
    expect((await http.get('/api/fitments').query({ year: 2024 })).body.total).toBe(0);

    const one = await http.get(`/api/fitments/${f.id}`);
    expect(one.status).toBe(200);
    expect(one.body.wheelbaseMm).toBe(1520);
    expect((await http.get('/api/fitments/makes')).body).toEqual([{ make: 'Corvane', models: ['Ridgeline 800'] }]);
  });

  it('a fitment entered by wet mass gets its sprung masses derived from split and unsprung masses', async () => {
    const { http, staff } = await staffApp();
    const res = await http
      .post('/api/staff/fitments')
      .set(staff.auth)
      .send(fitmentInput({ massInput: 'wet', frontSprungMassKg: null, rearSprungMassKg: null, wetMassKg: 220, frontStaticSharePct: 48, frontUnsprungMassKg: 18, rearUnsprungMassKg: 24 }));
    expect(res.status).toBe(201);
    // 220 × 0.48 − 18 = 87.6 kg front; 220 × 0.52 − 24 = 90.4 kg rear.
    expect(res.body.frontSprungMassKg).toBeCloseTo(87.6, 9);
    expect(res.body.rearSprungMassKg).toBeCloseTo(90.4, 9);
    expect(res.body.massInput).toBe('wet');
  });

  it('a leverage curve is kept point by point and replaces the single ratio', async () => {
    const { http, staff } = await staffApp();
    const curve = [
      { wheelTravelMm: 0, ratio: 2.9 },
      { wheelTravelMm: 100, ratio: 2.6 },
      { wheelTravelMm: 200, ratio: 2.4 },
    ];
    const res = await http.post('/api/staff/fitments').set(staff.auth).send(fitmentInput({ rearLeverageRatio: undefined, rearLeverageCurve: curve }));
    expect(res.status).toBe(201);
    expect(res.body.rearLeverageCurve).toEqual(curve);
    expect(res.body.rearLeverageRatio).toBeNull();
  });

  it('a ratio that asks the shock for more than its stroke, or a passenger ahead of the rider, is refused per field', async () => {
    const { http, staff } = await staffApp();
    const stations = fitmentInput().loadStations.map((st) => (st.station === 'passenger' ? { ...st, positionMm: 700 } : st));
    const res = await http.post('/api/staff/fitments').set(staff.auth).send(fitmentInput({ rearLeverageRatio: 2.2, loadStations: stations }));
    expect(res.status).toBe(400);
    // 200 mm ÷ 2.2 = 90.9 mm of a 77 mm stroke.
    expect(res.body.fields.rearLeverageRatio).toMatch(/90\.9 mm, more than its 77 mm stroke/);
    expect(res.body.fields['loadStations.1.positionMm']).toMatch(/behind the rider/);
  });

  it('the number of shocks, the static-sag tolerances and the stock fork spacer are checked against their ranges and default when left out', async () => {
    const { http, staff } = await staffApp();
    const bad = await http.post('/api/staff/fitments').set(staff.auth).send(fitmentInput({ shockCount: 3, rearStaticSagToleranceMm: 0, forkStockSpacerMm: -1 }));
    expect(bad.status).toBe(400);
    expect(bad.body.fields).toMatchObject({ shockCount: 'Must be at most 2 shocks.', rearStaticSagToleranceMm: 'Must be at least 0.5 mm.', forkStockSpacerMm: 'Must be at least 0 mm.' });
    const { shockCount: _s, frontStaticSagToleranceMm: _f, rearStaticSagToleranceMm: _r, forkStockPreloadMm: _p, ...plain } = fitmentInput();
    const saved = (await http.post('/api/staff/fitments').set(staff.auth).send(plain).expect(201)).body;
    expect(saved).toMatchObject({ shockCount: 1, frontStaticSagToleranceMm: 3, rearStaticSagToleranceMm: 3, forkStockSpacerMm: null, forkStockPreloadMm: 0 });
    const twin = (await http.put(`/api/staff/fitments/${saved.id}`).set(staff.auth).send(fitmentInput({ shockCount: 2, rearStaticSagToleranceMm: 6 })).expect(200)).body;
    expect(twin).toMatchObject({ shockCount: 2, rearStaticSagToleranceMm: 6 });
  });

  it('an edit is saved with its before and after in the audit log', async () => {
    const { http, staff } = await staffApp();
    const created = (await http.post('/api/staff/fitments').set(staff.auth).send(fitmentInput())).body as FitmentDto;
    const res = await http.put(`/api/staff/fitments/${created.id}`).set(staff.auth).send(fitmentInput({ rearLeverageRatio: 2.9, notes: 'new link' }));
    expect(res.status).toBe(200);
    expect(res.body.rearLeverageRatio).toBe(2.9);
    const audit = await http.get('/api/staff/audit').set(staff.auth).query({ entityType: 'fitment', entityId: created.id });
    expect(audit.status).toBe(200);
    expect(audit.body.items.map((a: { action: string }) => a.action)).toEqual(['update', 'create']);
    expect(audit.body.items[0].before.rearLeverageRatio).toBe(2.6);
    expect(audit.body.items[0].after.rearLeverageRatio).toBe(2.9);
    expect(audit.body.items[0].actorEmail).toBe(staff.user.email);
  });

  it('deleting a fitment removes it from the picker and records what it was', async () => {
    const { http, staff } = await staffApp();
    const created = (await http.post('/api/staff/fitments').set(staff.auth).send(fitmentInput())).body as FitmentDto;
    expect((await http.delete(`/api/staff/fitments/${created.id}`).set(staff.auth)).status).toBe(204);
    expect((await http.get(`/api/fitments/${created.id}`)).status).toBe(404);
    const [row] = await AppDataSource.query(`SELECT action, before->>'model' AS model FROM audit_log WHERE entity_id = $1 AND action = 'delete'`, [created.id]);
    expect(row).toEqual({ action: 'delete', model: 'Ridgeline 800' });
  });

  it('a second fitment with the same make, model, variant and first year is a conflict on yearFrom', async () => {
    const { http, staff } = await staffApp();
    await http.post('/api/staff/fitments').set(staff.auth).send(fitmentInput()).expect(201);
    const res = await http.post('/api/staff/fitments').set(staff.auth).send(fitmentInput({ make: 'CORVANE' }));
    expect(res.status).toBe(409);
    expect(res.body.fields.yearFrom).toBeDefined();
  });
});

describe('the fitment form gets a message on each bad field, never a 500', () => {
  it.each([
    ['a wheelbase of 5 m', { wheelbaseMm: 5000 }, 'wheelbaseMm'],
    ['a leverage ratio as text', { rearLeverageRatio: 'two' }, 'rearLeverageRatio'],
    ['years the wrong way round', { yearFrom: 2020, yearTo: 2010 }, 'yearTo'],
    ['a preload range upside down', { rearPreloadMinMm: 10, rearPreloadMaxMm: 5 }, 'rearPreloadMaxMm'],
    ['static sag above rider sag', { sag: { ...fitmentInput().sag, rear: { ...fitmentInput().sag.rear, road: { static: 70, rider: 60 } } } }, 'sag.rear.road.static'],
    ['a station with no position', { loadStations: [{ station: 'rider', maxLoadKg: 100 }] }, 'loadStations.0.positionMm'],
    ['no rider seat', { loadStations: [{ station: 'passenger', positionMm: 1000, maxLoadKg: 100 }] }, 'loadStations'],
    ['the wet mode without a wet mass', { massInput: 'wet' }, 'wetMassKg'],
    ['an unknown field', { colour: 'red' }, 'colour'],
    ['a fork angle of 80°', { forkAngleDeg: 80 }, 'forkAngleDeg'],
  ])('%s', async (_name, override, field) => {
    const { http, staff } = await staffApp();
    const res = await http.post('/api/staff/fitments').set(staff.auth).send({ ...fitmentInput(), ...override });
    expect(res.status).toBe(400);
    expect(res.body.code).toBe('validation');
    expect(typeof res.body.fields[field], JSON.stringify(res.body.fields)).toBe('string');
  });

  it.each([
    ['page 0', { page: 0 }, 'page'],
    ['a page size of 1000', { pageSize: 1000 }, 'pageSize'],
    ['an unknown sort', { sort: 'price' }, 'sort'],
    ['a year as text', { year: 'soon' }, 'year'],
    ['an unknown filter', { colour: 'red' }, 'colour'],
    ['a repeated page', 'page=1&page=2', 'page'],
  ])('the list query with %s is a 400 on its parameter', async (_name, query, field) => {
    const res = await testApp().http.get('/api/fitments').query(query);
    expect(res.status).toBe(400);
    expect(typeof res.body.fields[field]).toBe('string');
  });

  it.each([
    ['a NUL character in the notes', { notes: 'Torque\u0000 again' }, 'notes'],
    ['a NUL character in a fastener name', { torques: [{ fastener: 'Fork\u0000cap', torqueNm: 23 }] }, 'torques.0.fastener'],
    ['a lone surrogate half in the model', { model: 'Ridge\ud800line' }, 'model'],
    ['a make of only spaces', { make: '   ' }, 'make'],
    ['a tool of only spaces', { tools: ['  '] }, 'tools'],
    ['sag targets given as a list', { sag: [] }, 'sag'],
    ['the front sag given as a list', { sag: { ...fitmentInput().sag, front: [] } }, 'sag.front'],
    ['the rear road sag given as a list', { sag: { ...fitmentInput().sag, rear: { ...fitmentInput().sag.rear, road: [] } } }, 'sag.rear.road'],
  ])('%s is a 400 on that field and nothing is saved', async (_name, override, field) => {
    const { http, staff } = await staffApp();
    const res = await http.post('/api/staff/fitments').set(staff.auth).send({ ...fitmentInput(), ...override });
    expect(res.status).toBe(400);
    expect(typeof res.body.fields[field], JSON.stringify(res.body.fields)).toBe('string');
    expect((await http.get('/api/fitments')).body.total).toBe(0);
  });

  it('load stations nested 10,000 lists deep are a 400 on that field, not a stack overflow', async () => {
    const { http, staff } = await staffApp();
    const deep = '['.repeat(10_000) + ']'.repeat(10_000);
    const res = await http.post('/api/staff/fitments').set(staff.auth).set('Content-Type', 'application/json').send(JSON.stringify(fitmentInput()).replace(/"loadStations":\[.*?\]/, `"loadStations":${deep}`));
    expect(res.status).toBe(400);
    expect(typeof res.body.fields.loadStations, JSON.stringify(res.body.fields)).toBe('string');
  });

  it.each(['q', 'make', 'model'])('a NUL character in the list query’s %s is a 400 on it', async (param) => {
    const res = await testApp().http.get(`/api/fitments?${param}=a%00b`);
    expect(res.status).toBe(400);
    expect(typeof res.body.fields[param]).toBe('string');
  });

  it('an id that is not a UUID is simply not found', async () => {
    expect((await testApp().http.get('/api/fitments/not-a-uuid')).status).toBe(404);
  });
});

describe('fitment lists page and sort on the server', () => {
  it('pages do not overlap and follow the sort', async () => {
    const { http, staff } = await staffApp();
    for (const [i, make] of ['Haldris', 'Corvane', 'Brenmoor', 'Ostrel', 'Vantor'].entries()) {
      await http.post('/api/staff/fitments').set(staff.auth).send(fitmentInput({ make, yearFrom: 2010 + i, yearTo: 2015 + i })).expect(201);
    }
    const p1 = (await http.get('/api/staff/fitments').set(staff.auth).query({ sort: '-yearFrom', pageSize: 2, page: 1 })).body;
    const p2 = (await http.get('/api/staff/fitments').set(staff.auth).query({ sort: '-yearFrom', pageSize: 2, page: 2 })).body;
    expect(p1.total).toBe(5);
    expect(p1.items.map((f: FitmentDto) => f.make)).toEqual(['Vantor', 'Ostrel']);
    expect(p2.items.map((f: FitmentDto) => f.make)).toEqual(['Brenmoor', 'Corvane']);
    const byMake = (await http.get('/api/fitments').query({ sort: 'make', q: 'an' })).body;
    expect(byMake.items.map((f: FitmentDto) => f.make)).toEqual(['Corvane', 'Vantor']);
  });
});

describe('only staff and admins change the fitment table', () => {
  it.each(['rider', 'warehouse'] as const)('a %s gets 403 on every staff fitment route', async (role) => {
    const { http, config } = testApp();
    const { auth } = await userWithToken(config, role);
    const id = '00000000-0000-4000-8000-000000000000';
    expect((await http.get('/api/staff/fitments').set(auth)).status).toBe(403);
    expect((await http.post('/api/staff/fitments').set(auth).send(fitmentInput())).status).toBe(403);
    expect((await http.put(`/api/staff/fitments/${id}`).set(auth).send(fitmentInput())).status).toBe(403);
    expect((await http.delete(`/api/staff/fitments/${id}`).set(auth)).status).toBe(403);
    expect((await http.get('/api/staff/fitments/export.csv').set(auth)).status).toBe(403);
    expect((await http.post('/api/staff/fitments/import').set(auth).type('text/csv').send('id\n')).status).toBe(403);
  });

  it('a guest gets 401 on staff writes', async () => {
    const { http } = testApp();
    expect((await http.post('/api/staff/fitments').send(fitmentInput())).status).toBe(401);
    expect((await http.post('/api/staff/fitments/import/preview').type('text/csv').send('id\n')).status).toBe(401);
  });

  it('an admin may do what staff do', async () => {
    const { http, config } = testApp();
    const { auth } = await userWithToken(config, 'admin');
    expect((await http.post('/api/staff/fitments').set(auth).send(fitmentInput())).status).toBe(201);
  });
});

import { describe, expect, it } from 'vitest';
import { rearSpringExample } from '../../shared/engine/examples';
import { testApp } from '../test/factories';
import { expectShownDecimals } from '../test/shown-decimals';

const g = 9.80665;
/** Answers are rounded at the edge: a figure shown to `step` sits within half a step of the exact value. */
const shownAs = (actual: number, exact: number, step: number) => expect(Math.abs(actual - exact)).toBeLessThanOrEqual(step / 2 + 1e-9);

const rearBody = () => ({
  ...rearSpringExample(),
  springs: [
    { id: 'R-58', rateNPerMm: 58, freeLengthMm: 229, solidLengthMm: 110 },
    { id: 'R-65', rateNPerMm: 65, freeLengthMm: 229, solidLengthMm: 110 },
    { id: 'R-140', rateNPerMm: 140, freeLengthMm: 229, solidLengthMm: 110 },
  ],
});

const forkBody = () => ({
  wheelbaseMm: 1500,
  sprungMassKg: 85,
  loads: [{ massKg: 88, positionMm: 900 }],
  forkAngleDeg: 26,
  springCount: 2,
  forkTravelMm: 150,
  targets: { staticSagMm: 25, riderSagMm: 40 },
  preloadRangeMm: { min: 0, max: 20 },
  adjusterPitchMm: 1,
  springs: [
    { id: 'F-7', rateNPerMm: 7, freeLengthMm: 300 },
    { id: 'F-9', rateNPerMm: 9, freeLengthMm: 300 },
  ],
});

describe('POST /api/calculations/rear-spring', () => {
  it('answers the rear load, the required rate in three units and the candidates, ok ones first', async () => {
    const res = await testApp().http.post('/api/calculations/rear-spring').send(rearBody());
    expect(res.status).toBe(200);
    // Statics by hand: W_r = g·Σ m·x/L = 9.80665 × (80·900 + 12·1750)/1500 N.
    const rearN = (g * (80 * 900 + 12 * 1750)) / 1500;
    shownAs(res.body.rearLoadN, rearN, 0.1);
    shownAs(res.body.bikeLoadN, g * 95, 0.1);
    // Constant ratio closed form: k = LR²·W_r/(s_r − s_s).
    shownAs(res.body.requiredRate.nPerMm, (2.1 ** 2 * rearN) / 41, 0.01);
    shownAs(res.body.requiredRate.kgfPerMm, (2.1 ** 2 * rearN) / 41 / g, 0.001);
    const ids = res.body.candidates.map((c: { id: string }) => c.id);
    expect(ids[0]).toBe('R-65');
    const verdicts = Object.fromEntries(res.body.candidates.map((c: { id: string; verdict: string }) => [c.id, c.verdict]));
    expect(verdicts).toEqual({ 'R-65': 'ok', 'R-58': 'too-soft', 'R-140': 'too-stiff' });
    const ok = res.body.candidates[0];
    expect(ok.riderSagMm).toBeCloseTo(66, 1);
    shownAs(ok.installedLengthMm, 229 - ok.preloadMm, 0.02);
    shownAs(ok.coilBindMarginMm, 229 - 110 - (ok.preloadMm + 95), 0.02);
  });

  it('with load cases, answers each case and the springs that cover them all', async () => {
    const { loads: _solo, ...rest } = rearBody();
    const res = await testApp().http.post('/api/calculations/rear-spring').send({
      ...rest,
      cases: [
        { name: 'solo commute', loads: [{ massKg: 80, positionMm: 900 }] },
        { name: 'two-up touring', loads: [{ massKg: 80, positionMm: 900 }, { massKg: 65, positionMm: 1150 }, { massKg: 15, positionMm: 1750 }] },
      ],
    });
    expect(res.status).toBe(200);
    expect(res.body.cases).toHaveLength(2);
    expect(Array.isArray(res.body.coversAllCases)).toBe(true);
    for (const id of res.body.coversAllCases) {
      for (const c of res.body.cases) expect(c.candidates.find((x: { id: string }) => x.id === id).verdict).toBe('ok');
    }
  });
});

describe('POST /api/calculations/fork-spring', () => {
  it('answers the front load and the rate per spring along the fork axis', async () => {
    const res = await testApp().http.post('/api/calculations/fork-spring').send(forkBody());
    expect(res.status).toBe(200);
    const frontN = g * 88 * (1 - 900 / 1500);
    shownAs(res.body.frontLoadN, frontN, 0.1);
    // k = cos θ · W_f / (n · (x_r − x_s)).
    shownAs(res.body.requiredRate.nPerMm, (Math.cos((26 * Math.PI) / 180) * frontN) / (2 * 15), 0.01);
    expect(res.body.candidates).toHaveLength(2);
  });

  it('takes the default of two springs when the count is left out', async () => {
    const { springCount: _n, ...body } = forkBody();
    const a = await testApp().http.post('/api/calculations/fork-spring').send(body);
    const b = await testApp().http.post('/api/calculations/fork-spring').send(forkBody());
    expect(a.body.requiredRate.nPerMm).toBeCloseTo(b.body.requiredRate.nPerMm, 9);
  });
});

describe('POST /api/calculations/spring-geometry', () => {
  it('answers the rate and solid length of a helical spring', async () => {
    // Shigley's Mechanical Engineering Design, 10th ed., Problem 10-3: k ≈ 1.314 N/mm, Ls = 35 mm, Na = 13.
    const res = await testApp().http.post('/api/calculations/spring-geometry').send({
      wireDiameterMm: 2.5,
      outsideDiameterMm: 31,
      totalCoils: 14,
      endType: 'plain-ground',
      material: 'music-wire',
      freeLengthMm: 80,
      loadN: 20,
    });
    expect(res.status).toBe(200);
    expect(res.body.activeCoils).toBe(13);
    shownAs(res.body.solidLengthMm, 35, 0.01);
    expect(Math.abs(res.body.rateNPerMm - 1.314) / 1.314).toBeLessThan(0.01);
    shownAs(res.body.travelToSolidMm, 45, 0.01);
  });
});

describe('POST /api/calculations/sag-check', () => {
  it('tells the rider how much preload to add when the rider sag is too deep', async () => {
    const res = await testApp().http.post('/api/calculations/sag-check').send({
      end: 'rear',
      extendedMm: 600,
      staticMm: { down: 572, up: 578 },
      riderMm: 524,
      targets: { staticSagMm: 25, riderSagMm: 66 },
      leverageRatio: 2.0,
      adjusterPitchMm: 1,
    });
    expect(res.status).toBe(200);
    expect(res.body.staticSagMm).toBeCloseTo(25, 9);
    expect(res.body.riderSagMm).toBeCloseTo(76, 9);
    // Δp = (rider sag − target)/LR = (76 − 66)/2 = 5 mm of preload to add.
    expect(res.body.preloadChangeMm).toBeCloseTo(5, 9);
    expect(res.body.adjusterTurns).toBeCloseTo(5, 9);
    expect(typeof res.body.advice).toBe('string');
  });
});

describe('the new figures through the API', () => {
  it('gives the rate band beside the required rate, and each candidate’s reason and own preload range', async () => {
    const res = await testApp().http.post('/api/calculations/rear-spring').send(rearBody());
    const { rateBand, requiredRate, candidates, staticSagToleranceMm } = res.body;
    expect(staticSagToleranceMm).toBe(3);
    expect(rateBand.min.nPerMm).toBeLessThanOrEqual(requiredRate.nPerMm);
    expect(rateBand.max.nPerMm).toBeGreaterThanOrEqual(requiredRate.nPerMm);
    expect(candidates.find((c: { id: string }) => c.id === 'R-140')).toMatchObject({ verdict: 'too-stiff', reason: 'preload-below-range', preloadRangeMm: { min: 2, max: 20 } });
  });

  it('with an installed-length window, a 10 mm longer spring runs 10 mm more preload, and the band needs its free length', async () => {
    const { preloadRangeMm: _r, ...rest } = rearBody();
    const body = { ...rest, adjusterInstalledLengthMm: { min: 209, max: 227 }, springs: [{ id: 'A', rateNPerMm: 65, freeLengthMm: 229 }, { id: 'B', rateNPerMm: 65, freeLengthMm: 239 }] };
    const res = await testApp().http.post('/api/calculations/rear-spring').send(body);
    expect(res.status).toBe(200);
    const range = (id: string) => res.body.candidates.find((c: { id: string }) => c.id === id).preloadRangeMm;
    expect(range('B').min - range('A').min).toBe(10);
    expect(res.body).not.toHaveProperty('rateBand');
    const banded = await testApp().http.post('/api/calculations/rear-spring').send({ ...body, bandFreeLengthMm: 229 });
    expect(banded.body.rateBand.min.nPerMm).toBeGreaterThan(0);
  });

  it('sag check: exact with both loads, approximate on a curve without them', async () => {
    const body = { end: 'rear', extendedMm: 600, staticMm: 575, riderMm: 524, targets: { staticSagMm: 25, riderSagMm: 66 }, adjusterPitchMm: 1 };
    const curve = [{ wheelTravelMm: 0, ratio: 2.5 }, { wheelTravelMm: 200, ratio: 1.9 }];
    const approx = await testApp().http.post('/api/calculations/sag-check').send({ ...body, leverageRatio: curve });
    expect(approx.body.approximate).toBe(true);
    const exact = await testApp().http.post('/api/calculations/sag-check').send({ ...body, leverageRatio: curve, bikeLoadN: 930, riderLoadN: 600 });
    expect(exact.body.approximate).toBe(false);
    expect(exact.body.impliedRateNPerMm).toBeGreaterThan(0);
  });
});

describe('numbers people can read', () => {
  it('every answer of the four calculation endpoints has at most 0.01 mm, 0.01 N/mm (0.001 kgf/mm), 0.1 N and 0.01 turns', async () => {
    const { http } = testApp();
    const { loads: _l, ...rest } = rearBody();
    const curve = [{ wheelTravelMm: 0, ratio: 2.37 }, { wheelTravelMm: 113, ratio: 2.11 }, { wheelTravelMm: 200, ratio: 1.93 }];
    const answers = [
      await http.post('/api/calculations/rear-spring').send(rearBody()),
      await http.post('/api/calculations/rear-spring').send({ ...rearBody(), leverageRatio: curve, shockCount: 2 }),
      await http.post('/api/calculations/rear-spring').send({ ...rest, cases: [{ name: 'solo', loads: [{ massKg: 83.3, positionMm: 911 }] }, { name: 'two-up', loads: [{ massKg: 83.3, positionMm: 911 }, { massKg: 61.7, positionMm: 1177 }] }] }),
      await http.post('/api/calculations/fork-spring').send({ ...forkBody(), forkAngleDeg: 26.3, adjusterPitchMm: undefined, spacer: { stockSpacerMm: 101.3, stockFreeLengthMm: 303.3, stockPreloadMm: 11.1 } }),
      await http.post('/api/calculations/spring-geometry').send({ wireDiameterMm: 2.53, outsideDiameterMm: 31.1, totalCoils: 14.3, endType: 'plain-ground', material: 'music-wire', freeLengthMm: 81.7, loadN: 21.3 }),
      await http.post('/api/calculations/sag-check').send({ end: 'rear', extendedMm: 601.3, staticMm: { down: 572.1, up: 578.3 }, riderMm: 523.7, targets: { staticSagMm: 25.3, riderSagMm: 66.7 }, leverageRatio: curve, adjusterPitchMm: 1.3, bikeLoadN: 931.7, riderLoadN: 611.3 }),
      await http.post('/api/calculations/sag-check').send({ end: 'front', extendedMm: 601.3, staticMm: 573.1, riderMm: 559.9, targets: { staticSagMm: 25.3, riderSagMm: 36.7 }, forkAngleDeg: 25.3, adjusterPitchMm: 1.3, riderLoadN: 311.3 }),
    ];
    for (const a of answers) {
      expect(a.status).toBe(200);
      expectShownDecimals(a.body);
    }
  });
});

describe('bad input to the calculations gets 400 with a message per field, never a 500', () => {
  const big = <T>(n: number, f: (i: number) => T) => Array.from({ length: n }, (_, i) => f(i));
  const cases: [string, string, Record<string, unknown>, string][] = [
    ['a missing field', '/rear-spring', { ...rearBody(), wheelbaseMm: undefined }, 'wheelbaseMm'],
    ['a string for a number', '/rear-spring', { ...rearBody(), sprungMassKg: '95' }, 'sprungMassKg'],
    ['a negative mass', '/rear-spring', { ...rearBody(), loads: [{ massKg: -5, positionMm: 900 }] }, 'loads.0.massKg'],
    ['a zero length', '/rear-spring', { ...rearBody(), wheelTravelMm: 0 }, 'wheelTravelMm'],
    ['a static-sag target not below the rider-sag target', '/rear-spring', { ...rearBody(), targets: { staticSagMm: 66, riderSagMm: 66 } }, 'targets.riderSagMm'],
    ['a leverage curve with no point', '/rear-spring', { ...rearBody(), leverageRatio: [] }, 'leverageRatio'],
    ['an unsorted leverage curve', '/rear-spring', { ...rearBody(), leverageRatio: [{ wheelTravelMm: 100, ratio: 2 }, { wheelTravelMm: 50, ratio: 2.2 }] }, 'leverageRatio'],
    ['a leverage curve with a duplicate point', '/rear-spring', { ...rearBody(), leverageRatio: [{ wheelTravelMm: 0, ratio: 2 }, { wheelTravelMm: 0, ratio: 2.2 }] }, 'leverageRatio'],
    ['more than 50 springs', '/rear-spring', { ...rearBody(), springs: big(51, (i) => ({ id: `S${i}`, rateNPerMm: 50 + i, freeLengthMm: 229 })) }, 'springs'],
    ['more than 20 loads', '/rear-spring', { ...rearBody(), loads: big(21, () => ({ massKg: 1, positionMm: 900 })) }, 'loads'],
    ['an unknown field', '/rear-spring', { ...rearBody(), colour: 'red' }, 'colour'],
    ['an unknown fork field', '/fork-spring', { ...forkBody(), leverageRatio: 2 }, 'leverageRatio'],
    ['a fork angle out of range', '/fork-spring', { ...forkBody(), forkAngleDeg: 95 }, 'forkAngleDeg'],
    ['a geometry with no material', '/spring-geometry', { wireDiameterMm: 2.5, outsideDiameterMm: 31, totalCoils: 14, endType: 'plain-ground' }, 'material'],
    ['a geometry with a wire wider than the spring', '/spring-geometry', { wireDiameterMm: 20, outsideDiameterMm: 31, totalCoils: 14, endType: 'plain', material: 'music-wire' }, 'outsideDiameterMm'],
    ['loads that all sit on the front axle, which leave the rear unloaded', '/rear-spring', { ...rearBody(), loads: [{ massKg: 80, positionMm: 0 }] }, 'loads'],
    ['a top case behind the rear axle that takes the weight off the front', '/fork-spring', { ...forkBody(), loads: [{ massKg: 88, positionMm: 900 }, { massKg: 150, positionMm: 1900 }] }, 'loads'],
    ['a load far behind the rear axle that lifts the front wheel', '/fork-spring', { ...forkBody(), loads: [{ massKg: 300, positionMm: 5000 }] }, 'loads'],
    ['a load case that takes the weight off the front', '/fork-spring', { ...forkBody(), loads: undefined, cases: [{ name: 'solo', loads: [{ massKg: 88, positionMm: 900 }] }, { name: 'top case only', loads: [{ massKg: 20, positionMm: 1800 }] }] }, 'cases.1.loads'],
    ['a leverage curve falling so steeply that no spring meets both sag targets', '/rear-spring', { ...rearBody(), leverageRatio: [{ wheelTravelMm: 0, ratio: 3.5 }, { wheelTravelMm: 70, ratio: 1.0 }] }, 'leverageRatio'],
    ['an empty list of loads', '/rear-spring', { ...rearBody(), loads: [] }, 'loads'],
    ['a preload range with its minimum above its maximum', '/rear-spring', { ...rearBody(), preloadRangeMm: { min: 12, max: 10 } }, 'preloadRangeMm.max'],
    ['a spring whose solid length equals its free length', '/rear-spring', { ...rearBody(), springs: [{ id: 'S', rateNPerMm: 60, freeLengthMm: 229, solidLengthMm: 229 }] }, 'springs.0.solidLengthMm'],
    ['two springs with the same id', '/rear-spring', { ...rearBody(), springs: [{ id: 'S', rateNPerMm: 60, freeLengthMm: 229 }, { id: 'S', rateNPerMm: 70, freeLengthMm: 229 }] }, 'springs'],
    ['a sag check whose rider reading is longer than the extended one', '/sag-check', { end: 'rear', extendedMm: 600, staticMm: 600, riderMm: 610, targets: { staticSagMm: 25, riderSagMm: 66 }, leverageRatio: 2, adjusterPitchMm: 1 }, 'riderMm'],
    ['a geometry load above the force that closes the spring to solid', '/spring-geometry', { wireDiameterMm: 2.5, outsideDiameterMm: 31, totalCoils: 14, endType: 'plain-ground', material: 'music-wire', freeLengthMm: 80, loadN: 1000 }, 'loadN'],
    ['a sag check of an unknown end', '/sag-check', { end: 'middle', extendedMm: 600, staticMm: 575, riderMm: 534, targets: { staticSagMm: 25, riderSagMm: 66 }, adjusterPitchMm: 1 }, 'end'],
    ['both a preload range and an installed-length window', '/rear-spring', { ...rearBody(), adjusterInstalledLengthMm: { min: 209, max: 227 } }, 'preloadRangeMm'],
    ['neither a preload range nor an installed-length window', '/rear-spring', { ...rearBody(), preloadRangeMm: undefined }, 'preloadRangeMm'],
    ['an installed-length window upside down', '/rear-spring', { ...rearBody(), preloadRangeMm: undefined, adjusterInstalledLengthMm: { min: 227, max: 209 } }, 'adjusterInstalledLengthMm.max'],
    ['a band free length without a window', '/rear-spring', { ...rearBody(), bandFreeLengthMm: 229 }, 'bandFreeLengthMm'],
    ['three shocks', '/rear-spring', { ...rearBody(), shockCount: 3 }, 'shockCount'],
    ['a static-sag tolerance of 0', '/fork-spring', { ...forkBody(), staticSagToleranceMm: 0 }, 'staticSagToleranceMm'],
    ['a spacer on a fork with an adjuster', '/fork-spring', { ...forkBody(), spacer: { stockSpacerMm: 100, stockFreeLengthMm: 300, stockPreloadMm: 10 } }, 'spacer'],
    ['a shock count on a fork sag check', '/sag-check', { end: 'front', extendedMm: 600, staticMm: 575, riderMm: 560, targets: { staticSagMm: 25, riderSagMm: 40 }, forkAngleDeg: 25, shockCount: 2 }, 'shockCount'],
    ['a NUL character in a spring id', '/rear-spring', { ...rearBody(), springs: [{ id: 'R\u000058', rateNPerMm: 58, freeLengthMm: 229 }] }, 'springs.0.id'],
  ];
  it.each(cases)('%s', async (_name, path, body, field) => {
    const res = await testApp().http.post(`/api/calculations${path}`).send(body);
    expect(res.status).toBe(400);
    expect(res.body.code).toBe('validation');
    expect(typeof res.body.fields[field], JSON.stringify(res.body.fields)).toBe('string');
  });

  it('loads nested 10,000 lists deep are a 400 on that field, not a stack overflow', async () => {
    const deep = '['.repeat(10_000) + ']'.repeat(10_000);
    const res = await testApp().http.post('/api/calculations/rear-spring').set('Content-Type', 'application/json').send(JSON.stringify({ ...rearBody(), loads: [] }).replace('"loads":[]', `"loads":${deep}`));
    expect(res.status).toBe(400);
    expect(typeof res.body.fields.loads, JSON.stringify(res.body.fields)).toBe('string');
  });

  it('NaN and Infinity, which JSON cannot carry, arrive as a broken body and are refused plainly', async () => {
    const res = await testApp()
      .http.post('/api/calculations/rear-spring')
      .set('Content-Type', 'application/json')
      .send(JSON.stringify(rearBody()).replace('"wheelbaseMm":1500', '"wheelbaseMm":NaN'));
    expect(res.status).toBe(400);
    const inf = await testApp()
      .http.post('/api/calculations/rear-spring')
      .set('Content-Type', 'application/json')
      .send(JSON.stringify(rearBody()).replace('"wheelbaseMm":1500', '"wheelbaseMm":1e999'));
    expect(inf.status).toBe(400);
    expect(inf.body.fields.wheelbaseMm).toBeDefined();
  });
});

describe('the list limits are inclusive', () => {
  it('answers 50 springs for each of 20 load cases of 20 loads', async () => {
    const { loads: _l, ...rest } = rearBody();
    const loads = Array.from({ length: 20 }, (_, i) => ({ massKg: 4, positionMm: 600 + i * 30 }));
    const springs = Array.from({ length: 50 }, (_, i) => ({ id: `S-${i}`, rateNPerMm: 30 + 2 * i, freeLengthMm: 229, solidLengthMm: 110 }));
    const cases = Array.from({ length: 20 }, (_, i) => ({ name: `case ${i}`, loads }));
    const res = await testApp().http.post('/api/calculations/rear-spring').send({ ...rest, springs, cases });
    expect(res.status).toBe(200);
    expect(res.body.cases).toHaveLength(20);
    for (const c of res.body.cases) expect(c.candidates).toHaveLength(50);
  });
});

describe('rate limit', () => {
  it('refuses an address that sends more than the configured number of calculations a minute', async () => {
    const { http } = testApp({ calcRateLimitPerMinute: 2 });
    await http.post('/api/calculations/rear-spring').send(rearBody()).expect(200);
    await http.post('/api/calculations/rear-spring').send(rearBody()).expect(200);
    const third = await http.post('/api/calculations/rear-spring').send(rearBody());
    expect(third.status).toBe(429);
    expect(third.body.code).toBe('rate-limited');
  });
});

describe('no session on the stateless routes', () => {
  it('answers a calculation whatever token, cookie or origin comes with it, and a wrong path is still a JSON 404', async () => {
    const { http } = testApp();
    const res = await http
      .post('/api/calculations/rear-spring')
      .set('Authorization', 'Bearer not-a-token')
      .set('Cookie', 'loadline_session=stale')
      .set('Origin', 'https://elsewhere.example')
      .send(rearBody());
    // Nothing here reads or changes an account, so a sign-in or a cross-site origin is irrelevant to it.
    expect(res.status).toBe(200);
    expect(res.body.candidates).toHaveLength(3);
    const missing = await http.post('/api/calculations/unknown').send({});
    expect(missing.status).toBe(404);
    expect(missing.body.code).toBe('not-found');
  });
});

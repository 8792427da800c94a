import { describe, expect, it } from 'vitest';
import type { RecommendationDto } from '../../shared/catalogue';
import { recommendFor, RecommendationProblem, type BikeForRecommendationDto, type RecommendationRequest } from '../../shared/recommend/recommend';
import { fitmentInput, productInput, springInput } from '../test/catalogue-factories';
import { testApp, userWithToken } from '../test/factories';

/** A bike with fork and shock springs around its loads, one of them needing an adapter. */
async function shop() {
  const t = testApp();
  const staff = await userWithToken(t.config, 'staff');
  const post = async (path: string, body: object) => (await t.http.post(path).set(staff.auth).send(body).expect(201)).body;
  const fitment = await post('/api/staff/fitments', fitmentInput());
  const shocks = [];
  for (const [rate, coils] of [[75, 8.9], [85, 8], [95, 7.4], [105, 7], [120, 6.2]] as const) {
    shocks.push(await post('/api/staff/products', springInput({ name: `Shock ${rate}`, sku: `LL-SHOCK-${rate}` }, { rateNPerMm: rate, totalCoils: coils })));
  }
  for (const [rate, coils] of [[8, 31.3], [9, 28], [10, 25.4], [11, 23.3]] as const) {
    await post('/api/staff/products', springInput({ name: `Fork ${rate}`, sku: `LL-FORK-${rate}` }, { end: 'fork', rateNPerMm: rate, freeLengthMm: 460, innerDiameterMm: 28, outerDiameterMm: 39, wireDiameterMm: 5.5, totalCoils: coils }));
  }
  const adapter = await post('/api/staff/products', productInput({ name: 'Seat adapter', sku: 'LL-AD-1' }));
  await t.http.put(`/api/staff/fitments/${fitment.id}/springs/${shocks[1].id}/adapters`).set(staff.auth).send({ adapters: [{ productId: adapter.id, quantity: 1 }] }).expect(200);
  return { ...t, fitment };
}

// What the finder does in the browser: the bike as it crossed the wire, then the shared rule on it.
function inBrowser(bike: BikeForRecommendationDto, body: RecommendationRequest): { status: number; body: unknown } {
  try {
    return { status: 200, body: JSON.parse(JSON.stringify(recommendFor(bike, body))) as RecommendationDto };
  } catch (e) {
    if (e instanceof RecommendationProblem) return { status: e.kind === 'validation' ? 400 : 409, body: e.fields };
    throw e;
  }
}

describe('the finder in the browser and the recommendation API', () => {
  it('give the same answer for the same load, over a grid of riders, luggage, passengers and riding styles', async () => {
    const { http, fitment } = await shop();
    const bike = (await http.get(`/api/recommendations/bikes/${fitment.id}`).expect(200)).body as BikeForRecommendationDto;
    expect(bike.fitment.id).toBe(fitment.id);
    expect(bike.springs.filter((s) => s.end === 'shock')).toHaveLength(5);
    expect(bike.springs.find((s) => s.sku === 'LL-SHOCK-85')!.adapters).toMatchObject([{ sku: 'LL-AD-1', quantity: 1 }]);

    let compared = 0;
    let refused = 0;
    for (const ridingStyle of ['road', 'adventure', 'off-road'] as const) {
      for (const massKg of [52, 68.5, 81, 95, 110, 128]) {
        for (const panniersKg of [0, 20, 45]) {
          for (const passengerKg of [0, 75]) {
            const body: RecommendationRequest = {
              fitmentId: fitment.id,
              ridingStyle,
              rider: { massKg, gearKg: 8 },
              luggage: panniersKg ? [{ station: 'panniers', massKg: panniersKg }] : [],
              ...(passengerKg ? { passengerKg } : {}),
            };
            const server = await http.post('/api/recommendations').send(body);
            const local = inBrowser(bike, body);
            expect(local.status, JSON.stringify(body)).toBe(server.status);
            if (server.status === 200) expect(local.body).toEqual(server.body);
            else {
              expect(local.body).toEqual(server.body.fields);
              refused += 1;
            }
            compared += 1;
          }
        }
      }
    }
    expect(compared).toBe(108);
    // The grid reaches past the panniers' and the bike's limits, so refusals are compared too.
    expect(refused).toBeGreaterThan(0);
    expect(refused).toBeLessThan(compared);
  });

  it('give the same answer with load cases, coversAllCases and the case that rules each spring out included', async () => {
    const { http, fitment } = await shop();
    const bike = (await http.get(`/api/recommendations/bikes/${fitment.id}`).expect(200)).body as BikeForRecommendationDto;
    for (const massKg of [60, 95]) {
      const body: RecommendationRequest = {
        fitmentId: fitment.id,
        ridingStyle: 'road',
        rider: { massKg, gearKg: 8 },
        luggage: [{ station: 'panniers', massKg: 20 }],
        cases: [
          { name: 'solo', rider: { massKg, gearKg: 8 }, luggage: [] },
          { name: 'two-up touring', rider: { massKg, gearKg: 8 }, passengerKg: 70, luggage: [{ station: 'panniers', massKg: 30 }] },
        ],
      };
      const server = await http.post('/api/recommendations').send(body).expect(200);
      expect(server.body.shock.cases.map((c: { name: string }) => c.name)).toEqual(['as entered', 'solo', 'two-up touring']);
      expect(inBrowser(bike, body).body).toEqual(server.body);
    }
  });

  it('the bike endpoint names an unknown bike as a 404 and a malformed id too', async () => {
    const { http } = testApp();
    const missing = await http.get('/api/recommendations/bikes/00000000-0000-4000-8000-000000000000');
    expect(missing.status).toBe(404);
    expect((await http.get('/api/recommendations/bikes/not-a-bike')).status).toBe(404);
  });
});

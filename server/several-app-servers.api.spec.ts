import { mkdtempSync } from 'node:fs';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ShockRecommendationDto, StaffProductDto } from '../shared/catalogue';
import { createApp } from './app';
import { parseConfig } from './config';
import { startServerProcess, type RunningServer } from './test/app-process';
import { fitmentInput, springInput } from './test/catalogue-factories';
import { createUser, testPassword, userWithToken } from './test/factories';
import { startS3Standin, type S3Standin } from './test/s3-standin';

// Two app servers on one database, as behind a load balancer: A runs in this process, B in its own (as on a
// second machine, with its own caches and module state). Both get the same settings, as the README asks.
const calcLimit = 10;
const cacheTtlMs = 300;

let s3: S3Standin;
let serverA: Server;
let serverB: RunningServer;
let a: ReturnType<typeof request>;
let b: ReturnType<typeof request>;
let shared: Record<string, string>;

beforeAll(async () => {
  s3 = await startS3Standin();
  shared = {
    ...s3.env,
    CALC_RATE_LIMIT_PER_MINUTE: String(calcLimit),
    LOGIN_LIMIT_PER_ACCOUNT: '8',
    LOGIN_LIMIT_PER_IP: '1000',
    CATALOGUE_CACHE_TTL_MS: String(cacheTtlMs),
  };
  // Each server its own upload folder: anything they share has to come through the database or the bucket.
  serverB = await startServerProcess({ ...shared, UPLOAD_DIR: mkdtempSync(join(tmpdir(), 'loadline-b-')) });
  const configA = parseConfig({ ...process.env, ...shared, UPLOAD_DIR: mkdtempSync(join(tmpdir(), 'loadline-a-')) });
  serverA = await new Promise<Server>((resolve) => {
    const s = createApp(configA).listen(0, '127.0.0.1', () => resolve(s));
  });
  a = request(`http://127.0.0.1:${(serverA.address() as AddressInfo).port}`);
  b = request(serverB.url);
});

afterAll(async () => {
  await serverB?.stop();
  await new Promise((r) => serverA?.close(r));
  await s3?.close();
});

const rearBody = {
  wheelbaseMm: 1500,
  sprungMassKg: 95,
  loads: [{ massKg: 80, positionMm: 900 }],
  leverageRatio: 2.1,
  wheelTravelMm: 200,
  shockStrokeMm: 95,
  targets: { staticSagMm: 25, riderSagMm: 66 },
  preloadRangeMm: { min: 2, max: 20 },
  adjusterPitchMm: 1.0,
  springs: [{ id: 'R-58', rateNPerMm: 58, freeLengthMm: 229, solidLengthMm: 110 }],
};

// The servers trust the proxy on the loopback, so a forwarded address is the client's, as behind a reverse proxy.
const from = (address: string) => ({ 'X-Forwarded-For': address });

describe('several app servers on one database', () => {
  it('enforce one calculation limit per client address between them, not one each', async () => {
    const rider = from('203.0.113.9');
    for (let i = 0; i < calcLimit; i++) {
      const server = i % 2 ? b : a;
      expect((await server.post('/api/calculations/rear-spring').set(rider).send(rearBody)).status, `request ${i + 1}`).toBe(200);
    }
    // Each server has answered only half the limit, yet both now refuse this address.
    for (const server of [a, b]) {
      const refused = await server.post('/api/calculations/rear-spring').set(rider).send(rearBody);
      expect(refused.status).toBe(429);
      expect(refused.body).toEqual({ code: 'rate-limited', message: 'Too many requests. Please wait a little and try again.' });
    }
    // Another rider behind the same proxy has a limit of their own.
    expect((await b.post('/api/calculations/rear-spring').set(from('203.0.113.10')).send(rearBody)).status).toBe(200);
  });

  it('the sign-in throttle refuses the ninth wrong password within 15 minutes when the attempts alternate between servers', async () => {
    await createUser({ email: 'alternating@example.test' });
    for (let i = 0; i < 8; i++) {
      const res = await (i % 2 ? b : a).post('/api/auth/login').send({ email: 'alternating@example.test', password: `wrong-guess-${i}` });
      expect(res.status, `attempt ${i + 1}`).toBe(401);
    }
    const ninth = await a.post('/api/auth/login').send({ email: 'alternating@example.test', password: 'wrong-guess-8' });
    expect(ninth.status).toBe(429);
    expect(ninth.body.code).toBe('rate-limited');
    // Throttled on both servers, even with the right password, until the window closes.
    expect((await b.post('/api/auth/login').send({ email: 'Alternating@Example.test', password: testPassword })).status).toBe(429);
  });

  it('an account disabled through one server is refused by the other on its very next request', async () => {
    const admin = await createUser({ role: 'admin', email: 'admin-two@example.test' });
    const staff = await createUser({ role: 'staff', email: 'staff-two@example.test' });
    const login = async (http: ReturnType<typeof request>, email: string) =>
      ({ Authorization: `Bearer ${(await http.post('/api/auth/login').send({ email, password: testPassword }).expect(200)).body.token as string}` });
    const adminOnA = await login(a, admin.email);
    const staffOnB = await login(b, staff.email);
    await b.get('/api/staff/products').set(staffOnB).expect(200);
    await a.patch(`/api/admin/users/${staff.id}`).set(adminOnA).send({ disabled: true }).expect(200);
    // No wait: B reads the account from the database on each request, so there is no window to bound.
    expect((await b.get('/api/staff/products').set(staffOnB)).status).toBe(401);
  });

  it('a fitment change saved on one server reaches the other server’s recommendations within the cache window', async () => {
    const config = parseConfig({ ...process.env, ...shared });
    const staff = await userWithToken(config, 'staff');
    const fitment = (await a.post('/api/staff/fitments').set(staff.auth).send(fitmentInput()).expect(201)).body as { id: string };
    await a.post('/api/staff/products').set(staff.auth).send(springInput({ sku: 'LL-SHOCK-85' }, { rateNPerMm: 85, totalCoils: 8 })).expect(201);
    let riders = 0;
    // Each poll is another rider, so polling never meets the per-address limit.
    const shockOnB = async () => {
      const res = await b.post('/api/recommendations').set(from(`198.51.100.${++riders}`)).send({ fitmentId: fitment.id, ridingStyle: 'road', rider: { massKg: 90, gearKg: 8 } });
      expect(res.status).toBe(200);
      return res.body.shock as ShockRecommendationDto;
    };
    const before = await shockOnB(); // B now holds the fitment in its cache.
    await a.put(`/api/staff/fitments/${fitment.id}`).set(staff.auth).send(fitmentInput({ rearLeverageRatio: 3.0 })).expect(200);

    // B learns of the change only when its cached copy ages out; poll rather than time it.
    let after = await shockOnB();
    for (let polls = 0; after.requiredRate.nPerMm === before.requiredRate.nPerMm && polls < 200; polls++) {
      await new Promise((r) => setTimeout(r, cacheTtlMs / 4));
      after = await shockOnB();
    }
    // With a constant ratio the spring must carry LR² times the wheel rate (wheel rate = spring rate / LR², the
    // installation-ratio relation), so 2.6 → 3.0 raises the required rate by (3.0/2.6)²; answers are rounded to
    // 0.01 N/mm, so the ratio of two rounded rates of ~100 N/mm holds to about 1e-4.
    expect(after.requiredRate.nPerMm / before.requiredRate.nPerMm).toBeCloseTo((3.0 / 2.6) ** 2, 3);
  });

  it('with images in the object store, an image uploaded through one server is served by the other, and a removal holds on both', async () => {
    const png = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==', 'base64');
    const staff = await userWithToken(parseConfig({ ...process.env, ...shared }), 'staff');
    const product = (await a.post('/api/staff/products').set(staff.auth).send(springInput()).expect(201)).body as StaffProductDto;
    const uploaded = (await a.post(`/api/staff/products/${product.id}/images`).set(staff.auth).attach('image', png, 'spring.png').expect(201)).body as StaffProductDto;
    const url = uploaded.images[0]!.url;
    const served = await b.get(url).buffer(true).parse((res, cb) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(served.status).toBe(200);
    expect(served.headers['content-type']).toBe('image/png');
    expect(Buffer.compare(served.body as Buffer, png)).toBe(0);

    await b.delete(`/api/staff/products/${product.id}/images/${uploaded.images[0]!.id}`).set(staff.auth).expect(200);
    expect((await a.get(url)).status).toBe(404);
  });
});

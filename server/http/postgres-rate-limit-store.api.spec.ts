import type { Options } from 'express-rate-limit';
import { describe, expect, it } from 'vitest';
import { AppDataSource } from '../db/data-source';
import { testApp } from '../test/factories';
import { PostgresRateLimitStore, sweepExpiredCounters } from './postgres-rate-limit-store';

function store(name: string, windowMs = 60_000): PostgresRateLimitStore {
  const s = new PostgresRateLimitStore(name);
  s.init({ windowMs } as Options);
  return s;
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

describe('rate-limit counters in PostgreSQL', () => {
  it('two servers counting one address concurrently hand out every position in the window exactly once', async () => {
    // Two stores of one limiter stand for the same limit on two app servers.
    const a = store('calc-test');
    const b = store('calc-test');
    const hits = await Promise.all(Array.from({ length: 60 }, (_, i) => (i % 2 ? a : b).increment('203.0.113.7')));
    expect(hits.map((h) => h.totalHits).sort((x, y) => x - y)).toEqual(Array.from({ length: 60 }, (_, i) => i + 1));
    expect(new Set(hits.map((h) => h.resetTime!.getTime())).size).toBe(1);
    expect((await a.get('203.0.113.7'))?.totalHits).toBe(60);
  });

  it('addresses and limiters are counted apart', async () => {
    const calc = store('calc-test');
    const signIn = store('sign-in-test');
    await calc.increment('203.0.113.7');
    await calc.increment('203.0.113.7');
    expect((await calc.increment('203.0.113.8')).totalHits).toBe(1);
    expect((await signIn.increment('203.0.113.7')).totalHits).toBe(1);
  });

  it('once its window has closed, an address starts again from one hit', async () => {
    const s = store('short-window', 300);
    await s.increment('203.0.113.7');
    const second = await s.increment('203.0.113.7');
    expect(second.totalHits).toBe(2);
    // Waits for the window the database gave, however long this machine took to get here.
    while (Date.now() <= second.resetTime!.getTime() + 50) await sleep(50);
    expect(await s.get('203.0.113.7')).toBeUndefined();
    const next = await s.increment('203.0.113.7');
    expect(next.totalHits).toBe(1);
    expect(next.resetTime!.getTime()).toBeGreaterThan(second.resetTime!.getTime());
  });

  it('a decrement gives one hit back, never below zero, and a reset forgets the address', async () => {
    const s = store('sign-in-test');
    await s.increment('rider@example.test');
    await s.increment('rider@example.test');
    await s.decrement('rider@example.test');
    expect((await s.get('rider@example.test'))?.totalHits).toBe(1);
    await s.decrement('rider@example.test');
    await s.decrement('rider@example.test');
    expect((await s.get('rider@example.test'))?.totalHits).toBe(0);
    await s.resetKey('rider@example.test');
    expect(await s.get('rider@example.test')).toBeUndefined();
    expect((await s.increment('rider@example.test')).totalHits).toBe(1);
  });

  it('the sweep deletes the counters whose window has closed and keeps the open ones', async () => {
    const open = store('open', 60_000);
    const closing = store('closing', 100);
    await open.increment('203.0.113.7');
    const closed = await closing.increment('203.0.113.7');
    while (Date.now() <= closed.resetTime!.getTime() + 50) await sleep(50);
    expect(await sweepExpiredCounters()).toBe(1);
    const left: { limiter: string }[] = await AppDataSource.query('SELECT limiter FROM rate_limit_counters');
    expect(left.map((r) => r.limiter)).toEqual(['open']);
  });
});

describe('limits while the database is away', () => {
  it('the calculations go on answering, while sign-in says 503 rather than letting guesses through uncounted', async () => {
    const { http } = testApp();
    const body = {
      wireDiameterMm: 10, outsideDiameterMm: 70, totalCoils: 10, endType: 'squared-ground', material: 'chrome-silicon',
    };
    await AppDataSource.destroy();
    try {
      const calc = await http.post('/api/calculations/spring-geometry').send(body);
      expect(calc.status).toBe(200);
      const signIn = await http.post('/api/auth/login').send({ email: 'rider@example.test', password: 'a-guess-of-some-length' });
      expect(signIn.status).toBe(503);
      expect(signIn.body.code).toBe('unavailable');
    } finally {
      await AppDataSource.initialize();
    }
  });
});

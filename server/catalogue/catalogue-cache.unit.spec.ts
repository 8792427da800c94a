import { describe, expect, it } from 'vitest';
import { catalogueChanged, TtlCache } from './catalogue-cache';

/** A cache on a hand-moved clock, with a loader that counts its calls and answers the call number. */
function setup(ttlMs = 1000, random = () => 1) {
  let t = 0;
  let calls = 0;
  let fail = false;
  const cache = new TtlCache<number>(ttlMs, { now: () => t, random });
  const load = () => {
    calls += 1;
    return fail ? Promise.reject(new Error('database down')) : Promise.resolve(calls);
  };
  return {
    get: () => cache.getOrLoad('bike', load),
    at: (ms: number) => (t = ms),
    calls: () => calls,
    failing: (v: boolean) => (fail = v),
  };
}

const settle = () => new Promise((r) => setTimeout(r, 0));

describe('TtlCache', () => {
  it('loads once while fresh', async () => {
    const c = setup();
    expect(await c.get()).toBe(1);
    c.at(999);
    expect(await c.get()).toBe(1);
    expect(c.calls()).toBe(1);
  });

  it('just past its time, answers the old copy while exactly one reload runs, then the new one', async () => {
    const c = setup();
    await c.get();
    await settle();
    c.at(1500);
    expect(await Promise.all([c.get(), c.get(), c.get()])).toEqual([1, 1, 1]);
    expect(c.calls()).toBe(2);
    await settle();
    expect(await c.get()).toBe(2);
    expect(c.calls()).toBe(2);
  });

  it('waits for a fresh load once an entry is more than a TTL past its time', async () => {
    const c = setup();
    await c.get();
    await settle();
    c.at(2000);
    expect(await c.get()).toBe(2);
  });

  it('a write in this process makes the next read load again, at once', async () => {
    const c = setup();
    await c.get();
    catalogueChanged();
    expect(await c.get()).toBe(2);
  });

  it('a failed reload keeps the old copy inside its window and tries again on the next read', async () => {
    const c = setup();
    await c.get();
    await settle();
    c.at(1200);
    c.failing(true);
    expect(await c.get()).toBe(1);
    await settle();
    c.failing(false);
    expect(await c.get()).toBe(1);
    await settle();
    expect(c.calls()).toBe(3);
    expect(await c.get()).toBe(3);
  });

  it('a failed first load is not kept', async () => {
    const c = setup();
    c.failing(true);
    await expect(c.get()).rejects.toThrow('database down');
    c.failing(false);
    expect(await c.get()).toBe(2);
  });

  it('spreads lifetimes over 80–100 % of the TTL, so entries loaded together expire apart', async () => {
    const short = setup(1000, () => 0);
    await short.get();
    await settle();
    short.at(799);
    expect(await short.get()).toBe(1);
    expect(short.calls()).toBe(1);
    short.at(800);
    await short.get();
    expect(short.calls()).toBe(2);
  });

  it('with a TTL of 0 every read loads', async () => {
    const c = setup(0);
    await c.get();
    await settle();
    expect(await c.get()).toBe(2);
  });
});

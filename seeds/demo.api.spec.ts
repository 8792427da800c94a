import { describe, expect, it } from 'vitest';
import { ridingStyles } from '../shared/catalogue';
import { AppDataSource } from '../server/db/data-source';
import { Fitment } from '../server/fitment/Fitment.entity';
import { Product } from '../server/catalogue/Product.entity';
import { createBikeCache, recommend } from '../server/recommendations/recommendations.service';
import { testApp } from '../server/test/factories';
import { seedDemo } from './demo';
import { gridGearKg, gridLoadsFor, gridRiderKg } from './grid';

describe('the demo scenario', () => {
  it('has six makes, twenty fitments, seventy-six springs, adapter kits, a spring compressor and a sag tool', async () => {
    await AppDataSource.transaction((em) => seedDemo(em));
    const makes = (await testApp().http.get('/api/fitments/makes')).body as { make: string }[];
    expect(makes).toHaveLength(6);
    expect(await AppDataSource.getRepository(Fitment).count()).toBe(20);
    const products = await AppDataSource.getRepository(Product).find();
    expect(products.filter((p) => p.kind === 'spring')).toHaveLength(76);
    expect(products.filter((p) => p.kind === 'adapter').length).toBeGreaterThanOrEqual(2);
    expect(products.some((p) => /spring compressor/i.test(p.name))).toBe(true);
    expect(products.some((p) => /sag/i.test(p.name) && p.kind === 'tool')).toBe(true);
    // Every demo spring's stated rate agrees with the engine's geometry within the 5 % staff are warned at.
    for (const p of products.filter((x) => x.kind === 'spring')) {
      expect(Math.abs(p.rateNPerMm! - p.computedRateNPerMm!) / p.computedRateNPerMm!, p.sku).toBeLessThan(0.05);
    }
  });

  it('every demo bike and riding style serves riders of 55 to 120 kg solo, and two-up where it may: a suiting fork and shock spring, and the first one suits', async () => {
    await AppDataSource.transaction((em) => seedDemo(em));
    const cache = createBikeCache(60_000);
    const fitments = await AppDataSource.getRepository(Fitment).find();
    expect(fitments).toHaveLength(20);
    const misses: string[] = [];
    let ends = 0;
    for (const f of fitments) {
      const loads = gridLoadsFor(f);
      // The grid takes two-up only where the seat and rated load allow, and every bike with a seat gets some.
      expect(loads.filter((l) => !l.passengerKg)).toHaveLength(gridRiderKg.length);
      if (f.loadStations.some((s) => s.station === 'passenger')) expect(loads.some((l) => l.passengerKg)).toBe(true);
      for (const ridingStyle of ridingStyles) {
        for (const l of loads) {
          const r = await recommend({ fitmentId: f.id, ridingStyle, rider: { massKg: l.riderKg, gearKg: gridGearKg }, ...(l.passengerKg ? { passengerKg: l.passengerKg } : {}) }, cache);
          if (!('candidates' in r.fork) || !('candidates' in r.shock)) throw new Error('expected the single-load shape');
          for (const [end, answer] of [['fork', r.fork], ['shock', r.shock]] as const) {
            ends += 1;
            const what = `${r.fitment.make} ${r.fitment.model} ${r.fitment.variant} ${end} ${l.riderKg} kg${l.passengerKg ? ' two-up' : ''} ${ridingStyle}`;
            if (!answer.candidates.some((c) => c.verdict === 'ok')) misses.push(`${what}: no suiting spring`);
            else if (answer.candidates[0]!.verdict !== 'ok') misses.push(`${what}: the first spring does not suit`);
          }
        }
      }
    }
    expect(ends).toBeGreaterThan(20 * 3 * gridRiderKg.length * 2);
    expect(misses).toEqual([]);
  });
});

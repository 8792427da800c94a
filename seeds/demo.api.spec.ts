import { describe, expect, it } from 'vitest';
import { ridingStyles } from '../shared/catalogue';
import { AppDataSource } from '../server/db/data-source';
import { Fitment } from '../server/fitment/Fitment.entity';
import { Product } from '../server/catalogue/Product.entity';
import { createBikeCache, recommend } from '../server/recommendations/recommendations.service';
import { testApp } from '../server/test/factories';
import { seedDemo } from './demo';

describe('the demo scenario', () => {
  it('has six makes, twenty fitments, sixty springs, adapter kits, a spring compressor and a sag tool', async () => {
    await AppDataSource.transaction((em) => seedDemo(em));
    const makes = (await testApp().http.get('/api/fitments/makes')).body as { make: string }[];
    expect(makes).toHaveLength(6);
    expect(await AppDataSource.getRepository(Fitment).count()).toBe(20);
    const products = await AppDataSource.getRepository(Product).find();
    expect(products.filter((p) => p.kind === 'spring')).toHaveLength(60);
    expect(products.filter((p) => p.kind === 'adapter').length).toBeGreaterThanOrEqual(2);
    expect(products.some((p) => /spring compressor/i.test(p.name))).toBe(true);
    expect(products.some((p) => /sag/i.test(p.name) && p.kind === 'tool')).toBe(true);
    // Every demo spring's stated rate agrees with the engine's geometry within the 5 % staff are warned at.
    for (const p of products.filter((x) => x.kind === 'spring')) {
      expect(Math.abs(p.rateNPerMm! - p.computedRateNPerMm!) / p.computedRateNPerMm!, p.sku).toBeLessThan(0.05);
    }
  });

  it('for any rider from 60 to 110 kg with 8 kg of gear, every demo bike has an ok fork spring and an ok shock spring in every riding style', async () => {
    await AppDataSource.transaction((em) => seedDemo(em));
    const cache = createBikeCache(60_000);
    const fitments = await AppDataSource.getRepository(Fitment).find();
    const misses: string[] = [];
    for (const f of fitments) {
      for (const ridingStyle of ridingStyles) {
        for (let massKg = 60; massKg <= 110; massKg += 1) {
          const r = await recommend({ fitmentId: f.id, ridingStyle, rider: { massKg, gearKg: 8 } }, cache);
          if (!('candidates' in r.fork) || !('candidates' in r.shock)) throw new Error('expected the single-load shape');
          if (!r.fork.candidates.some((c) => c.verdict === 'ok')) misses.push(`${r.fitment.make} ${r.fitment.model} ${r.fitment.variant} fork ${massKg} kg ${ridingStyle}`);
          if (!r.shock.candidates.some((c) => c.verdict === 'ok')) misses.push(`${r.fitment.make} ${r.fitment.model} ${r.fitment.variant} shock ${massKg} kg ${ridingStyle}`);
        }
      }
    }
    expect(misses).toEqual([]);
  });
});

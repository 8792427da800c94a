import { compareWithBaseline, migrateDatabase, startApp } from './lib';
import { stageTimes } from './stages';

/** A 10-point leverage curve and 10 springs: a realistic, not a trivial, rear-spring request. */
export const rearSpringBody = {
  wheelbaseMm: 1480,
  sprungMassKg: 96,
  loads: [
    { massKg: 88, positionMm: 880 },
    { massKg: 14, positionMm: 1720 },
  ],
  leverageRatio: Array.from({ length: 10 }, (_, i) => ({ wheelTravelMm: i * 22, ratio: 2.6 - i * 0.07 })),
  wheelTravelMm: 200,
  shockStrokeMm: 90,
  targets: { staticSagMm: 25, riderSagMm: 66 },
  preloadRangeMm: { min: 2, max: 20 },
  adjusterPitchMm: 1,
  springs: Array.from({ length: 10 }, (_, i) => ({ id: `S-${50 + i * 5}`, rateNPerMm: 50 + i * 5, freeLengthMm: 229, solidLengthMm: 112 })),
};

/** POST /api/calculations/rear-spring beside bare Express; target: throughput ratio ≥ 0.5 and p99 ≤ 2.5 × the baseline's p99, 50 connections, 10 s rounds. */
export async function benchCalculations(): Promise<void> {
  // Riders vary: cycle through a few loads so the run is not one request repeated.
  const bodies = [70, 85, 100, 115].map((massKg) => ({ ...rearSpringBody, loads: [{ massKg, positionMm: 880 }, ...rearSpringBody.loads.slice(1)] }));
  await migrateDatabase();
  const app = await startApp({ calcRateLimitPerMinute: 100_000_000, logLevel: 'silent' });
  try {
    const r = await compareWithBaseline('rear-spring', { url: `${app.url}/api/calculations/rear-spring`, bodies });
    console.log(`  target (medians): ratio >= 0.5 ${r.ratio >= 0.5 ? 'met' : 'NOT met'}, p99 <= 2.5 x baseline p99 (${r.p99Ratio.toFixed(2)} x) ${r.p99Ratio <= 2.5 ? 'met' : 'NOT met'}`);
  } finally {
    await app.close();
  }
  stageTimes(rearSpringBody);
}

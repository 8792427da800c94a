import { measure, report, startServer } from './http-bench';

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

export async function benchCalculations(): Promise<void> {
  const { ports, child } = await startServer('bench/serve-calculations.ts');
  try {
    const opts = { connections: 50, durationSec: Number(process.env.BENCH_SECONDS ?? 10) };
    // A short warm-up so the JIT has seen both routes before anything is measured.
    await measure('warm-up', `http://127.0.0.1:${ports.app}/api/calculations/rear-spring`, rearSpringBody, { connections: 10, durationSec: 2 });
    const baseline = await measure('bare Express, constant JSON', `http://127.0.0.1:${ports.baseline}/baseline`, rearSpringBody, opts);
    const subject = await measure('POST /api/calculations/rear-spring', `http://127.0.0.1:${ports.app}/api/calculations/rear-spring`, rearSpringBody, opts);
    report(baseline, subject, { ratio: 0.5, p99Ms: 20 });
  } finally {
    child.kill('SIGTERM');
  }
}

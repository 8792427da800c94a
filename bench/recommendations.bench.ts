import { compareWithBaseline, freshDemoDatabase, startApp } from './lib';

/** POST /api/recommendations on the demo catalogue beside bare Express; target ratio ≥ 0.25 and p99 < 50 ms at 50 connections. */
export async function run(): Promise<void> {
  await freshDemoDatabase();
  const { AppDataSource } = await import('../server/db/data-source');
  const ids: { id: string }[] = await AppDataSource.query('SELECT id FROM fitments ORDER BY id');
  const styles = ['road', 'adventure', 'off-road'] as const;
  const bodies = ids.flatMap(({ id }, i) =>
    [62, 78, 94, 108].map((massKg) => ({ fitmentId: id, ridingStyle: styles[i % 3], rider: { massKg, gearKg: 8 }, luggage: [{ station: 'tank-bag', massKg: 3 }] })),
  );
  // The per-address limit is raised through its config value, as a load balancer in front would spread real riders.
  const app = await startApp({ calcRateLimitPerMinute: 100_000_000, logLevel: 'silent' });
  try {
    const r = await compareWithBaseline('recommendations', { url: `${app.url}/api/recommendations`, bodies });
    console.log(`  target: ratio >= 0.25 ${r.ratio >= 0.25 ? 'met' : 'NOT met'}, p99 < 50 ms ${r.route.p99Ms < 50 ? 'met' : 'NOT met'}`);
  } finally {
    await app.close();
  }
}

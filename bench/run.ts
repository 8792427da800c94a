/**
 * npm run bench [-- name...]: runs the named benchmarks (all when none is named) against a scratch
 * database on the test cluster (LOADLINE_DB_PORT, default 54339; start it with npm run db:start).
 */
import { prepareDatabase } from './lib';

const benches: Record<string, () => Promise<{ run: () => Promise<void> }>> = {
  recommendations: () => import('./recommendations.bench'),
  'csv-import': () => import('./csv-import.bench'),
};

const asked = process.argv.slice(2).filter((a) => a !== '--');
const unknown = asked.filter((a) => !(a in benches));
if (unknown.length) {
  console.error(`Unknown benchmark(s): ${unknown.join(', ')}. Known: ${Object.keys(benches).join(', ')}`);
  process.exit(2);
}
await prepareDatabase();
for (const name of asked.length ? asked : Object.keys(benches)) await (await benches[name]!()).run();
const { AppDataSource } = await import('../server/db/data-source');
if (AppDataSource.isInitialized) await AppDataSource.destroy();

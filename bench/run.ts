/**
 * npm run bench [-- name...]: runs the named benchmarks (all when none is named). The catalogue ones use a
 * scratch database on the test cluster (LOADLINE_DB_PORT, default 54339; start it with npm run db:start).
 */
import { benchCalculations } from './calculations';
import { prepareDatabase } from './lib';

const benches: Record<string, () => Promise<void>> = {
  calculations: benchCalculations,
  recommendations: async () => (await import('./recommendations.bench')).run(),
  'csv-import': async () => (await import('./csv-import.bench')).run(),
  checkout: async () => (await import('./checkout.bench')).run(),
  pages: async () => (await import('./pages.bench')).run(),
};
// The app process opens its database at start, so every bench that starts it needs one.
const needDatabase = new Set(['calculations', 'recommendations', 'csv-import', 'checkout', 'pages']);

const wanted = process.argv.slice(2).filter((a) => !a.startsWith('-'));
const names = wanted.length ? wanted : Object.keys(benches);
const unknown = names.filter((n) => !benches[n]);
if (unknown.length) {
  console.error(`unknown benchmark '${unknown.join("', '")}'; known: ${Object.keys(benches).join(', ')}`);
  process.exit(2);
}
// Before any server module is imported: they read DATABASE_URL once, on import.
if (names.some((n) => needDatabase.has(n))) await prepareDatabase();
for (const name of names) {
  console.log(`\n== ${name} ==`);
  await benches[name]!();
}
const { AppDataSource } = await import('../server/db/data-source');
if (AppDataSource.isInitialized) await AppDataSource.destroy();
process.exit(0);

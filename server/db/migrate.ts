import { AppDataSource } from './data-source';

const ds = await AppDataSource.initialize();
const done = await ds.runMigrations({ transaction: 'each' });
console.log(done.length ? `migrations applied: ${done.map((m) => m.name).join(', ')}` : 'database schema is up to date');
await ds.destroy();

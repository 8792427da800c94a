import { getConfig } from '../config';
import { ensureJobQueue } from '../mail/job-queue';
import { AppDataSource } from './data-source';

const ds = await AppDataSource.initialize();
const done = await ds.runMigrations({ transaction: 'each' });
console.log(done.length ? `migrations applied: ${done.map((m) => m.name).join(', ')}` : 'database schema is up to date');
await ds.destroy();
// pg-boss creates and upgrades its own tables (schema pgboss); the mail queue is made here so any app server can queue mail.
await ensureJobQueue(getConfig());
console.log('job queue is ready');

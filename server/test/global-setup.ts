import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { migrations } from '../db/migrations/index';
import { ensureJobQueue, jobSchema } from '../mail/job-queue';
import { assertTestDatabase, testDatabaseUrl } from './test-env';

/** Rebuilds the test schema from the migrations once per run, which also proves they apply from scratch. */
export async function setup(): Promise<void> {
  assertTestDatabase(testDatabaseUrl);
  const ds = new DataSource({ type: 'postgres', url: testDatabaseUrl, migrations, extra: { connectionTimeoutMillis: 3000 } });
  try {
    await ds.initialize();
  } catch (e) {
    throw new Error(`The test database at ${testDatabaseUrl} is not reachable (${(e as Error).message}). Run 'npm test', which starts it.`);
  }
  await ds.query('DROP SCHEMA public CASCADE');
  await ds.query(`DROP SCHEMA IF EXISTS ${jobSchema} CASCADE`);
  await ds.query('CREATE SCHEMA public');
  await ds.runMigrations({ transaction: 'each' });
  // Every migration must also go down cleanly and come back.
  for (let i = 0; i < migrations.length; i++) await ds.undoLastMigration({ transaction: 'each' });
  await ds.runMigrations({ transaction: 'each' });
  await ds.destroy();
  // The job queue's tables and the mail queue, with the short retry delay the API tests run with (see vite.config.ts).
  await ensureJobQueue({ databaseUrl: testDatabaseUrl, mailRetryLimit: 5, mailRetryDelaySeconds: 1 });
}

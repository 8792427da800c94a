import 'reflect-metadata';
import { afterAll, beforeAll, beforeEach } from 'vitest';
import { AppDataSource } from '../db/data-source';
import { jobSchema } from '../mail/job-queue';
import { assertTestDatabase } from './test-env';

beforeAll(async () => {
  assertTestDatabase(AppDataSource.options.type === 'postgres' ? String(AppDataSource.options.url) : '');
  if (!AppDataSource.isInitialized) await AppDataSource.initialize();
});

// Each test starts from empty tables; the schema itself stays from the one migration run.
beforeEach(async () => {
  const tables: { tablename: string }[] = await AppDataSource.query(
    `SELECT tablename FROM pg_tables WHERE schemaname = 'public' AND tablename <> 'migrations'`,
  );
  if (tables.length) await AppDataSource.query(`TRUNCATE ${tables.map((t) => `"${t.tablename}"`).join(', ')} RESTART IDENTITY CASCADE`);
  // Queued jobs live in the job queue's own schema; a test starts with none left over from another.
  await AppDataSource.query(`DELETE FROM ${jobSchema}.job`);
});

afterAll(async () => {
  if (AppDataSource.isInitialized) await AppDataSource.destroy();
});

import PgBoss from 'pg-boss';
import type { EntityManager } from 'typeorm';
import type { Config } from '../config';

/** pg-boss keeps its tables in their own schema, beside ours; it creates and upgrades them itself. */
export const jobSchema = 'pgboss';
export const mailQueue = 'mail';

export type MailJobData = { outboxId: string };

/** The retry policy of the mail queue, from config: pg-boss doubles the delay after each failure, with jitter. */
export function mailQueueOptions(config: Pick<Config, 'mailRetryLimit' | 'mailRetryDelaySeconds'>): PgBoss.Queue {
  return {
    name: mailQueue,
    policy: 'standard',
    retryLimit: config.mailRetryLimit,
    retryDelay: config.mailRetryDelaySeconds,
    retryBackoff: true,
    // A worker that dies mid-send leaves its job active; after this long the supervisor hands it to another try.
    expireInSeconds: 120,
  };
}

/** A pg-boss client with its own small pool; `supervise` runs the expiry and archive upkeep (one per app server is enough). */
export function openJobQueue(config: Pick<Config, 'databaseUrl'>, options: { supervise: boolean }): PgBoss {
  const boss = new PgBoss({
    connectionString: config.databaseUrl,
    schema: jobSchema,
    max: 4,
    migrate: true,
    supervise: options.supervise,
    schedule: false,
    application_name: 'loadline-jobs',
  });
  return boss;
}

/** Creates the job tables and the mail queue if missing and applies the retry policy from config. */
export async function installMailQueue(boss: PgBoss, config: Pick<Config, 'mailRetryLimit' | 'mailRetryDelaySeconds'>): Promise<void> {
  const options = mailQueueOptions(config);
  await boss.createQueue(mailQueue, options);
  await boss.updateQueue(mailQueue, options);
}

/** Installs the job tables and the mail queue on a database, then lets go (migrations and test set-up call it). */
export async function ensureJobQueue(config: Pick<Config, 'databaseUrl' | 'mailRetryLimit' | 'mailRetryDelaySeconds'>): Promise<void> {
  const boss = openJobQueue(config, { supervise: false });
  boss.on('error', () => undefined);
  await boss.start();
  try {
    await installMailQueue(boss, config);
  } finally {
    await boss.stop({ graceful: false, wait: true });
  }
}

// Jobs are only ever written through a caller's transaction (see transactionDb); this refuses anything else.
const enqueuer = new PgBoss({
  schema: jobSchema,
  db: {
    executeSql: () => Promise.reject(new Error('mail jobs are written only inside a transaction')),
  },
});

/** pg-boss runs its insert through this, so the job commits or rolls back with the caller's transaction. */
function transactionDb(manager: EntityManager): PgBoss.Db {
  const runner = manager.queryRunner;
  if (!runner || !runner.isTransactionActive) {
    throw new Error('Mail is queued inside a transaction: pass the EntityManager of AppDataSource.transaction(…)');
  }
  return {
    executeSql: async (text, values) => {
      const result = await runner.query(text, values, true);
      return { rows: (result.records ?? []) as unknown[] };
    },
  };
}

export async function queueMailJob(manager: EntityManager, data: MailJobData): Promise<void> {
  const id = await enqueuer.send(mailQueue, data, { db: transactionDb(manager) });
  if (!id) throw new Error(`the mail job for outbox row ${data.outboxId} was not queued`);
}

import type PgBoss from 'pg-boss';
import type { Config } from '../config';
import { installMailQueue, mailQueue, openJobQueue, type MailJobData } from './job-queue';
import { createMailer, type Mailer } from './mailer';
import { deliverOutboxMail } from './outbox';

type WorkerLog = { info(obj: object, msg: string): void; warn(obj: object, msg: string): void; error(obj: object, msg: string): void };
const quiet: WorkerLog = { info: () => undefined, warn: () => undefined, error: () => undefined };

export interface MailWorker {
  /** Sends every mail job that is due now, one after another; returns how many were sent. Tests use it in place of polling. */
  drain(): Promise<number>;
  stop(): Promise<void>;
}

export interface MailWorkerOptions {
  mailer?: Mailer;
  /** Poll the queue in the background (the server does); tests leave it off and call drain(). */
  poll?: boolean;
  log?: WorkerLog;
}

/** Starts the job queue client, makes sure the mail queue exists with the configured retries, and optionally polls it. */
export async function startMailWorker(config: Config, options: MailWorkerOptions = {}): Promise<MailWorker> {
  const log = options.log ?? quiet;
  const mailer = options.mailer ?? createMailer(config);
  const poll = options.poll ?? false;
  const boss = openJobQueue(config, { supervise: poll });
  boss.on('error', (e) => log.error({ err: e }, 'job queue error'));
  await boss.start();
  await installMailQueue(boss, config);

  const run = async (jobs: PgBoss.Job<MailJobData>[]): Promise<number> => {
    let sent = 0;
    // Each job settles on its own, so one refused mail does not fail the others fetched with it.
    for (const job of jobs) {
      try {
        const result = await deliverOutboxMail(mailer, config, job.data.outboxId);
        await boss.complete(mailQueue, job.id, { result });
        if (result === 'sent') sent++;
        if (result === 'missing') log.warn({ outboxId: job.data.outboxId }, 'mail job names no outbox row');
      } catch (e) {
        log.warn({ outboxId: job.data.outboxId, err: (e as Error).message }, 'mail not sent; it will be retried');
        await boss.fail(mailQueue, job.id, { message: (e as Error).message });
      }
    }
    return sent;
  };

  if (poll) {
    await boss.work<MailJobData>(mailQueue, { batchSize: 10, pollingIntervalSeconds: 1 }, async (jobs) => {
      await run(jobs);
    });
  }

  return {
    async drain() {
      let total = 0;
      for (;;) {
        const jobs = await boss.fetch<MailJobData>(mailQueue, { batchSize: 20 });
        if (!jobs.length) return total;
        total += await run(jobs);
      }
    },
    async stop() {
      await boss.stop({ graceful: true, timeout: 5000, wait: true });
      const closable = mailer as Mailer & { close?: () => void };
      if (!options.mailer) closable.close?.();
    },
  };
}

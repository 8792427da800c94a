import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { AppDataSource } from '../db/data-source';
import { createUser, testApp, testConfig } from '../test/factories';
import { TestMailbox } from '../test/mail-standin';
import { jobSchema, mailQueue } from './job-queue';
import { createMailer, type Mailer } from './mailer';
import { MailOutbox } from './MailOutbox.entity';
import { startMailWorker, type MailWorker } from './mail-worker';
import { deliverOutboxMail, enqueueMail, outboxMessageId } from './outbox';

const mail = { to: 'rider@example.test', subject: 'Your springs', text: 'Plain words', html: '<p>Plain words</p>' };

let mailbox: TestMailbox;
let worker: MailWorker | undefined;

beforeEach(async () => {
  mailbox = await new TestMailbox().start();
});
afterEach(async () => {
  await worker?.stop();
  worker = undefined;
  await mailbox.dispose();
});

const configFor = (box: TestMailbox) => testConfig({ smtpPort: box.smtpPort, mailCaptureUrl: box.captureUrl });
const jobs = async () =>
  // backedOff: the next try is set at least the configured delay (1 s here) after the failed one started.
  (await AppDataSource.query(
    `SELECT state, COALESCE(start_after - started_on >= interval '1 second', false) AS "backedOff" FROM ${jobSchema}.job WHERE name = $1`,
    [mailQueue],
  )) as { state: string; backedOff: boolean }[];
const outbox = () => AppDataSource.getRepository(MailOutbox);

describe('mail outbox', () => {
  it('the same event queued five times is one outbox row, one job and one mail', async () => {
    for (let i = 0; i < 5; i++) {
      await AppDataSource.transaction((em) => enqueueMail(em, 'order-confirmed:42', mail));
    }
    expect(await outbox().count()).toBe(1);
    expect(await jobs()).toHaveLength(1);

    worker = await startMailWorker(configFor(mailbox));
    expect(await worker.drain()).toBe(1);
    const got = await mailbox.messages();
    expect(got.map((m) => [m.to, m.subject, m.text.trim()])).toEqual([['rider@example.test', 'Your springs', 'Plain words']]);
    expect((await outbox().findOneByOrFail({ dedupeKey: 'order-confirmed:42' })).sentAt).toBeInstanceOf(Date);
  });

  it('a mail queued in a transaction that rolls back is neither kept nor sent', async () => {
    await expect(
      AppDataSource.transaction(async (em) => {
        await enqueueMail(em, 'order-confirmed:43', mail);
        throw new Error('the order change failed');
      }),
    ).rejects.toThrow('the order change failed');
    expect(await outbox().count()).toBe(0);
    expect(await jobs()).toHaveLength(0);
  });

  it('queuing outside a transaction is refused, so a mail never outlives a change that did not happen', async () => {
    await expect(enqueueMail(AppDataSource.manager, 'order-confirmed:44', mail)).rejects.toThrow(/inside a transaction/);
  });

  it('the polling worker the server runs sends queued mail by itself', async () => {
    worker = await startMailWorker(configFor(mailbox), { poll: true });
    await AppDataSource.transaction((em) => enqueueMail(em, 'cancelled:5', mail));
    await expect.poll(async () => (await mailbox.messages()).length, { timeout: 10_000, interval: 200 }).toBe(1);
    await expect.poll(async () => (await outbox().findOneByOrFail({ dedupeKey: 'cancelled:5' })).sentAt, { timeout: 5000 }).toBeInstanceOf(Date);
  });

  it('running the send step twice for one outbox row sends the mail once', async () => {
    await AppDataSource.transaction((em) => enqueueMail(em, 'refund:7', mail));
    const row = await outbox().findOneByOrFail({ dedupeKey: 'refund:7' });
    const mailer = createMailer(configFor(mailbox));
    expect(await deliverOutboxMail(mailer, configFor(mailbox), row.id)).toBe('sent');
    expect(await deliverOutboxMail(mailer, configFor(mailbox), row.id)).toBe('already-sent');
    expect(await mailbox.messages()).toHaveLength(1);
  });

  it('a worker that dies after the mail service took the mail but before the sent mark: the retry carries the same Message-ID and shows once', async () => {
    await AppDataSource.transaction((em) => enqueueMail(em, 'shipped:9', mail));
    const row = await outbox().findOneByOrFail({ dedupeKey: 'shipped:9' });
    const config = configFor(mailbox);
    const real = createMailer(config);
    // Sends for real, then fails before the sent mark commits, as a process killed at that moment would.
    const dying: Mailer = {
      async send(m) {
        await real.send(m);
        throw new Error('worker killed after the send');
      },
    };
    await expect(deliverOutboxMail(dying, config, row.id)).rejects.toThrow('worker killed');
    const afterCrash = await outbox().findOneByOrFail({ id: row.id });
    expect(afterCrash.sentAt).toBeNull();
    expect(afterCrash.lastError).toMatch(/worker killed/);

    expect(await deliverOutboxMail(real, config, row.id)).toBe('sent');
    const got = await mailbox.messages();
    expect(got).toHaveLength(1);
    expect(got[0]!.messageId).toBe(outboxMessageId(row.id, config.mailFrom));
    expect(await mailbox.stats()).toEqual({ count: 1, duplicatesDropped: 1 });
  });
});

describe('password reset mail', () => {
  it('with the mail service down the request still answers 202, and the link arrives once it is back', async () => {
    const { config, http } = testApp({ smtpPort: mailbox.smtpPort, mailCaptureUrl: mailbox.captureUrl });
    await createUser({ email: 'forgetful@example.test', displayName: 'Forgetful Rider' });
    await mailbox.stop();

    await http.post('/api/auth/password-reset/request').send({ email: 'forgetful@example.test' }).expect(202);

    worker = await startMailWorker(config);
    expect(await worker.drain()).toBe(0);
    // The failed try is on record and the job waits for its backoff before the next one.
    expect((await outbox().findOneOrFail({ where: {} })).lastError).toMatch(/ECONNREFUSED/);
    expect(await jobs()).toEqual([{ state: 'retry', backedOff: true }]);

    await mailbox.start();
    let sent = 0;
    for (let i = 0; i < 40 && sent === 0; i++) {
      await new Promise((r) => setTimeout(r, 250));
      sent = await worker.drain();
    }
    expect(sent).toBe(1);
    const [reset, ...others] = await mailbox.messages();
    expect(others).toHaveLength(0);
    expect(reset!.to).toBe('forgetful@example.test');
    expect(reset!.subject).toBe('Choose a new password for Loadline');

    // The mailed link is the working one: it sets the new password.
    const token = /reset-password\?token=([\w-]+)/.exec(reset!.text)?.[1];
    expect(token).toBeDefined();
    await http.post('/api/auth/password-reset/confirm').send({ token, password: 'a-brand-new-pw' }).expect(204);
    await http.post('/api/auth/login').send({ email: 'forgetful@example.test', password: 'a-brand-new-pw' }).expect(200);
  });

  it('an unknown address gets the same answer and queues no mail', async () => {
    const { http } = testApp();
    const res = await http.post('/api/auth/password-reset/request').send({ email: 'ghost@example.test' }).expect(202);
    expect(res.body.message).toMatch(/If an account uses this e-mail/);
    expect(await outbox().count()).toBe(0);
    expect(await jobs()).toHaveLength(0);
  });
});

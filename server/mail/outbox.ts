import type { EntityManager } from 'typeorm';
import type { Config } from '../config';
import { AppDataSource } from '../db/data-source';
import { queueMailJob } from './job-queue';
import { MailOutbox } from './MailOutbox.entity';
import { senderDomain, type Mailer } from './mailer';

/** What a mail says and to whom; templates give subject, text and html, the caller adds `to`. */
export interface MailContent {
  to: string;
  subject: string;
  text: string;
  html: string;
}

/**
 * Promises a mail inside the caller's transaction: an outbox row (unique on `dedupeKey`, so the same event
 * enqueued again is a no-op) and the job that will send it commit or roll back with the caller's change.
 *
 * @example
 * await AppDataSource.transaction(async (em) => {
 *   await markPaid(em, order);
 *   await enqueueMail(em, `order-confirmed:${order.id}`, { to: order.email, ...orderConfirmationMail(data) });
 * });
 */
export async function enqueueMail(manager: EntityManager, dedupeKey: string, mail: MailContent): Promise<void> {
  if (!dedupeKey || dedupeKey.length > 200) throw new Error('enqueueMail needs a dedupe key of 1 to 200 characters');
  if (!mail.to || mail.to.length > 254) throw new Error('enqueueMail needs a recipient address of at most 254 characters');
  const inserted = await manager
    .createQueryBuilder()
    .insert()
    .into(MailOutbox)
    .values({ dedupeKey, to: mail.to, subject: mail.subject.slice(0, 300), text: mail.text, html: mail.html })
    .orIgnore()
    .returning(['id'])
    .execute();
  const id = (inserted.raw as { id: string }[])[0]?.id;
  // An existing row means this event's mail is already promised (and queued); nothing more to do.
  if (!id) return;
  await queueMailJob(manager, { outboxId: id });
}

/** The Message-ID of an outbox row: the same on every try, so a resend after a crash can be recognised downstream. */
export function outboxMessageId(outboxId: string, mailFrom: string): string {
  return `<${outboxId}.outbox@${senderDomain(mailFrom)}>`;
}

export type DeliveryResult = 'sent' | 'already-sent' | 'missing';

/**
 * The send step of a mail job. The row is locked while it is sent and marked sent in the same transaction, so two
 * workers never both send it and a finished send is never repeated. Delivery is at least once only in one gap: the
 * mail service accepted the message but the process died before the mark committed; the retry then sends the same
 * Message-ID again, which the local stand-in (and many mailbox providers) drop as a duplicate.
 */
export async function deliverOutboxMail(mailer: Mailer, config: Pick<Config, 'mailFrom'>, outboxId: string): Promise<DeliveryResult> {
  try {
    return await AppDataSource.transaction(async (em) => {
      const row = await em.getRepository(MailOutbox).findOne({ where: { id: outboxId }, lock: { mode: 'pessimistic_write' } });
      if (!row) return 'missing';
      if (row.sentAt) return 'already-sent';
      await mailer.send({ to: row.to, subject: row.subject, text: row.text, html: row.html, messageId: outboxMessageId(row.id, config.mailFrom) });
      await em.update(MailOutbox, { id: row.id }, { sentAt: new Date(), attempts: row.attempts + 1, lastError: null });
      return 'sent';
    });
  } catch (e) {
    // Kept for whoever looks at a stuck mail; the job queue schedules the next try.
    await AppDataSource.createQueryBuilder()
      .update(MailOutbox)
      .set({ attempts: () => 'attempts + 1', lastError: String((e as Error).message ?? e).slice(0, 1000) })
      .where('id = :id AND sent_at IS NULL', { id: outboxId })
      .execute()
      .catch(() => undefined);
    throw e;
  }
}

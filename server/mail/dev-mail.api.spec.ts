import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { AppDataSource } from '../db/data-source';
import { testApp, userWithToken } from '../test/factories';
import { TestMailbox } from '../test/mail-standin';
import { startMailWorker } from './mail-worker';
import { enqueueMail } from './outbox';

let mailbox: TestMailbox;
beforeEach(async () => {
  mailbox = await new TestMailbox().start();
});
afterEach(async () => {
  await mailbox.dispose();
});

const appFor = (box: TestMailbox, nodeEnv: 'test' | 'production' = 'test') =>
  testApp({ nodeEnv, smtpPort: box.smtpPort, mailCaptureUrl: box.captureUrl });

async function sendTwoMails(config: ReturnType<typeof appFor>['config']) {
  const worker = await startMailWorker(config);
  // One drain per mail, so they arrive in a known order.
  await AppDataSource.transaction((em) => enqueueMail(em, 'first', { to: 'one@example.test', subject: 'First', text: 'first text', html: '<p>first html</p>' }));
  expect(await worker.drain()).toBe(1);
  await AppDataSource.transaction((em) => enqueueMail(em, 'second', { to: 'two@example.test', subject: 'Second', text: 'second text', html: '<p>second html</p>' }));
  expect(await worker.drain()).toBe(1);
  await worker.stop();
}

describe('GET /api/dev/mail', () => {
  it('lists what the mail stand-in captured, newest first, for an admin', async () => {
    const { http, config } = appFor(mailbox);
    await sendTwoMails(config);
    const { auth } = await userWithToken(config, 'admin');
    const res = await http.get('/api/dev/mail').set(auth).expect(200);
    expect(res.body.map((m: { to: string; subject: string }) => [m.to, m.subject])).toEqual([
      ['two@example.test', 'Second'],
      ['one@example.test', 'First'],
    ]);
    const first = res.body.find((m: { subject: string }) => m.subject === 'First');
    expect(Object.keys(first).sort()).toEqual(['date', 'html', 'subject', 'text', 'to']);
    expect(first.text.trim()).toBe('first text');
    expect(first.html).toContain('<p>first html</p>');
    expect(Number.isNaN(Date.parse(first.date))).toBe(false);
  });

  it('is for admins only', async () => {
    const { http, config } = appFor(mailbox);
    await http.get('/api/dev/mail').expect(401);
    for (const role of ['rider', 'staff', 'warehouse'] as const) {
      const { auth } = await userWithToken(config, role);
      await http.get('/api/dev/mail').set(auth).expect(403);
    }
  });

  it('does not exist on a production server', async () => {
    const { http, config } = appFor(mailbox, 'production');
    const { auth } = await userWithToken(config, 'admin');
    await http.get('/api/dev/mail').set(auth).expect(404);
  });

  it('says clearly when the stand-in is not running', async () => {
    const { http, config } = appFor(mailbox);
    const { auth } = await userWithToken(config, 'admin');
    await mailbox.stop();
    const res = await http.get('/api/dev/mail').set(auth).expect(503);
    expect(res.body.message).toMatch(/mail stand-in is not answering/);
  });

  it('an admin can empty the mailbox', async () => {
    const { http, config } = appFor(mailbox);
    await sendTwoMails(config);
    const { auth } = await userWithToken(config, 'admin');
    await http.delete('/api/dev/mail').set(auth).expect(204);
    expect((await http.get('/api/dev/mail').set(auth).expect(200)).body).toEqual([]);
  });
});

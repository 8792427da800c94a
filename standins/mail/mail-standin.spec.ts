import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { NodemailerMailer } from '../../server/mail/mailer';
import { startMailStandin, type MailStandin } from './mail-standin';

const dir = mkdtempSync(join(tmpdir(), 'loadline-mail-standin-'));
let standin: MailStandin | undefined;
afterEach(async () => {
  await standin?.stop();
  standin = undefined;
});

const mailerFor = (s: MailStandin) =>
  new NodemailerMailer({ smtpHost: '127.0.0.1', smtpPort: s.smtpPort, smtpSecure: false, smtpUser: '', smtpPassword: '', mailFrom: 'Shop <shop@example.test>' });
// Untyped on purpose: the assertions themselves check the shape of the read API's JSON.
const read = async (s: MailStandin, path: string, method = 'GET'): Promise<any> => (await fetch(`http://127.0.0.1:${s.httpPort}${path}`, { method })).json();

describe('mail stand-in', () => {
  it('captures both parts of what arrives and lists it over HTTP', async () => {
    standin = await startMailStandin({ smtpPort: 0, httpPort: 0, storeFile: join(dir, 'a.json') });
    await mailerFor(standin).send({ to: 'rider@example.test', subject: 'Hello', text: 'Plain part', html: '<p>Rich part</p>', messageId: '<1@example.test>' });
    const [m, ...rest] = await read(standin, '/messages');
    expect(rest).toEqual([]);
    expect(m).toMatchObject({ to: 'rider@example.test', from: 'shop@example.test', subject: 'Hello', messageId: '<1@example.test>' });
    expect(m.text.trim()).toBe('Plain part');
    expect(m.html).toContain('<p>Rich part</p>');
  });

  it('takes a signed-in sender too, as a real relay would ask for one', async () => {
    standin = await startMailStandin({ smtpPort: 0, httpPort: 0, storeFile: join(dir, 'auth.json') });
    const mailer = new NodemailerMailer({ smtpHost: '127.0.0.1', smtpPort: standin.smtpPort, smtpSecure: false, smtpUser: 'shop', smtpPassword: 'secret', mailFrom: 'shop@example.test' });
    await mailer.send({ to: 'a@example.test', subject: 'Signed in', text: 't', html: '<p>h</p>', messageId: '<auth@example.test>' });
    expect(await read(standin, '/stats')).toEqual({ count: 1, duplicatesDropped: 0 });
  });

  it('keeps one copy of a Message-ID it already holds', async () => {
    standin = await startMailStandin({ smtpPort: 0, httpPort: 0, storeFile: join(dir, 'b.json') });
    const mailer = mailerFor(standin);
    const mail = { to: 'rider@example.test', subject: 'Once', text: 't', html: '<p>h</p>', messageId: '<same@example.test>' };
    await mailer.send(mail);
    await mailer.send(mail);
    await mailer.send({ ...mail, messageId: '<other@example.test>' });
    expect(await read(standin, '/stats')).toEqual({ count: 2, duplicatesDropped: 1 });
  });

  it('still holds its mail after a restart, until it is emptied', async () => {
    const storeFile = join(dir, 'c.json');
    standin = await startMailStandin({ smtpPort: 0, httpPort: 0, storeFile });
    await mailerFor(standin).send({ to: 'rider@example.test', subject: 'Kept', text: 't', html: '<p>h</p>', messageId: '<kept@example.test>' });
    await standin.stop();
    standin = await startMailStandin({ smtpPort: 0, httpPort: 0, storeFile });
    expect((await read(standin, '/messages')).map((m: { subject: string }) => m.subject)).toEqual(['Kept']);
    await read(standin, '/messages', 'DELETE');
    expect(await read(standin, '/messages')).toEqual([]);
    await standin.stop();
    standin = await startMailStandin({ smtpPort: 0, httpPort: 0, storeFile });
    expect(await read(standin, '/messages')).toEqual([]);
  });
});

process.on('exit', () => rmSync(dir, { recursive: true, force: true }));

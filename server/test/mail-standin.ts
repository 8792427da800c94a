import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { startMailStandin, type CapturedMail, type MailStandin } from '../../standins/mail/mail-standin';

/** A mail stand-in of the test's own on free ports, which a test may stop and start again on the same ports. */
export class TestMailbox {
  private standin?: MailStandin;
  private readonly dir = mkdtempSync(join(tmpdir(), 'loadline-mail-'));
  smtpPort = 0;
  httpPort = 0;

  async start(): Promise<this> {
    this.standin = await startMailStandin({ smtpPort: this.smtpPort, httpPort: this.httpPort, storeFile: join(this.dir, 'store.json') });
    this.smtpPort = this.standin.smtpPort;
    this.httpPort = this.standin.httpPort;
    return this;
  }

  async stop(): Promise<void> {
    await this.standin?.stop();
    this.standin = undefined;
  }

  get captureUrl(): string {
    return `http://127.0.0.1:${this.httpPort}`;
  }

  /** What the stand-in holds, read over its HTTP API as the app does. */
  async messages(): Promise<CapturedMail[]> {
    return (await (await fetch(`${this.captureUrl}/messages`)).json()) as CapturedMail[];
  }

  async stats(): Promise<{ count: number; duplicatesDropped: number }> {
    return (await (await fetch(`${this.captureUrl}/stats`)).json()) as { count: number; duplicatesDropped: number };
  }

  async dispose(): Promise<void> {
    await this.stop();
    rmSync(this.dir, { recursive: true, force: true });
  }
}

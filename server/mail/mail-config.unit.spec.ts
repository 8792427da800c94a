import { describe, expect, it } from 'vitest';
import { ConfigError, parseConfig } from '../config';
import { senderDomain } from './mailer';

const base = { JWT_SECRET: 'unit-secret-unit-secret-unit-secret-0001' };
const problems = (env: Record<string, string>) => {
  try {
    parseConfig({ ...base, ...env });
    return [];
  } catch (e) {
    return (e as ConfigError).problems;
  }
};

describe('mail settings', () => {
  it('default to the local mail stand-in with the demo sender', () => {
    const c = parseConfig(base);
    expect([c.smtpHost, c.smtpPort, c.smtpSecure, c.mailCaptureUrl, c.mailWorker]).toEqual(['127.0.0.1', 2525, false, 'http://127.0.0.1:2526', true]);
    expect(senderDomain(c.mailFrom)).toBe('loadline.test');
  });

  it('refuses a sender that is not an address, a port out of range and a user without a password', () => {
    expect(problems({ MAIL_FROM: 'nobody' })).toEqual([expect.stringMatching(/^MAIL_FROM/)]);
    expect(problems({ SMTP_PORT: '70000' })).toEqual([expect.stringMatching(/^SMTP_PORT/)]);
    expect(problems({ SMTP_USER: 'shop' })).toEqual([expect.stringMatching(/^SMTP_PASSWORD/)]);
    expect(problems({ MAIL_RETRY_DELAY_SECONDS: '0' })).toEqual([expect.stringMatching(/^MAIL_RETRY_DELAY_SECONDS/)]);
  });

  it('takes a sender with or without a display name', () => {
    expect(senderDomain(parseConfig({ ...base, MAIL_FROM: 'shop@parts.example.test' }).mailFrom)).toBe('parts.example.test');
    expect(senderDomain(parseConfig({ ...base, MAIL_FROM: 'Parts desk <desk@example.test>' }).mailFrom)).toBe('example.test');
  });
});

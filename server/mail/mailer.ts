import nodemailer, { type Transporter } from 'nodemailer';
import type { Config } from '../config';

/** One message as it leaves Loadline; `messageId` is stable per outbox row so a resend can be recognised. */
export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string;
  /** A full Message-ID header value, angle brackets included: `<…@…>`. */
  messageId: string;
}

/** Hands a message to the mail service; resolves once the service has accepted it. */
export interface Mailer {
  send(message: OutgoingMail): Promise<{ messageId: string }>;
}

export type SmtpSettings = Pick<Config, 'smtpHost' | 'smtpPort' | 'smtpSecure' | 'smtpUser' | 'smtpPassword' | 'mailFrom'>;

/** The production mailer: nodemailer's SMTP transport, pointed at the local stand-in or a real relay by config. */
export class NodemailerMailer implements Mailer {
  private readonly transport: Transporter;

  constructor(private readonly settings: SmtpSettings) {
    this.transport = nodemailer.createTransport({
      host: settings.smtpHost,
      port: settings.smtpPort,
      secure: settings.smtpSecure,
      auth: settings.smtpUser ? { user: settings.smtpUser, pass: settings.smtpPassword } : undefined,
      connectionTimeout: 10_000,
      greetingTimeout: 10_000,
      socketTimeout: 30_000,
    });
  }

  async send(message: OutgoingMail): Promise<{ messageId: string }> {
    const info = await this.transport.sendMail({
      from: this.settings.mailFrom,
      to: message.to,
      subject: message.subject,
      text: message.text,
      html: message.html,
      messageId: message.messageId,
    });
    return { messageId: info.messageId || message.messageId };
  }

  close(): void {
    this.transport.close();
  }
}

export function createMailer(config: Config): Mailer {
  return new NodemailerMailer(config);
}

/** The domain part of the sender address, used to build Message-IDs that are ours. */
export function senderDomain(mailFrom: string): string {
  const address = /<([^>]+)>/.exec(mailFrom)?.[1] ?? mailFrom;
  return address.split('@')[1]?.trim() || 'loadline.invalid';
}

import { randomUUID } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { dirname } from 'node:path';
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';

/** One captured mail, as the read API lists it. */
export interface CapturedMail {
  id: string;
  messageId: string | null;
  from: string;
  to: string;
  subject: string;
  text: string;
  html: string;
  date: string;
}

export interface MailStandinOptions {
  host?: string;
  smtpPort: number;
  httpPort: number;
  /** Where captured mail is kept, so a restart of the stand-in keeps it. */
  storeFile: string;
  log?: (line: string) => void;
}

export interface MailStandin {
  smtpPort: number;
  httpPort: number;
  messages(): CapturedMail[];
  stop(): Promise<void>;
}

const addressText = (a: AddressObject | AddressObject[] | undefined): string =>
  (Array.isArray(a) ? a : a ? [a] : []).map((x) => x.value.map((v) => v.address ?? '').join(', ')).join(', ');

/**
 * A local mail service: accepts SMTP (no TLS, any or no sign-in), keeps what arrives in memory and in a JSON file,
 * and serves it over HTTP (GET /messages, DELETE /messages, GET /stats). A message whose Message-ID it already holds
 * is accepted and dropped, as many mailbox providers do, so a sender's retry after a lost acknowledgement shows once.
 */
export async function startMailStandin(options: MailStandinOptions): Promise<MailStandin> {
  const host = options.host ?? '127.0.0.1';
  const log = options.log ?? (() => undefined);
  let messages: CapturedMail[] = load(options.storeFile);
  let duplicatesDropped = 0;

  const save = () => {
    mkdirSync(dirname(options.storeFile), { recursive: true });
    const tmp = `${options.storeFile}.${process.pid}.tmp`;
    writeFileSync(tmp, JSON.stringify(messages));
    renameSync(tmp, options.storeFile);
  };

  const smtp = new SMTPServer({
    secure: false,
    authOptional: true,
    // Sign-in is offered without TLS on loopback, so a configured SMTP_USER works against the stand-in too.
    allowInsecureAuth: true,
    disabledCommands: ['STARTTLS'],
    banner: 'Loadline mail stand-in',
    size: 10 * 1024 * 1024,
    logger: false,
    onAuth(_auth, _session, callback) {
      callback(null, { user: 'local' });
    },
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          const messageId = parsed.messageId ?? null;
          if (messageId && messages.some((m) => m.messageId === messageId)) {
            duplicatesDropped++;
            log(`dropped a second copy of ${messageId}`);
            return callback();
          }
          const mail: CapturedMail = {
            id: randomUUID(),
            messageId,
            from: addressText(parsed.from),
            to: addressText(parsed.to),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : '',
            date: new Date().toISOString(),
          };
          messages.push(mail);
          save();
          log(`captured "${mail.subject}" for ${mail.to}`);
          callback();
        })
        .catch((e: Error) => callback(e));
    },
  });
  smtp.on('error', (e) => log(`smtp error: ${e.message}`));

  const http = createServer((req, res) => handle(req, res));
  function handle(req: IncomingMessage, res: ServerResponse) {
    const path = (req.url ?? '/').split('?')[0];
    const reply = (status: number, body: unknown) => {
      res.writeHead(status, { 'Content-Type': 'application/json' });
      res.end(JSON.stringify(body));
    };
    if (path === '/messages' && req.method === 'GET') return reply(200, messages);
    if (path === '/messages' && req.method === 'DELETE') {
      messages = [];
      duplicatesDropped = 0;
      save();
      return reply(200, { cleared: true });
    }
    if (path === '/stats' && req.method === 'GET') return reply(200, { count: messages.length, duplicatesDropped });
    return reply(404, { error: 'not found' });
  }

  await new Promise<void>((resolve, reject) => {
    smtp.server.once('error', reject);
    smtp.listen(options.smtpPort, host, () => resolve());
  });
  await new Promise<void>((resolve, reject) => {
    http.once('error', reject);
    http.listen(options.httpPort, host, () => resolve());
  });

  return {
    smtpPort: (smtp.server.address() as AddressInfo).port,
    httpPort: (http.address() as AddressInfo).port,
    messages: () => messages,
    async stop() {
      await new Promise<void>((resolve) => smtp.close(() => resolve()));
      await closeHttp(http);
    },
  };
}

function closeHttp(server: Server): Promise<void> {
  return new Promise((resolve) => {
    server.close(() => resolve());
    server.closeAllConnections();
  });
}

function load(file: string): CapturedMail[] {
  if (!existsSync(file)) return [];
  try {
    const data = JSON.parse(readFileSync(file, 'utf8')) as unknown;
    return Array.isArray(data) ? (data as CapturedMail[]) : [];
  } catch {
    // A half-written or hand-edited file is not worth refusing to start over.
    return [];
  }
}

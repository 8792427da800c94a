import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { startMailStandin } from './mail-standin';

// Ports come from the environment so several checkouts can run side by side.
const port = (key: string, fallback: number): number => {
  const raw = process.env[key];
  const n = raw ? Number(raw) : fallback;
  if (!Number.isInteger(n) || n < 1 || n > 65535) {
    console.error(`${key} must be a port number, got '${raw}'`);
    process.exit(2);
  }
  return n;
};

const runDir = resolve(process.env.LOADLINE_RUN_DIR ?? '.run');
const readyFile = join(runDir, 'standins', 'mail.ready');
const standin = await startMailStandin({
  smtpPort: port('MAIL_STANDIN_SMTP_PORT', 2525),
  httpPort: port('MAIL_STANDIN_HTTP_PORT', 2526),
  storeFile: join(runDir, 'standins', 'mail-store.json'),
  log: (line) => console.log(`mail stand-in: ${line}`),
});
console.log(`mail stand-in: SMTP on 127.0.0.1:${standin.smtpPort}, read API on http://127.0.0.1:${standin.httpPort}/messages`);
mkdirSync(join(runDir, 'standins'), { recursive: true });
writeFileSync(readyFile, String(process.pid));

let stopping = false;
async function stop() {
  if (stopping) return;
  stopping = true;
  rmSync(readyFile, { force: true });
  await standin.stop();
  process.exit(0);
}
process.on('SIGTERM', () => void stop());
process.on('SIGINT', () => void stop());

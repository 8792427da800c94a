import 'reflect-metadata';
import type { AddressInfo } from 'node:net';
import { createApp } from './app';
import { startReservationSweeper } from './checkout/reservations';
import { paymentProviderFor } from './payments/stripe-provider';
import { ConfigError, getConfig } from './config';
import { AppDataSource } from './db/data-source';
import { startMailWorker, type MailWorker } from './mail/mail-worker';

let config;
try {
  config = getConfig();
} catch (e) {
  if (e instanceof ConfigError) {
    console.error(e.message);
    process.exit(2);
  }
  throw e;
}

// The database may still be starting; try for a while before giving up.
for (let attempt = 1; ; attempt++) {
  try {
    await AppDataSource.initialize();
    break;
  } catch (e) {
    if (attempt >= 15) {
      console.error(`Cannot reach the database at ${config.databaseUrl.replace(/:[^:@/]+@/, ':***@')}: ${(e as Error).message}`);
      process.exit(1);
    }
    await new Promise((r) => setTimeout(r, 1000));
  }
}

// The mail worker polls the job queue in this process; extra app servers may leave it to one (MAIL_WORKER=false).
let mailWorker: MailWorker | undefined;
if (config.mailWorker) {
  const log = {
    info: (obj: object, msg: string) => console.log(msg, JSON.stringify(obj)),
    warn: (obj: object, msg: string) => console.warn(msg, JSON.stringify(obj)),
    error: (obj: object, msg: string) => console.error(msg, JSON.stringify(obj)),
  };
  mailWorker = await startMailWorker(config, { poll: true, log });
}

// Every app server sweeps expired reservations; SKIP LOCKED lets them share the work.
const stopSweeper = startReservationSweeper(config, paymentProviderFor(config), (msg, err) => (err ? console.error(msg, err) : console.log(msg)));

const app = createApp(config);
const server = app.listen(config.port, config.host, () => {
  // The port actually bound, so PORT=0 (any free port) can be found by whoever started the process.
  console.log(`Loadline is serving on http://${config.host}:${(server.address() as AddressInfo).port}`);
});

let stopping = false;
async function shutdown(signal: string) {
  if (stopping) return;
  stopping = true;
  console.log(`${signal} received, stopping…`);
  server.close();
  server.closeIdleConnections();
  setTimeout(() => server.closeAllConnections(), 3000).unref();
  stopSweeper();
  await mailWorker?.stop().catch(() => undefined);
  await AppDataSource.destroy().catch(() => undefined);
  process.exit(0);
}
process.on('SIGTERM', () => void shutdown('SIGTERM'));
process.on('SIGINT', () => void shutdown('SIGINT'));

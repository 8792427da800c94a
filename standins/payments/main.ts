import express from 'express';
import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { apiRoutes, dashboardRoutes } from './api';
import { deliverDue } from './events';
import { expireDue, pageRoutes } from './page';
import { Store } from './store';

/**
 * Local stand-in of the hosted payment service: the SDK calls the shop makes, a payment page per session, signed
 * webhooks retried until answered, and sessions that expire on time. Ports and paths come from the environment.
 */
const env = process.env;
const port = Number(env.STRIPE_API_PORT ?? 8470);
const host = '127.0.0.1';
const runDir = join(env.LOADLINE_RUN_DIR ?? '.run', 'standins');
const publicUrl = env.PAYMENTS_PUBLIC_URL ?? `http://${host}:${port}`;
const log = (msg: string) => console.log(`${new Date().toISOString()} payments: ${msg}`);

const store = new Store(join(runDir, `payments-state-${port}.json`));
// The account the shop's own key names gets the shop's webhook endpoint, as configured in the service's dashboard.
if (env.PAYMENTS_WEBHOOK_URL) {
  const account = env.STRIPE_SECRET_KEY || 'sk_test_loadline_local';
  store.state.endpoints.we_default = { id: 'we_default', account, url: env.PAYMENTS_WEBHOOK_URL, secret: env.STRIPE_WEBHOOK_SECRET || 'whsec_loadline_local_standin' };
}

const app = express();
app.disable('x-powered-by');
app.use('/v1', apiRoutes(store, publicUrl));
app.use('/pay', pageRoutes(store));
app.use('/dashboard', dashboardRoutes(store));
app.get('/health', (_req, res) => void res.json({ status: 'ok' }));

const retryBaseMs = Number(env.PAYMENTS_RETRY_BASE_MS ?? 500);
const tick = setInterval(() => {
  expireDue(store);
  deliverDue(store, { retryBaseMs, retryMaxMs: 60_000, log });
}, 100);

// Express 5 calls this back with the error when the port is taken; only a real listen writes the ready file.
const server = app.listen(port, host, (err?: Error) => {
  if (err) return;
  mkdirSync(runDir, { recursive: true });
  writeFileSync(join(runDir, 'payments.ready'), `${publicUrl}\n`);
  log(`listening on ${publicUrl}; webhook endpoint ${env.PAYMENTS_WEBHOOK_URL ?? '(none configured)'}`);
});
server.on('error', (e) => {
  console.error(`payments: cannot listen on ${host}:${port}: ${e.message}`);
  process.exit(1);
});

function stop(): void {
  clearInterval(tick);
  store.flush();
  rmSync(join(runDir, 'payments.ready'), { force: true });
  server.close(() => process.exit(0));
  server.closeAllConnections();
  setTimeout(() => process.exit(0), 2000).unref();
}
process.on('SIGTERM', stop);
process.on('SIGINT', stop);

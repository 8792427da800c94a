/**
 * Runs one server for a benchmark in its own process, so autocannon in the parent does not share its
 * event loop: `serve.ts app '{"calcRateLimitPerMinute":1e8}'` or `serve.ts baseline`. Prints "listening <port>".
 */
import express from 'express';
import type { AddressInfo } from 'node:net';

const [mode = 'app', overrides = '{}'] = process.argv.slice(2);

async function build(): Promise<express.Express> {
  if (mode === 'baseline') {
    const app = express();
    app.use(express.json());
    app.post('/baseline', (req, res) => {
      res.json({ ok: true, keys: Object.keys(req.body as object).length });
    });
    return app;
  }
  const { createApp } = await import('../server/app');
  const { parseConfig } = await import('../server/config');
  const { AppDataSource } = await import('../server/db/data-source');
  await AppDataSource.initialize();
  return createApp({ ...parseConfig(process.env), ...(JSON.parse(overrides) as object) });
}

const server = (await build()).listen(0, '127.0.0.1', () => {
  console.log(`listening ${(server.address() as AddressInfo).port}`);
});
process.on('SIGTERM', () => server.close(() => process.exit(0)));

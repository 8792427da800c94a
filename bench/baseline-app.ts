import express, { type Express } from 'express';

/** The yardstick: a bare Express route that parses the same JSON body and returns a constant answer. */
export function baselineApp(): Express {
  const app = express();
  app.use(express.json({ limit: '4mb' }));
  app.post('/baseline', (_req, res) => {
    res.json({ ok: true });
  });
  return app;
}

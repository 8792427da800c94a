import { Router } from 'express';
import type { Config } from '../config';
import { requireRole } from '../http/auth';
import { clearCapturedMail, listCapturedMail } from './dev-mailbox.service';

/** The development mailbox: what the local mail stand-in captured. Mounted only outside production. */
export function devMailRoutes(config: Config): Router {
  const r = Router();
  r.use(requireRole('admin'));

  r.get('/', async (_req, res) => {
    res.json(await listCapturedMail(config));
  });

  r.delete('/', async (_req, res) => {
    await clearCapturedMail(config);
    res.status(204).end();
  });

  return r;
}

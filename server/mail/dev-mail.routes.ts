import { Router } from 'express';
import type { Config } from '../config';
import { requireRole } from '../http/auth';
import { endpoint } from '../http/endpoint';
import { clearCapturedMail, listCapturedMail } from './dev-mailbox.service';

/** The development mailbox: what the local mail stand-in captured. Mounted only outside production. */
export function devMailRoutes(config: Config): Router {
  const r = Router();
  r.use(requireRole('admin'));

  r.get('/', endpoint({ summary: 'Mail the local mail stand-in captured, newest first (development only)' }, async (_input, _req, res) => {
    res.json(await listCapturedMail(config));
  }));

  r.delete('/', endpoint({ summary: 'Empty the development mailbox', reply: 'none' }, async (_input, _req, res) => {
    await clearCapturedMail(config);
    res.status(204).end();
  }));

  return r;
}

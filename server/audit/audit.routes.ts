import { Router } from 'express';
import { AuditListQueryDto } from '../../shared/catalogue';
import { requireRole } from '../http/auth';
import { endpoint } from '../http/endpoint';
import { listAudit } from './audit.service';

export function auditRoutes(): Router {
  const r = Router();
  r.use(requireRole('staff', 'admin'));
  r.get('/', endpoint({ summary: 'Changes to the catalogue and fitment table, newest first', query: AuditListQueryDto }, async ({ query }, _req, res) => {
    res.json(await listAudit(query));
  }));
  return r;
}

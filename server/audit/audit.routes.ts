import { Router } from 'express';
import { AuditListQueryDto } from '../../shared/catalogue';
import { requireRole } from '../http/auth';
import { parseQuery } from '../http/validate';
import { listAudit } from './audit.service';

export function auditRoutes(): Router {
  const r = Router();
  r.use(requireRole('staff', 'admin'));
  r.get('/', async (req, res) => {
    res.json(await listAudit(await parseQuery(AuditListQueryDto, req.query)));
  });
  return r;
}

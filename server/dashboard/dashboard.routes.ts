import { Router } from 'express';
import { DashboardQueryDto } from '../../shared/admin/dashboard.dto';
import { requireRole } from '../http/auth';
import { parseQuery } from '../http/validate';
import { dashboardFor } from './dashboard.service';

/** The staff dashboard's figures over a range of days. */
export function staffDashboardRoutes(): Router {
  const r = Router();
  r.use(requireRole('staff', 'admin'));
  r.get('/', async (req, res) => {
    res.json(await dashboardFor(await parseQuery(DashboardQueryDto, req.query)));
  });
  return r;
}

import { Router } from 'express';
import { DashboardQueryDto } from '../../shared/admin/dashboard.dto';
import { requireRole } from '../http/auth';
import { endpoint } from '../http/endpoint';
import { dashboardFor } from './dashboard.service';

/** The staff dashboard's figures over a range of days. */
export function staffDashboardRoutes(): Router {
  const r = Router();
  r.use(requireRole('staff', 'admin'));
  r.get('/', endpoint({ summary: 'Orders, revenue, best sellers and recommendation conversion over a range of days; open exchanges and low stock now', query: DashboardQueryDto }, async ({ query }, _req, res) => {
    res.json(await dashboardFor(query));
  }));
  return r;
}

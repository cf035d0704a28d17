import { Router } from 'express';
import { requires } from '../middlewares/authorize';
import { parseQuery } from '../lib/validate';
import { DashboardQuerySchema } from '../../shared/schemas/dashboard';
import { computeDashboard } from '../services/dashboard.service';
import type { AppDeps } from '../app-deps';

export function dashboardRoutes(deps: AppDeps): Router {
  const router = Router();
  router.get('/dashboard', requires.can('read', 'Dashboard'), async (req, res) => {
    res.json(await computeDashboard(deps, parseQuery(DashboardQuerySchema, req)));
  });
  return router;
}

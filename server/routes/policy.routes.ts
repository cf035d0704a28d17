import { Router } from 'express';
import { requires } from '../middlewares/authorize';
import { parseBody } from '../lib/validate';
import { PolicyUpdateSchema } from '../../shared/schemas/technique-register';
import { getPolicyView, updatePolicy } from '../services/policy.service';
import type { AppDeps } from '../app-deps';

export function policyRoutes({ sequelize }: AppDeps): Router {
  const router = Router();

  router.get('/policy', requires.can('read', 'Policy'), async (_req, res) => {
    res.json(await getPolicyView());
  });

  router.patch('/policy', requires.can('update', 'Policy'), async (req, res) => {
    const input = parseBody(PolicyUpdateSchema, req);
    res.json(await updatePolicy(sequelize, res.locals.user!.id, input));
  });

  return router;
}

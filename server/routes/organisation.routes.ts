// The organisation as screens need it: its name and the time zone dates are shown in.
import { Router } from 'express';
import { requires } from '../middlewares/authorize';
import { loadOrganisation } from '../services/organisation.service';
import type { AppDeps } from '../app-deps';

export function organisationRoutes(deps: AppDeps): Router {
  const router = Router();
  router.get('/organisation', requires.signedIn('every signed-in user sees dates in the organisation’s time zone'), async (_req, res) => {
    res.json(await loadOrganisation(deps));
  });
  return router;
}

import { Router } from 'express';
import { requires } from '../middlewares/authorize';
import { waitingOn } from '../services/home.service';
import type { AppDeps } from '../app-deps';

export function homeRoutes(deps: AppDeps): Router {
  const router = Router();
  router.get('/home', requires.signedIn('each person sees what waits on them'), async (_req, res) => {
    res.json(await waitingOn(deps, res.locals.user!, res.locals.ability!));
  });
  return router;
}

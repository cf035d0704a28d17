import { Router } from 'express';
import { requires } from '../middlewares/authorize';
import { parseBody, parseParams, parseQuery } from '../lib/validate';
import { IdParamSchema } from '../../shared/schemas/common';
import { ActionCreateSchema, ActionEventSchema, ActionListQuerySchema } from '../../shared/schemas/workflow';
import { assignAction, getAction, listActions } from '../services/actions.service';
import { applyRecordEvent } from '../services/record-events.service';
import type { AppDeps } from '../app-deps';

export function actionRoutes(deps: AppDeps): Router {
  const router = Router();

  router.get('/actions', requires.can('read', 'CorrectiveAction'), async (req, res) => {
    res.json(await listActions(deps, res.locals.ability!, parseQuery(ActionListQuerySchema, req)));
  });

  router.get('/actions/:id', requires.can('read', 'CorrectiveAction'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    res.json(await getAction(deps, res.locals.ability!, id));
  });

  router.post('/actions', requires.can('create', 'CorrectiveAction'), async (req, res) => {
    const input = parseBody(ActionCreateSchema, req);
    const id = await assignAction(deps, res.locals.user!, input);
    res.status(201).json(await getAction(deps, res.locals.ability!, id));
  });

  router.post('/actions/:id/events', requires.signedIn('the role rule is checked on the loaded action for the event sent'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    const input = parseBody(ActionEventSchema, req);
    await applyRecordEvent(deps, { actor: res.locals.user!, ability: res.locals.ability!, kind: 'action', id, input });
    res.json(await getAction(deps, res.locals.ability!, id));
  });

  return router;
}

import { Router } from 'express';
import { requires } from '../middlewares/authorize';
import { parseBody, parseParams, parseQuery } from '../lib/validate';
import { IdParamSchema } from '../../shared/schemas/common';
import {
  ChecklistQuerySchema,
  NewRevisionSchema,
  RevisionApproveSchema,
  RevisionParamsSchema,
  RevisionUpdateSchema,
  TechniqueCreateSchema,
  TechniqueListQuerySchema,
} from '../../shared/schemas/technique-register';
import {
  approveRevision,
  createTechnique,
  listTechniques,
  loadTechniqueView,
  startNewRevision,
  updateRevision,
} from '../services/technique.service';
import { evaluateAnyTechnique, techniqueChecklist } from '../services/technique-checklist.service';
import type { AppDeps } from '../app-deps';

export function techniqueRoutes(deps: AppDeps): Router {
  const router = Router();

  router.get('/techniques', requires.can('read', 'Technique'), async (req, res) => {
    res.json(await listTechniques(parseQuery(TechniqueListQuerySchema, req)));
  });

  router.get('/techniques/:id', requires.can('read', 'Technique'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    res.json(await loadTechniqueView(res.locals.ability!, id));
  });

  router.post('/techniques', requires.can('create', 'Technique'), async (req, res) => {
    const input = parseBody(TechniqueCreateSchema, req);
    res.status(201).json(await createTechnique(deps, res.locals.user!.id, res.locals.ability!, input));
  });

  router.patch('/techniques/:id/revisions/:rev', requires.can('update', 'Technique'), async (req, res) => {
    const params = parseParams(RevisionParamsSchema, req);
    const input = parseBody(RevisionUpdateSchema, req);
    res.json(await updateRevision(deps, res.locals.user!.id, res.locals.ability!, params, input));
  });

  router.post('/techniques/:id/revisions/:rev/approve', requires.can('approve', 'Technique'), async (req, res) => {
    const params = parseParams(RevisionParamsSchema, req);
    const input = parseBody(RevisionApproveSchema, req);
    res.json(await approveRevision(deps, res.locals.user!.id, res.locals.ability!, params, input));
  });

  router.post('/techniques/:id/revisions', requires.can('create', 'Technique'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    parseBody(NewRevisionSchema, req);
    res.status(201).json(await startNewRevision(deps, res.locals.user!.id, res.locals.ability!, id));
  });

  router.get('/techniques/:id/checklist', requires.can('read', 'Technique'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    const { revision } = parseQuery(ChecklistQuerySchema, req);
    res.json(await techniqueChecklist(deps, id, revision));
  });

  // Any technique JSON, for the editor's preview and for tools; nothing is stored.
  router.post('/checklist/evaluate', requires.can('read', 'Technique'), async (req, res) => {
    res.json(await evaluateAnyTechnique(deps, req.body));
  });

  return router;
}

import { Router } from 'express';
import { requires } from '../middlewares/authorize';
import { parseBody, parseParams, parseQuery } from '../lib/validate';
import { IdParamSchema } from '../../shared/schemas/common';
import {
  AuditCreateSchema,
  AuditEventSchema,
  AuditListQuerySchema,
  ChecklistRunCreateSchema,
  ChecklistRunNotesSchema,
  ChecklistRunParamsSchema,
  FindingCreateSchema,
} from '../../shared/schemas/workflow';
import { createAudit, getAudit, listAudits, runChecklist, updateChecklistNotes } from '../services/audits.service';
import { applyRecordEvent } from '../services/record-events.service';
import { getFinding, raiseFinding } from '../services/findings.service';
import type { AppDeps } from '../app-deps';

export function auditRoutes(deps: AppDeps): Router {
  const router = Router();

  router.get('/audits', requires.can('read', 'Audit'), async (req, res) => {
    res.json(await listAudits(res.locals.ability!, parseQuery(AuditListQuerySchema, req)));
  });

  router.get('/audits/:id', requires.can('read', 'Audit'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    res.json(await getAudit(res.locals.user!, res.locals.ability!, id));
  });

  router.post('/audits', requires.can('create', 'Audit'), async (req, res) => {
    const input = parseBody(AuditCreateSchema, req);
    const id = await createAudit(deps, res.locals.user!, res.locals.ability!, input);
    res.status(201).json(await getAudit(res.locals.user!, res.locals.ability!, id));
  });

  router.post('/audits/:id/events', requires.signedIn('the role rule is checked on the loaded audit for the event sent'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    const input = parseBody(AuditEventSchema, req);
    await applyRecordEvent(deps, { actor: res.locals.user!, ability: res.locals.ability!, kind: 'audit', id, input });
    res.json(await getAudit(res.locals.user!, res.locals.ability!, id));
  });

  router.post('/audits/:id/checklist-runs', requires.can('create', 'ChecklistRun'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    const input = parseBody(ChecklistRunCreateSchema, req);
    res.status(201).json(await runChecklist(deps, res.locals.user!, res.locals.ability!, id, input));
  });

  router.patch('/audits/:id/checklist-runs/:runId', requires.can('update', 'ChecklistRun'), async (req, res) => {
    const { id, runId } = parseParams(ChecklistRunParamsSchema, req);
    const { version, notes } = parseBody(ChecklistRunNotesSchema, req);
    res.json(await updateChecklistNotes(deps, res.locals.user!, res.locals.ability!, { auditId: id, runId, version, notes }));
  });

  router.post('/audits/:id/findings', requires.can('create', 'Finding'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    const input = parseBody(FindingCreateSchema, req);
    const findingId = await raiseFinding(deps, res.locals.user!, res.locals.ability!, id, input);
    res.status(201).json(await getFinding(deps, res.locals.ability!, findingId));
  });

  return router;
}

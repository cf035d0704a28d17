import { Router } from 'express';
import { z } from 'zod';
import { requires } from '../middlewares/authorize';
import { parseBody, parseParams, parseQuery } from '../lib/validate';
import { IdParamSchema } from '../../shared/schemas/common';
import { FindingCreateSchema, FindingEventSchema, FindingListQuerySchema } from '../../shared/schemas/workflow';
import { getFinding, listFindings, raiseFinding } from '../services/findings.service';
import { applyRecordEvent } from '../services/record-events.service';
import type { AppDeps } from '../app-deps';

const AuditIdSchema = z.object({ auditId: z.number({ error: 'auditId is required: findings are raised on an audit' }).int().positive() }).loose();

export function findingRoutes(deps: AppDeps): Router {
  const router = Router();

  router.get('/findings', requires.can('read', 'Finding'), async (req, res) => {
    res.json(await listFindings(deps, res.locals.ability!, parseQuery(FindingListQuerySchema, req)));
  });

  router.get('/findings/:id', requires.can('read', 'Finding'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    res.json(await getFinding(deps, res.locals.ability!, id));
  });

  // The same as POST /audits/:auditId/findings, with the audit in the body.
  router.post('/findings', requires.can('create', 'Finding'), async (req, res) => {
    const { auditId } = parseBody(AuditIdSchema, req);
    const { auditId: _auditId, ...rest } = req.body as Record<string, unknown>;
    const input = parseBody(FindingCreateSchema, { body: rest } as never);
    const id = await raiseFinding(deps, res.locals.user!, res.locals.ability!, auditId, input);
    res.status(201).json(await getFinding(deps, res.locals.ability!, id));
  });

  router.post('/findings/:id/events', requires.signedIn('the role rule is checked on the loaded finding for the event sent'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    const input = parseBody(FindingEventSchema, req);
    await applyRecordEvent(deps, { actor: res.locals.user!, ability: res.locals.ability!, kind: 'finding', id, input });
    res.json(await getFinding(deps, res.locals.ability!, id));
  });

  return router;
}

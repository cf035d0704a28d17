import { Router } from 'express';
import { z } from 'zod';
import { requires } from '../middlewares/authorize';
import { parseBody, parseParams, parseQuery } from '../lib/validate';
import { IdParamSchema } from '../../shared/schemas/common';
import { PodAcceptSchema, PodAnalyseSchema, PodDemonstrationFieldsSchema, PodDemonstrationUpdateSchema, PodListQuerySchema } from '../../shared/schemas/pod';
import {
  acceptDemonstration,
  analyseStoredDemonstration,
  createDemonstration,
  getDemonstration,
  listDemonstrations,
  updateDemonstration,
} from '../services/pod-demonstrations.service';
import { createCsvUpload } from '../middlewares/csv-upload';
import { POD_IMPORT_MAX_BYTES, POD_IMPORT_MAX_ROWS, previewPodImport } from '../services/pod-import.service';
import type { AppDeps } from '../app-deps';

/** The import preview takes a file and no other field. */
const NoFieldsSchema = z.object({}).strict();

export function podDemonstrationRoutes(deps: AppDeps): Router {
  const router = Router();
  const upload = createCsvUpload({ maxBytes: POD_IMPORT_MAX_BYTES, maxRowsHint: POD_IMPORT_MAX_ROWS });

  // Reads a CSV of the demonstration's calls and answers its specimens, inspections and noise with per-row errors; writes nothing.
  router.post('/pod-demonstrations/import/preview', requires.can('create', 'Demonstration'), upload, async (req, res) => {
    parseBody(NoFieldsSchema, req);
    res.json(await previewPodImport(req.file!.buffer));
  });

  router.get('/pod-demonstrations', requires.can('read', 'Demonstration'), async (req, res) => {
    res.json(await listDemonstrations(parseQuery(PodListQuerySchema, req)));
  });

  router.get('/pod-demonstrations/:id', requires.can('read', 'Demonstration'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    res.json(await getDemonstration(id));
  });

  router.post('/pod-demonstrations', requires.can('create', 'Demonstration'), async (req, res) => {
    const input = parseBody(PodDemonstrationFieldsSchema, req);
    res.status(201).json(await createDemonstration(deps, res.locals.user!.id, input));
  });

  router.patch('/pod-demonstrations/:id', requires.can('update', 'Demonstration'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    const input = parseBody(PodDemonstrationUpdateSchema, req);
    res.json(await updateDemonstration(deps, res.locals.user!.id, id, input));
  });

  router.post('/pod-demonstrations/:id/analysis', requires.can('update', 'Demonstration'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    const { version } = parseBody(PodAnalyseSchema, req);
    res.json(await analyseStoredDemonstration(deps, res.locals.user!.id, id, version));
  });

  router.post('/pod-demonstrations/:id/acceptance', requires.can('approve', 'Demonstration'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    const input = parseBody(PodAcceptSchema, req);
    const user = res.locals.user!;
    res.json(await acceptDemonstration(deps, res.locals.ability!, { id: user.id, displayName: user.displayName }, id, input));
  });

  return router;
}

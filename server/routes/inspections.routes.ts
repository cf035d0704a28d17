import { Router } from 'express';
import { z } from 'zod';
import { requires } from '../middlewares/authorize';
import { parseBody, parseParams, parseQuery } from '../lib/validate';
import { IdParamSchema } from '../../shared/schemas/common';
import {
  INSPECTION_IMPORT_MAX_BYTES,
  INSPECTION_IMPORT_MAX_ROWS,
  INSPECTION_RESULT_LABELS,
  InspectionFieldsSchema,
  InspectionListQuerySchema,
  InspectionUpdateSchema,
  type InspectionView,
} from '../../shared/schemas/inspection';
import { createInspection, getInspection, inspectionOptions, listInspections, updateInspection } from '../services/inspections.service';
import { importInspections, previewInspectionImport } from '../services/inspection-import.service';
import { createCsvUpload } from '../middlewares/csv-upload';
import { collectAllPages, sendCsv, type CsvColumn } from '../lib/csv';
import type { AppDeps } from '../app-deps';
import { safeFileName } from '../services/evidence-content';

export const INSPECTION_CSV_COLUMNS: CsvColumn<InspectionView>[] = [
  { header: 'Date', value: (i) => i.performedOn },
  { header: 'Technique code', value: (i) => i.technique.code },
  { header: 'Revision', value: (i) => i.revision.revision },
  { header: 'Part number', value: (i) => i.partNumber },
  { header: 'Serial number', value: (i) => i.serialNumber },
  { header: 'Work order', value: (i) => i.workOrder },
  { header: 'Customer', value: (i) => i.customer },
  { header: 'Inspector', value: (i) => i.inspector.name },
  { header: 'Result', value: (i) => INSPECTION_RESULT_LABELS[i.result] },
  { header: 'Instrument serial', value: (i) => i.instrument?.serialNumber },
  { header: 'Probe serial', value: (i) => i.probe?.serialNumber },
  { header: 'Reference standard serial', value: (i) => i.referenceStandard?.serialNumber },
  { header: 'Notes', value: (i) => i.notes },
];

/** The import routes take a file and no other field. */
const NoFieldsSchema = z.object({}).strict();

export function inspectionRoutes(deps: AppDeps): Router {
  const router = Router();
  const upload = createCsvUpload({ maxBytes: INSPECTION_IMPORT_MAX_BYTES, maxRowsHint: INSPECTION_IMPORT_MAX_ROWS });

  router.get('/inspections', requires.can('read', 'Inspection'), async (req, res) => {
    res.json(await listInspections(parseQuery(InspectionListQuerySchema, req)));
  });

  router.get('/inspections.csv', requires.can('read', 'Inspection'), async (req, res) => {
    const rows = await collectAllPages(listInspections, parseQuery(InspectionListQuerySchema, req));
    sendCsv(res, 'inspections', INSPECTION_CSV_COLUMNS, rows, deps.clock.now());
  });

  // Before '/inspections/:id', which would read "options" as an id.
  router.get('/inspections/options', requires.can('read', 'Inspection'), async (req, res) => {
    parseQuery(NoFieldsSchema, req);
    res.json(await inspectionOptions());
  });

  router.get('/inspections/:id', requires.can('read', 'Inspection'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    res.json(await getInspection(id));
  });

  router.post('/inspections', requires.can('create', 'Inspection'), async (req, res) => {
    const input = parseBody(InspectionFieldsSchema, req);
    res.status(201).json(await createInspection(deps, res.locals.ability!, res.locals.user!.id, input));
  });

  router.patch('/inspections/:id', requires.can('update', 'Inspection'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    const input = parseBody(InspectionUpdateSchema, req);
    res.json(await updateInspection(deps, res.locals.ability!, res.locals.user!.id, id, input));
  });

  router.post('/inspections/import/preview', requires.can('create', 'Inspection'), upload, async (req, res) => {
    parseBody(NoFieldsSchema, req);
    res.json(await previewInspectionImport(deps, res.locals.ability!, req.file!.buffer));
  });

  router.post('/inspections/import', requires.can('create', 'Inspection'), upload, async (req, res) => {
    parseBody(NoFieldsSchema, req);
    // The file's name goes on each row's trail entry: bounded and cleaned like an evidence file's name.
    const fileName = safeFileName(req.file!.originalname || 'upload.csv');
    res.status(201).json(await importInspections(deps, { actorId: res.locals.user!.id, ability: res.locals.ability! }, req.file!.buffer, fileName));
  });

  return router;
}

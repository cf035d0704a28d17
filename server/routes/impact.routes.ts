// Extent of condition and impact on past inspections, from a finding, and the
// impact view from an item of equipment.
import { Router } from 'express';
import { requires } from '../middlewares/authorize';
import { parseBody, parseParams, parseQuery } from '../lib/validate';
import { sendCsv, type CsvColumn } from '../lib/csv';
import { IdParamSchema } from '../../shared/schemas/common';
import { RaiseExtentFindingsSchema } from '../../shared/schemas/extent';
import {
  CONTAINMENT_DECISION_LABELS,
  ContainmentDecisionsSchema,
  EquipmentImpactQuerySchema,
  ImpactScopeSchema,
  type ImpactRow,
} from '../../shared/schemas/impact';
import { INSPECTION_RESULT_LABELS } from '../../shared/schemas/inspection';
import { getFindingFamily, runExtent } from '../services/extent.service';
import { raiseExtentFindings } from '../services/extent-findings.service';
import { getFindingImpact, recordContainmentDecisions, setImpactScope } from '../services/finding-impact.service';
import { getEquipmentImpact } from '../services/equipment-impact.service';
import { Finding } from '../models';
import type { AppDeps } from '../app-deps';

const equipmentCell = (item: ImpactRow['inspection']['instrument']) => (item ? `${item.serialNumber} (${item.description})` : null);

const INSPECTION_COLUMNS: CsvColumn<ImpactRow>[] = [
  { header: 'Date', value: (r) => r.inspection.performedOn },
  { header: 'Customer', value: (r) => r.inspection.customer },
  { header: 'Part number', value: (r) => r.inspection.partNumber },
  { header: 'Serial number', value: (r) => r.inspection.serialNumber },
  { header: 'Work order', value: (r) => r.inspection.workOrder },
  { header: 'Technique', value: (r) => r.inspection.technique.code },
  { header: 'Revision', value: (r) => r.inspection.revision.revision },
  { header: 'Inspector', value: (r) => r.inspection.inspector.name },
  { header: 'Result', value: (r) => INSPECTION_RESULT_LABELS[r.inspection.result] },
  { header: 'Instrument', value: (r) => equipmentCell(r.inspection.instrument) },
  { header: 'Probe', value: (r) => equipmentCell(r.inspection.probe) },
  { header: 'Reference standard', value: (r) => equipmentCell(r.inspection.referenceStandard) },
];

export const WORKSHEET_COLUMNS: CsvColumn<ImpactRow>[] = [
  ...INSPECTION_COLUMNS,
  { header: 'Decision', value: (r) => (r.decision ? CONTAINMENT_DECISION_LABELS[r.decision.decision] : 'undecided') },
  { header: 'Reason', value: (r) => r.decision?.reason },
  { header: 'Decided by', value: (r) => r.decision?.decidedBy.name },
  { header: 'Decided at (UTC)', value: (r) => r.decision?.decidedAt },
];

export function impactRoutes(deps: AppDeps): Router {
  const router = Router();

  router.get('/findings/:id/extent', requires.can('read', 'Finding'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    res.json(await getFindingFamily(id));
  });

  router.post('/findings/:id/extent-runs', requires.can('assess_extent', 'Finding'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    res.status(201).json(await runExtent(deps, res.locals.user!, res.locals.ability!, id));
  });

  router.post('/findings/:id/extent-findings', requires.can('assess_extent', 'Finding'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    const input = parseBody(RaiseExtentFindingsSchema, req);
    const created = await raiseExtentFindings(deps, res.locals.user!, res.locals.ability!, id, input);
    res.status(201).json({ created });
  });

  router.get('/findings/:id/impact', requires.can('read', 'Finding'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    res.json(await getFindingImpact(deps, id));
  });

  router.get('/findings/:id/impact.csv', requires.can('read', 'Finding'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    const impact = await getFindingImpact(deps, id);
    const finding = await Finding.findByPk(id, { attributes: ['number'] });
    sendCsv(res, `${finding!.number}-impact-worksheet`, WORKSHEET_COLUMNS, impact.rows, deps.clock.now());
  });

  router.patch('/findings/:id/impact-scope', requires.can('decide_impact', 'Finding'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    const input = parseBody(ImpactScopeSchema, req);
    await setImpactScope(deps, res.locals.user!, res.locals.ability!, id, input);
    res.json(await getFindingImpact(deps, id));
  });

  router.post('/findings/:id/containment-decisions', requires.can('decide_impact', 'Finding'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    const input = parseBody(ContainmentDecisionsSchema, req);
    await recordContainmentDecisions(deps, res.locals.user!, res.locals.ability!, id, input);
    res.json(await getFindingImpact(deps, id));
  });

  router.get('/equipment/:id/impact', requires.can('read', 'Equipment'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    const { since } = parseQuery(EquipmentImpactQuerySchema, req);
    res.json(await getEquipmentImpact(deps, id, since));
  });

  router.get('/equipment/:id/impact.csv', requires.can('read', 'Equipment'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    const { since } = parseQuery(EquipmentImpactQuerySchema, req);
    const impact = await getEquipmentImpact(deps, id, since);
    sendCsv(res, `${impact.equipment.serialNumber}-inspections`, INSPECTION_COLUMNS, impact.rows, deps.clock.now());
  });

  return router;
}

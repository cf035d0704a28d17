import { Router } from 'express';
import { z } from 'zod';
import { requires } from '../middlewares/authorize';
import { parseBody, parseParams, parseQuery } from '../lib/validate';
import { IdParamSchema } from '../../shared/schemas/common';
import {
  EQUIPMENT_KIND_LABELS,
  EquipmentCreateSchema,
  EquipmentListQuerySchema,
  EquipmentUpdateSchema,
  TechniqueLinksSchema,
  type EquipmentView,
} from '../../shared/schemas/equipment';
import { CALIBRATION_STATUS_LABELS, EQUIPMENT_USE_STATUS_LABELS } from '../../shared/registers/flags';
import { createEquipment, getEquipment, listEquipment, updateEquipment } from '../services/equipment.service';
import { getTechniqueLinks, setTechniqueLinks } from '../services/technique-links.service';
import { collectAllPages, sendCsv, type CsvColumn } from '../lib/csv';
import { forbidden } from '../lib/app-error';
import type { AppDeps } from '../app-deps';

const describeNotch = (n: EquipmentView['notches'][number]) =>
  `${n.label ? `${n.label}: ` : ''}${n.orientation}${n.angleDeg !== null ? ` ${n.angleDeg}°` : ''} ${n.depthMm} mm deep × ${n.lengthMm} mm${
    n.edgeDistanceMm !== null ? `, ${n.edgeDistanceMm} mm from edge` : ''
  }`;

export const EQUIPMENT_CSV_COLUMNS: CsvColumn<EquipmentView>[] = [
  { header: 'Kind', value: (e) => EQUIPMENT_KIND_LABELS[e.kind] },
  { header: 'Description', value: (e) => e.description },
  { header: 'Model', value: (e) => e.model },
  { header: 'Serial number', value: (e) => e.serialNumber },
  { header: 'Status', value: (e) => EQUIPMENT_USE_STATUS_LABELS[e.useStatus] },
  { header: 'Calibrated', value: (e) => e.calibratedOn },
  { header: 'Calibration due', value: (e) => e.calibrationDueOn },
  { header: 'Calibration status', value: (e) => CALIBRATION_STATUS_LABELS[e.calibration.status] },
  { header: 'Conductivity (%IACS)', value: (e) => e.conductivityIacs },
  { header: 'Material', value: (e) => e.material },
  { header: 'Notches', value: (e) => e.notches.map(describeNotch).join('; ') },
];

const TechniqueIdParamSchema = z.object({ techniqueId: z.coerce.number().int().positive() }).strict();

export function equipmentRoutes(deps: AppDeps): Router {
  const router = Router();

  router.get('/equipment', requires.can('read', 'Equipment'), async (req, res) => {
    res.json(await listEquipment(deps, parseQuery(EquipmentListQuerySchema, req)));
  });

  router.get('/equipment.csv', requires.can('read', 'Equipment'), async (req, res) => {
    const query = parseQuery(EquipmentListQuerySchema, req);
    const rows = await collectAllPages((q) => listEquipment(deps, q), query);
    sendCsv(res, 'equipment', EQUIPMENT_CSV_COLUMNS, rows, deps.clock.now());
  });

  router.get('/equipment/:id', requires.can('read', 'Equipment'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    res.json(await getEquipment(deps, id));
  });

  router.post('/equipment', requires.can('create', 'Equipment'), async (req, res) => {
    const input = parseBody(EquipmentCreateSchema, req);
    res.status(201).json(await createEquipment(deps, res.locals.user!.id, input));
  });

  router.patch('/equipment/:id', requires.can('update', 'Equipment'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    const input = parseBody(EquipmentUpdateSchema, req);
    res.json(await updateEquipment(deps, res.locals.user!.id, id, input));
  });

  // The equipment and people a technique uses (read by the checklist's register rules).
  router.get('/techniques/:techniqueId/register-links', requires.can('read', 'Technique'), async (req, res) => {
    const { techniqueId } = parseParams(TechniqueIdParamSchema, req);
    res.json(await getTechniqueLinks(deps, techniqueId));
  });

  router.put(
    '/techniques/:techniqueId/register-links',
    requires.signedIn('Level 3s (who write techniques) and quality managers (who keep the registers) set the links; checked below'),
    async (req, res) => {
      const { ability } = res.locals;
      if (!ability!.can('create', 'Technique') && !ability!.can('update', 'Equipment')) {
        throw forbidden('Only a Level 3 or a quality manager may set the equipment and people of a technique');
      }
      const { techniqueId } = parseParams(TechniqueIdParamSchema, req);
      const input = parseBody(TechniqueLinksSchema, req);
      res.json(await setTechniqueLinks(deps, res.locals.user!.id, techniqueId, input));
    },
  );

  return router;
}

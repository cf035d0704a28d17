import { Equipment, Inspection, Technique, TechniqueRevision, User } from '../models';
import type { InspectionEquipmentRef, InspectionView } from '../../shared/schemas/inspection';

const EQUIPMENT_ATTRIBUTES = ['id', 'kind', 'serialNumber', 'description'];

/** What every inspection view needs joined in: technique, revision, inspector and the three items of equipment. */
export const inspectionIncludes = [
  { model: Technique, as: 'technique', attributes: ['id', 'code'] },
  { model: TechniqueRevision, as: 'techniqueRevision', attributes: ['id', 'revision'] },
  { model: User, as: 'inspector', attributes: ['id', 'displayName'] },
  { model: Equipment, as: 'instrument', attributes: EQUIPMENT_ATTRIBUTES },
  { model: Equipment, as: 'probe', attributes: EQUIPMENT_ATTRIBUTES },
  { model: Equipment, as: 'referenceStandard', attributes: EQUIPMENT_ATTRIBUTES },
];

const equipmentRef = (item: Equipment | null | undefined): InspectionEquipmentRef | null =>
  item ? { id: item.id, kind: item.kind, serialNumber: item.serialNumber, description: item.description } : null;

/** Needs the row loaded with `inspectionIncludes`. */
export function presentInspection(row: Inspection): InspectionView {
  return {
    id: row.id,
    technique: { id: row.techniqueId, code: row.technique?.code ?? '' },
    revision: { id: row.techniqueRevisionId, revision: row.techniqueRevision?.revision ?? '' },
    performedOn: row.performedOn,
    partNumber: row.partNumber,
    serialNumber: row.serialNumber,
    workOrder: row.workOrder,
    customer: row.customer,
    inspector: { id: row.inspectorId, name: row.inspector?.displayName ?? '' },
    result: row.result,
    instrument: equipmentRef(row.instrument),
    probe: equipmentRef(row.probe),
    referenceStandard: equipmentRef(row.referenceStandard),
    notes: row.notes,
    createdById: row.createdById,
    version: row.version,
    createdAt: row.createdAt.toISOString(),
  };
}

// The same impact view from the equipment side: an instrument, probe or
// reference standard found out of calibration puts in doubt every inspection
// made with it since its last good calibration (or since a date chosen).
import { Op, type WhereOptions } from 'sequelize';
import type { AppDeps } from '../app-deps';
import type { EquipmentImpactView } from '../../shared/schemas/impact';
import { Equipment, Inspection } from '../models';
import { AppError, notFound } from '../lib/app-error';
import { inspectionIncludes, presentInspection } from '../presenters/inspection.presenter';
import { groupByCustomerAndPart, IMPACT_ORDER } from './finding-impact.service';

export async function getEquipmentImpact(deps: AppDeps, equipmentId: number, since?: string): Promise<EquipmentImpactView> {
  if (since && since > deps.clock.now().toISOString().slice(0, 10)) {
    throw new AppError('Some query parameters are not valid', { status: 400, code: 'invalid_input', details: [{ path: 'since', message: 'the date cannot be in the future' }] });
  }
  const item = await Equipment.findByPk(equipmentId);
  if (!item) throw notFound('Equipment');
  const from = since ?? item.calibratedOn ?? null;
  const basis = since
    ? `from the date chosen (${since})`
    : item.calibratedOn
      ? `since its last calibration on ${item.calibratedOn}`
      : 'no calibration is on record: every inspection made with it';
  const usedIt: WhereOptions = { [Op.or]: [{ instrumentId: equipmentId }, { probeId: equipmentId }, { referenceStandardId: equipmentId }] };
  const inspections = await Inspection.findAll({
    where: from ? { [Op.and]: [usedIt, { performedOn: { [Op.gte]: from } }] } : usedIt,
    include: inspectionIncludes,
    order: IMPACT_ORDER as never,
  });
  const rows = inspections.map((inspection) => ({ inspection: presentInspection(inspection), decision: null }));
  return {
    equipment: {
      id: item.id,
      kind: item.kind,
      serialNumber: item.serialNumber,
      description: item.description,
      calibratedOn: item.calibratedOn,
      calibrationDueOn: item.calibrationDueOn,
      status: item.status,
    },
    from,
    basis,
    groups: groupByCustomerAndPart(rows, false),
    rows,
    total: rows.length,
  };
}

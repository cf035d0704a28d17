// Equipment register: instruments, probes and reference standards (with their
// notches), calibration dates and status. Every change is a trail entry.
import { Op, type WhereOptions } from 'sequelize';
import type { Transaction } from 'sequelize';
import type { AppDeps } from '../app-deps';
import { Equipment, ReferenceNotch } from '../models';
import { appendTrail } from './trail.service';
import { presentEquipment } from '../presenters/equipment.presenter';
import { AppError, notFound, staleVersion } from '../lib/app-error';
import { parseSort, type ListResponse } from '../../shared/schemas/common';
import type { EquipmentCreateInput, EquipmentListQuery, EquipmentUpdateInput, EquipmentView, NotchInput } from '../../shared/schemas/equipment';
import { CALIBRATION_WARNING_DAYS } from '../../shared/registers/flags';
import { isoDay } from '../../shared/domain/checklist/registers';

const SORTABLE = ['description', 'kind', 'serialNumber', 'calibratedOn', 'calibrationDueOn', 'status'] as const;
const notchInclude = { model: ReferenceNotch, as: 'notches' };

const addDays = (day: string, days: number) => isoDay(new Date(Date.parse(`${day}T00:00:00Z`) + days * 86_400_000));

export async function listEquipment(deps: AppDeps, query: EquipmentListQuery): Promise<ListResponse<EquipmentView>> {
  const now = deps.clock.now();
  const today = isoDay(now);
  const and: WhereOptions[] = [];
  if (query.q) {
    const like = `%${query.q}%`;
    and.push({ [Op.or]: [{ description: { [Op.like]: like } }, { serialNumber: { [Op.like]: like } }, { model: { [Op.like]: like } }] });
  }
  if (query.kind) and.push({ kind: query.kind });
  if (query.status) and.push({ status: query.status });
  if (query.calibration === 'overdue') and.push({ calibrationDueOn: { [Op.lt]: today } });
  if (query.calibration === 'due-soon') and.push({ calibrationDueOn: { [Op.between]: [today, addDays(today, CALIBRATION_WARNING_DAYS)] } });
  if (query.calibration === 'none') and.push({ calibrationDueOn: null });
  const sort = parseSort(query.sort, SORTABLE, 'description');
  // Count and page on equipment alone; notches come in a second query so the page size is exact.
  const { rows, count } = await Equipment.findAndCountAll({
    where: { [Op.and]: and },
    order: [[sort.field, sort.direction], ['id', 'ASC']],
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
  });
  const notches = rows.length ? await ReferenceNotch.findAll({ where: { equipmentId: rows.map((row) => row.id) } }) : [];
  for (const row of rows) row.notches = notches.filter((notch) => notch.equipmentId === row.id);
  return { items: rows.map((row) => presentEquipment(row, now)), total: count };
}

export async function getEquipment(deps: AppDeps, id: number): Promise<EquipmentView> {
  const item = await Equipment.findByPk(id, { include: [notchInclude] });
  if (!item) throw notFound('Equipment');
  return presentEquipment(item, deps.clock.now());
}

async function writeNotches(equipmentId: number, notches: NotchInput[], transaction: Transaction) {
  await ReferenceNotch.destroy({ where: { equipmentId }, transaction });
  await ReferenceNotch.bulkCreate(
    notches.map((notch, position) => ({ ...notch, equipmentId, position })),
    { transaction },
  );
}

export async function createEquipment(deps: AppDeps, actorId: number, input: EquipmentCreateInput): Promise<EquipmentView> {
  const id = await deps.sequelize.transaction(async (transaction) => {
    const { notches, ...fields } = input;
    const created = await Equipment.create(fields, { transaction });
    await writeNotches(created.id, notches, transaction);
    await appendTrail(deps.sequelize, transaction, {
      userId: actorId,
      recordType: 'equipment',
      recordId: created.id,
      event: 'EQUIPMENT_CREATED',
      changes: { ...input },
    });
    return created.id;
  });
  return getEquipment(deps, id);
}

export async function updateEquipment(deps: AppDeps, actorId: number, id: number, input: EquipmentUpdateInput): Promise<EquipmentView> {
  await deps.sequelize.transaction(async (transaction) => {
    const item = await Equipment.findByPk(id, { include: [notchInclude], transaction, lock: transaction.LOCK.UPDATE });
    if (!item) throw notFound('Equipment');
    if (item.version !== input.version) throw staleVersion();
    const { notches, version: _version, ...fields } = input;
    const changes: Record<string, { before: unknown; after: unknown }> = {};
    for (const [key, after] of Object.entries(fields) as [keyof typeof fields, unknown][]) {
      if (after === undefined) continue;
      const raw = item.get(key);
      const before = key === 'conductivityIacs' && raw !== null ? Number(raw) : raw;
      if (before === after) continue;
      changes[key] = { before, after };
      item.set(key, after as never);
    }
    if (item.calibratedOn && item.calibrationDueOn && item.calibrationDueOn <= item.calibratedOn) {
      throw new AppError('Some body fields are not valid', {
        status: 400,
        code: 'invalid_input',
        details: [{ path: 'calibrationDueOn', message: 'the due date must be after the calibration date' }],
      });
    }
    if (notches) {
      if (item.kind !== 'reference-standard' && notches.length > 0) {
        throw new AppError('Some body fields are not valid', {
          status: 400,
          code: 'invalid_input',
          details: [{ path: 'notches', message: 'only a reference standard has notches' }],
        });
      }
      const before = (item.notches ?? []).length;
      await writeNotches(id, notches, transaction);
      changes.notches = { before: `${before} notches`, after: notches };
      item.changed('updatedAt', true);
    }
    if (Object.keys(changes).length === 0) return;
    await item.save({ transaction });
    await appendTrail(deps.sequelize, transaction, {
      userId: actorId,
      recordType: 'equipment',
      recordId: id,
      event: changes.status ? `EQUIPMENT_${String(input.status).toUpperCase()}` : 'EQUIPMENT_UPDATED',
      changes,
    });
  });
  return getEquipment(deps, id);
}

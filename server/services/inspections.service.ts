// The register of inspections performed with each technique revision: list,
// read, record and correct. Every write runs in a transaction with its trail entry.
import { Op, type Transaction, type WhereOptions } from 'sequelize';
import { ForbiddenError, subject } from '@casl/ability';
import type { AppDeps } from '../app-deps';
import type { AppAbility } from '../../shared/abilities';
import { ContainmentDecision, Equipment, Finding, Inspection, Technique, TechniqueRevision, User } from '../models';
import { appendTrail } from './trail.service';
import { inspectionIncludes, presentInspection } from '../presenters/inspection.presenter';
import { AppError, notFound, staleVersion } from '../lib/app-error';
import { parseSort, type ListResponse } from '../../shared/schemas/common';
import { isoDay } from '../../shared/domain/checklist/registers';
import type {
  InspectionInput,
  InspectionListQuery,
  InspectionOptionsView,
  InspectionUpdateInput,
  InspectionView,
} from '../../shared/schemas/inspection';
import { inspectionRuleErrors, loadInspectionFacts, type FieldError, type InspectionFacts } from './inspection-rules';

const SORTABLE = ['performedOn', 'partNumber', 'serialNumber', 'workOrder', 'customer', 'result', 'createdAt'] as const;

export const invalidInspection = (details: FieldError[]) =>
  new AppError('Some body fields are not valid', { status: 400, code: 'invalid_input', details });

function listWhere(query: InspectionListQuery): WhereOptions {
  const and: WhereOptions[] = [];
  if (query.techniqueId) and.push({ techniqueId: query.techniqueId });
  if (query.revisionId) and.push({ techniqueRevisionId: query.revisionId });
  if (query.equipmentId) {
    const id = query.equipmentId;
    and.push({ [Op.or]: [{ instrumentId: id }, { probeId: id }, { referenceStandardId: id }] });
  }
  if (query.result) and.push({ result: query.result });
  if (query.from) and.push({ performedOn: { [Op.gte]: query.from } });
  if (query.to) and.push({ performedOn: { [Op.lte]: query.to } });
  if (query.q) {
    const like = `%${query.q}%`;
    and.push({
      [Op.or]: [{ partNumber: { [Op.like]: like } }, { serialNumber: { [Op.like]: like } }, { workOrder: { [Op.like]: like } }, { customer: { [Op.like]: like } }],
    });
  }
  return { [Op.and]: and };
}

export async function listInspections(query: InspectionListQuery): Promise<ListResponse<InspectionView>> {
  const where = listWhere(query);
  const sort = parseSort(query.sort, SORTABLE, '-performedOn');
  // Counted on the table alone: every include is a belongs-to, so it cannot change the count.
  const [total, rows] = await Promise.all([
    Inspection.count({ where }),
    Inspection.findAll({
      where,
      include: inspectionIncludes,
      order: [[sort.field, sort.direction], ['id', sort.direction]],
      limit: query.pageSize,
      offset: (query.page - 1) * query.pageSize,
    }),
  ]);
  return { items: rows.map(presentInspection), total };
}

export async function getInspection(id: number, transaction?: Transaction): Promise<InspectionView> {
  const row = await Inspection.findByPk(id, { include: inspectionIncludes, transaction });
  if (!row) throw notFound('Inspection');
  return presentInspection(row);
}

/** Loads the facts for one record and refuses it (400 with field details) when any check fails. */
export async function assertInspectionValid(
  deps: AppDeps,
  input: InspectionInput,
  transaction: Transaction,
  { recordedInspectorId }: { recordedInspectorId?: number } = {},
): Promise<InspectionFacts> {
  const facts = await loadInspectionFacts([input], transaction);
  // A correction may keep the inspector it was recorded with, even one who has since left.
  if (recordedInspectorId !== undefined && input.inspectorId === recordedInspectorId) facts.activeUsers.add(recordedInspectorId);
  const errors = inspectionRuleErrors(input, facts, deps.clock.now());
  if (errors.length) throw invalidInspection(errors);
  return facts;
}

/** Whoever records an inspection names themself as its inspector, unless a quality role records it for someone else. */
function assertMayName(ability: AppAbility, inspectorId: number) {
  ForbiddenError.from(ability)
    .setMessage('Record the inspections you performed yourself: only a quality manager records one for another inspector')
    .throwUnlessCan('create', subject('Inspection', { inspectorId }));
}

export async function createInspection(deps: AppDeps, ability: AppAbility, actorId: number, input: InspectionInput): Promise<InspectionView> {
  assertMayName(ability, input.inspectorId);
  return deps.sequelize.transaction(async (transaction) => {
    const facts = await assertInspectionValid(deps, input, transaction);
    const techniqueId = facts.revisions.get(input.techniqueRevisionId)!.techniqueId;
    const created = await Inspection.create({ ...input, techniqueId, createdById: actorId }, { transaction });
    await appendTrail(deps.sequelize, transaction, {
      userId: actorId,
      recordType: 'inspection',
      recordId: created.id,
      event: 'INSPECTION_RECORDED',
      changes: { ...input, techniqueId },
      at: deps.clock.now(),
    });
    return getInspection(created.id, transaction);
  });
}

export async function updateInspection(deps: AppDeps, ability: AppAbility, actorId: number, id: number, input: InspectionUpdateInput): Promise<InspectionView> {
  return deps.sequelize.transaction(async (transaction) => {
    const row = await Inspection.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
    if (!row) throw notFound('Inspection');
    // A result a finding's containment decision rests on changes through that finding's impact worksheet only.
    const decision = await ContainmentDecision.findOne({ where: { inspectionId: id }, attributes: ['findingId'], transaction });
    if (decision) {
      const finding = await Finding.findByPk(decision.findingId, { attributes: ['number'], transaction });
      throw new AppError(
        `This inspection has a containment decision on finding ${finding?.number ?? decision.findingId}; correct it through that finding’s impact worksheet, where the decision is reviewed with it`,
        { status: 409, code: 'decided_in_worksheet' },
      );
    }
    // A technician corrects only the rows they recorded (shared/abilities.ts).
    ForbiddenError.from(ability).throwUnlessCan('update', subject('Inspection', { ...row.get({ plain: true }), hasContainmentDecision: false }));
    if (input.inspectorId !== row.inspectorId) assertMayName(ability, input.inspectorId);
    if (row.version !== input.version) throw staleVersion();
    const { version: _version, ...fields } = input;
    const facts = await assertInspectionValid(deps, fields, transaction, { recordedInspectorId: row.inspectorId });
    const next = { ...fields, techniqueId: facts.revisions.get(fields.techniqueRevisionId)!.techniqueId };
    const changes: Record<string, { before: unknown; after: unknown }> = {};
    for (const [key, after] of Object.entries(next) as [keyof typeof next, unknown][]) {
      const before = row.get(key);
      if (before === after) continue;
      changes[key] = { before, after };
      row.set(key, after as never);
    }
    if (Object.keys(changes).length === 0) return getInspection(id, transaction);
    await row.save({ transaction });
    await appendTrail(deps.sequelize, transaction, {
      userId: actorId,
      recordType: 'inspection',
      recordId: id,
      event: 'INSPECTION_CORRECTED',
      changes,
      at: deps.clock.now(),
    });
    return getInspection(id, transaction);
  });
}

/** Revisions that were approved (drafts never), active people, and the equipment register, for the form and the filters. */
export async function inspectionOptions(): Promise<InspectionOptionsView> {
  const [revisions, users, equipment] = await Promise.all([
    TechniqueRevision.findAll({
      attributes: ['id', 'techniqueId', 'revision', 'state', 'approvedAt', 'seq'],
      where: { approvedAt: { [Op.ne]: null } },
      include: [{ model: Technique, as: 'technique', attributes: ['id', 'code', 'title'] }],
      order: [[{ model: Technique, as: 'technique' }, 'code', 'ASC'], ['seq', 'DESC']],
    }),
    User.findAll({ attributes: ['id', 'displayName', 'email'], where: { active: true }, order: [['displayName', 'ASC']] }),
    Equipment.findAll({ attributes: ['id', 'kind', 'serialNumber', 'description', 'status', 'calibrationDueOn'], order: [['kind', 'ASC'], ['description', 'ASC']] }),
  ]);
  return {
    revisions: revisions.map((r) => ({
      id: r.id,
      techniqueId: r.techniqueId,
      techniqueCode: r.technique?.code ?? '',
      techniqueTitle: r.technique?.title ?? '',
      revision: r.revision,
      state: r.state,
      approvedOn: isoDay(r.approvedAt!),
    })),
    inspectors: users.map((u) => ({ id: u.id, name: u.displayName, email: u.email })),
    equipment: equipment.map((e) => ({
      id: e.id,
      kind: e.kind,
      serialNumber: e.serialNumber,
      description: e.description,
      status: e.status,
      calibrationDueOn: e.calibrationDueOn,
    })),
  };
}

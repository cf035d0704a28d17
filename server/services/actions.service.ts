// Corrective actions: assign (create), list, read.
import { Op, col, fn, where, type WhereOptions } from 'sequelize';
import type { z } from 'zod';
import {
  CORRECTIVE_ACTION_MACHINE_VERSION,
  correctiveActionMachine,
  createInitialSnapshot,
  persistSnapshot,
} from '../../machines';
import type { AppDeps } from '../app-deps';
import type { AppAbility } from '../../shared/abilities';
import { CorrectiveAction, Finding, RoleAssignment, Signature, User } from '../models';
import { AppError, forbidden, notAllowedNow, notFound } from '../lib/app-error';
import { parseSort, type ListResponse } from '../../shared/schemas/common';
import type { ActionCreateInput, ActionDetailView, ActionListQuerySchema, ActionView } from '../../shared/schemas/workflow';
import { appendTrail } from './trail.service';
import { allocateRecordNumber } from './record-numbers.service';
import { allowedEventsForUser, factsForMany } from './workflow/record-kinds';
import { retryOnDeadlock } from './workflow/retry';
import { runEffectsAfterCommit, runEffectsInTransaction, type EffectBatch } from './effects';
import { presentAction, presentActionDetail } from '../presenters/action.presenter';
import { todayIso } from '../presenters/workflow-refs';
import { stateFilter } from './audits.service';
import { stateLabel } from '../../shared/labels';
import type { EventActor } from './record-events.service';

const SORTABLE = ['number', 'dueDate', 'state', 'createdAt'] as const;
/** People who carry out corrective actions. */
const OWNER_ROLES = ['level3', 'technician'];

export const actionIncludes = [
  { model: User, as: 'owner', attributes: ['id', 'displayName'] },
  { model: Finding, as: 'finding', attributes: ['id', 'number', 'title', 'state', 'class', 'dueDate', 'authorId', 'areaId'] },
];

const invalid = (path: string, message: string) =>
  new AppError('Some body fields are not valid', { status: 400, code: 'invalid_input', details: [{ path, message }] });

export async function assignAction(deps: AppDeps, actor: EventActor, input: ActionCreateInput): Promise<number> {
  const now = deps.clock.now();
  if (input.dueDate < todayIso(now)) throw invalid('dueDate', 'the due date is in the past');
  const owner = await User.findByPk(input.ownerId, { include: [{ model: RoleAssignment, as: 'roleAssignments', attributes: ['role'] }] });
  if (!owner || !owner.active || !owner.roles.some((role) => OWNER_ROLES.includes(role))) {
    throw invalid('ownerId', 'the owner must be an active Level 3 or technician');
  }
  const batches: EffectBatch[] = [];
  const id = await retryOnDeadlock(() =>
    deps.sequelize.transaction(async (transaction) => {
      batches.length = 0;
      const finding = await Finding.findByPk(input.findingId, { transaction, lock: transaction.LOCK.UPDATE });
      if (!finding) throw invalid('findingId', 'no such finding');
      if (finding.authorId === input.ownerId) throw forbidden('The finding’s author cannot own its corrective action');
      if (finding.state !== 'action_open') {
        throw notAllowedNow(`A corrective action is assigned when the finding is waiting for one; ${finding.number} is ${stateLabel(finding.state).toLowerCase()}`);
      }
      const existing = await CorrectiveAction.findOne({ where: { findingId: finding.id }, attributes: ['id', 'number'], transaction });
      if (existing) throw notAllowedNow(`${finding.number} already has corrective action ${existing.number}`);
      const number = await allocateRecordNumber(deps.sequelize, transaction, 'CA', now);
      const initial = createInitialSnapshot(correctiveActionMachine, { dueDate: input.dueDate });
      const action = await CorrectiveAction.create(
        {
          number,
          findingId: finding.id,
          ownerId: input.ownerId,
          dueDate: input.dueDate,
          pendingExtension: null,
          method: null,
          rootCause: null,
          plan: [],
          submissionSummary: null,
          returnReason: null,
          reopenReason: null,
          verifiedAt: null,
          createdById: actor.id,
          state: 'assigned',
          snapshot: persistSnapshot(correctiveActionMachine, initial.snapshot),
          machineVersion: CORRECTIVE_ACTION_MACHINE_VERSION,
          // From the app's clock, like every other date of the record (tests and demo data move it).
          createdAt: now,
        },
        { transaction },
      );
      const changes = { number, findingId: finding.id, ownerId: input.ownerId, owner: owner.displayName, dueDate: input.dueDate, state: 'assigned' };
      await appendTrail(deps.sequelize, transaction, { userId: actor.id, recordType: 'action', recordId: action.id, event: 'ACTION_ASSIGNED', changes, at: now });
      await appendTrail(deps.sequelize, transaction, {
        userId: actor.id,
        recordType: 'finding',
        recordId: finding.id,
        event: 'ACTION_ASSIGNED',
        changes: { actionId: action.id, actionNumber: number, owner: owner.displayName, dueDate: input.dueDate },
        at: now,
      });
      batches.push({
        effects: initial.effects,
        context: {
          deps,
          actorId: actor.id,
          recordType: 'action',
          recordId: action.id,
          event: 'ASSIGN',
          state: 'assigned',
          context: initial.snapshot.context as unknown as Record<string, unknown>,
        },
      });
      await runEffectsInTransaction(transaction, batches);
      return action.id;
    }),
  );
  await runEffectsAfterCommit(batches);
  return id;
}

function overdueClause(today: string): WhereOptions {
  return { state: { [Op.ne]: 'verified' }, dueDate: { [Op.lt]: today } };
}

/** The dashboard's definitions (dashboard.service.ts): verified on or before the due day, after it, overdue, open and not yet due. */
function timelinessClause(kind: 'on_time' | 'late' | 'overdue' | 'not_yet_due', today: string): WhereOptions {
  const verifiedDay = fn('DATE', col('CorrectiveAction.verified_at'));
  const dueDay = col('CorrectiveAction.due_date');
  switch (kind) {
    case 'on_time':
      return { [Op.and]: [{ state: 'verified' }, where(verifiedDay, Op.lte, dueDay)] };
    case 'late':
      return { [Op.and]: [{ state: 'verified' }, where(verifiedDay, Op.gt, dueDay)] };
    case 'overdue':
      return overdueClause(today);
    case 'not_yet_due':
      return { state: { [Op.ne]: 'verified' }, dueDate: { [Op.gte]: today } };
  }
}

export async function listActions(
  deps: AppDeps,
  ability: AppAbility,
  query: z.infer<typeof ActionListQuerySchema>,
): Promise<ListResponse<ActionView>> {
  const now = deps.clock.now();
  const and: WhereOptions[] = [];
  const state = stateFilter(query.state);
  if (state) and.push({ state });
  if (query.owner) and.push({ ownerId: query.owner });
  if (query.areaId) and.push({ '$finding.area_id$': query.areaId });
  if (query.overdue === 'true') and.push(overdueClause(todayIso(now)));
  if (query.overdue === 'false') and.push({ [Op.not]: overdueClause(todayIso(now)) });
  if (query.dueFrom) and.push({ dueDate: { [Op.gte]: query.dueFrom } });
  if (query.dueTo) and.push({ dueDate: { [Op.lte]: query.dueTo } });
  if (query.timeliness) and.push(timelinessClause(query.timeliness, todayIso(now)));
  if (query.q) {
    const like = `%${query.q}%`;
    and.push({
      [Op.or]: [
        { number: { [Op.like]: like } },
        { rootCause: { [Op.like]: like } },
        { '$finding.number$': { [Op.like]: like } },
        { '$finding.title$': { [Op.like]: like } },
      ],
    });
  }
  const sort = parseSort(query.sort, SORTABLE, 'dueDate');
  const { rows, count } = await CorrectiveAction.findAndCountAll({
    where: and.length ? { [Op.and]: and } : {},
    include: actionIncludes,
    order: [[sort.field, sort.direction], ['id', 'DESC']],
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
    subQuery: false,
  });
  const facts = await factsForMany('action', rows.map((row) => row.id));
  return {
    items: rows.map((action) => {
      const fact = (facts.get(action.id) ?? { evidenceCount: 0 }) as { evidenceCount: number };
      return presentAction(action, {
        now,
        evidenceCount: fact.evidenceCount,
        allowedEvents: allowedEventsForUser('action', action, { findingAuthorId: action.finding?.authorId ?? null }, fact, ability),
      });
    }),
    total: count,
  };
}

export async function getAction(deps: AppDeps, ability: AppAbility, id: number): Promise<ActionDetailView> {
  const action = await CorrectiveAction.findByPk(id, { include: actionIncludes });
  if (!action) throw notFound('Corrective action');
  const [facts, signatures] = await Promise.all([
    factsForMany('action', [id]),
    Signature.findAll({ where: { recordType: 'action', recordId: id }, order: [['signedAt', 'ASC']] }),
  ]);
  const fact = (facts.get(id) ?? { evidenceCount: 0 }) as { evidenceCount: number };
  return presentActionDetail(action, {
    now: deps.clock.now(),
    signatures,
    evidenceCount: fact.evidenceCount,
    allowedEvents: allowedEventsForUser('action', action, { findingAuthorId: action.finding?.authorId ?? null }, fact, ability),
  });
}

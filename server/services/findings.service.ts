// Findings: raise (from a failed checklist result or by hand), list, read.
import { subject } from '@casl/ability';
import { Op, literal, type WhereOptions } from 'sequelize';
import type { z } from 'zod';
import { FINDING_MACHINE_VERSION, createInitialSnapshot, findingMachine, persistSnapshot } from '../../machines';
import type { AppDeps } from '../app-deps';
import type { AppAbility } from '../../shared/abilities';
import { Area, Audit, ChecklistRun, CorrectiveAction, Finding, Signature, User } from '../models';
import { AppError, forbidden, notAllowedNow, notFound } from '../lib/app-error';
import { parseSort, type ListResponse } from '../../shared/schemas/common';
import type { FindingCreateInput, FindingDetailView, FindingListQuerySchema, FindingView } from '../../shared/schemas/workflow';
import type { RuleResult } from '../../shared/domain/checklist';
import { appendTrail } from './trail.service';
import { allocateRecordNumber } from './record-numbers.service';
import { refuseDuplicateFinding } from './duplicate-findings';
import { allowedEventsForUser, findingFacts } from './workflow/record-kinds';
import { retryOnDeadlock } from './workflow/retry';
import { presentFinding, presentFindingDetail } from '../presenters/finding.presenter';
import { todayIso } from '../presenters/workflow-refs';
import { stateFilter } from './audits.service';
import { basisInWords, formatResultValues, ruleLabel } from '../../shared/labels';
import type { EventActor } from './record-events.service';

const SORTABLE = ['number', 'dueDate', 'state', 'class', 'createdAt', 'title'] as const;

export const findingIncludes = [
  { model: User, as: 'author', attributes: ['id', 'displayName'] },
  { model: Area, as: 'area', attributes: ['id', 'name'] },
  { model: Audit, as: 'audit', attributes: ['id', 'title', 'leadAuditorId'] },
  { model: CorrectiveAction, as: 'action', attributes: ['id', 'number', 'state', 'ownerId', 'dueDate'], include: [{ model: User, as: 'owner', attributes: ['id', 'displayName'] }] },
];

const RAISING_STATES = ['fieldwork', 'reporting'];

/** What a new finding has not got yet: class, containment, due dates and the notes of later steps. */
export const NEW_FINDING_FIELDS = {
  class: null,
  classificationNote: null,
  containment: null,
  containmentDueDate: null,
  dueDate: null,
  effectivenessNote: null,
  notEffectiveReason: null,
  closureNote: null,
  withdrawReason: null,
  closedAt: null,
} as const;

const describeValues = (values: RuleResult['values']): string => formatResultValues(values);

/** What a failed checklist result says, as the finding's prefilled fields. */
function prefillFromResult(result: RuleResult, techniqueCode: string, techniqueRevision: string) {
  const about = [result.flaw ? `flaw ${result.flaw}` : null, result.coil !== undefined ? `coil ${result.coil + 1}` : null].filter(Boolean).join(', ');
  return {
    title: `${techniqueCode}: ${ruleLabel(result.rule)}${about ? ` (${about})` : ''}`,
    rule: `checklist rule ${result.rule}`,
    requirement: `The technique must pass the checklist rule “${ruleLabel(result.rule)}”. Basis: ${basisInWords(result.basis)}`,
    objectiveEvidence: `Checklist run on ${techniqueCode} rev ${techniqueRevision}: ${result.message}${
      Object.keys(result.values).length ? ` Values: ${describeValues(result.values)}.` : ''
    }`,
  };
}

export function mayAssignAction(ability: AppAbility, finding: Finding): boolean {
  return finding.state === 'action_open' && !finding.action && ability.can('create', 'CorrectiveAction');
}

export async function raiseFinding(
  deps: AppDeps,
  actor: EventActor,
  ability: AppAbility,
  auditId: number,
  input: FindingCreateInput,
): Promise<number> {
  const now = deps.clock.now();
  return retryOnDeadlock(() =>
    deps.sequelize.transaction(async (transaction) => {
      // Raises on one audit take turns, so the duplicate check below sees every finding committed before it.
      const audit = await Audit.findByPk(auditId, { transaction, lock: transaction.LOCK.UPDATE });
      if (!audit) throw notFound('Audit');
      if (!ability.can('create', subject('Finding', { auditLeadAuditorId: audit.leadAuditorId, areaId: audit.areaId })) || audit.leadAuditorId !== actor.id) {
        throw forbidden('Only the audit’s lead auditor raises findings on it');
      }
      if (!RAISING_STATES.includes(audit.state)) throw notAllowedNow(`Findings are raised during fieldwork or reporting; this audit is ${audit.state}`);

      let prefill: { title: string; rule: string; requirement: string; objectiveEvidence: string } | null = null;
      let run: ChecklistRun | null = null;
      let resultValues: RuleResult['values'] | null = null;
      if (input.checklistRunId !== undefined) {
        run = await ChecklistRun.findOne({ where: { id: input.checklistRunId, auditId }, transaction });
        if (!run) throw new AppError('Some body fields are not valid', { status: 400, code: 'invalid_input', details: [{ path: 'checklistRunId', message: 'no such checklist run on this audit' }] });
        const result = run.output.results[input.resultIndex!];
        if (!result) throw new AppError('Some body fields are not valid', { status: 400, code: 'invalid_input', details: [{ path: 'resultIndex', message: `the run has ${run.output.results.length} results` }] });
        if (result.status !== 'fail' && result.status !== 'warn') throw notAllowedNow(`That result is "${result.status}": a finding is raised from a failed (or warned) result`);
        await refuseDuplicateFinding(
          { auditId, techniqueId: run.techniqueId, techniqueCode: run.techniqueCode, techniqueRevision: run.techniqueRevision, result },
          transaction,
        );
        prefill = prefillFromResult(result, run.techniqueCode, run.techniqueRevision);
        resultValues = result.values;
      }
      const number = await allocateRecordNumber(deps.sequelize, transaction, 'F', now);
      const { snapshot } = createInitialSnapshot(findingMachine);
      const techniqueCode = run?.techniqueCode ?? input.techniqueCode ?? null;
      if (techniqueCode && !audit.scope.some((item) => item.code === techniqueCode)) {
        throw new AppError('Some body fields are not valid', { status: 400, code: 'invalid_input', details: [{ path: 'techniqueCode', message: 'not in the audit’s scope' }] });
      }
      const finding = await Finding.create(
        {
          number,
          auditId,
          techniqueId: run?.techniqueId ?? audit.scope.find((item) => item.code === techniqueCode)?.techniqueId ?? null,
          techniqueCode,
          checklistRunId: run?.id ?? null,
          resultIndex: run ? input.resultIndex! : null,
          title: input.title ?? prefill!.title,
          rule: input.rule ?? prefill!.rule,
          requirement: input.requirement ?? prefill!.requirement,
          objectiveEvidence: input.objectiveEvidence ?? prefill!.objectiveEvidence,
          resultValues,
          ...NEW_FINDING_FIELDS,
          authorId: actor.id,
          areaId: audit.areaId,
          state: 'raised',
          snapshot: persistSnapshot(findingMachine, snapshot),
          machineVersion: FINDING_MACHINE_VERSION,
          // From the app's clock, like every other date of the record (tests and demo data move it).
          createdAt: now,
        },
        { transaction },
      );
      await appendTrail(deps.sequelize, transaction, {
        userId: actor.id,
        recordType: 'finding',
        recordId: finding.id,
        event: 'FINDING_RAISED',
        changes: {
          number,
          auditId,
          techniqueCode,
          checklistRunId: run?.id ?? null,
          resultIndex: run ? input.resultIndex! : null,
          title: finding.title,
          rule: finding.rule,
          state: 'raised',
        },
        at: now,
      });
      return finding.id;
    }),
  );
}

function overdueClause(today: string): WhereOptions {
  return {
    [Op.or]: [
      { state: 'containment', containmentDueDate: { [Op.lt]: today } },
      { state: { [Op.in]: ['containment', 'action_open'] }, dueDate: { [Op.lt]: today } },
    ],
  };
}

export async function listFindings(
  deps: AppDeps,
  ability: AppAbility,
  query: z.infer<typeof FindingListQuerySchema>,
): Promise<ListResponse<FindingView>> {
  const now = deps.clock.now();
  const and: WhereOptions[] = [];
  const state = stateFilter(query.state);
  if (state) and.push({ state });
  if (query.class) and.push({ class: query.class === 'unclassified' ? null : query.class });
  if (query.areaId) and.push({ areaId: query.areaId });
  if (query.raisedFrom) and.push({ createdAt: { [Op.gte]: new Date(`${query.raisedFrom}T00:00:00Z`) } });
  if (query.raisedTo) and.push({ createdAt: { [Op.lt]: new Date(Date.parse(`${query.raisedTo}T00:00:00Z`) + 86_400_000) } });
  if (query.auditId) and.push({ auditId: query.auditId });
  if (query.owner) and.push({ '$action.owner_id$': query.owner });
  if (query.overdue === 'true') and.push(overdueClause(todayIso(now)));
  if (query.overdue === 'false') and.push({ [Op.not]: overdueClause(todayIso(now)) });
  if (query.q) {
    const like = `%${query.q}%`;
    and.push({
      [Op.or]: [{ number: { [Op.like]: like } }, { title: { [Op.like]: like } }, { requirement: { [Op.like]: like } }, { rule: { [Op.like]: like } }],
    });
  }
  const sort = parseSort(query.sort, SORTABLE, '-number');
  // Findings without a due date sort last either way.
  const order = sort.field === 'dueDate'
    ? [[literal('`Finding`.`due_date` IS NULL'), 'ASC'], ['dueDate', sort.direction], ['id', 'DESC']]
    : [[sort.field, sort.direction], ['id', 'DESC']];
  const where = and.length ? { [Op.and]: and } : {};
  // The count joins only what a filter refers to (the owner lives on the action):
  // joining every include made counting a large list cost more than reading its page.
  const [rows, count] = await Promise.all([
    Finding.findAll({
      where,
      include: findingIncludes,
      order: order as never,
      limit: query.pageSize,
      offset: (query.page - 1) * query.pageSize,
      subQuery: false,
    }),
    Finding.count({ where, include: query.owner ? [{ model: CorrectiveAction, as: 'action', attributes: [] }] : [] }),
  ]);
  const facts = await findingFacts(rows, now);
  return {
    items: rows.map((finding) =>
      presentFinding(finding, {
        now,
        canAssignAction: mayAssignAction(ability, finding),
        allowedEvents: allowedEventsForUser('finding', finding, { actionOwnerId: finding.action?.ownerId ?? null }, facts.get(finding.id)!, ability),
      }),
    ),
    total: count,
  };
}

export async function getFinding(deps: AppDeps, ability: AppAbility, id: number): Promise<FindingDetailView> {
  const finding = await Finding.findByPk(id, { include: findingIncludes });
  if (!finding) throw notFound('Finding');
  const now = deps.clock.now();
  const [signatures, facts] = await Promise.all([
    Signature.findAll({ where: { recordType: 'finding', recordId: id }, order: [['signedAt', 'ASC']] }),
    findingFacts([finding], now),
  ]);
  return presentFindingDetail(finding, {
    now,
    signatures,
    canAssignAction: mayAssignAction(ability, finding),
    allowedEvents: allowedEventsForUser('finding', finding, { actionOwnerId: finding.action?.ownerId ?? null }, facts.get(id)!, ability),
    undecidedInspectionCount: facts.get(id)!.undecidedInspectionCount,
  });
}

// Audits: plan (create), list, read, and the checklist runs of their scope.
import { subject } from '@casl/ability';
import { Op, type Transaction, type WhereOptions } from 'sequelize';
import type { z } from 'zod';
import { AUDIT_MACHINE_VERSION, auditMachine, createInitialSnapshot, persistSnapshot } from '../../machines';
import type { AppDeps } from '../app-deps';
import type { AppAbility } from '../../shared/abilities';
import { Area, Audit, ChecklistRun, Finding, RoleAssignment, Signature, User } from '../models';
import { AppError, forbidden, notAllowedNow, notFound, staleVersion } from '../lib/app-error';
import { parseSort, type ListResponse } from '../../shared/schemas/common';
import type {
  AuditCreateInput,
  AuditDetailView,
  AuditListQuerySchema,
  AuditView,
  ChecklistRunCreateSchema,
  ChecklistRunView,
} from '../../shared/schemas/workflow';
import { CHECKLIST_ENGINE_VERSION, evaluateParsedTechnique, parseTechnique, type ChecklistOutput } from '../../shared/domain/checklist';
import { techniqueChecklist } from './technique-checklist.service';
import { QueryTypes } from 'sequelize';
import { appendTrail } from './trail.service';
import { resolveScope } from './technique-source';
import { loadOrganisationPolicy } from './workflow-policy';
import { allowedEventsForUser, openFindingCounts } from './workflow/record-kinds';
import { presentAudit, presentAuditDetail, presentChecklistRun } from '../presenters/audit.presenter';
import type { EventActor } from './record-events.service';

const SORTABLE = ['title', 'plannedStart', 'state', 'createdAt'] as const;
const auditIncludes = [
  { model: Area, as: 'area', attributes: ['id', 'name'] },
  { model: User, as: 'leadAuditor', attributes: ['id', 'displayName'] },
];

const invalid = (path: string, message: string) =>
  new AppError('Some body fields are not valid', { status: 400, code: 'invalid_input', details: [{ path, message }] });

/** A comma-separated list of states ("planned,fieldwork") as a where clause. */
export function stateFilter(state: string | undefined) {
  if (!state) return undefined;
  const states = state.split(',').map((value) => value.trim()).filter(Boolean);
  return states.length === 1 ? states[0] : { [Op.in]: states };
}

export async function createAudit(deps: AppDeps, actor: EventActor, ability: AppAbility, input: AuditCreateInput): Promise<number> {
  if (!ability.can('create', subject('Audit', { leadAuditorId: input.leadAuditorId, areaId: input.areaId }))) {
    throw forbidden('You may plan audits you lead yourself, and never of an area you belong to');
  }
  const [area, lead] = await Promise.all([
    Area.findByPk(input.areaId),
    User.findByPk(input.leadAuditorId, { include: [{ model: RoleAssignment, as: 'roleAssignments', attributes: ['role'] }] }),
  ]);
  if (!area) throw invalid('areaId', 'no such area');
  if (!lead || !lead.active || !lead.roles.includes('auditor')) throw invalid('leadAuditorId', 'the lead auditor must be an active auditor');
  if (lead.areaId === input.areaId) throw forbidden(`${lead.displayName} belongs to ${area.name} and cannot lead an audit of it`);
  const scope = await resolveScope(deps.sequelize, input.techniques);
  const { snapshot } = createInitialSnapshot(auditMachine);
  return deps.sequelize.transaction(async (transaction) => {
    const audit = await Audit.create(
      {
        title: input.title,
        criteria: input.criteria,
        areaId: input.areaId,
        leadAuditorId: input.leadAuditorId,
        plannedStart: input.plannedStart,
        plannedEnd: input.plannedEnd,
        scope,
        cancelReason: null,
        issuedAt: null,
        closedAt: null,
        createdById: actor.id,
        state: 'planned',
        snapshot: persistSnapshot(auditMachine, snapshot),
        machineVersion: AUDIT_MACHINE_VERSION,
        // From the app's clock, like every other date of the record (tests and demo data move it).
        createdAt: deps.clock.now(),
      },
      { transaction },
    );
    await appendTrail(deps.sequelize, transaction, {
      userId: actor.id,
      recordType: 'audit',
      recordId: audit.id,
      event: 'AUDIT_PLANNED',
      changes: {
        title: input.title,
        areaId: input.areaId,
        leadAuditorId: input.leadAuditorId,
        plannedStart: input.plannedStart,
        plannedEnd: input.plannedEnd,
        scope: scope.map((item) => `${item.code} rev ${item.revision}`),
        state: 'planned',
      },
      at: deps.clock.now(),
    });
    return audit.id;
  });
}

export async function listAudits(ability: AppAbility, query: z.infer<typeof AuditListQuerySchema>): Promise<ListResponse<AuditView>> {
  const and: WhereOptions[] = [];
  const state = stateFilter(query.state);
  if (state) and.push({ state });
  if (query.areaId) and.push({ areaId: query.areaId });
  if (query.owner) and.push({ leadAuditorId: query.owner });
  if (query.q) and.push({ title: { [Op.like]: `%${query.q}%` } });
  const sort = parseSort(query.sort, SORTABLE, '-plannedStart');
  const { rows, count } = await Audit.findAndCountAll({
    where: and.length ? { [Op.and]: and } : {},
    include: auditIncludes,
    order: [[sort.field, sort.direction], ['id', 'DESC']],
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
  });
  const counts = await openFindingCounts(rows.map((row) => row.id));
  return {
    items: rows.map((audit) => {
      const openFindingCount = counts.get(audit.id) ?? 0;
      return presentAudit(audit, { openFindingCount, allowedEvents: allowedEventsForUser('audit', audit, {}, { openFindingCount }, ability) });
    }),
    total: count,
  };
}

function maySendChecklist(ability: AppAbility, audit: Audit) {
  // The role rule, with the state the rule expects: a wrong state is a 422, not a 403.
  return ability.can('create', subject('ChecklistRun', { leadAuditorId: audit.leadAuditorId, state: 'fieldwork', areaId: audit.areaId }));
}

/** The run of the same technique just before this one in the same audit, to show what changed. */
async function previousRunOf(run: ChecklistRun): Promise<ChecklistRun | null> {
  return ChecklistRun.findOne({
    where: { auditId: run.auditId, techniqueCode: run.techniqueCode, [Op.or]: [{ runAt: { [Op.lt]: run.runAt } }, { runAt: run.runAt, id: { [Op.lt]: run.id } }] },
    order: [['runAt', 'DESC'], ['id', 'DESC']],
  });
}

async function presentStoredRun(runId: number): Promise<ChecklistRunView> {
  const run = await ChecklistRun.findByPk(runId, { include: [{ model: User, as: 'runBy', attributes: ['id', 'displayName'] }] });
  return presentChecklistRun(run!, await previousRunOf(run!));
}

export async function getAudit(actor: EventActor, ability: AppAbility, id: number): Promise<AuditDetailView> {
  const audit = await Audit.findByPk(id, { include: auditIncludes });
  if (!audit) throw notFound('Audit');
  const [runs, findings, signatures] = await Promise.all([
    ChecklistRun.findAll({ where: { auditId: id }, include: [{ model: User, as: 'runBy', attributes: ['id', 'displayName'] }], order: [['runAt', 'DESC'], ['id', 'DESC']] }),
    Finding.findAll({ where: { auditId: id }, order: [['number', 'ASC']] }),
    Signature.findAll({ where: { recordType: 'audit', recordId: id }, order: [['signedAt', 'ASC']] }),
  ]);
  const openFindingCount = findings.filter((finding) => !['closed', 'withdrawn'].includes(finding.state)).length;
  return presentAuditDetail(audit, {
    allowedEvents: allowedEventsForUser('audit', audit, {}, { openFindingCount }, ability),
    openFindingCount,
    runs,
    findings,
    signatures,
    canRunChecklist: audit.state === 'fieldwork' && maySendChecklist(ability, audit),
    canRaiseFinding: ['fieldwork', 'reporting'].includes(audit.state) && audit.leadAuditorId === actor.id && ability.can('create', 'Finding'),
  });
}

async function revisionContent(deps: AppDeps, revisionId: number, transaction: Transaction): Promise<unknown> {
  const [row] = await deps.sequelize.query<{ content: unknown }>('SELECT content FROM technique_revisions WHERE id = ?', {
    replacements: [revisionId],
    type: QueryTypes.SELECT,
    transaction,
  });
  if (!row) return null;
  return typeof row.content === 'string' ? JSON.parse(row.content) : row.content;
}

export async function runChecklist(
  deps: AppDeps,
  actor: EventActor,
  ability: AppAbility,
  auditId: number,
  input: z.infer<typeof ChecklistRunCreateSchema>,
): Promise<ChecklistRunView> {
  const now = deps.clock.now();
  const runId = await deps.sequelize.transaction(async (transaction) => {
    const audit = await Audit.findByPk(auditId, { transaction, lock: transaction.LOCK.SHARE });
    if (!audit) throw notFound('Audit');
    if (!maySendChecklist(ability, audit)) throw forbidden('Only the audit’s lead auditor runs its checklist');
    if (audit.state !== 'fieldwork') throw notAllowedNow(`The checklist runs during fieldwork; this audit is ${audit.state}`);
    const item = audit.scope.find((entry) => (input.techniqueId ? entry.techniqueId === input.techniqueId : entry.code === input.techniqueCode));
    if (!item) throw invalid(input.techniqueId ? 'techniqueId' : 'techniqueCode', 'this technique is not in the audit’s scope');
    let definition = item.definition;
    let output: ChecklistOutput | null = null;
    if (item.techniqueId) {
      // A register technique: its current revision, with the personnel and equipment register facts, as the register shows it.
      const checklist = await techniqueChecklist(deps, item.techniqueId).catch(() => null);
      const content = checklist ? await revisionContent(deps, checklist.revision.id, transaction) : null;
      const parsed = content ? parseTechnique(content) : null;
      if (checklist && parsed?.success) {
        definition = parsed.data;
        output = checklist.output;
      }
    }
    if (!definition) throw notAllowedNow(`${item.code} has no complete technique definition the checklist can evaluate`);
    if (!output) output = evaluateParsedTechnique(definition, { policy: await loadOrganisationPolicy(deps.sequelize), now });
    const notes = Object.fromEntries(Object.entries(input.notes ?? {}).filter(([index]) => Number(index) < output.results.length));
    const run = await ChecklistRun.create(
      {
        auditId,
        techniqueId: item.techniqueId,
        techniqueCode: definition.code,
        techniqueRevision: definition.revision,
        technique: definition,
        output,
        verdict: output.verdict,
        engineVersion: CHECKLIST_ENGINE_VERSION,
        notes,
        runById: actor.id,
        runAt: now,
      },
      { transaction },
    );
    await appendTrail(deps.sequelize, transaction, {
      userId: actor.id,
      recordType: 'audit',
      recordId: auditId,
      event: 'CHECKLIST_RUN',
      changes: { checklistRunId: run.id, technique: `${definition.code} rev ${definition.revision}`, verdict: output.verdict, summary: output.summary, engineVersion: CHECKLIST_ENGINE_VERSION },
      at: now,
    });
    return run.id;
  });
  return presentStoredRun(runId);
}

export async function updateChecklistNotes(
  deps: AppDeps,
  actor: EventActor,
  ability: AppAbility,
  { auditId, runId, version, notes }: { auditId: number; runId: number; version: number; notes: Record<string, string> },
): Promise<ChecklistRunView> {
  await deps.sequelize.transaction(async (transaction) => {
    const run = await ChecklistRun.findOne({ where: { id: runId, auditId }, transaction, lock: transaction.LOCK.UPDATE });
    if (!run) throw notFound('Checklist run');
    const audit = (await Audit.findByPk(auditId, { transaction }))!;
    if (!ability.can('update', subject('ChecklistRun', { leadAuditorId: audit.leadAuditorId, auditState: 'fieldwork', areaId: audit.areaId }))) {
      throw forbidden('Only the audit’s lead auditor writes notes on its checklist');
    }
    if (audit.state !== 'fieldwork') throw notAllowedNow(`Checklist notes can change during fieldwork only; this audit is ${audit.state}`);
    if (run.version !== version) throw staleVersion();
    const resultCount = run.output.results.length;
    const outOfRange = Object.keys(notes).find((index) => Number(index) >= resultCount);
    if (outOfRange) throw invalid(`notes.${outOfRange}`, `there are only ${resultCount} results`);
    const next = { ...run.notes };
    const changes: Record<string, { before: string | null; after: string | null }> = {};
    for (const [index, note] of Object.entries(notes)) {
      const before = run.notes[index] ?? null;
      const after = note.trim() === '' ? null : note.trim();
      if (before === after) continue;
      changes[`note ${index}`] = { before, after };
      if (after === null) delete next[index];
      else next[index] = after;
    }
    if (!Object.keys(changes).length) return;
    run.notes = next;
    await run.save({ transaction });
    await appendTrail(deps.sequelize, transaction, {
      userId: actor.id,
      recordType: 'audit',
      recordId: auditId,
      event: 'CHECKLIST_NOTES_UPDATED',
      changes: { checklistRunId: run.id, ...changes },
      at: deps.clock.now(),
    });
  });
  return presentStoredRun(runId);
}

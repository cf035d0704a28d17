// The impact worksheet of a finding: the past inspections it puts in doubt,
// grouped by customer and part number, with the quality manager's containment
// decision for each (re-inspect, recall report, accept with justification,
// not affected). A major finding cannot leave containment while any is undecided.
import { Op } from 'sequelize';
import type { AppDeps } from '../app-deps';
import type { AppAbility } from '../../shared/abilities';
import type { ContainmentDecisionsInput, FindingImpactView, ImpactGroup, ImpactRow } from '../../shared/schemas/impact';
import { ContainmentDecision, Finding, Inspection, User } from '../models';
import { AppError, notAllowedNow, notFound, staleVersion } from '../lib/app-error';
import { assertFindingAbility } from './finding-ability';
import { inspectionIncludes, presentInspection } from '../presenters/inspection.presenter';
import { appendTrail } from './trail.service';
import { impactScopeOf, scopeWhere, type ImpactScope } from './impact-scope';
import { SETTLED_FINDING_STATES } from './workflow/record-kinds';
import { retryOnDeadlock } from './workflow/retry';
import type { EventActor } from './record-events.service';

const mayDecide = (ability: AppAbility, finding: Finding) =>
  assertFindingAbility(ability, 'decide_impact', finding, 'Only a quality manager decides the impact of a finding');

function refuseIfSettled(finding: Finding) {
  if ((SETTLED_FINDING_STATES as readonly string[]).includes(finding.state)) {
    throw notAllowedNow(`This finding is ${finding.state}: its impact worksheet is kept as it was`);
  }
}

/** Groups rows by customer and part number (in the rows' order), counting the undecided ones. */
export function groupByCustomerAndPart(rows: ImpactRow[], withDecisions: boolean): ImpactGroup[] {
  const groups = new Map<string, ImpactGroup>();
  for (const { inspection, decision } of rows) {
    const key = JSON.stringify([inspection.customer, inspection.partNumber]);
    const group = groups.get(key) ?? { customer: inspection.customer, partNumber: inspection.partNumber, count: 0, undecided: withDecisions ? 0 : null };
    group.count += 1;
    if (withDecisions && !decision) group.undecided! += 1;
    groups.set(key, group);
  }
  return [...groups.values()];
}

export const IMPACT_ORDER = [
  ['customer', 'ASC'],
  ['partNumber', 'ASC'],
  ['performedOn', 'ASC'],
  ['id', 'ASC'],
] as const;

async function impactRows(findingId: number, scope: ImpactScope): Promise<ImpactRow[]> {
  if (!scope.revisions.length) return [];
  const inspections = await Inspection.findAll({ where: scopeWhere(scope), include: inspectionIncludes, order: IMPACT_ORDER as never });
  const decisions = await ContainmentDecision.findAll({
    where: { findingId, inspectionId: { [Op.in]: inspections.map((inspection) => inspection.id) } },
    include: [{ model: User, as: 'decidedBy', attributes: ['id', 'displayName'] }],
  });
  const byInspection = new Map(decisions.map((decision) => [decision.inspectionId, decision]));
  return inspections.map((inspection) => {
    const decision = byInspection.get(inspection.id);
    return {
      inspection: presentInspection(inspection),
      decision: decision
        ? {
            decision: decision.decision,
            reason: decision.reason,
            decidedBy: { id: decision.decidedById, name: decision.decidedBy?.displayName ?? '' },
            decidedAt: decision.decidedAt.toISOString(),
          }
        : null,
    };
  });
}

export async function getFindingImpact(deps: AppDeps, findingId: number): Promise<FindingImpactView> {
  const finding = await Finding.findByPk(findingId);
  if (!finding) throw notFound('Finding');
  const scope = await impactScopeOf(finding, deps.clock.now());
  const rows = await impactRows(findingId, scope);
  const undecided = rows.filter((row) => !row.decision).length;
  return {
    findingId,
    techniqueId: finding.techniqueId,
    techniqueCode: finding.techniqueCode,
    since: finding.impactSince ?? null,
    revisions: scope.revisions,
    groups: groupByCustomerAndPart(rows, true),
    rows,
    total: rows.length,
    undecided,
    blocksContainment: finding.state === 'containment' && undecided > 0,
    unavailableReason: scope.reason,
  };
}

/** Sets (or clears) the first day the worksheet lists inspections from. */
export async function setImpactScope(
  deps: AppDeps,
  actor: EventActor,
  ability: AppAbility,
  findingId: number,
  input: { since: string | null; version: number },
): Promise<void> {
  const now = deps.clock.now();
  if (input.since !== null && input.since > now.toISOString().slice(0, 10)) {
    throw new AppError('Some body fields are not valid', { status: 400, code: 'invalid_input', details: [{ path: 'since', message: 'the date cannot be in the future' }] });
  }
  await deps.sequelize.transaction(async (transaction) => {
    const finding = await Finding.findByPk(findingId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!finding) throw notFound('Finding');
    mayDecide(ability, finding);
    refuseIfSettled(finding);
    if (finding.version !== input.version) throw staleVersion();
    const previous = finding.impactSince ?? null;
    if (previous === input.since) return;
    finding.impactSince = input.since;
    await finding.save({ transaction });
    await appendTrail(deps.sequelize, transaction, {
      userId: actor.id,
      recordType: 'finding',
      recordId: findingId,
      event: 'IMPACT_SCOPE_SET',
      changes: { impactSince: { from: previous, to: input.since } },
      at: now,
    });
  });
}

/** Records one decision for each chosen inspection; a later decision replaces an earlier one, and the trail keeps both. */
export async function recordContainmentDecisions(
  deps: AppDeps,
  actor: EventActor,
  ability: AppAbility,
  findingId: number,
  input: ContainmentDecisionsInput,
): Promise<void> {
  const now = deps.clock.now();
  const inspectionIds = [...new Set(input.inspectionIds)];
  await retryOnDeadlock(() =>
    deps.sequelize.transaction(async (transaction) => {
      // The finding's row lock orders these decisions against RECORD_CONTAINMENT, which counts them.
      const finding = await Finding.findByPk(findingId, { transaction, lock: transaction.LOCK.UPDATE });
      if (!finding) throw notFound('Finding');
      mayDecide(ability, finding);
      refuseIfSettled(finding);
      const scope = await impactScopeOf(finding, now, transaction);
      const inScope = scope.revisions.length
        ? await Inspection.findAll({ where: { [Op.and]: [scopeWhere(scope), { id: { [Op.in]: inspectionIds } }] }, attributes: ['id'], transaction })
        : [];
      const found = new Set(inScope.map((inspection) => inspection.id));
      const outside = inspectionIds.filter((id) => !found.has(id));
      if (outside.length) {
        throw new AppError('Some body fields are not valid', {
          status: 400,
          code: 'invalid_input',
          details: [{ path: 'inspectionIds', message: `not on this finding's worksheet: ${outside.slice(0, 20).join(', ')}${outside.length > 20 ? ', …' : ''}` }],
        });
      }
      const existing = await ContainmentDecision.findAll({ where: { findingId, inspectionId: { [Op.in]: inspectionIds } }, transaction, lock: transaction.LOCK.UPDATE });
      const byInspection = new Map(existing.map((decision) => [decision.inspectionId, decision]));
      const replaced: Array<{ inspectionId: number; decision: string; reason: string }> = [];
      const fresh = [];
      for (const inspectionId of inspectionIds) {
        const previous = byInspection.get(inspectionId);
        if (previous) {
          replaced.push({ inspectionId, decision: previous.decision, reason: previous.reason });
          previous.set({ decision: input.decision, reason: input.reason, decidedById: actor.id, decidedAt: now });
          await previous.save({ transaction });
        } else {
          fresh.push({ findingId, inspectionId, decision: input.decision, reason: input.reason, decidedById: actor.id, decidedAt: now });
        }
      }
      if (fresh.length) await ContainmentDecision.bulkCreate(fresh, { transaction });
      await appendTrail(deps.sequelize, transaction, {
        userId: actor.id,
        recordType: 'finding',
        recordId: findingId,
        event: 'CONTAINMENT_DECIDED',
        changes: { decision: input.decision, reason: input.reason, inspectionIds, replaced },
        at: now,
      });
    }),
  );
}

// Which past inspections a finding puts in doubt: those made to an affected
// revision of the finding's technique on or after the day the doubt starts
// (the revision's approval, or the date the quality manager chose). A revision
// is affected when it fails the finding's checklist rule today or is the
// revision the finding was raised on; a finding that names no rule puts every
// approved revision of its technique in doubt.
import { Op, literal, type Transaction, type WhereOptions } from 'sequelize';
import type { ImpactRevision } from '../../shared/schemas/impact';
import { Finding, Inspection, TechniqueRevision } from '../models';
import { loadOrganisationPolicy } from './policy.service';
import { findingRuleOf, ruleFailuresOfRevision } from './finding-rule';

export interface ImpactScope {
  revisions: ImpactRevision[];
  /** Why nothing is in doubt, when nothing is. */
  reason: string | null;
}

const isoDay = (date: Date) => date.toISOString().slice(0, 10);

export async function impactScopeOf(finding: Finding, now: Date, transaction?: Transaction): Promise<ImpactScope> {
  if (finding.techniqueId === null) {
    return { revisions: [], reason: 'This finding names no technique, so it puts no past inspection in doubt' };
  }
  const approved = await TechniqueRevision.findAll({
    where: { techniqueId: finding.techniqueId, approvedAt: { [Op.ne]: null } },
    order: [['seq', 'ASC']],
    transaction,
  });
  if (!approved.length) return { revisions: [], reason: `No revision of ${finding.techniqueCode ?? 'the technique'} was ever approved, so no inspection was made to it` };
  const rule = await findingRuleOf(finding, transaction);
  const policy = rule ? await loadOrganisationPolicy(transaction) : null;
  const revisions: ImpactRevision[] = [];
  for (const revision of approved) {
    let reason: string | null = null;
    if (!rule) {
      reason = 'the finding names the technique, not one checklist rule: every approved revision';
    } else if (rule.revision === revision.revision) {
      reason = 'the revision the finding was raised on';
    } else {
      const failures = await ruleFailuresOfRevision(revision, rule, { policy: policy!, now, transaction });
      if (failures?.length) reason = `fails ${rule.rule} when evaluated today`;
    }
    if (!reason) continue;
    revisions.push({
      id: revision.id,
      revision: revision.revision,
      approvedAt: revision.approvedAt!.toISOString(),
      from: finding.impactSince ?? isoDay(revision.approvedAt!),
      reason,
    });
  }
  return {
    revisions,
    reason: revisions.length ? null : `No approved revision of ${finding.techniqueCode ?? 'the technique'} fails ${rule?.rule ?? 'the rule'} today`,
  };
}

/** The inspections of the scope, as a where clause on inspections. */
export function scopeWhere(scope: ImpactScope): WhereOptions {
  return {
    [Op.or]: scope.revisions.map((revision) => ({ techniqueRevisionId: revision.id, performedOn: { [Op.gte]: revision.from } })),
  };
}

/** Inspections in the scope that have no decision of this finding yet. */
export async function countUndecided(findingId: number, scope: ImpactScope, transaction?: Transaction): Promise<number> {
  if (!scope.revisions.length) return 0;
  return Inspection.count({
    where: {
      [Op.and]: [
        scopeWhere(scope),
        // findingId is an integer primary key, never user text.
        { id: { [Op.notIn]: literal(`(SELECT inspection_id FROM containment_decisions WHERE finding_id = ${Number(findingId)})`) } },
      ],
    },
    transaction,
  });
}

/** The containment facts of findings: undecided inspections, counted only where they matter (a finding in containment). */
export async function undecidedCounts(findingIds: number[], now: Date, transaction?: Transaction): Promise<Map<number, number>> {
  const counts = new Map<number, number>(findingIds.map((id) => [id, 0]));
  if (!findingIds.length) return counts;
  const inContainment = await Finding.findAll({ where: { id: { [Op.in]: findingIds }, state: 'containment' }, transaction });
  for (const finding of inContainment) {
    counts.set(finding.id, await countUndecided(finding.id, await impactScopeOf(finding, now, transaction), transaction));
  }
  return counts;
}

// Which past inspections a finding puts in doubt: those made to an affected
// revision of the finding's technique on or after the day the doubt starts
// (the revision's approval, or the date the quality manager chose). A revision
// is affected when it fails the finding's checklist rule today or is the
// revision the finding was raised on; a finding that names no rule puts every
// approved revision of its technique in doubt.
import { Op, QueryTypes, literal, type Transaction, type WhereOptions } from 'sequelize';
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

/** Inspections this finding has not decided on (findingId is an integer key, never user text). */
function notDecidedBy(findingId: number): WhereOptions {
  return { id: { [Op.notIn]: literal(`(SELECT inspection_id FROM containment_decisions WHERE finding_id = ${Number(findingId)})`) } };
}

/** Inspections in the scope that have no decision of this finding yet. */
export async function countUndecided(findingId: number, scope: ImpactScope, transaction?: Transaction): Promise<number> {
  if (!scope.revisions.length) return 0;
  return Inspection.count({ where: { [Op.and]: [scopeWhere(scope), notDecidedBy(findingId)] }, transaction });
}

/**
 * The containment facts of findings: undecided inspections, counted only where
 * they matter (a finding in containment). Takes loaded rows, or ids to load.
 * One grouped query finds the findings whose technique has any inspection they
 * have not decided; only those need their scope worked out (and the engine run).
 */
export async function undecidedCounts(findings: Finding[] | number[], now: Date, transaction?: Transaction): Promise<Map<number, number>> {
  const rows = typeof findings[0] === 'number'
    ? await Finding.findAll({ where: { id: { [Op.in]: findings as number[] }, state: 'containment' }, transaction })
    : (findings as Finding[]);
  const counts = new Map<number, number>(rows.map((finding) => [finding.id, 0]));
  const candidates = rows.filter((finding) => finding.state === 'containment' && finding.techniqueId !== null);
  if (!candidates.length) return counts;
  const open = await Finding.sequelize!.query<{ id: number }>(
    `SELECT f.id FROM findings f
       JOIN inspections i ON i.technique_id = f.technique_id
       LEFT JOIN containment_decisions d ON d.finding_id = f.id AND d.inspection_id = i.id
      WHERE f.id IN (:ids) AND d.id IS NULL
      GROUP BY f.id`,
    { replacements: { ids: candidates.map((finding) => finding.id) }, type: QueryTypes.SELECT, transaction },
  );
  const withUndecided = new Set(open.map((row) => Number(row.id)));
  for (const finding of candidates) {
    if (!withUndecided.has(finding.id)) continue;
    counts.set(finding.id, await countUndecided(finding.id, await impactScopeOf(finding, now, transaction), transaction));
  }
  return counts;
}

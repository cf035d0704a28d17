// One open finding per failed check: a second finding on the same technique
// revision, rule, flaw and coil is refused with a pointer to the first, so the
// extent of condition, the impact worksheet and the corrective action stay on
// one record (and a double click cannot raise two).
import { Op, type Transaction } from 'sequelize';
import { ChecklistRun, Finding, Technique } from '../models';
import { AppError } from '../lib/app-error';
import type { RuleResult } from '../../shared/domain/checklist';
import { findingRuleOf } from './finding-rule';

const CLOSED_STATES = ['closed', 'withdrawn'];

export interface CheckIdentity {
  auditId: number;
  /** Null for a technique carried in the audit's scope only (not in the register): then only that audit is searched. */
  techniqueId: number | null;
  techniqueCode: string;
  techniqueRevision: string;
  result: Pick<RuleResult, 'rule' | 'flaw' | 'coil'>;
}

/**
 * Waits for any other raise on the same technique (row lock held to the end of the
 * transaction), then refuses when an open finding already names the same check.
 * A finding raised from an extent-of-condition run names its technique and rule
 * but no flaw or coil: it counts as the same check for that rule.
 */
export async function refuseDuplicateFinding(check: CheckIdentity, transaction: Transaction): Promise<void> {
  if (check.techniqueId !== null) {
    await Technique.findByPk(check.techniqueId, { attributes: ['id'], lock: transaction.LOCK.UPDATE, transaction });
  }
  const open = await Finding.findAll({
    where: {
      state: { [Op.notIn]: CLOSED_STATES },
      ...(check.techniqueId !== null ? { techniqueId: check.techniqueId } : { auditId: check.auditId, techniqueCode: check.techniqueCode }),
      [Op.or]: [{ checklistRunId: { [Op.ne]: null } }, { extentOfId: { [Op.ne]: null } }],
    },
    order: [['id', 'ASC']],
    transaction,
  });
  for (const finding of open) {
    if (await namesSameCheck(finding, check, transaction)) {
      throw new AppError(
        `An open finding already names this check: ${finding.number}, “${finding.title}”. Add what you found to that finding instead of raising another.`,
        { status: 409, code: 'duplicate_finding', details: { findingId: finding.id, number: finding.number } },
      );
    }
  }
}

async function namesSameCheck(finding: Finding, check: CheckIdentity, transaction: Transaction): Promise<boolean> {
  if (finding.checklistRunId !== null && finding.resultIndex !== null) {
    const run = await ChecklistRun.findByPk(finding.checklistRunId, { attributes: ['id', 'techniqueRevision', 'output'], transaction });
    const result = run?.output.results[finding.resultIndex];
    return (
      !!run &&
      !!result &&
      run.techniqueRevision === check.techniqueRevision &&
      result.rule === check.result.rule &&
      (result.flaw ?? null) === (check.result.flaw ?? null) &&
      (result.coil ?? null) === (check.result.coil ?? null)
    );
  }
  const rule = await findingRuleOf(finding, transaction);
  return rule?.rule === check.result.rule;
}

// Runs the checklist engine over stored technique content. The verdict and the
// failing rules are stored with each revision (for the register's filters) and
// refreshed whenever the content or the organisation's policy changes.
import type { Transaction } from 'sequelize';
import {
  evaluateParsedTechnique,
  parseTechnique,
  toIssues,
  type ChecklistOutput,
  type EvaluateOptions,
  type Policy,
  type RuleId,
  type Technique,
  type Verdict,
} from '../../shared/domain/checklist';
import { TechniqueRevision } from '../models';
import { AppError } from '../lib/app-error';

export interface StoredVerdict {
  verdict: Verdict;
  failedRules: RuleId[];
}

export function summariseVerdict(output: ChecklistOutput): StoredVerdict {
  const failed = new Set<RuleId>();
  for (const result of output.results) if (result.status === 'fail') failed.add(result.rule);
  return { verdict: output.verdict, failedRules: [...failed] };
}

export function evaluateContent(content: Technique, policy: Policy, options: Omit<EvaluateOptions, 'policy'> = {}): ChecklistOutput {
  return evaluateParsedTechnique(content, { ...options, policy });
}

/**
 * Validates technique content with the engine's schema; a 400 whose details are the
 * engine's issues ("technique.coils[0].diameterMm: …") when it is not valid.
 */
export function parseTechniqueContent(input: unknown, prefix = 'technique'): Technique {
  const parsed = parseTechnique(input);
  if (!parsed.success) {
    throw new AppError('The technique is not valid: see the fields listed', {
      status: 400,
      code: 'invalid_input',
      details: toIssues(parsed.error, prefix || undefined),
    });
  }
  return parsed.data;
}

/** Re-evaluates every stored revision under `policy`; returns how many verdicts changed. */
export async function refreshStoredVerdicts(policy: Policy, transaction: Transaction): Promise<number> {
  const revisions = await TechniqueRevision.findAll({
    attributes: ['id', 'content', 'verdict', 'failedRules'],
    transaction,
    lock: transaction.LOCK.UPDATE,
  });
  let changed = 0;
  for (const revision of revisions) {
    const parsed = parseTechnique(revision.content);
    if (!parsed.success) continue; // stored content was valid when saved; a later schema change must not block the policy edit
    const next = summariseVerdict(evaluateContent(parsed.data, policy));
    const previousRules = [...(revision.failedRules ?? [])].sort().join();
    if (next.verdict === revision.verdict && next.failedRules.slice().sort().join() === previousRules) continue;
    changed += 1;
    // A computed cache, not an edit: no version bump, so an open editor is not made stale by a policy change.
    await TechniqueRevision.update(
      { verdict: next.verdict, failedRules: next.failedRules },
      { where: { id: revision.id }, transaction, silent: true },
    );
  }
  return changed;
}

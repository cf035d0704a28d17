// What checklist rule a finding says is not met, read from the checklist run it
// was raised from (or, for a finding raised from an extent-of-condition run,
// from the finding it extends), and the engine run over stored revisions for
// that rule. Extent runs and impact worksheets both start here.
import type { Transaction } from 'sequelize';
import {
  RULE_IDS,
  RegisterFactsSchema,
  parseTechnique,
  type Policy,
  type RuleId,
  type RuleResult,
} from '../../shared/domain/checklist';
import type { Technique as TechniqueContent } from '../../shared/schemas/technique';
import type { ExtentFailure } from '../../shared/schemas/extent';
import { ChecklistRun, Finding, type TechniqueRevision } from '../models';
import { evaluateContent } from './technique-evaluation';
import { buildRegisterFacts } from './technique-links.service';

export interface FindingRule {
  rule: RuleId;
  /** The result's status the finding was raised from: a finding raised from a warning also counts warnings. */
  status: 'fail' | 'warn';
  flawOrientation: string | null;
  coilType: string | null;
  /** The revision letter of the run the finding was raised from; null for an extent finding. */
  revision: string | null;
}

/** Rules whose results depend on the registers: they need the register facts to run at all. */
const REGISTER_RULES: readonly RuleId[] = ['personnel', 'equipment'];

function isRuleId(value: unknown): value is RuleId {
  return typeof value === 'string' && (RULE_IDS as readonly string[]).includes(value);
}

/** The finding's rule, or null when it was raised by hand (it names no checklist result). */
export async function findingRuleOf(finding: Finding, transaction?: Transaction): Promise<FindingRule | null> {
  if (finding.checklistRunId !== null && finding.resultIndex !== null) {
    const run = await ChecklistRun.findByPk(finding.checklistRunId, { transaction });
    const result = run?.output.results[finding.resultIndex];
    if (!run || !result || !isRuleId(result.rule)) return null;
    const flaw = result.flaw === undefined ? undefined : run.technique.flaws.find((candidate) => candidate.id === result.flaw);
    const coil = result.coil === undefined ? undefined : run.technique.coils[result.coil];
    return {
      rule: result.rule,
      status: result.status === 'warn' ? 'warn' : 'fail',
      flawOrientation: flaw?.orientation ?? null,
      coilType: coil?.type ?? null,
      revision: run.techniqueRevision,
    };
  }
  if (finding.extentOfId !== null) {
    const parent = await Finding.findByPk(finding.extentOfId, { transaction });
    const rule = parent ? await findingRuleOf(parent, transaction) : null;
    return rule ? { ...rule, revision: null } : null;
  }
  return null;
}

/** The failing (or, for a warned finding, warned) results of the rule, described for an extent list. */
export function failuresOf(results: RuleResult[], content: TechniqueContent, rule: FindingRule): ExtentFailure[] {
  return results
    .filter((result) => result.rule === rule.rule && (result.status === 'fail' || (rule.status === 'warn' && result.status === 'warn')))
    .map((result) => {
      const flaw = result.flaw === undefined ? undefined : content.flaws.find((candidate) => candidate.id === result.flaw);
      const coil = result.coil === undefined ? undefined : content.coils[result.coil];
      return {
        message: result.message,
        flaw: result.flaw ?? null,
        flawOrientation: flaw?.orientation ?? null,
        coil: result.coil ?? null,
        coilType: coil?.type ?? null,
        values: result.values,
      };
    });
}

/**
 * Evaluates one stored revision under the organisation's policy (with the
 * register facts when the rule needs them) and returns the rule's failures;
 * null when the stored content no longer parses (it cannot be judged).
 */
export async function ruleFailuresOfRevision(
  revision: TechniqueRevision,
  rule: FindingRule,
  { policy, now, transaction }: { policy: Policy; now: Date; transaction?: Transaction },
): Promise<ExtentFailure[] | null> {
  const parsed = parseTechnique(revision.content);
  if (!parsed.success) return null;
  let registers;
  if (REGISTER_RULES.includes(rule.rule)) {
    const facts = await buildRegisterFacts({
      techniqueId: revision.techniqueId,
      approvedById: revision.approvedById,
      approvedAt: revision.approvedAt,
      transaction,
    });
    registers = RegisterFactsSchema.parse(facts);
  }
  const output = evaluateContent(parsed.data, policy, { registers, now });
  return failuresOf(output.results, parsed.data, rule);
}

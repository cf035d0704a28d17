// Extent of condition: from a finding raised on a failed checklist rule, run
// the engine over every approved technique and list those that fail the same
// rule (and which of them fail it for the same flaw orientation or coil type).
// Each run is kept (who, when, engine and policy version, the whole list) and
// written to the trail, so the decision can be shown to an assessor later.
// Linked findings are raised from a run in extent-findings.service.ts.
import { Op, type Transaction } from 'sequelize';
import type { AppDeps } from '../app-deps';
import type { AppAbility } from '../../shared/abilities';
import { CHECKLIST_ENGINE_VERSION } from '../../shared/domain/checklist';
import { describeExtentChanges, engineVersionNote } from '../../shared/domain/checklist/run-history';
import type { ExtentRunView, ExtentTechnique, FindingFamilyView } from '../../shared/schemas/extent';
import { ExtentRun, Finding, PolicyHead, Technique, TechniqueRevision, User } from '../models';
import { notAllowedNow, notFound } from '../lib/app-error';
import { appendTrail } from './trail.service';
import { contentHash } from '../lib/content-hash';
import { loadOrganisationPolicy } from './policy.service';
import { findingRuleOf, ruleFailuresOfRevision, type FindingRule } from './finding-rule';
import { assertFindingAbility } from './finding-ability';
import type { EventActor } from './record-events.service';

const HAND_RAISED = 'This finding was raised by hand and names no checklist result: an extent run needs a finding raised from a failed checklist rule';

export const mayAssessExtent = (ability: AppAbility, finding: Finding) =>
  assertFindingAbility(ability, 'assess_extent', finding, 'Only a quality manager assesses the extent of a finding');

/** Every approved revision, judged for the finding's rule. */
async function evaluateApprovedRevisions(deps: AppDeps, finding: Finding, rule: FindingRule, transaction: Transaction): Promise<ExtentTechnique[]> {
  const policy = await loadOrganisationPolicy(transaction);
  const revisions = await TechniqueRevision.findAll({
    where: { state: 'approved' },
    include: [{ model: Technique, as: 'technique', attributes: ['id', 'code', 'title'] }],
    transaction,
  });
  const judged: ExtentTechnique[] = [];
  for (const revision of revisions) {
    const failures = await ruleFailuresOfRevision(revision, rule, { policy, now: deps.clock.now(), transaction });
    if (failures === null) continue; // stored content that no longer parses cannot be judged; it is not listed as passing either
    judged.push({
      techniqueId: revision.techniqueId,
      revisionId: revision.id,
      code: revision.technique!.code,
      title: revision.technique!.title,
      revision: revision.revision,
      failures,
      sameOrientation: rule.flawOrientation !== null && failures.some((failure) => failure.flawOrientation === rule.flawOrientation),
      sameCoilType: rule.coilType !== null && failures.some((failure) => failure.coilType === rule.coilType),
      isFindingTechnique: revision.techniqueId === finding.techniqueId,
    });
  }
  return judged.sort((a, b) => Number(b.isFindingTechnique) - Number(a.isFindingTechnique) || a.code.localeCompare(b.code));
}

async function presentRun(run: ExtentRun, transaction?: Transaction): Promise<ExtentRunView> {
  const runBy = run.runBy ?? (await User.findByPk(run.runById, { attributes: ['id', 'displayName'], transaction }));
  const previous = await ExtentRun.findOne({
    where: { findingId: run.findingId, id: { [Op.lt]: run.id } },
    order: [['id', 'DESC']],
    attributes: ['id', 'runAt', 'engineVersion', 'techniques'],
    transaction,
  });
  const linked = await Finding.findAll({
    where: { extentOfId: run.findingId },
    attributes: ['id', 'number', 'state', 'techniqueId'],
    order: [['number', 'ASC']],
    transaction,
  });
  return {
    id: run.id,
    findingId: run.findingId,
    rule: run.rule as ExtentRunView['rule'],
    flawOrientation: run.flawOrientation,
    coilType: run.coilType,
    engineVersion: run.engineVersion,
    engineNote: engineVersionNote(run.engineVersion, run.runAt),
    policyVersion: run.policyVersion,
    runAt: run.runAt.toISOString(),
    runBy: { id: run.runById, name: runBy?.displayName ?? '' },
    evaluatedCount: run.techniques.length,
    failing: run.techniques.filter((technique) => technique.failures.length > 0),
    changes: previous
      ? {
          previousRunId: previous.id,
          previousRunAt: previous.runAt.toISOString(),
          previousEngineVersion: previous.engineVersion,
          lines: describeExtentChanges(run.rule, previous.techniques, run.techniques),
        }
      : null,
    linked: linked
      .filter((finding) => finding.techniqueId !== null)
      .map((finding) => ({ techniqueId: finding.techniqueId!, findingId: finding.id, number: finding.number, state: finding.state })),
  };
}

export async function runExtent(deps: AppDeps, actor: EventActor, ability: AppAbility, findingId: number): Promise<ExtentRunView> {
  const now = deps.clock.now();
  return deps.sequelize.transaction(async (transaction) => {
    const finding = await Finding.findByPk(findingId, { transaction });
    if (!finding) throw notFound('Finding');
    mayAssessExtent(ability, finding);
    if (finding.state === 'withdrawn') throw notAllowedNow('This finding is withdrawn: there is no condition to look for elsewhere');
    const rule = await findingRuleOf(finding, transaction);
    if (!rule) throw notAllowedNow(HAND_RAISED);
    const techniques = await evaluateApprovedRevisions(deps, finding, rule, transaction);
    const policyVersion = (await PolicyHead.findByPk(1, { transaction }))?.version ?? 0;
    const run = await ExtentRun.create(
      {
        findingId,
        rule: rule.rule,
        flawOrientation: rule.flawOrientation,
        coilType: rule.coilType,
        engineVersion: CHECKLIST_ENGINE_VERSION,
        policyVersion,
        techniques,
        runById: actor.id,
        runAt: now,
      },
      { transaction },
    );
    const failing = techniques.filter((technique) => technique.failures.length > 0);
    await appendTrail(deps.sequelize, transaction, {
      userId: actor.id,
      recordType: 'finding',
      recordId: findingId,
      event: 'EXTENT_RUN',
      changes: {
        runId: run.id,
        rule: rule.rule,
        flawOrientation: rule.flawOrientation,
        coilType: rule.coilType,
        engineVersion: CHECKLIST_ENGINE_VERSION,
        policyVersion,
        evaluated: techniques.length,
        // The stored list (extent_runs.techniques) can be checked against this.
        listSha256: contentHash(techniques),
        failing: failing.map((technique) => `${technique.code} rev ${technique.revision}`),
        sameOrientation: failing.filter((technique) => technique.sameOrientation).map((technique) => technique.code),
        sameCoilType: failing.filter((technique) => technique.sameCoilType).map((technique) => technique.code),
      },
      at: now,
    });
    return presentRun(run, transaction);
  });
}

export async function getFindingFamily(findingId: number): Promise<FindingFamilyView> {
  const finding = await Finding.findByPk(findingId, {
    include: [{ model: Finding, as: 'extentOf', attributes: ['id', 'number', 'title', 'state'] }],
  });
  if (!finding) throw notFound('Finding');
  const [members, rule, latest] = await Promise.all([
    Finding.findAll({ where: { extentOfId: findingId }, order: [['number', 'ASC']] }),
    findingRuleOf(finding),
    ExtentRun.findOne({ where: { findingId }, order: [['runAt', 'DESC'], ['id', 'DESC']], include: [{ model: User, as: 'runBy', attributes: ['id', 'displayName'] }] }),
  ]);
  return {
    extentOf: finding.extentOf
      ? { id: finding.extentOf.id, number: finding.extentOf.number, title: finding.extentOf.title, state: finding.extentOf.state }
      : null,
    members: members.map((member) => ({
      id: member.id,
      number: member.number,
      title: member.title,
      techniqueCode: member.techniqueCode,
      state: member.state,
      class: member.class,
      proposedClass: member.proposedClass ?? null,
    })),
    extentPossible: rule !== null && finding.state !== 'withdrawn',
    extentUnavailableReason: rule === null ? HAND_RAISED : finding.state === 'withdrawn' ? 'This finding is withdrawn' : null,
    latestRun: latest ? await presentRun(latest) : null,
  };
}

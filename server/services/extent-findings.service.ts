// Linked findings from an extent-of-condition run: one finding per technique the
// quality manager picks from the run, each pointing back at the finding it
// extends, with the class proposed, in one transaction with their trail entries.
import { Op } from 'sequelize';
import { applyEvent, createInitialSnapshot, findingMachine, FINDING_MACHINE_VERSION, persistSnapshot } from '../../machines';
import type { AppDeps } from '../app-deps';
import type { AppAbility } from '../../shared/abilities';
import type { ExtentTechnique, RaiseExtentFindingsInput } from '../../shared/schemas/extent';
import { ExtentRun, Finding, Technique } from '../models';
import { AppError, notAllowedNow, notFound } from '../lib/app-error';
import { appendTrail } from './trail.service';
import { allocateRecordNumber } from './record-numbers.service';
import { retryOnDeadlock } from './workflow/retry';
import { NEW_FINDING_FIELDS } from './findings.service';
import { mayAssessExtent } from './extent.service';
import { ruleLabel } from '../../shared/labels';
import type { EventActor } from './record-events.service';

function invalid(path: string, message: string) {
  return new AppError('Some body fields are not valid', { status: 400, code: 'invalid_input', details: [{ path, message }] });
}

function describeFailures(entry: ExtentTechnique): string {
  return entry.failures
    .map((failure) => {
      const values = Object.entries(failure.values).map(([key, value]) => `${key} = ${value === null ? '—' : String(value)}`).join('; ');
      return values ? `${failure.message} Values: ${values}.` : failure.message;
    })
    .join(' ');
}

/**
 * Raises one finding per chosen technique, linked to the original as its extent
 * of condition, with the proposed class. They start in review (the quality
 * manager raised them, so there is nobody to submit them) and are classified
 * one by one like any finding. Returns the new findings' ids.
 */
export async function raiseExtentFindings(
  deps: AppDeps,
  actor: EventActor,
  ability: AppAbility,
  findingId: number,
  input: RaiseExtentFindingsInput,
): Promise<Array<{ id: number; number: string }>> {
  const now = deps.clock.now();
  return retryOnDeadlock(() =>
    deps.sequelize.transaction(async (transaction) => {
      const original = await Finding.findByPk(findingId, { transaction, lock: transaction.LOCK.UPDATE });
      if (!original) throw notFound('Finding');
      mayAssessExtent(ability, original);
      if (original.state === 'withdrawn') throw notAllowedNow('This finding is withdrawn: raise nothing from it');
      const run = await ExtentRun.findOne({ where: { id: input.runId, findingId }, transaction });
      if (!run) throw invalid('runId', 'no such extent run on this finding');
      const revisionIds = [...new Set(input.revisionIds)];
      const entries = revisionIds.map((revisionId, index) => {
        const entry = run.techniques.find((candidate) => candidate.revisionId === revisionId);
        if (!entry || entry.failures.length === 0) throw invalid(`revisionIds.${index}`, 'this revision does not fail the rule in that run');
        if (entry.isFindingTechnique) throw invalid(`revisionIds.${index}`, `${entry.code} is the technique this finding is about`);
        return entry;
      });
      const existing = await Finding.findAll({
        where: { extentOfId: findingId, techniqueId: { [Op.in]: entries.map((entry) => entry.techniqueId) }, state: { [Op.ne]: 'withdrawn' } },
        attributes: ['number', 'techniqueCode'],
        transaction,
      });
      if (existing.length) {
        const list = existing.map((finding) => `${finding.number} (${finding.techniqueCode})`).join(', ');
        throw new AppError(`Already raised from this finding: ${list}`, { status: 409, code: 'already_raised' });
      }
      const proposedClass = input.proposedClass ?? original.class;
      const techniques = await Technique.findAll({ where: { id: { [Op.in]: entries.map((entry) => entry.techniqueId) } }, attributes: ['id', 'areaId'], transaction });
      const created: Array<{ id: number; number: string }> = [];
      for (const entry of entries) {
        const number = await allocateRecordNumber(deps.sequelize, transaction, 'F', now);
        const submitted = applyEvent(findingMachine, createInitialSnapshot(findingMachine).snapshot, { type: 'SUBMIT' });
        const finding = await Finding.create(
          {
            number,
            auditId: null,
            techniqueId: entry.techniqueId,
            techniqueCode: entry.code,
            checklistRunId: null,
            resultIndex: null,
            title: `${entry.code}: ${ruleLabel(run.rule)} (extent of ${original.number})`,
            rule: original.rule,
            requirement: original.requirement,
            objectiveEvidence: `Extent-of-condition run ${run.id} from ${original.number} on ${run.runAt.toISOString().slice(0, 10)} (engine ${run.engineVersion}, policy version ${run.policyVersion}): ${entry.code} rev ${entry.revision} fails “${ruleLabel(run.rule)}”. ${describeFailures(entry)}`,
            resultValues: entry.failures[0]?.values ?? null,
            ...NEW_FINDING_FIELDS,
            extentOfId: original.id,
            proposedClass,
            authorId: actor.id,
            areaId: techniques.find((technique) => technique.id === entry.techniqueId)?.areaId ?? original.areaId,
            state: submitted.state,
            snapshot: persistSnapshot(findingMachine, submitted.snapshot),
            machineVersion: FINDING_MACHINE_VERSION,
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
            extentOf: original.number,
            extentRunId: run.id,
            techniqueCode: entry.code,
            revision: entry.revision,
            rule: original.rule,
            proposedClass,
            state: submitted.state,
          },
          at: now,
        });
        created.push({ id: finding.id, number });
      }
      await appendTrail(deps.sequelize, transaction, {
        userId: actor.id,
        recordType: 'finding',
        recordId: original.id,
        event: 'EXTENT_FINDINGS_RAISED',
        changes: {
          extentRunId: run.id,
          proposedClass,
          raised: created.map((finding, index) => `${finding.number}: ${entries[index].code} rev ${entries[index].revision}`),
        },
        at: now,
      });
      return created;
    }),
  );
}

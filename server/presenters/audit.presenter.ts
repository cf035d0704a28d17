import type { Audit, ChecklistRun, Finding, Signature } from '../models';
import { describeRunChanges, engineVersionNote, type RunOutcome } from '../../shared/domain/checklist/run-history';
import type { AuditDetailView, AuditView, ChecklistRunView, FindingSummaryView } from '../../shared/schemas/workflow';
import { presentSignature } from '../services/signatures.service';
import { iso, personRef } from './workflow-refs';

export function presentAudit(audit: Audit, extra: { allowedEvents: string[]; openFindingCount: number }): AuditView {
  return {
    id: audit.id,
    state: audit.state,
    version: audit.version,
    allowedEvents: extra.allowedEvents,
    createdAt: audit.createdAt.toISOString(),
    updatedAt: audit.updatedAt.toISOString(),
    title: audit.title,
    criteria: audit.criteria,
    areaId: audit.areaId,
    areaName: audit.area?.name ?? null,
    leadAuditor: personRef(audit.leadAuditor),
    plannedStart: audit.plannedStart,
    plannedEnd: audit.plannedEnd,
    scope: audit.scope.map(({ techniqueId, code, title, revision }) => ({ techniqueId, code, title, revision })),
    cancelReason: audit.cancelReason,
    issuedAt: iso(audit.issuedAt),
    closedAt: iso(audit.closedAt),
    openFindingCount: extra.openFindingCount,
  };
}

type StoredOutput = { verdict: string; results: RunOutcome['results'] };

/** The run, with what changed since `previous` (the run of the same technique before it in the same audit). */
export function presentChecklistRun(run: ChecklistRun, previous?: ChecklistRun | null): ChecklistRunView {
  return {
    id: run.id,
    auditId: run.auditId,
    techniqueId: run.techniqueId,
    techniqueCode: run.techniqueCode,
    techniqueRevision: run.techniqueRevision,
    verdict: run.verdict,
    output: run.output,
    notes: run.notes,
    runBy: personRef(run.runBy),
    runAt: run.runAt.toISOString(),
    version: run.version,
    engineVersion: run.engineVersion,
    engineNote: engineVersionNote(run.engineVersion, run.runAt),
    changes: previous
      ? {
          previousRunId: previous.id,
          previousRunAt: previous.runAt.toISOString(),
          previousEngineVersion: previous.engineVersion,
          lines: describeRunChanges(previous.output as StoredOutput, run.output as StoredOutput),
        }
      : null,
  };
}

/** Runs newest first, each with the next older run of the same technique code as its previous one. */
export function presentChecklistRuns(runsNewestFirst: ChecklistRun[]): ChecklistRunView[] {
  return runsNewestFirst.map((run, index) =>
    presentChecklistRun(run, runsNewestFirst.slice(index + 1).find((older) => older.techniqueCode === run.techniqueCode) ?? null),
  );
}

export function presentFindingSummary(finding: Finding): FindingSummaryView {
  return {
    id: finding.id,
    number: finding.number,
    title: finding.title,
    state: finding.state,
    class: finding.class,
    dueDate: finding.dueDate,
  };
}

export function presentAuditDetail(
  audit: Audit,
  extra: {
    allowedEvents: string[];
    openFindingCount: number;
    runs: ChecklistRun[];
    findings: Finding[];
    signatures: Signature[];
    canRunChecklist: boolean;
    canRaiseFinding: boolean;
  },
): AuditDetailView {
  return {
    ...presentAudit(audit, extra),
    checklistRuns: presentChecklistRuns(extra.runs),
    findings: extra.findings.map(presentFindingSummary),
    signatures: extra.signatures.map(presentSignature),
    canRunChecklist: extra.canRunChecklist,
    canRaiseFinding: extra.canRaiseFinding,
  };
}

import type { Audit, ChecklistRun, Finding, Signature } from '../models';
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

export function presentChecklistRun(run: ChecklistRun): ChecklistRunView {
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
  };
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
    checklistRuns: extra.runs.map(presentChecklistRun),
    findings: extra.findings.map(presentFindingSummary),
    signatures: extra.signatures.map(presentSignature),
    canRunChecklist: extra.canRunChecklist,
    canRaiseFinding: extra.canRaiseFinding,
  };
}

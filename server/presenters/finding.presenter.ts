import type { Finding, Signature } from '../models';
import type { FindingDetailView, FindingView } from '../../shared/schemas/workflow';
import { presentSignature } from '../services/signatures.service';
import { iso, personRef, todayIso } from './workflow-refs';

const OPEN_FOR_DUE_DATE = ['containment', 'action_open'];

/** Overdue: containment not recorded by its due date, or the corrective work not done by the finding's due date. */
export function findingOverdue(finding: Finding, now: Date): boolean {
  const today = todayIso(now);
  if (finding.state === 'containment' && finding.containmentDueDate && finding.containmentDueDate < today) return true;
  return OPEN_FOR_DUE_DATE.includes(finding.state) && finding.dueDate !== null && finding.dueDate < today;
}

export function presentFinding(finding: Finding, extra: { allowedEvents: string[]; now: Date; canAssignAction: boolean }): FindingView {
  const action = finding.action ?? null;
  return {
    id: finding.id,
    state: finding.state,
    version: finding.version,
    allowedEvents: extra.allowedEvents,
    createdAt: finding.createdAt.toISOString(),
    updatedAt: finding.updatedAt.toISOString(),
    number: finding.number,
    title: finding.title,
    auditId: finding.auditId,
    auditTitle: finding.audit?.title ?? null,
    techniqueId: finding.techniqueId,
    techniqueCode: finding.techniqueCode,
    checklistRunId: finding.checklistRunId,
    resultIndex: finding.resultIndex,
    rule: finding.rule,
    requirement: finding.requirement,
    objectiveEvidence: finding.objectiveEvidence,
    resultValues: finding.resultValues,
    class: finding.class,
    extentOfId: finding.extentOfId ?? null,
    proposedClass: finding.proposedClass ?? null,
    classificationNote: finding.classificationNote,
    containment: finding.containment,
    containmentDueDate: finding.containmentDueDate,
    dueDate: finding.dueDate,
    effectivenessNote: finding.effectivenessNote,
    notEffectiveReason: finding.notEffectiveReason,
    closureNote: finding.closureNote,
    withdrawReason: finding.withdrawReason,
    closedAt: iso(finding.closedAt),
    author: personRef(finding.author),
    areaId: finding.areaId,
    areaName: finding.area?.name ?? null,
    action: action
      ? { id: action.id, number: action.number, state: action.state, owner: personRef(action.owner), dueDate: action.dueDate }
      : null,
    overdue: findingOverdue(finding, extra.now),
    canAssignAction: extra.canAssignAction,
  };
}

export function presentFindingDetail(
  finding: Finding,
  extra: { allowedEvents: string[]; now: Date; canAssignAction: boolean; signatures: Signature[]; undecidedInspectionCount: number },
): FindingDetailView {
  return { ...presentFinding(finding, extra), signatures: extra.signatures.map(presentSignature), undecidedInspectionCount: extra.undecidedInspectionCount };
}

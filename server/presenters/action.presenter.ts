import type { CorrectiveAction, Signature } from '../models';
import type { ActionDetailView, ActionView } from '../../shared/schemas/workflow';
import { presentSignature } from '../services/signatures.service';
import { presentFindingSummary } from './audit.presenter';
import { iso, personRef, todayIso } from './workflow-refs';

export function actionOverdue(action: CorrectiveAction, now: Date): boolean {
  return action.state !== 'verified' && action.dueDate < todayIso(now);
}

export function presentAction(action: CorrectiveAction, extra: { allowedEvents: string[]; evidenceCount: number; now: Date }): ActionView {
  return {
    id: action.id,
    state: action.state,
    version: action.version,
    allowedEvents: extra.allowedEvents,
    createdAt: action.createdAt.toISOString(),
    updatedAt: action.updatedAt.toISOString(),
    number: action.number,
    findingId: action.findingId,
    finding: action.finding ? presentFindingSummary(action.finding) : null,
    owner: personRef(action.owner),
    dueDate: action.dueDate,
    pendingExtension: action.pendingExtension,
    method: action.method,
    rootCause: action.rootCause,
    plan: action.plan,
    submissionSummary: action.submissionSummary,
    returnReason: action.returnReason,
    reopenReason: action.reopenReason,
    verifiedAt: iso(action.verifiedAt),
    evidenceCount: extra.evidenceCount,
    overdue: actionOverdue(action, extra.now),
  };
}

export function presentActionDetail(
  action: CorrectiveAction,
  extra: { allowedEvents: string[]; evidenceCount: number; now: Date; signatures: Signature[] },
): ActionDetailView {
  return { ...presentAction(action, extra), signatures: extra.signatures.map(presentSignature) };
}

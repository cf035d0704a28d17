// How a transition's new machine context and state become the record's columns
// (the columns are what lists filter on and what reminder jobs read; the
// snapshot stays the machine's own truth).
import type { Model } from 'sequelize';
import type { RecordKind } from '../../../machines';
import type { AuditContext, CorrectiveActionContext, FindingContext } from '../../../machines';
import type { FindingDuePolicy } from '../workflow-policy';
import { addDays } from '../workflow-policy';
import type { WorkflowRow } from './record-kinds';

export function fieldsAfter(
  kind: RecordKind,
  row: WorkflowRow,
  { state, context, eventType, now, policy }: { state: string; context: unknown; eventType: string; now: Date; policy: FindingDuePolicy },
): Record<string, unknown> {
  if (kind === 'audit') {
    const audit = context as AuditContext;
    return {
      cancelReason: audit.cancelReason,
      ...(state === 'issued' && eventType === 'ISSUE' ? { issuedAt: now } : {}),
      ...(state === 'closed' && eventType === 'CLOSE' ? { closedAt: now } : {}),
    };
  }
  if (kind === 'finding') {
    const finding = context as FindingContext;
    const fields: Record<string, unknown> = {
      class: finding.class,
      classificationNote: finding.classificationNote,
      containment: finding.containmentDescription,
      effectivenessNote: finding.effectivenessNote,
      notEffectiveReason: finding.notEffectiveReason,
      closureNote: finding.closureNote,
      withdrawReason: finding.withdrawReason,
    };
    if (eventType === 'CLASSIFY') {
      // Due dates run from the classification (the organisation's policy; defaults are common practice).
      if (finding.class === 'major') {
        fields.dueDate = addDays(now, policy.findingDueDaysMajor);
        fields.containmentDueDate = addDays(now, policy.findingContainmentDays);
      } else if (finding.class === 'minor') {
        fields.dueDate = addDays(now, policy.findingDueDaysMinor);
      }
    }
    if (state === 'closed' && (eventType === 'CLOSE' || eventType === 'CLASSIFY')) fields.closedAt = now;
    return fields;
  }
  const action = context as CorrectiveActionContext;
  return {
    dueDate: action.dueDate,
    pendingExtension: action.pendingExtension,
    method: action.method,
    rootCause: action.rootCause,
    plan: action.plan,
    submissionSummary: action.submissionSummary,
    returnReason: action.returnReason,
    reopenReason: action.reopenReason,
    ...(eventType === 'VERIFY' ? { verifiedAt: now } : {}),
    ...(eventType === 'REOPEN' ? { verifiedAt: null } : {}),
  };
  void row;
}

/** Canonical JSON form of a value for before/after comparison in the trail. */
function comparable(value: unknown): unknown {
  if (value instanceof Date) return value.toISOString();
  return value ?? null;
}

/** Sets the fields on the row and returns { field: { before, after } } for those that changed. */
export function assignFields(row: WorkflowRow, fields: Record<string, unknown>): Record<string, { before: unknown; after: unknown }> {
  const changes: Record<string, { before: unknown; after: unknown }> = {};
  for (const [key, after] of Object.entries(fields)) {
    const before = (row as unknown as Record<string, unknown>)[key];
    if (JSON.stringify(comparable(before)) === JSON.stringify(comparable(after))) continue;
    changes[key] = { before: comparable(before), after: comparable(after) };
    (row as unknown as Model).set(key, after);
  }
  return changes;
}

// Probe events: one event of each type with a placeholder payload that passes
// every payload check, plus the server's real facts. Asking `can` with them
// tells which event types the record's state, context and facts allow now,
// whatever the user types later; the real payload is checked again when sent.
// This is how the server computes a record's `allowedEvents` without a payload.
import type { AuditCloseFacts, AuditContext, AuditEvent } from './audit.machine';
import type {
  CorrectiveActionContext,
  CorrectiveActionEvent,
  CorrectiveActionSubmitFacts,
} from './corrective-action.machine';
import { FINDING_CLASSES, type FindingContainmentFacts, type FindingContext, type FindingEvent } from './finding.machine';
import { isIsoDate, nextIsoDate } from './payload-checks';

const PLACEHOLDER = 'probe';

export function auditProbeEvents(_context: AuditContext, facts: AuditCloseFacts): AuditEvent[] {
  return [
    { type: 'START_FIELDWORK' },
    { type: 'FINISH_FIELDWORK' },
    { type: 'ISSUE' },
    { type: 'CLOSE', facts },
    { type: 'CANCEL', reason: PLACEHOLDER },
  ];
}

/** CLASSIFY is probed once per class, so it is open if any class would be accepted. */
export function findingProbeEvents(_context: FindingContext, facts: FindingContainmentFacts): FindingEvent[] {
  return [
    { type: 'SUBMIT' },
    { type: 'WITHDRAW', reason: PLACEHOLDER },
    ...FINDING_CLASSES.map((findingClass): FindingEvent => ({ type: 'CLASSIFY', class: findingClass, note: PLACEHOLDER })),
    { type: 'RECORD_CONTAINMENT', description: PLACEHOLDER, facts },
    { type: 'ACTION_VERIFIED' },
    { type: 'CONFIRM_EFFECTIVE', note: PLACEHOLDER },
    { type: 'NOT_EFFECTIVE', reason: PLACEHOLDER },
    { type: 'CLOSE' },
  ];
}

/** REQUEST_EXTENSION is probed with the day after the current due date (the earliest date it accepts). */
export function correctiveActionProbeEvents(
  context: CorrectiveActionContext,
  facts: CorrectiveActionSubmitFacts,
): CorrectiveActionEvent[] {
  const laterDate = isIsoDate(context.dueDate) ? nextIsoDate(context.dueDate) : context.dueDate;
  return [
    { type: 'START' },
    {
      type: 'SUBMIT_PLAN',
      method: 'other',
      rootCause: PLACEHOLDER,
      plan: [{ description: PLACEHOLDER, dueDate: context.dueDate }],
    },
    { type: 'APPROVE_PLAN' },
    { type: 'RETURN_PLAN', reason: PLACEHOLDER },
    { type: 'SUBMIT', summary: PLACEHOLDER, facts },
    { type: 'VERIFY' },
    { type: 'RETURN', reason: PLACEHOLDER },
    { type: 'REOPEN', reason: PLACEHOLDER },
    { type: 'REQUEST_EXTENSION', dueDate: laterDate, reason: PLACEHOLDER },
    { type: 'APPROVE_EXTENSION' },
    { type: 'REJECT_EXTENSION', reason: PLACEHOLDER },
  ];
}

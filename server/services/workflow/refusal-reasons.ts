// Why an event is not allowed now, in words a user can act on (the 422 message).
import { eventTypesFromState, type RecordKind } from '../../../machines';
import type { AnyMachineSnapshot } from 'xstate';
import { stateLabel } from '../../../shared/labels';
import { LABELS } from './record-kinds';

const STATE_WORDS = (state: string) => stateLabel(state).toLowerCase();

export function refusalReason(
  kind: RecordKind,
  snapshot: AnyMachineSnapshot,
  event: { type: string; [key: string]: unknown },
): string {
  const state = String(snapshot.value);
  const label = LABELS[kind];
  if (!eventTypesFromState(snapshot).includes(event.type)) {
    return `${event.type} is not possible while the ${label} is ${STATE_WORDS(state)}`;
  }
  const context = snapshot.context as Record<string, unknown>;
  const facts = (event.facts ?? {}) as Record<string, number>;
  switch (`${kind}:${event.type}`) {
    case 'audit:CLOSE':
      return `${facts.openFindingCount} finding(s) of this audit are still open; each must be closed or withdrawn before the audit closes`;
    case 'audit:CANCEL':
    case 'finding:WITHDRAW':
    case 'finding:NOT_EFFECTIVE':
    case 'action:RETURN_PLAN':
    case 'action:RETURN':
      return 'A reason is required';
    case 'finding:CLASSIFY':
      return event.class === 'observation'
        ? 'An observation closes at once and needs a note saying why no corrective action is required'
        : 'Choose a class: major, minor or observation';
    case 'finding:RECORD_CONTAINMENT':
      return facts.undecidedInspectionCount > 0
        ? `${facts.undecidedInspectionCount} past inspection(s) this finding puts in doubt have no containment decision yet; decide each on the impact worksheet first`
        : 'Describe the containment (what was done at once)';
    case 'finding:CONFIRM_EFFECTIVE':
      return 'A note saying how effectiveness was checked is required';
    case 'action:SUBMIT_PLAN': {
      const late = lateSteps(event.plan, context.dueDate);
      if (late.length) {
        const items = late.map(({ index, dueDate }) => `item ${index + 1} (${dueDate})`).join(', ');
        return `Plan ${items} ${late.length === 1 ? 'falls' : 'fall'} due after the corrective action itself (${String(context.dueDate)}): bring ${late.length === 1 ? 'it' : 'them'} forward, or request an extension first`;
      }
      return 'The plan needs a root-cause method, an analysis and at least one item with a due date';
    }
    case 'action:SUBMIT':
      return facts.evidenceCount === 0
        ? 'Attach at least one evidence file before submitting the corrective action'
        : 'A summary of what was done is required';
    case 'action:REQUEST_EXTENSION':
      return context.pendingExtension
        ? 'An extension request is already waiting for a decision'
        : `The requested due date must be later than the current one (${String(context.dueDate)}), with a reason`;
    case 'action:APPROVE_EXTENSION':
    case 'action:REJECT_EXTENSION':
      return context.pendingExtension ? 'A reason is required' : 'There is no extension request to decide';
    default:
      return `${event.type} is not allowed on this ${label} now`;
  }
}

/** Plan items due after the action's own due date (ISO dates compare as strings). */
export function lateSteps(plan: unknown, actionDueDate: unknown): { index: number; dueDate: string }[] {
  if (!Array.isArray(plan) || typeof actionDueDate !== 'string') return [];
  return plan.flatMap((step: { dueDate?: unknown }, index) =>
    typeof step?.dueDate === 'string' && step.dueDate > actionDueDate ? [{ index, dueDate: step.dueDate }] : [],
  );
}

// States, events, classes and root-cause methods of the workflow records, per
// record, typed against the machines' unions.
import type {
  AuditEventType,
  AuditState,
  CorrectiveActionEventType,
  CorrectiveActionState,
  FindingClass,
  FindingEventType,
  FindingState,
  RootCauseMethod,
} from '../../machines';
import { humanizeCode } from './humanize';

export const AUDIT_STATE_LABELS: Record<AuditState, string> = {
  planned: 'Planned',
  fieldwork: 'Fieldwork',
  reporting: 'Reporting',
  issued: 'Report issued',
  closed: 'Closed',
  cancelled: 'Cancelled',
};

export const FINDING_STATE_LABELS: Record<FindingState, string> = {
  raised: 'Raised',
  in_review: 'In review',
  withdrawn: 'Withdrawn',
  containment: 'Containment',
  action_open: 'Action open',
  effectiveness_check: 'Effectiveness check',
  awaiting_signoff: 'Awaiting signature',
  closed: 'Closed',
};

export const ACTION_STATE_LABELS: Record<CorrectiveActionState, string> = {
  assigned: 'Assigned',
  investigating: 'Investigating',
  plan_review: 'Plan review',
  in_progress: 'In progress',
  submitted: 'Submitted',
  verified: 'Verified',
};

export const AUDIT_EVENT_LABELS: Record<AuditEventType, string> = {
  START_FIELDWORK: 'Start fieldwork',
  FINISH_FIELDWORK: 'Finish fieldwork',
  ISSUE: 'Issue report',
  CLOSE: 'Close',
  CANCEL: 'Cancel audit',
};

export const FINDING_EVENT_LABELS: Record<FindingEventType, string> = {
  SUBMIT: 'Submit',
  WITHDRAW: 'Withdraw',
  CLASSIFY: 'Classify',
  RECORD_CONTAINMENT: 'Record containment',
  ACTION_VERIFIED: 'Corrective action verified (sent by the server)',
  CONFIRM_EFFECTIVE: 'Confirm effective',
  NOT_EFFECTIVE: 'Not effective',
  CLOSE: 'Close',
};

export const ACTION_EVENT_LABELS: Record<CorrectiveActionEventType, string> = {
  START: 'Start investigation',
  SUBMIT_PLAN: 'Submit root cause and plan',
  APPROVE_PLAN: 'Approve plan',
  RETURN_PLAN: 'Return plan',
  SUBMIT: 'Submit',
  VERIFY: 'Verify',
  RETURN: 'Return submission',
  REOPEN: 'Reopened after a failed effectiveness check',
  REQUEST_EXTENSION: 'Request extension',
  APPROVE_EXTENSION: 'Approve extension',
  REJECT_EXTENSION: 'Reject extension',
};

export const FINDING_CLASS_LABELS: Record<FindingClass, string> = { major: 'Major', minor: 'Minor', observation: 'Observation' };

export const ROOT_CAUSE_METHOD_LABELS: Record<RootCauseMethod, string> = {
  five_whys: 'Five whys',
  cause_and_effect: 'Cause-and-effect categories',
  other: 'Other',
};

/** Every workflow state by its code (the three machines share no code with different meanings). */
export const STATE_LABELS: Readonly<Record<string, string>> = { ...AUDIT_STATE_LABELS, ...FINDING_STATE_LABELS, ...ACTION_STATE_LABELS };

export const stateLabel = (state: string | null | undefined): string => (state ? (STATE_LABELS[state] ?? humanizeCode(state)) : '—');
export const findingClassLabel = (value: string | null | undefined, none = 'Not yet classified'): string =>
  value ? ((FINDING_CLASS_LABELS as Record<string, string>)[value] ?? humanizeCode(value)) : none;
export const rootCauseMethodLabel = (value: string | null | undefined): string =>
  value ? ((ROOT_CAUSE_METHOD_LABELS as Record<string, string>)[value] ?? humanizeCode(value)) : '—';

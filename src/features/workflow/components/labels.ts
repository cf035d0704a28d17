// Words people read for states and events; the codes stay as the machines name them.
export const STATE_LABELS: Record<string, string> = {
  planned: 'Planned',
  fieldwork: 'Fieldwork',
  reporting: 'Reporting',
  issued: 'Report issued',
  closed: 'Closed',
  cancelled: 'Cancelled',
  raised: 'Raised',
  in_review: 'In review',
  withdrawn: 'Withdrawn',
  containment: 'Containment',
  action_open: 'Action open',
  effectiveness_check: 'Effectiveness check',
  awaiting_signoff: 'Awaiting signature',
  assigned: 'Assigned',
  investigating: 'Investigating',
  plan_review: 'Plan review',
  in_progress: 'In progress',
  submitted: 'Submitted',
  verified: 'Verified',
};

export const EVENT_LABELS: Record<string, string> = {
  START_FIELDWORK: 'Start fieldwork',
  FINISH_FIELDWORK: 'Finish fieldwork',
  ISSUE: 'Issue report',
  CLOSE: 'Close',
  CANCEL: 'Cancel audit',
  SUBMIT: 'Submit',
  WITHDRAW: 'Withdraw',
  CLASSIFY: 'Classify',
  RECORD_CONTAINMENT: 'Record containment',
  CONFIRM_EFFECTIVE: 'Confirm effective',
  NOT_EFFECTIVE: 'Not effective',
  START: 'Start investigation',
  SUBMIT_PLAN: 'Submit root cause and plan',
  APPROVE_PLAN: 'Approve plan',
  RETURN_PLAN: 'Return plan',
  VERIFY: 'Verify',
  RETURN: 'Return submission',
  REQUEST_EXTENSION: 'Request extension',
  APPROVE_EXTENSION: 'Approve extension',
  REJECT_EXTENSION: 'Reject extension',
  // Trail-only events
  AUDIT_PLANNED: 'Audit planned',
  FINDING_RAISED: 'Finding raised',
  EXTENT_RUN: 'Extent of condition run',
  EXTENT_FINDINGS_RAISED: 'Linked findings raised',
  IMPACT_SCOPE_SET: 'Impact worksheet start date set',
  CONTAINMENT_DECIDED: 'Containment decision recorded',
  ACTION_ASSIGNED: 'Corrective action assigned',
  ACTION_VERIFIED: 'Corrective action verified (sent by the server)',
  REOPEN: 'Reopened after a failed effectiveness check',
  CHECKLIST_RUN: 'Checklist run',
  CHECKLIST_NOTES_UPDATED: 'Checklist notes updated',
  SIGNATURE_REFUSED: 'Signature refused (wrong password)',
};

export const CLASS_LABELS: Record<string, string> = { major: 'Major', minor: 'Minor', observation: 'Observation' };

export const METHOD_LABELS: Record<string, string> = {
  five_whys: 'Five whys',
  cause_and_effect: 'Cause-and-effect categories',
  other: 'Other',
};

export const stateLabel = (state: string) => STATE_LABELS[state] ?? state;
export const eventLabel = (event: string) => EVENT_LABELS[event] ?? event;

// What happened, as the trail and the record timelines say it (past tense).
// Workflow events are labelled per record, since SUBMIT and CLOSE mean different
// things on a finding and on a corrective action; every other trail event once.
import type { AuditEventType, CorrectiveActionEventType, FindingEventType } from '../../machines';
import { humanizeCode } from './humanize';

const AUDIT_TRAIL: Record<AuditEventType, string> = {
  START_FIELDWORK: 'Fieldwork started',
  FINISH_FIELDWORK: 'Fieldwork finished',
  ISSUE: 'Audit report issued',
  CLOSE: 'Audit closed',
  CANCEL: 'Audit cancelled',
};

const FINDING_TRAIL: Record<FindingEventType, string> = {
  SUBMIT: 'Finding submitted for review',
  WITHDRAW: 'Finding withdrawn',
  CLASSIFY: 'Finding classified',
  RECORD_CONTAINMENT: 'Containment recorded',
  ACTION_VERIFIED: 'Corrective action verified',
  CONFIRM_EFFECTIVE: 'Correction confirmed effective',
  NOT_EFFECTIVE: 'Correction found not effective',
  CLOSE: 'Finding closed',
};

const ACTION_TRAIL: Record<CorrectiveActionEventType, string> = {
  START: 'Investigation started',
  SUBMIT_PLAN: 'Root cause and plan submitted',
  APPROVE_PLAN: 'Plan approved',
  RETURN_PLAN: 'Plan returned',
  SUBMIT: 'Work and evidence submitted',
  VERIFY: 'Corrective action verified',
  RETURN: 'Submission returned',
  REOPEN: 'Reopened after a failed effectiveness check',
  REQUEST_EXTENSION: 'Extension requested',
  APPROVE_EXTENSION: 'Extension approved',
  REJECT_EXTENSION: 'Extension not approved',
};

/** Trail events written by services outside the record machines. */
export const TRAIL_EVENTS = [
  'AUDIT_PLANNED', 'FINDING_RAISED', 'EXTENT_RUN', 'EXTENT_FINDINGS_RAISED', 'IMPACT_SCOPE_SET', 'CONTAINMENT_DECIDED',
  'ACTION_ASSIGNED', 'ASSIGN', 'CHECKLIST_RUN', 'CHECKLIST_NOTES_UPDATED', 'SIGNATURE_REFUSED', 'SIGNATURE_PASSWORD_FAILED',
  'ACCOUNT_LOCKED', 'ACCOUNT_UNLOCKED', 'SIGNED_IN', 'SIGNED_OUT', 'SIGN_IN_FAILED', 'USER_CREATED', 'USER_UPDATED',
  'USER_DEACTIVATED', 'AREA_CREATED', 'AREA_UPDATED', 'CERTIFICATION_CREATED', 'CERTIFICATION_UPDATED',
  'CERTIFICATION_WITHDRAWN', 'EQUIPMENT_CREATED', 'EQUIPMENT_UPDATED', 'EVIDENCE_UPLOADED', 'EVIDENCE_SUPERSEDED',
  'EVIDENCE_DOWNLOADED', 'EVIDENCE_PREVIEWED', 'EVIDENCE_INTEGRITY_FAILED', 'INSPECTION_RECORDED', 'INSPECTION_CORRECTED',
  'INSPECTION_IMPORTED', 'MATERIAL_CREATED', 'MATERIAL_UPDATED', 'POLICY_UPDATED', 'TECHNIQUE_CREATED', 'REVISION_CREATED',
  'REVISION_EDITED', 'REVISION_APPROVED', 'REVISION_SUPERSEDED', 'TECHNIQUE_REGISTER_LINKS_SET',
] as const;
export type TrailEventType = (typeof TRAIL_EVENTS)[number];

export const TRAIL_EVENT_LABELS: Record<TrailEventType, string> = {
  AUDIT_PLANNED: 'Audit planned',
  FINDING_RAISED: 'Finding raised',
  EXTENT_RUN: 'Extent of condition run',
  EXTENT_FINDINGS_RAISED: 'Linked findings raised',
  IMPACT_SCOPE_SET: 'Impact worksheet start date set',
  CONTAINMENT_DECIDED: 'Containment decision recorded',
  ACTION_ASSIGNED: 'Corrective action assigned',
  ASSIGN: 'Corrective action assigned',
  CHECKLIST_RUN: 'Checklist run',
  CHECKLIST_NOTES_UPDATED: 'Checklist notes updated',
  SIGNATURE_REFUSED: 'Signature refused (wrong password)',
  SIGNATURE_PASSWORD_FAILED: 'Signature refused (wrong password)',
  ACCOUNT_LOCKED: 'Account locked',
  ACCOUNT_UNLOCKED: 'Account unlocked',
  SIGNED_IN: 'Signed in',
  SIGNED_OUT: 'Signed out',
  SIGN_IN_FAILED: 'Sign-in failed',
  USER_CREATED: 'Person added',
  USER_UPDATED: 'Person changed',
  USER_DEACTIVATED: 'Person deactivated',
  AREA_CREATED: 'Area added',
  AREA_UPDATED: 'Area changed',
  CERTIFICATION_CREATED: 'Certification recorded',
  CERTIFICATION_UPDATED: 'Certification changed',
  CERTIFICATION_WITHDRAWN: 'Certification withdrawn',
  EQUIPMENT_CREATED: 'Equipment added',
  EQUIPMENT_UPDATED: 'Equipment changed',
  EVIDENCE_UPLOADED: 'Evidence uploaded',
  EVIDENCE_SUPERSEDED: 'Evidence superseded',
  EVIDENCE_DOWNLOADED: 'Evidence downloaded',
  EVIDENCE_PREVIEWED: 'Evidence previewed',
  EVIDENCE_INTEGRITY_FAILED: 'Evidence failed its integrity check',
  INSPECTION_RECORDED: 'Inspection recorded',
  INSPECTION_CORRECTED: 'Inspection corrected',
  INSPECTION_IMPORTED: 'Inspection imported',
  MATERIAL_CREATED: 'Material added',
  MATERIAL_UPDATED: 'Material changed',
  POLICY_UPDATED: 'Policy changed',
  TECHNIQUE_CREATED: 'Technique created',
  REVISION_CREATED: 'Revision started',
  REVISION_EDITED: 'Revision edited',
  REVISION_APPROVED: 'Revision approved',
  REVISION_SUPERSEDED: 'Revision superseded',
  TECHNIQUE_REGISTER_LINKS_SET: 'People and equipment linked',
};

const BY_RECORD: Record<string, Record<string, string>> = { audit: AUDIT_TRAIL, finding: FINDING_TRAIL, action: ACTION_TRAIL };

/** The words for a trail event of a record type; an unknown code is put in words, never shown raw. */
export function trailEventLabel(recordType: string, event: string): string {
  return BY_RECORD[recordType]?.[event] ?? (TRAIL_EVENT_LABELS as Record<string, string>)[event] ?? humanizeCode(event);
}

export const TRAIL_EVENT_LABELS_BY_RECORD = { audit: AUDIT_TRAIL, finding: FINDING_TRAIL, action: ACTION_TRAIL } as const;

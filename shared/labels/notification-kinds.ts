// What each kind of message Whorl sends is, in words for the person reading it.
const KIND_LABELS: Record<string, string> = {
  'action-assigned': 'Corrective action assigned',
  'action-plan-submitted': 'Plan waiting for review',
  'action-plan-approved': 'Plan approved',
  'action-plan-returned': 'Plan returned',
  'action-submitted': 'Corrective action waiting for verification',
  'action-returned': 'Submission returned',
  'action-reopened': 'Corrective action reopened',
  'action-extension-requested': 'Extension requested',
  'action-extension-approved': 'Extension approved',
  'action-extension-rejected': 'Extension not approved',
  'action-due-soon': 'Reminder: corrective action due soon',
  'action-overdue': 'Reminder: corrective action overdue',
  'action-escalated': 'Escalation: corrective action overdue',
  'finding-submitted': 'Finding waiting for classification',
  'finding-withdrawn': 'Finding withdrawn',
  'finding-action-needed': 'Finding needs a corrective action',
  'finding-effectiveness-check': 'Effectiveness check to do',
  'finding-awaiting-signoff': 'Finding waiting for your signature',
  'finding-signoff-reminder': 'Reminder: finding waiting for signature',
  'finding-closed': 'Finding closed',
  'audit-report-issued': 'Audit report issued',
  'audit-cancelled': 'Audit cancelled',
  'audit-coming-up': 'Reminder: audit coming up',
  'certificate-expiry': 'Reminder: certificate expiry',
  'vision-exam': 'Reminder: near-vision exam',
  'daily-digest': 'Daily digest',
};

export function notificationKindLabel(kind: string): string {
  return KIND_LABELS[kind] ?? 'Notice';
}

// The workflow screens' words come from the shared labels, so screens, PDFs and e-mails say the same.
import { FINDING_CLASS_LABELS, ROOT_CAUSE_METHOD_LABELS, STATE_LABELS, stateLabel, trailEventLabel } from '../../../../shared/labels';
import { ACTION_EVENT_LABELS, AUDIT_EVENT_LABELS, FINDING_EVENT_LABELS } from '../../../../shared/labels';

export { STATE_LABELS, stateLabel };

/** Button words for the events a person may send (audit, finding and action events share some codes and words). */
export const EVENT_LABELS: Readonly<Record<string, string>> = { ...ACTION_EVENT_LABELS, ...FINDING_EVENT_LABELS, ...AUDIT_EVENT_LABELS };

export const CLASS_LABELS: Readonly<Record<string, string>> = FINDING_CLASS_LABELS;
export const METHOD_LABELS: Readonly<Record<string, string>> = ROOT_CAUSE_METHOD_LABELS;

export const eventLabel = (event: string, recordType?: 'audit' | 'finding' | 'action') =>
  recordType ? trailEventLabel(recordType, event) : (EVENT_LABELS[event] ?? trailEventLabel('', event));

import type { InspectionResult } from '../schemas/inspection';
import type { ContainmentDecisionKind } from '../schemas/impact';

export const INSPECTION_RESULT_LABELS: Record<InspectionResult, string> = {
  accept: 'Accept',
  reject: 'Reject',
  indication_recorded: 'Indication recorded',
};

export const CONTAINMENT_DECISION_LABELS: Record<ContainmentDecisionKind, string> = {
  reinspect: 'Re-inspect',
  recall_report: 'Recall report',
  accept_justified: 'Accept with justification',
  not_affected: 'Not affected',
};

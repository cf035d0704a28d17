// The checklist rules and their result statuses in the words people read.
// Typed against the engine's unions: a new rule id without a label does not compile.
import type { RuleId, RuleStatus, Verdict } from '../domain/checklist/types';

export const RULE_LABELS: Record<RuleId, string> = {
  'orientation-coverage': 'Orientation coverage',
  'center-effect': 'Center effect',
  'scan-index': 'Scan index',
  'penetration-depth': 'Penetration depth',
  'phase-separation': 'Flaw and lift-off signals apart',
  'lift-off': 'Coating and lift-off',
  'edge-effect': 'Edge effect',
  'fill-factor': 'Fill factor',
  'limit-frequency': 'Limit frequency',
  ferromagnetic: 'Ferromagnetic material',
  'reference-standard': 'Reference standard',
  'coil-size': 'Coil size against crack length',
  'coil-mode': 'Coil mode (absolute or differential)',
  personnel: 'People',
  equipment: 'Equipment',
  'demonstrated-capability': 'Demonstrated capability (probability of detection)',
};

export const RULE_STATUS_LABELS: Record<RuleStatus, string> = {
  pass: 'Pass',
  fail: 'Fail',
  warn: 'Warning',
  not_applicable: 'Not applicable',
};

export const VERDICT_LABELS: Record<Verdict, string> = {
  conforms: 'Conforms',
  'does-not-conform': 'Does not conform',
};

/** A rule's label; a rule name that is not an engine id (a clause typed by hand) is shown as written. */
export const ruleLabel = (rule: string | null | undefined): string => {
  if (!rule) return '—';
  // A finding raised from a checklist result stores "checklist rule <id>".
  const id = rule.replace(/^checklist rule /, '');
  return (RULE_LABELS as Record<string, string>)[id] ?? rule;
};

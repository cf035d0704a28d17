// The kinds of record the trail knows, in words.
import { humanizeCode } from './humanize';

export const RECORD_TYPE_LABELS: Readonly<Record<string, string>> = {
  audit: 'Audit',
  finding: 'Finding',
  action: 'Corrective action',
  technique: 'Technique',
  evidence: 'Evidence',
  user: 'Person',
  area: 'Area',
  certification: 'Certification',
  equipment: 'Equipment',
  inspection: 'Inspection',
  material: 'Material',
  policy: 'Policy',
};

export const recordTypeLabel = (type: string) => RECORD_TYPE_LABELS[type] ?? humanizeCode(type);

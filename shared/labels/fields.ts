// The names of record fields as people read them: in validation messages
// ("Calibration due: …", never "calibrationDueOn: …") and in the trail's
// account of what changed ("Area: Structures Bay", never "areaId: 2").
import { humanizeCode } from './humanize';

export const FIELD_LABELS: Readonly<Record<string, string>> = {
  // workflow records
  title: 'Title',
  criteria: 'Audit criteria',
  areaId: 'Area',
  areaName: 'Area',
  leadAuditorId: 'Lead auditor',
  leadUserId: 'Area lead',
  plannedStart: 'Planned start',
  plannedEnd: 'Planned end',
  techniques: 'Techniques in scope',
  technique: 'Technique',
  techniqueId: 'Technique',
  techniqueCode: 'Technique',
  techniqueRevisionId: 'Technique revision',
  revisionId: 'Technique revision',
  auditId: 'Audit',
  findingId: 'Finding',
  actionId: 'Corrective action',
  checklistRunId: 'Checklist run',
  resultIndex: 'Checklist result',
  rule: 'Rule or clause',
  requirement: 'Requirement',
  objectiveEvidence: 'Objective evidence',
  class: 'Class',
  proposedClass: 'Proposed class',
  note: 'Note',
  notes: 'Notes',
  description: 'Description',
  containment: 'Containment',
  containmentDescription: 'Containment',
  classificationNote: 'Classification note',
  effectivenessNote: 'Effectiveness note',
  notEffectiveReason: 'Why it was not effective',
  closureNote: 'Closure note',
  withdrawReason: 'Reason for withdrawal',
  cancelReason: 'Reason for cancelling',
  returnReason: 'Reason for returning',
  reopenReason: 'Reason for reopening',
  reason: 'Reason',
  password: 'Password',
  version: 'Version',
  state: 'State',
  status: 'Status',
  dueDate: 'Due date',
  containmentDueDate: 'Containment due',
  ownerId: 'Owner',
  authorId: 'Raised by',
  userId: 'Person',
  rootCause: 'Root cause',
  method: 'Root-cause method',
  plan: 'Plan',
  summary: 'What was done',
  submissionSummary: 'What was done',
  pendingExtension: 'Extension requested',
  verifiedAt: 'Verified',
  closedAt: 'Closed',
  signature: 'Signature',
  decision: 'Decision',
  inspectionIds: 'Inspections',
  revisionIds: 'Technique revisions',
  runId: 'Extent run',
  since: 'Worksheet starts',
  impactSince: 'Worksheet starts',
  // registers
  calibratedOn: 'Calibrated on',
  calibrationDueOn: 'Calibration due',
  serialNumber: 'Serial number',
  kind: 'Kind',
  model: 'Model',
  conductivityIacs: 'Conductivity (%IACS)',
  material: 'Material',
  notches: 'Notches',
  label: 'Label',
  angleDeg: 'Angle (°)',
  depthMm: 'Depth (mm)',
  lengthMm: 'Length (mm)',
  edgeDistanceMm: 'Distance from the edge (mm)',
  orientation: 'Orientation',
  equipmentId: 'Equipment',
  equipmentIds: 'Equipment',
  performerIds: 'People who perform it',
  scheme: 'Certification scheme',
  level: 'Level',
  certificateNumber: 'Certificate number',
  issuedOn: 'Issued on',
  expiresOn: 'Expires on',
  nearVisionExamOn: 'Near-vision exam',
  colourVisionCheckedOn: 'Colour vision checked',
  sectors: 'Sectors',
  // inspections
  performedOn: 'Date',
  partNumber: 'Part number',
  workOrder: 'Work order',
  customer: 'Customer',
  inspectorId: 'Inspector',
  inspectorEmail: 'Inspector e-mail',
  result: 'Result',
  instrumentId: 'Instrument',
  probeId: 'Probe',
  referenceStandardId: 'Reference standard',
  instrumentSerial: 'Instrument serial',
  probeSerial: 'Probe serial',
  referenceStandardSerial: 'Reference standard serial',
  date: 'Date',
  revision: 'Revision',
  // people
  email: 'E-mail',
  displayName: 'Name',
  name: 'Name',
  roles: 'Roles',
  role: 'Role',
  active: 'Active',
  mailDigest: 'Daily digest',
  // techniques
  code: 'Code',
  coils: 'Coils',
  frequenciesHz: 'Frequencies (Hz)',
  flaws: 'Flaws',
  part: 'Part',
  form: 'Part form',
  thicknessMm: 'Thickness (mm)',
  diameterMm: 'Diameter (mm)',
  wallMm: 'Wall (mm)',
  location: 'Location',
  relativePermeability: 'Relative permeability μr',
  saturated: 'Magnetic saturation',
  scan: 'Scan',
  indexMm: 'Scan index (mm)',
  minEdgeDistanceMm: 'Closest approach to an edge (mm)',
  edgeGuide: 'Edge guide',
  metalAboveMm: 'Metal above the flaw (mm)',
  shielded: 'Shielded',
  reference: 'Reference standard',
  policy: 'Policy',
  mode: 'Mode',
  type: 'Type',
  // lists
  q: 'Search',
  page: 'Page',
  pageSize: 'Rows per page',
  from: 'From',
  to: 'To',
  limit: 'Limit',
  record: 'Record',
};

/** One item of a list, by the list's key: coils[0] → "Coil 1". */
const ITEM_LABELS: Readonly<Record<string, string>> = {
  coils: 'Coil',
  frequenciesHz: 'Frequency',
  flaws: 'Flaw',
  notches: 'Notch',
  techniques: 'Technique',
  plan: 'Plan step',
  inspectionIds: 'Inspection',
  revisionIds: 'Technique revision',
  roles: 'Role',
  sectors: 'Sector',
  performerIds: 'Person',
  equipmentIds: 'Item',
};

export const fieldLabel = (key: string): string => FIELD_LABELS[key] ?? humanizeCode(key);

/**
 * A validation path in words: ["coils", 0, "frequenciesHz", 1] → "Coil 1, frequency 2";
 * ["calibrationDueOn"] → "Calibration due". Empty for a path at the top of the input.
 */
export function fieldPathLabel(path: readonly (string | number)[]): string {
  const parts: string[] = [];
  for (let i = 0; i < path.length; i += 1) {
    const segment = path[i];
    const next = path[i + 1];
    if (typeof segment === 'number' || /^\d+$/.test(String(segment))) {
      parts.push(`item ${Number(segment) + 1}`);
      continue;
    }
    if (typeof next === 'number' || (next !== undefined && /^\d+$/.test(String(next)))) {
      parts.push(`${ITEM_LABELS[segment] ?? fieldLabel(segment)} ${Number(next) + 1}`);
      i += 1;
      continue;
    }
    parts.push(fieldLabel(segment));
  }
  return parts.map((part, index) => (index === 0 ? part : part[0].toLowerCase() + part.slice(1))).join(', ');
}

/** A CSV import issue as one sentence: "Row 7, Work order: enter the work order", "Row 9: the same inspection as row 4". */
export function rowIssueText(issue: { row: number; field: string; message: string }): string {
  const field = issue.field && !/^\(.*\)$/.test(issue.field) ? issue.field.trim() : '';
  if (!field) return `Row ${issue.row}: ${issue.message}`;
  const camel = field.replace(/[\s_-]+(\w)/g, (_match, letter: string) => letter.toUpperCase());
  const label = FIELD_LABELS[camel] ?? field[0].toUpperCase() + field.slice(1);
  return `Row ${issue.row}, ${label}: ${issue.message}`;
}

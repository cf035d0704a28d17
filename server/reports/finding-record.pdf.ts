// The PDF finding record: the finding, its containment, extent of condition and
// impact worksheet, the corrective action (root cause, plan), the evidence with
// hashes, verification, the closure signature and the record's trail.
import type { EvidenceList, ExportEnvelope, FindingExport } from '../services/record-export.service';
import type { PresentedTrailEntryView } from '../../shared/schemas/trail';
import { findingClassLabel, formatResultValues, rootCauseMethodLabel, ruleLabel, stateLabel } from '../../shared/labels';
import { formatDate } from '../../shared/format/dates';
import { changeLineText } from '../presenters/trail.presenter';
import { at, createReportDocument, ensureSpace, fields, finishReport, heading, mono, paragraph, signatureBlock, small, subheading, title, type Doc, type ReportOrganisation } from './pdf-document';
import { extentSection, impactSection } from './impact-sections.pdf';

export interface FindingRecordExtras {
  organisation: ReportOrganisation;
  /** The trail's head when the report is printed, shown on its last line (compare with the trail and its anchors). */
  trailHead?: { seq: number; hash: string };
  /** The export's trail entries presented in words (trail-read.service presentTrail). */
  trail: PresentedTrailEntryView[];
}

const size = (bytes: number) => (bytes >= 1_048_576 ? `${(bytes / 1_048_576).toFixed(1)} MB` : bytes >= 1024 ? `${Math.round(bytes / 1024)} kB` : `${bytes} B`);

function evidence(doc: Doc, label: string, list: EvidenceList | null) {
  subheading(doc, label);
  if (!list) return paragraph(doc, 'None.');
  if (!list.shown) return paragraph(doc, 'Not shown: your role may not see this evidence.');
  if (list.items.length === 0) return paragraph(doc, 'No files.');
  for (const item of list.items) {
    paragraph(doc, `${item.fileName} (${item.mediaType}, ${size(item.sizeBytes)})`, { size: 9.5 });
    small(doc, `Uploaded by ${item.uploadedBy.displayName} on ${at(doc, item.uploadedAt)}${item.superseded ? ` · superseded ${at(doc, item.superseded.at)}: ${item.superseded.reason}` : ''}`);
    mono(doc, `SHA-256 ${item.sha256}`);
  }
}

export async function renderFindingRecord(exported: ExportEnvelope<FindingExport>, generatedAt: Date, extras: FindingRecordExtras): Promise<Buffer> {
  const { record: finding, action, evidence: files, extent, impact } = exported.content;
  const doc = createReportDocument({ title: `Finding record ${finding.number}`, subject: finding.title, organisation: extras.organisation });
  title(doc, `Finding record ${finding.number}`, finding.title);

  heading(doc, 'Finding');
  fields(doc, [
    ['State', stateLabel(finding.state)],
    ['Class', findingClassLabel(finding.class)],
    ['Area', finding.areaName],
    ['Audit', finding.auditTitle ? `#${finding.auditId}: ${finding.auditTitle}` : null],
    ['Technique', finding.techniqueCode],
    ['Rule', ruleLabel(finding.rule)],
    ['Raised by', `${finding.author?.displayName ?? 'unknown'} on ${at(doc, finding.createdAt)}`],
    ['Corrective action due', finding.dueDate ? formatDate(finding.dueDate) : null],
  ]);
  subheading(doc, 'Requirement');
  paragraph(doc, finding.requirement);
  subheading(doc, 'Objective evidence');
  paragraph(doc, finding.objectiveEvidence);
  const values = formatResultValues(finding.resultValues);
  if (values) small(doc, `Checklist values: ${values}`);
  if (finding.classificationNote) {
    subheading(doc, 'Classification note');
    paragraph(doc, finding.classificationNote);
  }
  if (finding.withdrawReason) {
    subheading(doc, 'Withdrawn');
    paragraph(doc, finding.withdrawReason);
  }

  heading(doc, 'Containment');
  paragraph(doc, finding.containment ?? (finding.class === 'major' ? 'Not yet recorded.' : 'Not required for this class.'));
  if (finding.containmentDueDate) small(doc, `Containment due ${formatDate(finding.containmentDueDate)}`);
  extentSection(doc, extent);
  impactSection(doc, impact);

  heading(doc, 'Corrective action');
  if (!action) paragraph(doc, 'No corrective action assigned.');
  else {
    fields(doc, [
      ['Action', `${action.number}, ${stateLabel(action.state)}`],
      ['Owner', action.owner?.displayName],
      ['Due', action.dueDate ? formatDate(action.dueDate) : null],
      ['Root-cause method', action.method ? rootCauseMethodLabel(action.method) : null],
      ['Verified', action.verifiedAt ? at(doc, action.verifiedAt) : null],
    ]);
    subheading(doc, 'Root cause');
    paragraph(doc, action.rootCause ?? 'Not yet submitted.');
    subheading(doc, 'Plan');
    paragraph(doc, action.plan.length ? action.plan.map((item, i) => `${i + 1}. ${item.description} (due ${formatDate(item.dueDate)})`).join('\n') : 'Not yet submitted.');
    if (action.submissionSummary) {
      subheading(doc, 'What was done');
      paragraph(doc, action.submissionSummary);
    }
    if (action.pendingExtension) small(doc, `Extension requested to ${formatDate(action.pendingExtension.dueDate)}: ${action.pendingExtension.reason}`);
  }

  heading(doc, 'Evidence');
  evidence(doc, 'Files on the finding', files.finding);
  evidence(doc, 'Files on the corrective action', files.action);

  heading(doc, 'Verification');
  const verify = action?.signatures.filter((s) => s.event === 'VERIFY') ?? [];
  if (verify.length === 0) paragraph(doc, 'The corrective action has not been verified.');
  for (const signature of verify) signatureBlock(doc, signature);
  if (finding.effectivenessNote) {
    subheading(doc, 'Effectiveness confirmed');
    paragraph(doc, finding.effectivenessNote);
  }
  if (finding.notEffectiveReason) {
    subheading(doc, 'Found not effective');
    paragraph(doc, finding.notEffectiveReason);
  }

  heading(doc, 'Closure');
  const closure = finding.signatures.filter((s) => s.event === 'CLOSE');
  if (closure.length === 0) paragraph(doc, finding.state === 'closed' ? (finding.closureNote ?? 'Closed without a signature (observation).') : 'Not closed.');
  for (const signature of closure) signatureBlock(doc, signature);
  if (finding.closureNote && closure.length) small(doc, `Closure note: ${finding.closureNote}`);

  heading(doc, 'Trail');
  for (const entry of extras.trail) {
    ensureSpace(doc, 30);
    paragraph(doc, `${at(doc, entry.at)} · ${entry.recordLabel} · ${entry.eventLabel} · ${entry.userName ?? 'Whorl (automatic)'} · entry ${entry.seq}`, { size: 8.5 });
    const details = entry.details.map(changeLineText).join('; ');
    if (details) small(doc, details.length > 800 ? `${details.slice(0, 800)}…` : details);
  }

  return finishReport(doc, { recordLabel: `Finding record ${finding.number}`, sha256: exported.sha256, generatedAt, trailHead: extras.trailHead });
}

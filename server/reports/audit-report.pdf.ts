// The PDF audit report: scope, criteria, auditor and dates; each technique's
// checklist results with their values and basis; the findings with class and
// state; the issuing signature; page numbers, the record hash and the caution on every page.
import type { AuditExport, ExportEnvelope } from '../services/record-export.service';
import type { IssuedFindingsSnapshot } from '../services/audit-issue-snapshot';
import type { ChecklistOutput } from '../../shared/domain/checklist';
import type { Technique } from '../../shared/schemas/technique';
import { VERDICT_LABELS, basisInWords, findingClassLabel, formatResultValues, ruleLabel, stateLabel } from '../../shared/labels';
import { formatDate } from '../../shared/format/dates';
import { at, createReportDocument, ensureSpace, fields, finishReport, heading, paragraph, signatureBlock, small, statusLine, subheading, title, type Doc, type ReportOrganisation } from './pdf-document';
import { formatHz, formatNumber } from './format-values';

export { ruleLabel };

export interface AuditReportExtras {
  organisation: ReportOrganisation;
  /** The trail's head when the report is printed, shown on its last line (compare with the trail and its anchors). */
  trailHead?: { seq: number; hash: string };
  /** The findings as they stood when the report was issued; null when not issued or issued before snapshots were kept. */
  issuedFindings: IssuedFindingsSnapshot | null;
}

function computedValues(doc: Doc, output: ChecklistOutput, technique: Technique | undefined) {
  const v = output.values;
  const lines: string[] = [];
  lines.push(`σ = ${formatNumber(v.conductivityMsPerM)} MS/m, ρ = ${formatNumber(v.resistivityMicroOhmCm)} µΩ·cm`);
  v.standardDepthMm.forEach((perFrequency, coil) => {
    perFrequency.forEach((delta, index) => {
      const frequency = technique?.coils[coil]?.frequenciesHz[index];
      const at = frequency ? ` at ${formatHz(frequency)}` : ` (frequency ${index + 1})`;
      lines.push(`Coil ${coil + 1}${at}: δ = ${formatNumber(delta)} mm, 3δ = ${formatNumber(v.effectiveDepthMm[coil][index])} mm`);
    });
  });
  if (v.limitFrequencyHz !== null && v.limitFrequencyHz !== undefined) lines.push(`f_g = ${formatHz(v.limitFrequencyHz)}`);
  v.fillFactor.forEach((eta, coil) => {
    if (eta !== null && eta !== undefined) lines.push(`Coil ${coil + 1}: fill factor η = ${formatNumber(eta)}`);
  });
  small(doc, lines.join('\n'));
}

export async function renderAuditReport(exported: ExportEnvelope<AuditExport>, generatedAt: Date, extras: AuditReportExtras): Promise<Buffer> {
  const { record: audit, runTechniques } = exported.content;
  const doc = createReportDocument({ title: `Audit report: ${audit.title}`, subject: `Audit ${audit.id}`, organisation: extras.organisation });
  title(doc, 'Internal audit report', audit.title);

  const issued = audit.signatures.find((s) => s.event === 'ISSUE');
  if (!issued) {
    paragraph(doc, `Not issued: this report shows the audit as it stands (${stateLabel(audit.state)}). It becomes the audit report when a quality manager issues it with a signature.`, {
      colour: '#a15c00',
    });
    doc.moveDown(0.4);
  }

  heading(doc, 'Scope and criteria');
  fields(doc, [
    ['Audit', `#${audit.id}, ${stateLabel(audit.state)}`],
    ['Area', audit.areaName],
    ['Lead auditor', audit.leadAuditor?.displayName],
    ['Planned', `${formatDate(audit.plannedStart)} to ${formatDate(audit.plannedEnd)}`],
    ['Issued', issued ? at(doc, issued.signedAt) : 'not yet'],
    ['Closed', audit.closedAt ? at(doc, audit.closedAt) : null],
  ]);
  subheading(doc, 'Techniques in scope');
  paragraph(doc, audit.scope.length ? audit.scope.map((item) => `• ${item.code} rev ${item.revision}: ${item.title}`).join('\n') : 'None recorded.');
  subheading(doc, 'Audit criteria');
  paragraph(doc, audit.criteria);

  heading(doc, 'Checklist results');
  if (audit.checklistRuns.length === 0) paragraph(doc, 'No checklist was run in this audit.');
  // Oldest first in print: the order the auditor worked in.
  for (const run of [...audit.checklistRuns].reverse()) {
    const output = run.output as ChecklistOutput;
    subheading(doc, `${run.techniqueCode} rev ${run.techniqueRevision}: ${VERDICT_LABELS[output.verdict].toLowerCase()}`);
    small(
      doc,
      `Run by ${run.runBy?.displayName ?? 'unknown'} on ${at(doc, run.runAt)} · ${output.summary.pass} pass, ${output.summary.fail} fail, ${output.summary.warn} warning(s), ${output.summary.not_applicable} not applicable`,
    );
    small(doc, run.engineNote);
    if (run.changes && run.changes.lines.length > 0) small(doc, `Changed since the previous run: ${run.changes.lines.join('; ')}.`);
    computedValues(doc, output, runTechniques[String(run.id)]);
    doc.moveDown(0.3);
    output.results.forEach((result, index) => {
      ensureSpace(doc, 50);
      statusLine(doc, result.status, `${ruleLabel(result.rule)}${result.flaw ? ` · flaw ${result.flaw}` : ''}${result.coil !== undefined ? ` · coil ${result.coil + 1}` : ''}`);
      paragraph(doc, result.message, { size: 9.5 });
      const values = formatResultValues(result.values as Record<string, unknown>);
      if (values) small(doc, `Values: ${values}`);
      small(doc, `Basis: ${basisInWords(result.basis)}`);
      const note = run.notes[String(index)];
      if (note) small(doc, `Auditor's note: ${note}`);
      doc.moveDown(0.3);
    });
  }

  findingsSection(doc, audit, issued !== undefined, extras.issuedFindings);

  heading(doc, 'Signatures');
  if (audit.signatures.length === 0) paragraph(doc, 'Not signed.');
  for (const signature of audit.signatures) signatureBlock(doc, signature);

  return finishReport(doc, { recordLabel: `Audit report #${audit.id}`, sha256: exported.sha256, generatedAt, trailHead: extras.trailHead });
}

type AuditFinding = AuditExport['record']['findings'][number];

/**
 * An issued report prints its findings as they stood at issue; an audit issued
 * before those were kept says so, and prints today's states as today's.
 */
function findingsSection(doc: Doc, audit: AuditExport['record'], isIssued: boolean, snapshot: IssuedFindingsSnapshot | null) {
  heading(doc, 'Findings');
  const line = (finding: { number: string; title: string; class: string | null; state: string; dueDate: string | null }) => {
    paragraph(doc, `${finding.number}: ${finding.title}`);
    small(doc, `Class: ${findingClassLabel(finding.class)} · State: ${stateLabel(finding.state)}${finding.dueDate ? ` · Due ${formatDate(finding.dueDate)}` : ''}`);
  };
  if (isIssued && snapshot) {
    small(doc, `As they stood when the report was issued (${at(doc, snapshot.takenAt)}).`);
    if (snapshot.findings.length === 0) paragraph(doc, 'No findings were raised.');
    snapshot.findings.forEach(line);
    return;
  }
  if (isIssued) small(doc, 'This report was issued before Whorl kept the findings as they stood at issue: the states below are those of today.');
  else small(doc, 'The states below are those of today.');
  if (audit.findings.length === 0) paragraph(doc, 'No findings were raised.');
  audit.findings.forEach((finding: AuditFinding) => line(finding));
}

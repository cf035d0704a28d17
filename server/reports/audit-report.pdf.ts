// The PDF audit report: scope, criteria, auditor and dates; each technique's
// checklist results with their values and basis; the findings with class and
// state; the issuing signature; page numbers, the record hash and the caution on every page.
import type { AuditExport, ExportEnvelope } from '../services/record-export.service';
import type { ChecklistOutput } from '../../shared/domain/checklist';
import type { Technique } from '../../shared/schemas/technique';
import { CAUTION_TEXT, createReportDocument, fields, finishReport, heading, paragraph, signatureBlock, small, statusLine, subheading, title, utc, type Doc } from './pdf-document';
import { formatHz, formatNumber, formatValues } from './format-values';

const RULE_LABELS: Record<string, string> = {
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
  'coil-size': 'Coil size',
  'coil-mode': 'Coil mode',
  personnel: 'Personnel',
  equipment: 'Equipment',
};

export const ruleLabel = (rule: string) => RULE_LABELS[rule] ?? rule;

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

export async function renderAuditReport(exported: ExportEnvelope<AuditExport>, generatedAt: Date): Promise<Buffer> {
  const { record: audit, runTechniques } = exported.content;
  const doc = createReportDocument({ title: `Audit report: ${audit.title}`, subject: `Audit ${audit.id}` });
  title(doc, 'Internal audit report', audit.title);

  const issued = audit.signatures.find((s) => s.event === 'ISSUE');
  if (!issued) {
    paragraph(doc, `Not issued: this report shows the audit in state "${audit.state}". It becomes the audit report when a quality manager issues it with a signature.`, {
      colour: '#a15c00',
    });
    doc.moveDown(0.4);
  }

  heading(doc, 'Scope and criteria');
  fields(doc, [
    ['Audit', `#${audit.id}, state ${audit.state}`],
    ['Area', audit.areaName],
    ['Lead auditor', audit.leadAuditor?.displayName],
    ['Planned', `${audit.plannedStart} to ${audit.plannedEnd}`],
    ['Issued', issued ? utc(issued.signedAt) : 'not yet'],
    ['Closed', audit.closedAt ? utc(audit.closedAt) : null],
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
    subheading(doc, `${run.techniqueCode} rev ${run.techniqueRevision}: ${output.verdict === 'conforms' ? 'conforms' : 'does not conform'}`);
    small(
      doc,
      `Run by ${run.runBy?.displayName ?? 'unknown'} at ${utc(run.runAt)} · ${output.summary.pass} pass, ${output.summary.fail} fail, ${output.summary.warn} warn, ${output.summary.not_applicable} not applicable`,
    );
    small(doc, run.engineNote);
    if (run.changes && run.changes.lines.length > 0) small(doc, `Changed since the previous run: ${run.changes.lines.join('; ')}.`);
    computedValues(doc, output, runTechniques[String(run.id)]);
    doc.moveDown(0.3);
    output.results.forEach((result, index) => {
      if (doc.y > doc.page.height - doc.page.margins.bottom - 50) doc.addPage();
      statusLine(doc, result.status, `${ruleLabel(result.rule)}${result.flaw ? ` · flaw ${result.flaw}` : ''}${result.coil !== undefined ? ` · coil ${result.coil + 1}` : ''}`);
      paragraph(doc, result.message, { size: 9.5 });
      const values = formatValues(result.values as Record<string, unknown>);
      if (values) small(doc, `Values: ${values}`);
      small(doc, `Basis: ${result.basis}`);
      const note = run.notes[String(index)];
      if (note) small(doc, `Auditor's note: ${note}`);
      doc.moveDown(0.3);
    });
  }

  heading(doc, 'Findings');
  if (audit.findings.length === 0) paragraph(doc, 'No findings were raised.');
  for (const finding of audit.findings) {
    paragraph(doc, `${finding.number}: ${finding.title}`);
    small(doc, `Class: ${finding.class ?? 'not yet classified'} · State: ${finding.state}${finding.dueDate ? ` · Due ${finding.dueDate}` : ''}`);
  }

  heading(doc, 'Signatures');
  if (audit.signatures.length === 0) paragraph(doc, 'Not signed.');
  for (const signature of audit.signatures) signatureBlock(doc, signature);

  heading(doc, 'Caution');
  paragraph(doc, CAUTION_TEXT, { size: 9 });

  return finishReport(doc, { recordLabel: `Audit report #${audit.id}`, sha256: exported.sha256, generatedAt });
}

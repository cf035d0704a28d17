// The finding record's extent-of-condition and impact sections: the techniques
// found with the same weakness, and the containment worksheet row by row.
import type { FindingFamilyView } from '../../shared/schemas/extent';
import type { FindingImpactView } from '../../shared/schemas/impact';
import { COIL_TYPE_LABELS, CONTAINMENT_DECISION_LABELS, INSPECTION_RESULT_LABELS, ORIENTATION_LABELS, findingClassLabel, ruleLabel, stateLabel } from '../../shared/labels';
import { formatDate } from '../../shared/format/dates';
import { at, fields, heading, paragraph, small, subheading, type Doc } from './pdf-document';

export function extentSection(doc: Doc, extent: FindingFamilyView) {
  heading(doc, 'Extent of condition');
  if (extent.extentOf) paragraph(doc, `Raised from the extent of condition of ${extent.extentOf.number}: ${extent.extentOf.title} (${stateLabel(extent.extentOf.state)}).`);
  const run = extent.latestRun;
  if (!run) paragraph(doc, extent.extentPossible ? 'No extent run recorded.' : (extent.extentUnavailableReason ?? 'Not applicable.'));
  else {
    fields(doc, [
      ['Latest run', `#${run.id} by ${run.runBy.name} on ${at(doc, run.runAt)}`],
      ['Rule', ruleLabel(run.rule)],
      ['Flaw orientation / coil type', `${run.flawOrientation ? ORIENTATION_LABELS[run.flawOrientation as keyof typeof ORIENTATION_LABELS] ?? run.flawOrientation : '—'} / ${run.coilType ? COIL_TYPE_LABELS[run.coilType as keyof typeof COIL_TYPE_LABELS] ?? run.coilType : '—'}`],
      ['Engine / policy version', `${run.engineVersion} / ${run.policyVersion}`],
      ['Approved techniques evaluated', run.evaluatedCount],
    ]);
    subheading(doc, `Failing the same rule (${run.failing.length})`);
    for (const technique of run.failing) {
      const marks = [technique.isFindingTechnique ? 'this finding' : null, technique.sameOrientation ? 'same orientation' : null, technique.sameCoilType ? 'same coil type' : null].filter(Boolean);
      paragraph(doc, `${technique.code} rev ${technique.revision}: ${technique.title}${marks.length ? ` (${marks.join(', ')})` : ''}`, { size: 9.5 });
      for (const failure of technique.failures) small(doc, failure.message);
    }
  }
  if (extent.members.length) {
    subheading(doc, 'Linked findings');
    for (const member of extent.members) {
      paragraph(doc, `${member.number} ${member.techniqueCode ?? ''}: ${stateLabel(member.state)}, class ${member.class ? findingClassLabel(member.class) : `proposed ${findingClassLabel(member.proposedClass, '—')}`}`, { size: 9.5 });
    }
  }
}

export function impactSection(doc: Doc, impact: FindingImpactView) {
  heading(doc, 'Impact on past inspections');
  if (impact.unavailableReason) {
    paragraph(doc, impact.unavailableReason);
    return;
  }
  for (const revision of impact.revisions) {
    small(doc, `Revision ${revision.revision} (approved ${at(doc, revision.approvedAt)}): inspections from ${formatDate(revision.from)}; ${revision.reason}.`);
  }
  fields(doc, [
    ['Inspections in doubt', impact.total],
    ['Without a decision', impact.undecided],
    ['Worksheet starts', impact.since ? formatDate(impact.since) : 'at each revision’s approval'],
  ]);
  if (!impact.rows.length) return;
  subheading(doc, 'By customer and part number');
  for (const group of impact.groups) small(doc, `${group.customer} · ${group.partNumber}: ${group.count} inspection(s), ${group.undecided ?? 0} undecided`);
  subheading(doc, 'Containment worksheet');
  for (const { inspection, decision } of impact.rows) {
    paragraph(
      doc,
      `${formatDate(inspection.performedOn)} · ${inspection.customer} · ${inspection.partNumber} s/n ${inspection.serialNumber} · ${inspection.workOrder} · ${INSPECTION_RESULT_LABELS[inspection.result]} → ${decision ? CONTAINMENT_DECISION_LABELS[decision.decision] : 'no decision yet'}`,
      { size: 8.5 },
    );
    if (decision) small(doc, `${decision.reason} (${decision.decidedBy.name}, ${at(doc, decision.decidedAt)})`);
  }
}

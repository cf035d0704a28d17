import { useState, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import type { FindingDetailView } from '../../../../shared/schemas/workflow';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { ErrorNotice, Loading, PageHeader } from '../../../components/ui/states';
import { RecordExportLinks } from '../../../components/ui/export-links';
import { useFinding } from '../api/workflow';
import { AssignActionForm } from './assign-action-form';
import { EventActions } from './event-actions';
import { NextStepPanel, findingNextStep } from './next-step';
import { Facts, Panel } from './record-layout';
import { RecordTimeline } from './record-timeline';
import { SignatureBlock } from './signature-block';
import { ClassBadge, DueDate, StateBadge } from './state-badge';
import { CLASS_LABELS } from './labels';
import { ruleLabel } from '../../../../shared/labels';

/**
 * A finding's page. `evidence` is the slot for the evidence panel and
 * `sections` for other features' panels (extent of condition, impact); the
 * route passes them in, and they are shown under the details.
 */
export function FindingPage({
  id,
  evidence,
  sections,
}: {
  id: number;
  evidence?: (finding: FindingDetailView) => ReactNode;
  sections?: (finding: FindingDetailView) => ReactNode;
}) {
  const finding = useFinding(id);
  const [assigning, setAssigning] = useState(false);
  if (finding.isLoading) return <Loading what="Loading the finding" />;
  if (finding.error || !finding.data) return <ErrorNotice error={finding.error} title="The finding could not be loaded" />;
  const f = finding.data;
  return (
    <div className="flex flex-col gap-4">
      <PageHeader title={`${f.number}: ${f.title}`}>
        <ClassBadge value={f.class} />
        <StateBadge state={f.state} />
      </PageHeader>
      <NextStepPanel
        next={findingNextStep(f)}
        state={f.state}
        canAct={f.allowedEvents.length > 0 || f.canAssignAction}
        actions={
          <div className="flex flex-wrap gap-2">
            <EventActions kind="finding" record={f} />
            {f.canAssignAction && <Button onClick={() => setAssigning(true)}>Assign corrective action</Button>}
          </div>
        }
      />
      <div className="flex flex-wrap justify-end gap-2">
        <RecordExportLinks kind="finding" id={f.id} />
      </div>
      <div className="grid gap-4 lg:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
        <div className="flex flex-col gap-4">
          <Panel title="Nonconformity">
            <Facts
              items={[
                ['Audit', f.auditId ? <Link className="text-lagoon underline" to={`/audits/${f.auditId}`}>{f.auditTitle}</Link> : null],
                ['Technique', f.techniqueCode],
                ['Area', f.areaName],
                ['Rule or clause not met', ruleLabel(f.rule)],
                ['Requirement', f.requirement],
                ['Objective evidence', f.objectiveEvidence],
                ['Raised by', f.author?.displayName],
                ['Class', f.class ? CLASS_LABELS[f.class] : 'Not classified yet'],
                ...(f.classificationNote ? ([['Classification note', f.classificationNote]] as Array<[string, ReactNode]>) : []),
                ...(f.containmentDueDate ? ([['Containment due', <DueDate date={f.containmentDueDate} overdue={f.overdue && f.state === 'containment'} />]] as Array<[string, ReactNode]>) : []),
                ...(f.containment ? ([['Containment', f.containment]] as Array<[string, ReactNode]>) : []),
                ...(f.dueDate ? ([['Corrective action due', <DueDate date={f.dueDate} overdue={f.overdue} />]] as Array<[string, ReactNode]>) : []),
                ...(f.notEffectiveReason ? ([['Last effectiveness check failed', f.notEffectiveReason]] as Array<[string, ReactNode]>) : []),
                ...(f.effectivenessNote ? ([['Effectiveness confirmed', f.effectivenessNote]] as Array<[string, ReactNode]>) : []),
                ...(f.closureNote ? ([['Closed with note', f.closureNote]] as Array<[string, ReactNode]>) : []),
                ...(f.withdrawReason ? ([['Withdrawn because', f.withdrawReason]] as Array<[string, ReactNode]>) : []),
              ]}
            />
          </Panel>
          {/* Evidence slot: the evidence feature's panel mounts here (see src/app/routes/finding.tsx). */}
          {evidence ? evidence(f) : null}
        </div>
        <div className="flex flex-col gap-4">
          <Panel title="Corrective action">
            {f.action ? (
              <p className="flex flex-wrap items-center gap-2 text-sm">
                <Link className="font-bold text-lagoon underline" to={`/actions/${f.action.id}`}>{f.action.number}</Link>
                <StateBadge state={f.action.state} />
                <span className="w-full text-ink-soft">Owner {f.action.owner?.displayName} · due {f.action.dueDate}</span>
              </p>
            ) : (
              <p className="text-sm text-ink-soft">None assigned.</p>
            )}
          </Panel>
          <SignatureBlock signatures={f.signatures} />
          <Panel title="Timeline">
            <RecordTimeline type="finding" id={f.id} />
          </Panel>
        </div>
      </div>
      {sections ? sections(f) : null}
      {assigning && (
        <Dialog open title={`Assign the corrective action for ${f.number}`} onClose={() => setAssigning(false)}>
          <AssignActionForm findingId={f.id} authorId={f.author?.id ?? null} suggestedDueDate={f.dueDate} onDone={() => setAssigning(false)} />
        </Dialog>
      )}
    </div>
  );
}

import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import type { ActionDetailView } from '../../../../shared/schemas/workflow';
import { ErrorNotice, Loading, PageHeader } from '../../../components/ui/states';
import { RecordExportLinks } from '../../../components/ui/export-links';
import { useAction } from '../api/workflow';
import { EventActions } from './event-actions';
import { NextStepPanel, actionNextStep } from './next-step';
import { Facts, Panel } from './record-layout';
import { RecordTimeline } from './record-timeline';
import { SignatureBlock } from './signature-block';
import { DueDate, StateBadge } from './state-badge';
import { METHOD_LABELS } from './labels';

/**
 * A corrective action's page. `evidence` is the slot for the evidence panel
 * (upload and list), passed in by the route from the evidence feature.
 */
export function ActionPage({ id, evidence }: { id: number; evidence?: (action: ActionDetailView) => ReactNode }) {
  const action = useAction(id);
  if (action.isLoading) return <Loading what="Loading the corrective action" />;
  if (action.error || !action.data) return <ErrorNotice error={action.error} title="The corrective action could not be loaded" />;
  const a = action.data;
  const rows: Array<[string, ReactNode]> = [
    ['Finding', a.finding ? <Link className="text-lagoon underline" to={`/findings/${a.findingId}`}>{a.finding.number}: {a.finding.title}</Link> : null],
    ['Owner', a.owner?.displayName],
    ['Due', <DueDate date={a.dueDate} overdue={a.overdue} />],
  ];
  if (a.pendingExtension) rows.push(['Extension requested', `${a.pendingExtension.dueDate}: ${a.pendingExtension.reason}`]);
  if (a.method) rows.push(['Root-cause method', METHOD_LABELS[a.method] ?? a.method]);
  if (a.rootCause) rows.push(['Root-cause analysis', a.rootCause]);
  if (a.submissionSummary) rows.push(['Submission', a.submissionSummary]);
  if (a.returnReason) rows.push(['Returned because', a.returnReason]);
  if (a.reopenReason) rows.push(['Reopened because', a.reopenReason]);
  rows.push(['Evidence files', a.evidenceCount]);
  return (
    <div className="flex flex-col gap-4">
      <PageHeader title={`${a.number}${a.finding ? ` for ${a.finding.number}` : ''}`}>
        <StateBadge state={a.state} />
      </PageHeader>
      <NextStepPanel next={actionNextStep(a)} state={a.state} canAct={a.allowedEvents.length > 0} actions={<EventActions kind="action" record={a} />} />
      <div className="flex flex-wrap justify-end gap-2">
        <RecordExportLinks kind="action" id={a.id} />
      </div>
      <div className="grid gap-4 lg:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
        <div className="flex flex-col gap-4">
          <Panel title="Corrective action">
            <Facts items={rows} />
          </Panel>
          {a.plan.length > 0 && (
            <Panel title="Plan">
              <ol className="list-decimal pl-5 text-sm">
                {a.plan.map((item, index) => (
                  <li key={index}>
                    {item.description} <span className="text-ink-soft">(due {item.dueDate})</span>
                  </li>
                ))}
              </ol>
            </Panel>
          )}
          {/* Evidence slot: the evidence feature's panel mounts here (see src/app/routes/action.tsx). */}
          {evidence ? evidence(a) : null}
        </div>
        <div className="flex flex-col gap-4">
          <SignatureBlock signatures={a.signatures} />
          <Panel title="Timeline">
            <RecordTimeline type="action" id={a.id} />
          </Panel>
        </div>
      </div>
    </div>
  );
}

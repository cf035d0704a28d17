import { useState, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { Dialog } from '../../../components/ui/dialog';
import { RaiseFindingForm } from './raise-finding-form';
import { Button } from '../../../components/ui/button';
import { Caution } from '../../../components/ui/caution';
import { ErrorNotice, Loading, PageHeader } from '../../../components/ui/states';
import { RecordExportLinks } from '../../../components/ui/export-links';
import { useAudit, useRunChecklist } from '../api/workflow';
import { ChecklistResults } from './checklist-results';
import { EventActions } from './event-actions';
import { NextStepPanel, auditNextStep } from './next-step';
import { Facts, Panel } from './record-layout';
import { RecordTimeline } from './record-timeline';
import { SignatureBlock } from './signature-block';
import { ClassBadge, StateBadge } from './state-badge';
import type { AuditDetailView } from '../../../../shared/schemas/workflow';

/** An audit's page. `evidence` is the slot for the evidence panel, passed in by the route like the finding's. */
export function AuditPage({ id, evidence }: { id: number; evidence?: (audit: AuditDetailView) => ReactNode }) {
  const audit = useAudit(id);
  const run = useRunChecklist(id);
  const [raising, setRaising] = useState(false);
  if (audit.isLoading) return <Loading what="Loading the audit" />;
  if (audit.error || !audit.data) return <ErrorNotice error={audit.error} title="The audit could not be loaded" />;
  const a = audit.data;
  const latestRun = (code: string) => a.checklistRuns.find((item) => item.techniqueCode === code);
  return (
    <div className="flex flex-col gap-4">
      <PageHeader title={a.title}>
        <StateBadge state={a.state} />
      </PageHeader>
      <NextStepPanel next={auditNextStep(a)} state={a.state} canAct={a.allowedEvents.length > 0} actions={<EventActions kind="audit" record={a} />} />
      <div className="flex flex-wrap items-start justify-between gap-2">
        <div className="flex flex-wrap gap-2">
        {a.canRaiseFinding && (
          <Button variant="secondary" onClick={() => setRaising(true)}>
            Raise a finding by hand
          </Button>
        )}
      </div>
      {raising && (
        <Dialog open title="Raise a finding" onClose={() => setRaising(false)}>
          <RaiseFindingForm auditId={a.id} techniqueCodes={a.scope.map((item) => item.code)} onCancel={() => setRaising(false)} />
        </Dialog>
      )}
        <RecordExportLinks kind="audit" id={a.id} />
      </div>
      <div className="grid gap-4 lg:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
        <div className="flex flex-col gap-4">
          <Panel title="Audit">
            <Facts
              items={[
                ['Area', a.areaName],
                ['Lead auditor', a.leadAuditor?.displayName],
                ['Planned', `${a.plannedStart} – ${a.plannedEnd}`],
                ['Criteria', a.criteria],
                ['Open findings', a.openFindingCount],
                ...(a.cancelReason ? ([['Cancelled because', a.cancelReason]] as Array<[string, string]>) : []),
              ]}
            />
          </Panel>
          <Panel title="Checklist per technique in scope">
            <div className="mb-3"><Caution compact /></div>
            {run.error ? <ErrorNotice error={run.error} title="The checklist did not run" /> : null}
            <div className="flex flex-col gap-4">
              {a.scope.map((item) => {
                const last = latestRun(item.code);
                return (
                  <div key={item.code} className="flex flex-col gap-2">
                    <div className="flex flex-wrap items-center justify-between gap-2">
                      <p className="font-bold">
                        {item.techniqueId ? <Link className="text-lagoon underline" to={`/techniques/${item.techniqueId}`}>{item.code}</Link> : item.code} rev {item.revision} — {item.title}
                      </p>
                      {a.canRunChecklist && (
                        <Button onClick={() => run.mutate(item.code)} disabled={run.isPending}>
                          {run.isPending && run.variables === item.code ? 'Running…' : last ? 'Run the checklist again' : 'Run the checklist'}
                        </Button>
                      )}
                    </div>
                    {last ? (
                      <ChecklistResults key={`${last.id}-${last.version}`} auditId={a.id} run={last} editable={a.state === 'fieldwork' && a.canRunChecklist} canRaise={a.canRaiseFinding} />
                    ) : (
                      <p className="text-sm text-ink-soft">Not run yet{a.state === 'planned' ? ': the checklist runs during fieldwork' : ''}.</p>
                    )}
                  </div>
                );
              })}
            </div>
          </Panel>
          {evidence ? evidence(a) : null}
        </div>
        <div className="flex flex-col gap-4">
          <Panel title="Findings" id="audit-findings">
            {a.findings.length ? (
              <ul className="flex flex-col gap-2 text-sm">
                {a.findings.map((finding) => (
                  <li key={finding.id} className="flex flex-wrap items-center gap-2">
                    <Link className="font-bold text-lagoon underline" to={`/findings/${finding.id}`}>{finding.number}</Link>
                    <ClassBadge value={finding.class} />
                    <StateBadge state={finding.state} />
                    <span className="w-full text-ink-soft">{finding.title}</span>
                  </li>
                ))}
              </ul>
            ) : (
              <p className="text-sm text-ink-soft">No findings raised.</p>
            )}
          </Panel>
          <SignatureBlock signatures={a.signatures} />
          <Panel title="Timeline">
            <RecordTimeline type="audit" id={a.id} />
          </Panel>
        </div>
      </div>
    </div>
  );
}

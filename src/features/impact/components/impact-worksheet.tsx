// The impact worksheet on a finding's page: which past inspections the finding
// puts in doubt (affected revisions, from which day), grouped by customer and
// part number, and the quality manager's containment decision for each.
import { useState, type FormEvent } from 'react';
import type { RowSelectionState } from '@tanstack/react-table';
import { CONTAINMENT_DECISIONS, CONTAINMENT_DECISION_LABELS, type ContainmentDecisionKind } from '../../../../shared/schemas/impact';
import { Button } from '../../../components/ui/button';
import { Caution } from '../../../components/ui/caution';
import { CsvExportLink } from '../../../components/ui/export-links';
import { SelectField, TextAreaField, TextField } from '../../../components/ui/field';
import { Panel } from '../../../components/ui/panel';
import { EmptyState, ErrorNotice, Loading } from '../../../components/ui/states';
import { ApiError } from '../../../lib/api-client';
import { useAbility } from '../../../lib/ability';
import { useDecideContainment, useFindingImpact, useSetImpactScope } from '../api/impact';
import { ImpactGroups, groupKey } from './impact-groups';
import { InspectionRowsTable } from './inspection-rows-table';
import { formatUtc } from './impact-format';

interface WorksheetFinding {
  id: number;
  number: string;
  state: string;
  version: number;
}

const SETTLED = ['closed', 'withdrawn'];

export function ImpactWorksheet({ finding, onChange }: { finding: WorksheetFinding; onChange?: () => void }) {
  const impact = useFindingImpact(finding.id);
  const ability = useAbility();
  const mayDecide = ability.can('decide_impact', 'Finding') && !SETTLED.includes(finding.state);
  const [group, setGroup] = useState<string | null>(null);
  const [undecidedOnly, setUndecidedOnly] = useState(false);
  const [selection, setSelection] = useState<RowSelectionState>({});

  if (impact.isLoading) return <Panel title="Impact on past inspections"><Loading what="Loading the inspections in doubt" /></Panel>;
  if (impact.error || !impact.data) return <Panel title="Impact on past inspections"><ErrorNotice error={impact.error} title="The impact worksheet could not be loaded" /></Panel>;
  const view = impact.data;
  const rows = view.rows.filter((row) => (!group || groupKey(row.inspection) === group) && (!undecidedOnly || !row.decision));
  // Only what is listed counts: a choice hidden by a filter is not decided by accident.
  const chosenIds = rows.filter((row) => selection[String(row.inspection.id)]).map((row) => row.inspection.id);

  return (
    <Panel
      id="impact-worksheet"
      title="Impact on past inspections"
      actions={view.total > 0 ? <CsvExportLink path={`/findings/${finding.id}/impact.csv`} query={{}} label="Worksheet CSV" /> : null}
    >
      <div className="flex flex-col gap-3 text-sm">
        {view.unavailableReason ? (
          <EmptyState title="No past inspection is in doubt">{view.unavailableReason}</EmptyState>
        ) : (
          <>
            <ul className="text-ink-soft">
              {view.revisions.map((revision) => (
                <li key={revision.id}>
                  {view.techniqueCode} rev <strong className="text-ink">{revision.revision}</strong>
                  {revision.approvedAt ? ` (approved ${formatUtc(revision.approvedAt)})` : ''}: inspections from <strong className="text-ink">{revision.from}</strong> — {revision.reason}
                </li>
              ))}
            </ul>
            {mayDecide && <ScopeForm key={view.since ?? ''} finding={finding} since={view.since} onChange={onChange} />}
            <p>
              <strong>{view.total}</strong> inspection(s) in doubt · <strong className={view.undecided ? 'text-fail' : 'text-pass'}>{view.undecided}</strong> without a decision
            </p>
            {view.blocksContainment && (
              <p role="note" className="rounded-md border border-fail/30 bg-red-50 px-3 py-2 text-fail">
                This major finding cannot leave containment while {view.undecided} inspection(s) have no decision.
              </p>
            )}
            <ImpactGroups groups={view.groups} chosen={group} onChoose={setGroup} />
            <label className="flex items-center gap-2">
              <input type="checkbox" checked={undecidedOnly} onChange={(event) => setUndecidedOnly(event.target.checked)} />
              Undecided only
            </label>
            <InspectionRowsTable
              rows={rows}
              caption={`Inspections in doubt through ${finding.number}`}
              withDecisions
              selection={mayDecide ? selection : undefined}
              onSelectionChange={mayDecide ? setSelection : undefined}
            />
            {mayDecide && view.total > 0 && (
              <DecisionForm findingId={finding.id} inspectionIds={chosenIds} onChange={onChange} onDone={() => setSelection({})} />
            )}
            <Caution compact />
          </>
        )}
      </div>
    </Panel>
  );
}

function ScopeForm({ finding, since, onChange }: { finding: WorksheetFinding; since: string | null; onChange?: () => void }) {
  const [value, setValue] = useState(since ?? '');
  const scope = useSetImpactScope(finding.id, onChange);
  const fieldError = scope.error instanceof ApiError ? scope.error.fieldErrors.find((detail) => detail.path === 'since')?.message : undefined;
  const submit = (event: FormEvent) => {
    event.preventDefault();
    scope.mutate({ since: value || null, version: finding.version });
  };
  return (
    <form onSubmit={submit} className="flex flex-wrap items-end gap-2">
      <div className="w-48">
        <TextField
          label="List inspections from"
          type="date"
          value={value}
          onChange={(event) => setValue(event.target.value)}
          error={fieldError}
          hint={since ? 'A date you chose' : 'Empty: from each revision’s approval'}
        />
      </div>
      <Button type="submit" variant="secondary" disabled={scope.isPending || (value || null) === since}>
        Apply
      </Button>
      {since && (
        <Button variant="ghost" disabled={scope.isPending} onClick={() => scope.mutate({ since: null, version: finding.version })}>
          Back to approval dates
        </Button>
      )}
      {scope.error && !fieldError ? <ErrorNotice error={scope.error} title="The date was not changed" /> : null}
    </form>
  );
}

function DecisionForm({ findingId, inspectionIds, onChange, onDone }: { findingId: number; inspectionIds: number[]; onChange?: () => void; onDone(): void }) {
  const [decision, setDecision] = useState<ContainmentDecisionKind>('reinspect');
  const [reason, setReason] = useState('');
  const decide = useDecideContainment(findingId, onChange);
  const reasonError = decide.error instanceof ApiError ? decide.error.fieldErrors.find((detail) => detail.path === 'reason')?.message : undefined;
  const submit = (event: FormEvent) => {
    event.preventDefault();
    decide.mutate(
      { inspectionIds, decision, reason },
      {
        onSuccess: () => {
          setReason('');
          onDone();
        },
      },
    );
  };
  return (
    <form onSubmit={submit} className="flex flex-col gap-2 rounded-md border border-ink/10 bg-paper p-3" aria-label="Record a containment decision">
      <p className="font-bold">{inspectionIds.length ? `Decide for ${inspectionIds.length} chosen inspection(s)` : 'Choose inspections above to decide for them'}</p>
      <div className="grid gap-2 sm:grid-cols-[14rem_1fr]">
        <SelectField label="Decision" value={decision} onChange={(event) => setDecision(event.target.value as ContainmentDecisionKind)}>
          {CONTAINMENT_DECISIONS.map((value) => (
            <option key={value} value={value}>{CONTAINMENT_DECISION_LABELS[value]}</option>
          ))}
        </SelectField>
        <TextAreaField label="Reason" rows={2} value={reason} onChange={(event) => setReason(event.target.value)} error={reasonError} required />
      </div>
      {decide.error && !reasonError ? <ErrorNotice error={decide.error} title="The decision was not recorded" /> : null}
      {decide.isSuccess && <p role="status" className="text-pass">Decision recorded.</p>}
      <div>
        <Button type="submit" disabled={decide.isPending || inspectionIds.length === 0 || !reason.trim()}>
          {decide.isPending ? 'Recording…' : 'Record decision'}
        </Button>
      </div>
    </form>
  );
}

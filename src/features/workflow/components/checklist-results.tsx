// A checklist run's results, with the auditor's notes per result and "raise a
// finding" on any failed or warned result in one step.
import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import type { ChecklistRunView } from '../../../../shared/schemas/workflow';
import type { RuleResult } from '../../../../shared/domain/checklist';
import { CHECKLIST_ENGINE_VERSION } from '../../../../shared/domain/checklist/types';
import { Button } from '../../../components/ui/button';
import { ErrorNotice } from '../../../components/ui/states';
import { useRaiseFinding, useUpdateChecklistNotes } from '../api/workflow';
import { RaiseErrorNotice } from './raise-error-notice';
import { RULE_STATUS_LABELS, VERDICT_LABELS, basisInWords, resultValueItems, ruleLabel } from '../../../../shared/labels';
import { useFormatDates } from '../../../lib/organisation';

const STATUS_TONE: Record<string, string> = {
  pass: 'bg-pass/15 text-pass',
  fail: 'bg-fail text-white',
  warn: 'bg-warn/25 text-ink',
  not_applicable: 'bg-ink/10 text-ink-soft',
};

function Values({ values }: { values: RuleResult['values'] }) {
  const items = resultValueItems(values);
  if (!items.length) return null;
  return (
    <dl className="mt-1 flex flex-wrap gap-x-4 gap-y-0.5 text-xs text-ink-soft">
      {items.map((item) => (
        <div key={item.key} className="flex gap-1">
          <dt>{item.label}:</dt>
          <dd className="text-ink">{item.text}</dd>
        </div>
      ))}
    </dl>
  );
}

function RunChanges({ changes }: { changes: NonNullable<ChecklistRunView['changes']> }) {
  const since = `Since the run of ${changes.previousRunAt.slice(0, 16).replace('T', ' ')} UTC (engine ${changes.previousEngineVersion})`;
  if (changes.lines.length === 0) return <p className="mb-2 text-xs text-ink-soft">{since}: no result changed.</p>;
  return (
    <div className="mb-2 rounded border border-ink/10 bg-ink/5 px-3 py-2 text-xs" aria-label="What changed since the previous run">
      <p className="font-bold">{since}, what changed:</p>
      <ul className="mt-1 list-disc pl-5">
        {changes.lines.map((line) => (
          <li key={line}>{line}</li>
        ))}
      </ul>
    </div>
  );
}

export function ChecklistResults({ auditId, run, editable, canRaise }: { auditId: number; run: ChecklistRunView; editable: boolean; canRaise: boolean }) {
  const output = run.output as { verdict: string; summary: Record<string, number>; results: RuleResult[] };
  const [notes, setNotes] = useState<Record<string, string>>(run.notes);
  const saveNotes = useUpdateChecklistNotes(auditId);
  const raise = useRaiseFinding(auditId);
  const navigate = useNavigate();
  const dirty = JSON.stringify(notes) !== JSON.stringify(run.notes);
  const dates = useFormatDates();

  return (
    <article className="rounded-lg border border-ink/10 bg-white p-4" aria-label={`Checklist of ${run.techniqueCode}`}>
      <header className="mb-3 flex flex-wrap items-baseline justify-between gap-2">
        <h3 className="font-bold">
          {run.techniqueCode} rev {run.techniqueRevision}:{' '}
          <span className={output.verdict === 'conforms' ? 'text-pass' : 'text-fail'}>{(VERDICT_LABELS[output.verdict as keyof typeof VERDICT_LABELS] ?? output.verdict).toLowerCase()}</span>
        </h3>
        <p className="text-xs text-ink-soft">
          {output.summary.pass} pass · {output.summary.fail} fail · {output.summary.warn} warn · run by {run.runBy?.displayName} on {dates.dateTime(run.runAt)}
        </p>
      </header>
      <p className={`mb-2 text-xs ${run.engineVersion === CHECKLIST_ENGINE_VERSION ? 'text-ink-soft' : 'font-bold text-warn'}`}>{run.engineNote}</p>
      {run.changes && <RunChanges changes={run.changes} />}
      <ol className="flex flex-col divide-y divide-ink/5">
        {output.results.map((result, index) => (
          <li key={index} className="py-2 text-sm" data-status={result.status}>
            <div className="flex flex-wrap items-start gap-2">
              <span className={`rounded px-1.5 py-0.5 text-xs font-bold ${STATUS_TONE[result.status]}`}>{RULE_STATUS_LABELS[result.status]}</span>
              <span className="font-bold">{ruleLabel(result.rule)}</span>
              {result.flaw && <span className="text-ink-soft">flaw {result.flaw}</span>}
              {result.coil !== undefined && <span className="text-ink-soft">coil {result.coil + 1}</span>}
              {canRaise && (result.status === 'fail' || result.status === 'warn') && (
                <Button
                  variant="secondary"
                  className="ml-auto"
                  disabled={raise.isPending}
                  busy={raise.isPending && raise.variables?.resultIndex === index}
                  busyLabel="Raising…"
                  onClick={() => raise.mutate({ checklistRunId: run.id, resultIndex: index }, { onSuccess: (finding) => navigate(`/findings/${finding.id}`) })}
                >
                  Raise a finding
                </Button>
              )}
            </div>
            <p className="mt-1">{result.message}</p>
            <Values values={result.values} />
            <p className="mt-1 text-xs text-ink-soft">Basis: {basisInWords(result.basis)}</p>
            {editable ? (
              <label className="mt-1 flex flex-col gap-1 text-xs font-bold text-ink-soft">
                Auditor’s note
                <textarea
                  rows={2}
                  className="rounded border border-ink/20 px-2 py-1 text-sm font-normal text-ink"
                  value={notes[index] ?? ''}
                  onChange={(e) => setNotes({ ...notes, [index]: e.target.value })}
                />
              </label>
            ) : (
              run.notes[index] && <p className="mt-1 text-xs"><strong>Auditor’s note:</strong> {run.notes[index]}</p>
            )}
          </li>
        ))}
      </ol>
      {raise.error ? <RaiseErrorNotice error={raise.error} /> : null}
      {saveNotes.error ? <ErrorNotice error={saveNotes.error} title="The notes were not saved" /> : null}
      {editable && (
        <div className="mt-2 flex justify-end">
          <Button disabled={!dirty || saveNotes.isPending} onClick={() => saveNotes.mutate({ runId: run.id, version: run.version, notes })}>
            {saveNotes.isPending ? 'Saving…' : 'Save notes'}
          </Button>
        </div>
      )}
    </article>
  );
}

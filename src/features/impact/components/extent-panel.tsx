// Extent of condition on a finding's page: the finding it extends, the findings
// raised from it, and the latest engine run over every approved technique,
// from which the quality manager raises linked findings.
import { useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import type { ExtentRunView, ExtentTechnique } from '../../../../shared/schemas/extent';
import { CHECKLIST_ENGINE_VERSION } from '../../../../shared/domain/checklist/types';
import { ruleName } from '../../../../shared/domain/checklist/run-history';
import { FINDING_CLASSES, type FindingClass } from '../../../../machines/finding.machine';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { SelectField } from '../../../components/ui/field';
import { Panel } from '../../../components/ui/panel';
import { ErrorNotice, Loading } from '../../../components/ui/states';
import { useAbility } from '../../../lib/ability';
import { useFindingFamily, useRaiseExtentFindings, useRunExtent } from '../api/impact';
import { StateText, formatUtc } from './impact-format';

type Scope = 'rule' | 'orientation' | 'coil';

const article = (word: string) => (/^[aeiou]/i.test(word) ? 'an' : 'a');

const CLASS_WORDS: Record<FindingClass, string> = { major: 'Major', minor: 'Minor', observation: 'Observation' };

interface ExtentFinding {
  id: number;
  number: string;
  class: string | null;
}

const asClass = (value: string | null): FindingClass | '' => ((FINDING_CLASSES as readonly string[]).includes(value ?? '') ? (value as FindingClass) : '');

export function ExtentPanel({ finding, onChange }: { finding: ExtentFinding; onChange?: () => void }) {
  const family = useFindingFamily(finding.id);
  const ability = useAbility();
  const mayAssess = ability.can('assess_extent', 'Finding');
  const run = useRunExtent(finding.id, onChange);

  if (family.isLoading) return <Panel title="Extent of condition"><Loading what="Loading the extent of condition" /></Panel>;
  if (family.error || !family.data) return <Panel title="Extent of condition"><ErrorNotice error={family.error} title="The extent of condition could not be loaded" /></Panel>;
  const { extentOf, members, extentPossible, extentUnavailableReason, latestRun } = family.data;

  return (
    <Panel
      title="Extent of condition"
      actions={
        mayAssess && extentPossible ? (
          <Button variant={latestRun ? 'secondary' : 'primary'} disabled={run.isPending} onClick={() => run.mutate()}>
            {run.isPending ? 'Evaluating every approved technique…' : latestRun ? 'Run again' : 'Look for the same weakness in other techniques'}
          </Button>
        ) : null
      }
    >
      <div className="flex flex-col gap-3 text-sm">
        {extentOf && (
          <p>
            Raised from the extent of condition of{' '}
            <Link className="font-bold text-lagoon underline" to={`/findings/${extentOf.id}`}>{extentOf.number}</Link> ({extentOf.title}),{' '}
            <StateText state={extentOf.state} />.
          </p>
        )}
        {!extentPossible && !extentOf && <p className="text-ink-soft">{extentUnavailableReason}</p>}
        {extentPossible && !latestRun && (
          <p className="text-ink-soft">
            Not assessed yet. The run evaluates every approved technique with the checklist engine and lists those that fail the same rule, with their values;
            the run is kept in the trail.
          </p>
        )}
        {run.error ? <ErrorNotice error={run.error} title="The run failed" /> : null}
        {members.length > 0 && (
          <div>
            <h3 className="mb-1 font-bold">Linked findings ({members.length})</h3>
            <ul className="flex flex-col gap-1">
              {members.map((member) => (
                <li key={member.id} className="flex flex-wrap items-center gap-2">
                  <Link className="font-bold text-lagoon underline" to={`/findings/${member.id}`}>{member.number}</Link>
                  <span>{member.techniqueCode}</span>
                  <StateText state={member.state} />
                  <span className="text-ink-soft">
                    {member.class ? CLASS_WORDS[member.class] : member.proposedClass ? `${CLASS_WORDS[member.proposedClass]} proposed` : 'not classified'}
                  </span>
                </li>
              ))}
            </ul>
          </div>
        )}
        {latestRun && <ExtentRunResult run={latestRun} finding={finding} mayRaise={mayAssess} onChange={onChange} />}
      </div>
    </Panel>
  );
}

function RunEngineNote({ note, outdated }: { note: string; outdated: boolean }) {
  return <p className={`text-xs ${outdated ? 'font-bold text-warn' : 'text-ink-soft'}`}>{note}</p>;
}

function ExtentChanges({ changes }: { changes: NonNullable<ExtentRunView['changes']> }) {
  const since = `Since the run of ${formatUtc(changes.previousRunAt)} (engine ${changes.previousEngineVersion})`;
  if (changes.lines.length === 0) return <p className="text-xs text-ink-soft">{since}: no technique changed its standing on this rule.</p>;
  return (
    <div className="rounded border border-ink/10 bg-ink/5 px-3 py-2 text-xs">
      <p className="font-bold">{since}, what changed:</p>
      <ul className="mt-1 list-disc pl-5">
        {changes.lines.map((line) => (
          <li key={line}>{line}</li>
        ))}
      </ul>
    </div>
  );
}

function ExtentRunResult({ run, finding, mayRaise, onChange }: { run: ExtentRunView; finding: ExtentFinding; mayRaise: boolean; onChange?: () => void }) {
  const [scope, setScope] = useState<Scope>('rule');
  const [chosen, setChosen] = useState<Set<number>>(new Set());
  const [proposedClass, setProposedClass] = useState<FindingClass | ''>(asClass(finding.class));
  const [confirming, setConfirming] = useState(false);
  const raise = useRaiseExtentFindings(finding.id, onChange);
  const linkedBy = useMemo(() => new Map(run.linked.map((link) => [link.techniqueId, link])), [run.linked]);

  const shown = run.failing.filter((technique) => scope === 'rule' || (scope === 'orientation' ? technique.sameOrientation : technique.sameCoilType));
  const selectable = (technique: ExtentTechnique) => mayRaise && !technique.isFindingTechnique && !linkedBy.has(technique.techniqueId);
  const toggle = (revisionId: number) =>
    setChosen((current) => {
      const next = new Set(current);
      if (next.has(revisionId)) next.delete(revisionId);
      else next.add(revisionId);
      return next;
    });
  const chosenTechniques = run.failing.filter((technique) => chosen.has(technique.revisionId) && selectable(technique));
  const count = (predicate: (technique: ExtentTechnique) => boolean) => run.failing.filter(predicate).length;

  return (
    <div className="flex flex-col gap-3">
      <p className="text-xs text-ink-soft">
        Run #{run.id} by {run.runBy.name} at {formatUtc(run.runAt)} · policy version {run.policyVersion}
        {run.policyVersion === 0 && ' (the defaults, never changed)'} ·{' '}
        {run.evaluatedCount} approved technique(s) evaluated for <strong className="text-ink">{ruleName(run.rule)}</strong>
      </p>
      <RunEngineNote note={run.engineNote} outdated={run.engineVersion !== CHECKLIST_ENGINE_VERSION} />
      {run.changes && <ExtentChanges changes={run.changes} />}
      <fieldset className="flex flex-wrap gap-4 text-sm">
        <legend className="sr-only">Which techniques to show</legend>
        {(
          [
            ['rule', `Fail the same rule (${run.failing.length})`],
            ...(run.flawOrientation ? [['orientation', `… for ${article(run.flawOrientation)} ${run.flawOrientation} flaw (${count((t) => t.sameOrientation)})`]] : []),
            ...(run.coilType ? [['coil', `… with ${article(run.coilType)} ${run.coilType} coil (${count((t) => t.sameCoilType)})`]] : []),
          ] as Array<[Scope, string]>
        ).map(([value, label]) => (
          <label key={value} className="flex items-center gap-1.5">
            <input type="radio" name={`extent-scope-${run.id}`} value={value} checked={scope === value} onChange={() => setScope(value)} />
            {label}
          </label>
        ))}
      </fieldset>
      <div className="overflow-x-auto rounded-md border border-ink/10">
        <table className="w-full text-left text-sm">
          <caption className="sr-only">Approved techniques that fail {run.rule}</caption>
          <thead className="bg-lagoon-soft/60 text-xs uppercase tracking-wide text-ink-soft">
            <tr>
              <th scope="col" className="px-2 py-2"><span className="sr-only">Choose</span></th>
              <th scope="col" className="px-2 py-2">Technique</th>
              <th scope="col" className="px-2 py-2">What fails</th>
              <th scope="col" className="px-2 py-2">Matches</th>
              <th scope="col" className="px-2 py-2">Finding</th>
            </tr>
          </thead>
          <tbody>
            {shown.map((technique) => {
              const linked = linkedBy.get(technique.techniqueId);
              return (
                <tr key={technique.revisionId} className="border-t border-ink/5 align-top">
                  <td className="px-2 py-2">
                    <input
                      type="checkbox"
                      aria-label={`Raise a linked finding against ${technique.code}`}
                      disabled={!selectable(technique)}
                      checked={chosen.has(technique.revisionId) && selectable(technique)}
                      onChange={() => toggle(technique.revisionId)}
                    />
                  </td>
                  <td className="px-2 py-2">
                    <Link className="font-bold text-lagoon underline" to={`/techniques/${technique.techniqueId}`}>{technique.code}</Link> rev {technique.revision}
                    <div className="text-xs text-ink-soft">{technique.title}</div>
                  </td>
                  <td className="px-2 py-2">
                    {technique.failures.map((failure, index) => (
                      <div key={index} className="mb-1">
                        {failure.message}
                        {Object.keys(failure.values).length > 0 && (
                          <div className="font-mono text-xs text-ink-soft">
                            {Object.entries(failure.values).map(([key, value]) => `${key} = ${value ?? '—'}`).join('; ')}
                          </div>
                        )}
                      </div>
                    ))}
                  </td>
                  <td className="whitespace-nowrap px-2 py-2 text-xs">
                    {technique.sameOrientation && <div>same orientation</div>}
                    {technique.sameCoilType && <div>same coil type</div>}
                  </td>
                  <td className="px-2 py-2">
                    {technique.isFindingTechnique ? (
                      <span className="text-ink-soft">{finding.number} (this finding)</span>
                    ) : linked ? (
                      <Link className="text-lagoon underline" to={`/findings/${linked.findingId}`}>{linked.number}</Link>
                    ) : (
                      <span className="text-ink-soft">none</span>
                    )}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
        {shown.length === 0 && <p className="p-3 text-sm text-ink-soft">No approved technique matches.</p>}
      </div>
      {run.failing.length === 1 && run.failing[0].isFindingTechnique && (
        <p className="text-sm text-pass">No other approved technique fails {run.rule}.</p>
      )}
      {mayRaise && run.failing.some(selectable) && (
        <div className="flex flex-wrap items-end gap-3">
          <div className="w-48">
            <SelectField label="Proposed class" value={proposedClass} onChange={(event) => setProposedClass(event.target.value as FindingClass | '')}>
              <option value="">None proposed</option>
              {FINDING_CLASSES.map((value) => (
                <option key={value} value={value}>{CLASS_WORDS[value]}</option>
              ))}
            </SelectField>
          </div>
          <Button disabled={chosenTechniques.length === 0} onClick={() => setConfirming(true)}>
            Raise {chosenTechniques.length || ''} linked finding{chosenTechniques.length === 1 ? '' : 's'}
          </Button>
        </div>
      )}
      {raise.isSuccess && <p role="status" className="text-sm text-pass">Raised {raise.data.created.map((created) => created.number).join(', ')}.</p>}
      <ConfirmDialog
        open={confirming}
        title={`Raise ${chosenTechniques.length} linked finding(s)`}
        confirmLabel="Raise them"
        pending={raise.isPending}
        error={raise.error}
        onCancel={() => setConfirming(false)}
        onConfirm={() =>
          raise.mutate(
            { runId: run.id, revisionIds: chosenTechniques.map((technique) => technique.revisionId), proposedClass: proposedClass || null },
            {
              onSuccess: () => {
                setConfirming(false);
                setChosen(new Set());
              },
            },
          )
        }
      >
        <p>
          One finding each against {chosenTechniques.map((technique) => technique.code).join(', ')}, linked to {finding.number} as its extent of condition,
          {proposedClass ? ` with ${CLASS_WORDS[proposedClass].toLowerCase()} proposed,` : ''} waiting for classification. Findings are not deleted once raised
          (a wrong one is withdrawn with a reason).
        </p>
      </ConfirmDialog>
    </div>
  );
}

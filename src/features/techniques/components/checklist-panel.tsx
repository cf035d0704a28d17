// The checklist's answer, rule by rule: status in words (never colour alone),
// the message, the numbers behind it and the basis it rests on.
import type { ChecklistOutput, RuleResult } from '../../../../shared/domain/checklist';
import type { Technique } from '../../../../shared/schemas/technique';
import { Caution } from '../../../components/ui/caution';
import { StatusBadge, VerdictBadge } from './badges';
import { RULE_LABELS, STATUS_TEXT } from './labels';
import { basisInWords, resultValueItems } from '../../../../shared/labels';

function subjectOf(result: RuleResult, technique: Technique | undefined): string | null {
  const parts: string[] = [];
  if (result.flaw) parts.push(`flaw “${result.flaw}”`);
  if (result.coil !== undefined) {
    const coil = technique?.coils[result.coil];
    parts.push(`coil ${result.coil + 1}${coil ? ` (${coil.type})` : ''}`);
  }
  return parts.length ? parts.join(', ') : null;
}

function ResultRow({ result, technique }: { result: RuleResult; technique?: Technique }) {
  const subject = subjectOf(result, technique);
  const values = resultValueItems(result.values);
  return (
    <li className="border-t border-ink/10 py-3 first:border-t-0" data-rule={result.rule} data-status={result.status}>
      <div className="flex flex-wrap items-baseline gap-2">
        <StatusBadge status={result.status} />
        <span className="font-bold text-ink">{RULE_LABELS[result.rule]}</span>
        {subject && <span className="text-xs text-ink-soft">{subject}</span>}
      </div>
      <p className="mt-1 text-sm text-ink">{result.message}</p>
      <details className="mt-1 text-xs text-ink-soft">
        <summary className="cursor-pointer select-none font-bold hover:text-ink">Values and basis</summary>
        {values.length > 0 && (
          <dl className="mt-1 grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5">
            {values.map((item) => (
              <div key={item.key} className="contents">
                <dt>{item.label}</dt>
                <dd>{item.text}</dd>
              </div>
            ))}
          </dl>
        )}
        <p className="mt-1">
          <span className="font-bold">Basis:</span> {basisInWords(result.basis)}
        </p>
      </details>
    </li>
  );
}

/** The checks an evaluation without register facts cannot make (the engine reports nothing for them then). */
const REGISTER_RULES = ['personnel', 'equipment'] as const;

/** True when the people and equipment checks were made (the evaluation had the register facts). */
export function registerChecksMade(output: ChecklistOutput): boolean {
  return output.results.some((result) => (REGISTER_RULES as readonly string[]).includes(result.rule));
}

export function ChecklistSummaryLine({ output }: { output: ChecklistOutput }) {
  const { summary } = output;
  const complete = registerChecksMade(output);
  return (
    <div aria-live="polite">
      <p className="text-sm text-ink-soft">
        {summary.fail} {STATUS_TEXT.fail.label.toLowerCase()} · {summary.warn} {summary.warn === 1 ? 'warning' : 'warnings'} · {summary.pass}{' '}
        {STATUS_TEXT.pass.label.toLowerCase()} · {summary.not_applicable} not applicable
        {complete ? '' : ' so far'}
      </p>
      {!complete && (
        <p className="mt-1 rounded border border-warn/30 bg-amber-50 px-2 py-1 text-xs text-ink" data-testid="register-checks-pending">
          People and equipment checks run once the technique is linked to the registers: who may perform and approve it, and the instrument,
          probe and reference standard it names. Until then this list is not complete.
        </p>
      )}
    </div>
  );
}

export function ChecklistPanel({
  output,
  technique,
  title = 'Checklist',
  note,
}: {
  output: ChecklistOutput;
  technique?: Technique;
  title?: string;
  note?: React.ReactNode;
}) {
  // Failures first, then warnings: what needs attention reads first.
  const order = { fail: 0, warn: 1, pass: 2, not_applicable: 3 } as const;
  const results = [...output.results].sort((a, b) => order[a.status] - order[b.status]);
  return (
    <section aria-labelledby="checklist-heading" className="rounded-lg border border-ink/10 bg-white p-4">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id="checklist-heading" className="text-lg font-bold text-ink">
          {title}
        </h2>
        <div data-testid="checklist-verdict" data-verdict={output.verdict}>
          <VerdictBadge verdict={output.verdict} large />
        </div>
      </div>
      <ChecklistSummaryLine output={output} />
      {note && <div className="mt-1 text-xs text-ink-soft">{note}</div>}
      <div className="mt-3 rounded-md border border-copper/40 bg-copper-soft/30 p-2">
        <Caution compact />
      </div>
      <ul className="mt-2">
        {results.map((result, index) => (
          <ResultRow key={`${result.rule}-${result.flaw ?? ''}-${result.coil ?? ''}-${index}`} result={result} technique={technique} />
        ))}
      </ul>
    </section>
  );
}

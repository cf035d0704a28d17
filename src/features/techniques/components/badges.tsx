import type { RuleStatus, Verdict } from '../../../../shared/domain/checklist';
import { TECHNIQUE_STATE_LABELS, VERDICT_LABELS, type TechniqueRevisionState } from '../../../../shared/schemas/technique-register';
import { STATUS_TEXT } from './labels';

const STATE_CLASSES: Record<TechniqueRevisionState, string> = {
  draft: 'border-copper/50 bg-copper-soft/50 text-ink',
  approved: 'border-lagoon/50 bg-lagoon-soft text-ink',
  superseded: 'border-ink/20 bg-white text-ink-soft line-through decoration-ink/30',
};

export function StateBadge({ state }: { state: TechniqueRevisionState }) {
  return (
    <span className={`inline-block rounded-full border px-2 py-0.5 text-xs font-bold ${STATE_CLASSES[state]}`}>{TECHNIQUE_STATE_LABELS[state]}</span>
  );
}

export function VerdictBadge({ verdict, large = false }: { verdict: Verdict; large?: boolean }) {
  const status: RuleStatus = verdict === 'conforms' ? 'pass' : 'fail';
  const style = STATUS_TEXT[status];
  return (
    <span className={`inline-flex items-center gap-1 rounded-full border font-bold ${style.className} ${large ? 'px-3 py-1 text-base' : 'px-2 py-0.5 text-xs'}`}>
      <span aria-hidden="true">{style.symbol}</span>
      {VERDICT_LABELS[verdict]}
    </span>
  );
}

export function StatusBadge({ status }: { status: RuleStatus }) {
  const style = STATUS_TEXT[status];
  return (
    <span className={`inline-flex min-w-28 items-center gap-1 rounded-md border px-2 py-0.5 text-xs font-bold ${style.className}`}>
      <span aria-hidden="true">{style.symbol}</span>
      {style.label}
    </span>
  );
}

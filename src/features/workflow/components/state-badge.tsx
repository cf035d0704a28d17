import { stateLabel } from './labels';
import { findingClassLabel } from '../../../../shared/labels';

const TONES: Record<string, string> = {
  closed: 'bg-pass/15 text-pass',
  verified: 'bg-pass/15 text-pass',
  withdrawn: 'bg-ink/10 text-ink-soft',
  cancelled: 'bg-ink/10 text-ink-soft',
  containment: 'bg-fail/10 text-fail',
  awaiting_signoff: 'bg-copper-soft text-ink',
};

export function StateBadge({ state }: { state: string }) {
  return (
    <span className={`inline-block whitespace-nowrap rounded-full px-2 py-0.5 text-xs font-bold ${TONES[state] ?? 'bg-lagoon-soft text-ink'}`}>
      {stateLabel(state)}
    </span>
  );
}

export function ClassBadge({ value }: { value: string | null }) {
  if (!value) return <span className="text-ink-soft">—</span>;
  const tone = value === 'major' ? 'bg-fail text-white' : value === 'minor' ? 'bg-warn/20 text-ink' : 'bg-ink/10 text-ink';
  return <span className={`inline-block rounded px-1.5 py-0.5 text-xs font-bold uppercase ${tone}`}>{findingClassLabel(value)}</span>;
}

export function DueDate({ date, overdue }: { date: string | null; overdue: boolean }) {
  if (!date) return <span className="text-ink-soft">—</span>;
  return overdue ? (
    <span className="font-bold text-fail">
      {date} <span className="text-xs uppercase">overdue</span>
    </span>
  ) : (
    <span>{date}</span>
  );
}

import { useRecordTrail } from '../api/workflow';
import { ErrorNotice, Loading } from '../../../components/ui/states';
import { eventLabel } from './labels';

function describeChanges(changes: unknown): string[] {
  if (!changes || typeof changes !== 'object') return [];
  return Object.entries(changes as Record<string, unknown>).map(([key, value]) => {
    if (key === 'signature' && value && typeof value === 'object' && 'meaning' in value) {
      const signature = value as { meaning: string; role: string; contentHash: string };
      return `signed “${signature.meaning}” as ${signature.role.replace(/_/g, ' ')} · SHA-256 ${signature.contentHash.slice(0, 16)}…`;
    }
    if (value && typeof value === 'object' && 'before' in value && 'after' in value) {
      const { before, after } = value as { before: unknown; after: unknown };
      const show = (v: unknown) => (v === null || v === undefined ? '—' : typeof v === 'object' ? JSON.stringify(v) : String(v));
      return `${key}: ${show(before)} → ${show(after)}`;
    }
    return `${key}: ${typeof value === 'object' ? JSON.stringify(value) : String(value)}`;
  });
}

/** The record's history from the tamper-evident trail, oldest first. */
export function RecordTimeline({ type, id }: { type: 'audit' | 'finding' | 'action'; id: number }) {
  const trail = useRecordTrail(type, id);
  if (trail.isLoading) return <Loading what="Loading the timeline" />;
  if (trail.error) return <ErrorNotice error={trail.error} title="The timeline could not be loaded" />;
  const items = trail.data?.items ?? [];
  if (!items.length) return <p className="text-sm text-ink-soft">No entries yet.</p>;
  return (
    <ol className="relative flex flex-col gap-3 border-l-2 border-lagoon-soft pl-4" aria-label="Timeline">
      {items.map((entry) => (
        <li key={entry.seq} className="text-sm">
          <span className="absolute -left-[7px] mt-1.5 h-3 w-3 rounded-full bg-lagoon" aria-hidden="true" />
          <p>
            <strong className="font-bold">{eventLabel(entry.event)}</strong>{' '}
            <span className="text-ink-soft">
              · {entry.userName ?? 'system'} · <time dateTime={entry.at}>{entry.at.replace('T', ' ').slice(0, 16)} UTC</time> · #{entry.seq}
            </span>
          </p>
          <ul className="mt-0.5 text-xs text-ink-soft">
            {describeChanges(entry.changes).map((line) => (
              <li key={line} className="break-words [overflow-wrap:anywhere]">
                {line}
              </li>
            ))}
          </ul>
        </li>
      ))}
    </ol>
  );
}

import { useRecordTrail } from '../api/workflow';
import { ErrorNotice, Loading } from '../../../components/ui/states';
import { TrailEntryText } from '../../../components/ui/trail-entry';

/** The record's history from the tamper-evident trail, oldest first, in words. */
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
          <TrailEntryText entry={entry} />
        </li>
      ))}
    </ol>
  );
}

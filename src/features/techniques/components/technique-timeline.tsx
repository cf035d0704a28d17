// What happened to the technique, from the tamper-evident trail: who created,
// edited, approved or superseded which revision, and when.
import { ErrorNotice, Loading } from '../../../components/ui/states';
import { useTechniqueTrail } from '../api/techniques';

const EVENT_WORDS: Record<string, string> = {
  TECHNIQUE_CREATED: 'Created',
  REVISION_CREATED: 'New revision started',
  REVISION_EDITED: 'Draft edited',
  REVISION_APPROVED: 'Approved',
  REVISION_SUPERSEDED: 'Superseded',
};

function describe(changes: unknown): string {
  if (!changes || typeof changes !== 'object') return '';
  const record = changes as Record<string, unknown>;
  const parts: string[] = [];
  if (typeof record.revision === 'string') parts.push(`revision ${record.revision}`);
  if (typeof record.copiedFrom === 'string') parts.push(`copied from ${record.copiedFrom}`);
  if (typeof record.supersededBy === 'string') parts.push(`by revision ${record.supersededBy}`);
  const sections = Object.keys(record).filter((key) => !['revision', 'verdict', 'copiedFrom', 'supersededBy', 'state', 'failedRules', 'supersedes', 'source', 'code', 'title', 'areaId'].includes(key));
  if (sections.length) parts.push(`changed: ${sections.join(', ')}`);
  if (record.verdict === 'conforms' || record.verdict === 'does-not-conform') parts.push(record.verdict === 'conforms' ? 'checklist conforms' : 'checklist does not conform');
  return parts.join(' · ');
}

export function TechniqueTimeline({ id }: { id: number }) {
  const trail = useTechniqueTrail(id);
  return (
    <section aria-labelledby="timeline-heading" className="rounded-lg border border-ink/10 bg-white p-4">
      <h2 id="timeline-heading" className="text-lg font-bold text-ink">
        Timeline
      </h2>
      {trail.isLoading && <Loading what="Loading the timeline" />}
      {trail.error ? <ErrorNotice error={trail.error} title="The timeline could not be loaded" /> : null}
      {trail.data && (
        <ol className="mt-2 flex flex-col gap-1 text-sm">
          {trail.data.items.map((entry) => (
            <li key={entry.seq} className="border-l-2 border-copper/50 pl-3">
              <span className="font-bold">{EVENT_WORDS[entry.event] ?? entry.event}</span>{' '}
              <span className="text-ink-soft">
                {describe(entry.changes)} — {entry.userName ?? 'system'}, {new Date(entry.at).toLocaleString()}
              </span>
            </li>
          ))}
          {trail.data.items.length === 0 && <li className="text-ink-soft">No entries yet.</li>}
        </ol>
      )}
    </section>
  );
}

// One trail entry as people read it, the same on the trail page and in every
// record's timeline: what happened, who, when (in the organisation's zone), and
// each change as a field with its value before and after, in words.
import type { PresentedTrailEntryView, TrailChangeLine } from '../../../shared/schemas/trail';
import { useFormatDates } from '../../lib/organisation';

function ChangeLine({ line }: { line: TrailChangeLine }) {
  return (
    <li className="break-words [overflow-wrap:anywhere]">
      <span className="font-bold text-ink">{line.label}:</span>{' '}
      {line.value !== undefined ? (
        line.value
      ) : (
        <>
          <span>{line.before ?? '—'}</span> <span aria-label="changed to">→</span> <span className="text-ink">{line.after ?? '—'}</span>
        </>
      )}
    </li>
  );
}

export function TrailEntryText({ entry, showRecord = false }: { entry: PresentedTrailEntryView; showRecord?: boolean }) {
  const dates = useFormatDates();
  return (
    <>
      <p>
        <strong className="font-bold">{entry.eventLabel}</strong>
        {showRecord && <span className="text-ink-soft"> · {entry.recordLabel}</span>}{' '}
        <span className="text-ink-soft">
          · {entry.userName ?? 'Whorl (automatic)'} · <time dateTime={entry.at}>{dates.dateTime(entry.at)}</time> · entry {entry.seq}
        </span>
      </p>
      {entry.details.length > 0 && (
        <ul className="mt-0.5 text-xs text-ink-soft">
          {entry.details.map((line, index) => (
            <ChangeLine key={`${line.label}-${index}`} line={line} />
          ))}
        </ul>
      )}
    </>
  );
}

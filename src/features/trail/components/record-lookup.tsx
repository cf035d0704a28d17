import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { EmptyState, ErrorNotice, Loading } from '../../../components/ui/states';
import { useRecordTrail } from '../api/trail';

/** Looks up the timeline of any record by its type and id (e.g. finding:12, user:3). */
export function RecordLookup() {
  const [input, setInput] = useState('');
  const [record, setRecord] = useState('');
  const trail = useRecordTrail(record);
  const submit = (event: FormEvent) => {
    event.preventDefault();
    setRecord(input.trim());
  };
  return (
    <section aria-labelledby="lookup-heading" className="mt-6 rounded-lg border border-ink/10 bg-white p-5">
      <h2 id="lookup-heading" className="text-lg font-bold">
        Entries of one record
      </h2>
      <form onSubmit={submit} className="mt-3 flex flex-wrap items-end gap-2">
        <TextField label="Record" placeholder="finding:12" value={input} onChange={(event) => setInput(event.target.value)} hint="type:id — audit, finding, action, technique, evidence, user, …" />
        <Button type="submit">Show entries</Button>
      </form>
      <div className="mt-4">
        {trail.isFetching && <Loading what="Reading the trail" />}
        {trail.error && <ErrorNotice error={trail.error} />}
        {trail.data && trail.data.items.length === 0 && <EmptyState title="No entries for this record" />}
        {trail.data && trail.data.items.length > 0 && (
          <ol className="divide-y divide-ink/5 text-sm">
            {trail.data.items.map((entry) => (
              <li key={entry.seq} className="py-2">
                <p>
                  <span className="font-mono text-xs text-ink-soft">#{entry.seq}</span>{' '}
                  <strong className="font-bold">{entry.event}</strong> by {entry.userName ?? 'the system'} ·{' '}
                  <time dateTime={entry.at}>{new Date(entry.at).toLocaleString()}</time>
                </p>
                <p className="font-mono text-xs text-ink-soft">hash {entry.hash.slice(0, 16)}…</p>
              </li>
            ))}
          </ol>
        )}
      </div>
    </section>
  );
}

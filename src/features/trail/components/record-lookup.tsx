import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { EmptyState, ErrorNotice, Loading } from '../../../components/ui/states';
import { TrailEntryText } from '../../../components/ui/trail-entry';
import { useRecordTrail } from '../api/trail';

/** Looks up the timeline of any record by its number (F-2026-0015, CA-2026-0003), a technique code, or type and id (user:3). */
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
        <TextField
          label="Record"
          placeholder="F-2026-0015"
          value={input}
          onChange={(event) => setInput(event.target.value)}
          hint="A finding or corrective action number, a technique code, or type:id (audit:3, user:7, equipment:2)"
        />
        <Button type="submit">Show entries</Button>
      </form>
      <div className="mt-4">
        {trail.isFetching && <Loading what="Reading the trail" />}
        {trail.error && <ErrorNotice error={trail.error} />}
        {trail.data && !trail.data.record && <EmptyState title={`No record found for “${record}”`} />}
        {trail.data?.record && trail.data.items.length === 0 && <EmptyState title={`No entries for ${trail.data.record.label}`} />}
        {trail.data?.record && trail.data.items.length > 0 && (
          <>
            <h3 className="font-bold">{trail.data.record.label}</h3>
            <ol className="divide-y divide-ink/5 text-sm" aria-label={`Entries of ${trail.data.record.label}`}>
              {trail.data.items.map((entry) => (
                <li key={entry.seq} className="py-2">
                  <TrailEntryText entry={entry} />
                  <p className="font-mono text-xs text-ink-soft">SHA-256 {entry.hash.slice(0, 16)}…</p>
                </li>
              ))}
            </ol>
          </>
        )}
      </div>
    </section>
  );
}

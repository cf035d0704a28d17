import type { TechniqueRevisionView } from '../../../../shared/schemas/technique-register';
import { StateBadge, VerdictBadge } from './badges';

const when = (iso: string | null) => (iso ? new Date(iso).toLocaleString() : '—');

export function RevisionHistory({ revisions, selected, onSelect }: { revisions: TechniqueRevisionView[]; selected: string; onSelect(revision: string): void }) {
  return (
    <section aria-labelledby="revisions-heading" className="rounded-lg border border-ink/10 bg-white">
      <h2 id="revisions-heading" className="px-4 pt-3 text-lg font-bold text-ink">
        Revisions
      </h2>
      <div className="overflow-x-auto">
        <table className="mt-2 w-full text-left text-sm">
          <caption className="sr-only">Revisions of this technique, newest first</caption>
          <thead className="bg-lagoon-soft/60 text-xs uppercase tracking-wide text-ink-soft">
            <tr>
              <th scope="col" className="px-3 py-2">Revision</th>
              <th scope="col" className="px-3 py-2">State</th>
              <th scope="col" className="px-3 py-2">Checklist</th>
              <th scope="col" className="px-3 py-2">Approved by</th>
              <th scope="col" className="px-3 py-2">Last change</th>
              <th scope="col" className="px-3 py-2"><span className="sr-only">Show</span></th>
            </tr>
          </thead>
          <tbody>
            {revisions.map((revision) => (
              <tr key={revision.id} className={`border-t border-ink/5 ${revision.revision === selected ? 'bg-copper-soft/30' : ''}`}>
                <td className="px-3 py-2 font-bold">{revision.revision}</td>
                <td className="px-3 py-2"><StateBadge state={revision.state} /></td>
                <td className="px-3 py-2"><VerdictBadge verdict={revision.verdict} /></td>
                <td className="px-3 py-2">
                  {revision.approvedBy ? (
                    <span>
                      {revision.approvedBy.name}
                      <span className="block text-xs text-ink-soft">{when(revision.approvedAt)}</span>
                    </span>
                  ) : (
                    '—'
                  )}
                </td>
                <td className="px-3 py-2 text-xs text-ink-soft">
                  {revision.updatedBy?.name ?? '—'}, {when(revision.updatedAt)}
                  {revision.supersededAt && <span className="block">Superseded {when(revision.supersededAt)}</span>}
                </td>
                <td className="px-3 py-2 text-right">
                  <button
                    type="button"
                    className="text-sm font-bold text-lagoon underline-offset-2 hover:underline disabled:text-ink-soft disabled:no-underline"
                    disabled={revision.revision === selected}
                    aria-pressed={revision.revision === selected}
                    onClick={() => onSelect(revision.revision)}
                  >
                    {revision.revision === selected ? 'Shown' : 'Show'}
                  </button>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}

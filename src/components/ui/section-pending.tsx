import { PageHeader } from './states';

/** A section whose screens are not built yet: says so plainly instead of pretending. */
export function SectionPending({ title, purpose }: { title: string; purpose: string }) {
  return (
    <div>
      <PageHeader title={title} />
      <div className="rounded-lg border border-dashed border-copper/40 bg-copper-soft/30 p-6">
        <p className="font-bold text-ink">This section is not available yet.</p>
        <p className="mt-1 text-sm text-ink-soft">{purpose}</p>
      </div>
    </div>
  );
}

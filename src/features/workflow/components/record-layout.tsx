import type { ReactNode } from 'react';

/** Label/value rows of a record page. */
export function Facts({ items }: { items: Array<[string, ReactNode]> }) {
  return (
    <dl className="grid grid-cols-1 gap-x-6 gap-y-2 text-sm sm:grid-cols-[max-content_1fr]">
      {items.map(([label, value]) => (
        <div key={label} className="contents">
          <dt className="font-bold text-ink-soft">{label}</dt>
          <dd className="whitespace-pre-wrap break-words">{value ?? '—'}</dd>
        </div>
      ))}
    </dl>
  );
}

export function Panel({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section className="rounded-lg border border-ink/10 bg-white p-4" aria-label={title}>
      <h2 className="mb-3 text-sm font-bold uppercase tracking-wide text-ink-soft">{title}</h2>
      {children}
    </section>
  );
}

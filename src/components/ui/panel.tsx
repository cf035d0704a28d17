import type { ReactNode } from 'react';

/** A titled section of a record page. */
export function Panel({ title, children, actions, id }: { title: string; children: ReactNode; actions?: ReactNode; id?: string }) {
  return (
    <section id={id} className="scroll-mt-4 rounded-lg border border-ink/10 bg-white p-4" aria-label={title}>
      <div className="mb-3 flex flex-wrap items-center justify-between gap-2">
        <h2 className="text-sm font-bold uppercase tracking-wide text-ink-soft">{title}</h2>
        {actions}
      </div>
      {children}
    </section>
  );
}

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

export { Panel } from '../../../components/ui/panel';

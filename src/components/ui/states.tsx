import type { ReactNode } from 'react';
import { errorInWords } from '../../lib/field-errors';

export function Loading({ what = 'Loading' }: { what?: string }) {
  return (
    <p role="status" className="animate-pulse py-6 text-sm text-ink-soft">
      {what}…
    </p>
  );
}

/** An error in words; a validation error names its fields by label (pass the form's labels), never by key. */
export function ErrorNotice({ error, title = 'Something went wrong', labels }: { error: unknown; title?: string; labels?: Record<string, string> }) {
  const message = errorInWords(error, labels);
  return (
    <div role="alert" className="rounded-md border border-fail/30 bg-red-50 px-3 py-2 text-sm text-fail">
      <strong className="font-bold">{title}.</strong> {message}
    </div>
  );
}

export function EmptyState({ title, children }: { title: string; children?: ReactNode }) {
  return (
    <div className="rounded-lg border border-dashed border-ink/20 px-6 py-10 text-center">
      <p className="font-bold text-ink">{title}</p>
      {children && <div className="mt-1 text-sm text-ink-soft">{children}</div>}
    </div>
  );
}

export function PageHeader({ title, children }: { title: string; children?: ReactNode }) {
  return (
    <div className="mb-5 flex flex-wrap items-end justify-between gap-3">
      <h1 className="text-2xl font-bold text-ink">{title}</h1>
      {children && <div className="flex flex-wrap gap-2">{children}</div>}
    </div>
  );
}

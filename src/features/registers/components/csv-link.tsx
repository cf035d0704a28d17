import { withQuery } from '../../../lib/api-client';

/** Downloads the list as it is filtered now (every page), as CSV. */
export function CsvLink({ path, query, label = 'Export CSV' }: { path: string; query: Record<string, string | number>; label?: string }) {
  const { page: _page, pageSize: _pageSize, ...filters } = query;
  return (
    <a
      href={`/api${withQuery(path, filters)}`}
      download
      className="inline-flex items-center gap-2 rounded-md border border-ink/20 bg-white px-3 py-1.5 text-sm font-bold text-ink hover:border-ink/50"
    >
      {label}
    </a>
  );
}

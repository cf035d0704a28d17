// A server-paged, server-sorted table on TanStack Table. The server does the
// work; this draws headers that sort, rows, and the pager.
import { flexRender, getCoreRowModel, useReactTable, type ColumnDef } from '@tanstack/react-table';
import { Button } from './button';
import { EmptyState, ErrorNotice, Loading } from './states';

export interface DataTableProps<T> {
  columns: ColumnDef<T, any>[];
  data: T[] | undefined;
  total: number;
  page: number;
  pageSize: number;
  /** "field" or "-field". */
  sort: string;
  onSortChange(sort: string): void;
  onPageChange(page: number): void;
  isLoading?: boolean;
  /** The rows on screen are the previous list's, kept while the new filter or page loads. */
  isRefreshing?: boolean;
  error?: unknown;
  emptyTitle?: string;
  emptyHint?: string;
  caption: string;
  getRowId?(row: T): string;
}

export function DataTable<T>({
  columns,
  data,
  total,
  page,
  pageSize,
  sort,
  onSortChange,
  onPageChange,
  isLoading,
  isRefreshing = false,
  error,
  emptyTitle = 'Nothing here yet',
  emptyHint,
  caption,
  getRowId,
}: DataTableProps<T>) {
  const table = useReactTable({
    data: data ?? [],
    columns,
    getCoreRowModel: getCoreRowModel(),
    manualPagination: true,
    manualSorting: true,
    rowCount: total,
    getRowId: getRowId ? (row) => getRowId(row) : undefined,
  });
  const pages = Math.max(1, Math.ceil(total / pageSize));
  const sortField = sort.replace(/^-/, '');
  const descending = sort.startsWith('-');

  if (error) return <ErrorNotice error={error} title="The list could not be loaded" />;

  return (
    <div className="overflow-hidden rounded-lg border border-ink/10 bg-white" aria-busy={isRefreshing}>
      <div className={`overflow-x-auto transition-opacity ${isRefreshing ? 'opacity-50' : ''}`}>
        <table className="w-full text-left text-sm">
          <caption className="sr-only">{caption}</caption>
          <thead className="bg-lagoon-soft/60 text-xs tracking-wide text-ink-soft">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sortable = header.column.columnDef.enableSorting !== false && header.column.id !== 'actions';
                  const active = sortField === header.column.id;
                  return (
                    <th key={header.id} scope="col" className="px-3 py-2 font-bold" aria-sort={active ? (descending ? 'descending' : 'ascending') : 'none'}>
                      {sortable ? (
                        <button
                          type="button"
                          className="inline-flex items-center gap-1 hover:text-ink"
                          onClick={() => onSortChange(active && !descending ? `-${header.column.id}` : header.column.id)}
                        >
                          {flexRender(header.column.columnDef.header, header.getContext())}
                          <span aria-hidden="true">{active ? (descending ? '▼' : '▲') : '↕'}</span>
                        </button>
                      ) : (
                        flexRender(header.column.columnDef.header, header.getContext())
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id} className="border-t border-ink/5 hover:bg-paper">
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className="px-3 py-2 align-top">
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {isLoading && !data && <div className="px-3"><Loading /></div>}
      {data && data.length === 0 && (
        <div className="p-4">
          <EmptyState title={emptyTitle}>{emptyHint}</EmptyState>
        </div>
      )}
      <div className="flex items-center justify-between border-t border-ink/10 px-3 py-2 text-xs text-ink-soft">
        <span>
          {total} {total === 1 ? 'record' : 'records'} · page {page} of {pages}
          {isRefreshing && <span role="status"> · updating…</span>}
        </span>
        <div className="flex gap-1">
          <Button variant="secondary" disabled={page <= 1} onClick={() => onPageChange(page - 1)} aria-label="Previous page">
            ‹ Previous
          </Button>
          <Button variant="secondary" disabled={page >= pages} onClick={() => onPageChange(page + 1)} aria-label="Next page">
            Next ›
          </Button>
        </div>
      </div>
    </div>
  );
}

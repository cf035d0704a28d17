// The inspections of an impact view, on TanStack Table with client-side paging;
// on a finding's worksheet rows can be chosen to record one decision for all.
import { useMemo, useState } from 'react';
import {
  flexRender,
  getCoreRowModel,
  getPaginationRowModel,
  useReactTable,
  type ColumnDef,
  type RowSelectionState,
} from '@tanstack/react-table';
import { CONTAINMENT_DECISION_LABELS, type ImpactRow } from '../../../../shared/schemas/impact';
import { INSPECTION_RESULT_LABELS } from '../../../../shared/schemas/inspection';
import { Button } from '../../../components/ui/button';
import { formatUtc } from './impact-format';

const PAGE_SIZE = 25;

const equipment = (row: ImpactRow) =>
  [row.inspection.instrument, row.inspection.probe, row.inspection.referenceStandard]
    .filter((item) => item !== null)
    .map((item) => item!.serialNumber)
    .join(' · ');

const baseColumns: ColumnDef<ImpactRow>[] = [
  { id: 'performedOn', header: 'Date', cell: ({ row }) => <span className="whitespace-nowrap">{row.original.inspection.performedOn}</span> },
  { id: 'customer', header: 'Customer', cell: ({ row }) => row.original.inspection.customer },
  {
    id: 'part',
    header: 'Part / serial',
    cell: ({ row }) => (
      <span className="whitespace-nowrap">
        {row.original.inspection.partNumber}
        <span className="block text-xs text-ink-soft">s/n {row.original.inspection.serialNumber}</span>
      </span>
    ),
  },
  { id: 'workOrder', header: 'Work order', cell: ({ row }) => <span className="whitespace-nowrap">{row.original.inspection.workOrder}</span> },
  {
    id: 'technique',
    header: 'Technique',
    cell: ({ row }) => (
      <span className="whitespace-nowrap">
        {row.original.inspection.technique.code} rev {row.original.inspection.revision.revision}
      </span>
    ),
  },
  { id: 'inspector', header: 'Inspector', cell: ({ row }) => row.original.inspection.inspector.name },
  { id: 'result', header: 'Result', cell: ({ row }) => INSPECTION_RESULT_LABELS[row.original.inspection.result] },
  { id: 'equipment', header: 'Equipment', cell: ({ row }) => <span className="text-xs">{equipment(row.original) || '—'}</span> },
];

const decisionColumn: ColumnDef<ImpactRow> = {
  id: 'decision',
  header: 'Decision',
  cell: ({ row }) => {
    const decision = row.original.decision;
    if (!decision) return <span className="font-bold text-fail">Undecided</span>;
    return (
      <>
        <span className="font-bold">{CONTAINMENT_DECISION_LABELS[decision.decision]}</span>
        <div className="text-xs text-ink-soft">{decision.reason}</div>
        <div className="text-xs text-ink-soft">
          {decision.decidedBy.name}, {formatUtc(decision.decidedAt)}
        </div>
      </>
    );
  },
};

export function InspectionRowsTable({
  rows,
  caption,
  withDecisions,
  selection,
  onSelectionChange,
}: {
  rows: ImpactRow[];
  caption: string;
  withDecisions: boolean;
  /** Chosen rows by inspection id; leave out to show the table without choosing. */
  selection?: RowSelectionState;
  onSelectionChange?(selection: RowSelectionState): void;
}) {
  const [pageIndex, setPageIndex] = useState(0);
  const selectable = selection !== undefined && onSelectionChange !== undefined;
  const columns = useMemo<ColumnDef<ImpactRow>[]>(() => {
    const select: ColumnDef<ImpactRow> = {
      id: 'select',
      header: ({ table }) => (
        <input
          type="checkbox"
          aria-label="Choose every listed inspection"
          checked={table.getIsAllRowsSelected()}
          ref={(input) => {
            if (input) input.indeterminate = table.getIsSomeRowsSelected();
          }}
          onChange={table.getToggleAllRowsSelectedHandler()}
        />
      ),
      cell: ({ row }) => (
        <input
          type="checkbox"
          aria-label={`Choose ${row.original.inspection.partNumber} s/n ${row.original.inspection.serialNumber}`}
          checked={row.getIsSelected()}
          onChange={row.getToggleSelectedHandler()}
        />
      ),
    };
    return [...(selectable ? [select] : []), ...baseColumns, ...(withDecisions ? [decisionColumn] : [])];
  }, [selectable, withDecisions]);

  // A filter may leave fewer pages than the one shown: stay on the last that exists.
  const pages = Math.max(1, Math.ceil(rows.length / PAGE_SIZE));
  const page = Math.min(pageIndex, pages - 1);
  const table = useReactTable({
    data: rows,
    columns,
    getCoreRowModel: getCoreRowModel(),
    getPaginationRowModel: getPaginationRowModel(),
    getRowId: (row) => String(row.inspection.id),
    enableRowSelection: selectable,
    state: { rowSelection: selection ?? {}, pagination: { pageIndex: page, pageSize: PAGE_SIZE } },
    onRowSelectionChange: (updater) => onSelectionChange?.(typeof updater === 'function' ? updater(selection ?? {}) : updater),
    onPaginationChange: (updater) => setPageIndex((typeof updater === 'function' ? updater({ pageIndex: page, pageSize: PAGE_SIZE }) : updater).pageIndex),
    autoResetPageIndex: false,
  });

  return (
    <div className="overflow-hidden rounded-md border border-ink/10">
      <div className="overflow-x-auto">
        <table className="w-full text-left text-sm">
          <caption className="sr-only">{caption}</caption>
          <thead className="bg-lagoon-soft/60 text-xs uppercase tracking-wide text-ink-soft">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => (
                  <th key={header.id} scope="col" className="px-2 py-2 font-bold">
                    {flexRender(header.column.columnDef.header, header.getContext())}
                  </th>
                ))}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id} className={`border-t border-ink/5 align-top ${row.getIsSelected() ? 'bg-copper-soft/40' : ''}`}>
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className="px-2 py-1.5">
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {rows.length === 0 && <p className="p-3 text-sm text-ink-soft">No inspection listed.</p>}
      {rows.length > PAGE_SIZE && (
        <div className="flex items-center justify-between border-t border-ink/10 px-3 py-2 text-xs text-ink-soft">
          <span>
            {rows.length} inspections · page {page + 1} of {pages}
          </span>
          <div className="flex gap-1">
            <Button variant="secondary" disabled={page <= 0} onClick={() => setPageIndex(page - 1)} aria-label="Previous page">‹ Previous</Button>
            <Button variant="secondary" disabled={page >= pages - 1} onClick={() => setPageIndex(page + 1)} aria-label="Next page">Next ›</Button>
          </div>
        </div>
      )}
    </div>
  );
}

import { useMemo, useState } from 'react';
import { createColumnHelper } from '@tanstack/react-table';
import { subject } from '@casl/ability';
import { INSPECTION_RESULTS, INSPECTION_RESULT_LABELS, type InspectionResult, type InspectionView } from '../../../../shared/schemas/inspection';
import { EQUIPMENT_KIND_LABELS } from '../../../../shared/schemas/equipment';
import { DataTable } from '../../../components/ui/data-table';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { CsvExportLink } from '../../../components/ui/export-links';
import { FilterDate, FilterSearch, FilterSelect } from '../../../components/ui/list-filter';
import { ErrorNotice, Loading } from '../../../components/ui/states';
import { useListParams } from '../../../hooks/use-list-params';
import { useAbility } from '../../../lib/ability';
import { useCreateInspection, useInspectionOptions, useInspections, useUpdateInspection } from '../api/inspections';
import { InspectionForm } from './inspection-form';
import { ImportDialog } from './import-dialog';

const column = createColumnHelper<InspectionView>();
const RESULT_CLASS: Record<InspectionResult, string> = {
  accept: 'bg-green-50 text-pass border-pass/30',
  reject: 'bg-red-50 text-fail border-fail/30',
  indication_recorded: 'bg-amber-50 text-warn border-warn/30',
};

function ResultBadge({ result }: { result: InspectionResult }) {
  return <span className={`inline-block rounded border px-1.5 py-0.5 text-xs font-bold whitespace-nowrap ${RESULT_CLASS[result]}`}>{INSPECTION_RESULT_LABELS[result]}</span>;
}

export function InspectionsPanel() {
  const list = useListParams({ sort: '-performedOn' });
  const inspections = useInspections(list.query);
  const options = useInspectionOptions();
  const create = useCreateInspection();
  const update = useUpdateInspection();
  const ability = useAbility();
  const canCreate = ability.can('create', 'Inspection');
  const [pending, setPending] = useState<{ kind: 'create' } | { kind: 'edit'; item: InspectionView } | { kind: 'import' } | null>(null);
  const [saved, setSaved] = useState<string | null>(null);

  const close = () => {
    setPending(null);
    create.reset();
    update.reset();
  };

  const techniques = useMemo(() => {
    const seen = new Map<number, string>();
    for (const r of options.data?.revisions ?? []) seen.set(r.techniqueId, `${r.techniqueCode} — ${r.techniqueTitle}`);
    return [...seen.entries()];
  }, [options.data]);
  const revisions = (options.data?.revisions ?? []).filter((r) => !list.filters.techniqueId || String(r.techniqueId) === list.filters.techniqueId);

  const columns = useMemo(
    () => [
      column.accessor('performedOn', { header: 'Date', cell: (info) => <span className="whitespace-nowrap">{info.getValue()}</span> }),
      column.display({
        id: 'technique',
        header: 'Technique',
        enableSorting: false,
        cell: ({ row }) => (
          <span className="whitespace-nowrap font-bold">
            {row.original.technique.code} rev {row.original.revision.revision}
          </span>
        ),
      }),
      column.accessor('partNumber', {
        header: 'Part / serial',
        cell: ({ row }) => (
          <div>
            <div className="font-bold">{row.original.partNumber}</div>
            <div className="text-xs text-ink-soft">S/N {row.original.serialNumber}</div>
          </div>
        ),
      }),
      column.accessor('workOrder', { header: 'Work order' }),
      column.accessor('customer', { header: 'Customer' }),
      column.display({ id: 'inspector', header: 'Inspector', enableSorting: false, cell: ({ row }) => row.original.inspector.name }),
      column.accessor('result', {
        header: 'Result',
        cell: ({ row }) => (
          <div className="flex flex-col items-start gap-1">
            <ResultBadge result={row.original.result} />
            {row.original.notes && <span className="max-w-56 text-xs text-ink-soft">{row.original.notes}</span>}
          </div>
        ),
      }),
      column.display({
        id: 'equipment',
        header: 'Equipment',
        enableSorting: false,
        cell: ({ row }) => {
          const items = [row.original.instrument, row.original.probe, row.original.referenceStandard].filter((item) => item !== null);
          if (items.length === 0) return <span className="text-xs text-ink-soft">none recorded</span>;
          return (
            <ul className="text-xs">
              {items.map((item) => (
                <li key={item.id} title={item.description}>
                  <span className="text-ink-soft">{EQUIPMENT_KIND_LABELS[item.kind as keyof typeof EQUIPMENT_KIND_LABELS] ?? item.kind}:</span> {item.serialNumber}
                </li>
              ))}
            </ul>
          );
        },
      }),
      column.display({
        id: 'actions',
        header: () => <span className="sr-only">Actions</span>,
        cell: ({ row }) =>
          ability.can('update', subject('Inspection', { createdById: row.original.createdById })) ? (
            <Button
              variant="ghost"
              onClick={() => setPending({ kind: 'edit', item: row.original })}
              aria-label={`Correct the inspection of ${row.original.partNumber} S/N ${row.original.serialNumber} on ${row.original.performedOn}`}
            >
              Correct
            </Button>
          ) : null,
      }),
    ],
    [ability],
  );

  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end justify-between gap-2">
        <div className="flex flex-wrap items-end gap-2">
          <FilterSearch placeholder="Part, serial, work order, customer" defaultValue={list.q} onChange={(q) => list.update({ q })} />
          <FilterSelect
            label="Technique"
            className="max-w-64"
            value={list.filters.techniqueId}
            options={techniques.map(([id, label]) => ({ value: id, label }))}
            onChange={(techniqueId) => list.update({ techniqueId, revisionId: null })}
          />
          <FilterSelect
            label="Revision"
            value={list.filters.revisionId}
            options={revisions.map((r) => ({ value: r.id, label: `${r.techniqueCode} rev ${r.revision}` }))}
            onChange={(revisionId) => list.update({ revisionId })}
          />
          <FilterSelect
            label="Equipment"
            className="max-w-56"
            value={list.filters.equipmentId}
            options={(options.data?.equipment ?? []).map((item) => ({ value: item.id, label: `${item.serialNumber} — ${item.description}` }))}
            onChange={(equipmentId) => list.update({ equipmentId })}
          />
          <FilterSelect
            label="Result"
            value={list.filters.result}
            options={INSPECTION_RESULTS.map((result) => ({ value: result, label: INSPECTION_RESULT_LABELS[result] }))}
            onChange={(result) => list.update({ result })}
          />
          <FilterDate label="From" value={list.filters.from} onChange={(from) => list.update({ from })} />
          <FilterDate label="To" value={list.filters.to} onChange={(to) => list.update({ to })} />
        </div>
        <div className="flex flex-wrap gap-2">
          <CsvExportLink path="/inspections.csv" query={list.query} />
          {canCreate && (
            <>
              <Button variant="secondary" onClick={() => setPending({ kind: 'import' })}>
                Import CSV
              </Button>
              <Button onClick={() => setPending({ kind: 'create' })}>Record inspection</Button>
            </>
          )}
        </div>
      </div>
      {saved && (
        <p role="status" className="rounded-md border border-pass/30 bg-green-50 px-3 py-2 text-sm font-bold text-pass">
          {saved}
        </p>
      )}
      <DataTable
        caption="Inspection register"
        columns={columns}
        data={inspections.data?.items}
        total={inspections.data?.total ?? 0}
        page={list.page}
        pageSize={list.pageSize}
        sort={list.sort}
        onSortChange={(sort) => list.update({ sort })}
        onPageChange={(page) => list.update({ page }, { resetPage: false })}
        isLoading={inspections.isLoading}
        isRefreshing={inspections.isPlaceholderData}
        error={inspections.error}
        emptyTitle="No inspections match"
        emptyHint={canCreate ? 'Change the filters, record an inspection, or import a CSV file.' : 'Change the filters.'}
        getRowId={(row) => String(row.id)}
      />
      <Dialog open={pending?.kind === 'create' || pending?.kind === 'edit'} title={pending?.kind === 'edit' ? 'Correct inspection' : 'Record inspection'} onClose={close}>
        {options.isLoading ? (
          <Loading what="Loading revisions, people and equipment" />
        ) : options.error ? (
          <ErrorNotice error={options.error} title="The form could not be loaded" />
        ) : options.data && pending?.kind === 'create' ? (
          <InspectionForm
            options={options.data}
            pending={create.isPending}
            error={create.error}
            onSubmit={(input) =>
              create.mutate(input, {
                onSuccess: (view) => {
                  setSaved(`Inspection of ${view.partNumber} S/N ${view.serialNumber} recorded against ${view.technique.code} rev ${view.revision.revision}.`);
                  close();
                },
              })
            }
            onCancel={close}
          />
        ) : options.data && pending?.kind === 'edit' ? (
          <InspectionForm
            key={pending.item.id}
            options={options.data}
            item={pending.item}
            pending={update.isPending}
            error={update.error}
            onSubmit={(input) =>
              update.mutate(
                { id: pending.item.id, version: pending.item.version, ...input },
                {
                  onSuccess: (view) => {
                    setSaved(`Inspection of ${view.partNumber} S/N ${view.serialNumber} corrected.`);
                    close();
                  },
                },
              )
            }
            onCancel={close}
          />
        ) : null}
      </Dialog>
      <ImportDialog open={pending?.kind === 'import'} onClose={close} />
    </div>
  );
}

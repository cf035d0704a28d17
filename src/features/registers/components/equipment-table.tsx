import { useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import { createColumnHelper } from '@tanstack/react-table';
import { EQUIPMENT_KIND_LABELS, EQUIPMENT_KIND_VALUES, EQUIPMENT_STATUSES, EQUIPMENT_STATUS_LABELS, type EquipmentView } from '../../../../shared/schemas/equipment';
import { DataTable } from '../../../components/ui/data-table';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { useListParams } from '../../../hooks/use-list-params';
import { useAbility } from '../../../lib/ability';
import { useCreateEquipment, useEquipment, useUpdateEquipment } from '../api/equipment';
import { EquipmentForm, toEquipmentInput, type EquipmentFormValues } from './equipment-form';
import { CalibrationBadge } from './flag-badge';
import { EQUIPMENT_USE_STATUS_LABELS } from '../../../../shared/labels/registers';
import { CsvExportLink, RecordExportLinks } from '../../../components/ui/export-links';
import { FilterSearch, FilterSelect } from '../../../components/ui/list-filter';

const column = createColumnHelper<EquipmentView>();
const CALIBRATION_FILTERS = [
  { value: 'overdue', label: 'Overdue' },
  { value: 'due-soon', label: 'Due within 30 days' },
  { value: 'none', label: 'No calibration record' },
];

const notchSummary = (item: EquipmentView) =>
  item.notches
    .map((n) => `${n.label ? `${n.label} ` : ''}${n.orientation} ${n.depthMm} mm${n.edgeDistanceMm !== null ? ` @ ${n.edgeDistanceMm} mm from edge` : ''}`)
    .join('; ');

export function EquipmentTable() {
  const list = useListParams({ sort: 'description' });
  const equipment = useEquipment(list.query);
  const create = useCreateEquipment();
  const update = useUpdateEquipment();
  const ability = useAbility();
  const canEdit = ability.can('update', 'Equipment');
  const [pending, setPending] = useState<{ kind: 'create' } | { kind: 'edit'; item: EquipmentView; values?: EquipmentFormValues; confirm?: boolean } | null>(null);

  const close = () => {
    setPending(null);
    create.reset();
    update.reset();
  };

  const columns = useMemo(
    () => [
      column.accessor('description', {
        header: 'Item',
        cell: ({ row }) => (
          <div>
            <div className="font-bold">{row.original.description}</div>
            <div className="text-xs text-ink-soft">
              {EQUIPMENT_KIND_LABELS[row.original.kind]}
              {row.original.model ? ` · ${row.original.model}` : ''}
            </div>
            {row.original.kind === 'reference-standard' && (
              <div className="text-xs text-ink-soft">
                {row.original.conductivityIacs !== null ? `${row.original.conductivityIacs} %IACS` : 'conductivity not recorded'}
                {row.original.notches.length ? ` · ${notchSummary(row.original)}` : ' · no notches recorded'}
              </div>
            )}
          </div>
        ),
      }),
      column.accessor('kind', { header: 'Kind', cell: (info) => EQUIPMENT_KIND_LABELS[info.getValue()] }),
      column.accessor('serialNumber', { header: 'Serial number' }),
      column.accessor('calibratedOn', { header: 'Calibrated', cell: (info) => info.getValue() ?? '—' }),
      column.accessor('calibrationDueOn', {
        header: 'Calibration due',
        cell: ({ row }) => (
          <div className="flex flex-col items-start gap-1">
            <span>{row.original.calibrationDueOn ?? '—'}</span>
            <CalibrationBadge flag={row.original.calibration} status={row.original.status} />
          </div>
        ),
      }),
      column.accessor('useStatus', { header: 'Status', cell: (info) => EQUIPMENT_USE_STATUS_LABELS[info.getValue()] }),
      column.display({
        id: 'actions',
        header: () => <span className="sr-only">Actions</span>,
        cell: ({ row }) => (
          <div className="flex flex-wrap items-center gap-1">
            <Link
              className="whitespace-nowrap px-2 text-sm text-lagoon underline"
              to={`/registers/equipment/${row.original.id}/impact`}
              aria-label={`Inspections made with ${row.original.serialNumber}`}
            >
              Inspections
            </Link>
            {canEdit ? (
              <Button variant="ghost" onClick={() => setPending({ kind: 'edit', item: row.original })} aria-label={`Edit ${row.original.description}`}>
                Edit
              </Button>
            ) : null}
          </div>
        ),
      }),
    ],
    [canEdit],
  );

  const save = (item: EquipmentView, values: EquipmentFormValues) =>
    update.mutate({ id: item.id, version: item.version, ...toEquipmentInput(values) }, { onSuccess: close });

  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end justify-between gap-2">
        <div className="flex flex-wrap items-end gap-2">
          <FilterSearch placeholder="Description, model, serial" defaultValue={list.q} onChange={(q) => list.update({ q })} />
          <FilterSelect
            label="Kind"
            value={list.filters.kind}
            options={EQUIPMENT_KIND_VALUES.map((kind) => ({ value: kind, label: EQUIPMENT_KIND_LABELS[kind] }))}
            onChange={(kind) => list.update({ kind })}
          />
          <FilterSelect
            label="Status"
            value={list.filters.status}
            options={EQUIPMENT_STATUSES.map((status) => ({ value: status, label: EQUIPMENT_STATUS_LABELS[status] }))}
            onChange={(status) => list.update({ status })}
          />
          <FilterSelect label="Calibration" value={list.filters.calibration} options={CALIBRATION_FILTERS} onChange={(calibration) => list.update({ calibration })} />
        </div>
        <div className="flex gap-2">
          <CsvExportLink path="/equipment.csv" query={list.query} />
          {ability.can('create', 'Equipment') && <Button onClick={() => setPending({ kind: 'create' })}>Register equipment</Button>}
        </div>
      </div>
      <DataTable
        caption="Equipment register"
        columns={columns}
        data={equipment.data?.items}
        total={equipment.data?.total ?? 0}
        page={list.page}
        pageSize={list.pageSize}
        sort={list.sort}
        onSortChange={(sort) => list.update({ sort })}
        onPageChange={(page) => list.update({ page }, { resetPage: false })}
        isLoading={equipment.isLoading}
        isRefreshing={equipment.isPlaceholderData}
        error={equipment.error}
        emptyTitle="No equipment matches"
        emptyHint="Change the filters, or register an instrument, probe or reference standard."
        getRowId={(row) => String(row.id)}
      />
      <Dialog open={pending?.kind === 'create'} title="Register equipment" onClose={close}>
        <EquipmentForm pending={create.isPending} error={create.error} onSubmit={(values) => create.mutate({ kind: values.kind, ...toEquipmentInput(values) }, { onSuccess: close })} onCancel={close} />
      </Dialog>
      {pending?.kind === 'edit' && !pending.confirm && (
        <Dialog open title={`Edit ${pending.item.description}`} onClose={close}>
          <EquipmentForm
            item={pending.item}
            pending={update.isPending}
            error={update.error}
            onSubmit={(values) =>
              // Retiring takes an item out of use for good: ask first.
              values.status === 'retired' && pending.item.status !== 'retired' ? setPending({ ...pending, values, confirm: true }) : save(pending.item, values)
            }
            onCancel={close}
          />
          <div className="mt-3">
            <RecordExportLinks kind="equipment" id={pending.item.id} />
          </div>
        </Dialog>
      )}
      {pending?.kind === 'edit' && pending.confirm && pending.values && (
        <ConfirmDialog
          open
          title={`Retire ${pending.item.description}?`}
          confirmLabel="Retire"
          danger
          pending={update.isPending}
          error={update.error}
          onCancel={close}
          onConfirm={() => save(pending.item, pending.values!)}
        >
          A retired item is out of use for good: link the techniques that call for it to another item. The record and its history stay in the register.
        </ConfirmDialog>
      )}
    </div>
  );
}

import { useMemo, useState } from 'react';
import { createColumnHelper } from '@tanstack/react-table';
import { CERTIFICATION_SCHEMES, NDT_METHODS, type CertificationView } from '../../../../shared/schemas/certification';
import { DataTable } from '../../../components/ui/data-table';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { useListParams } from '../../../hooks/use-list-params';
import { useAbility } from '../../../lib/ability';
import { useCertifications, useCreateCertification, useUpdateCertification } from '../api/certifications';
import { CertificationForm, toCertificationInput, type CertificationFormValues } from './certification-form';
import { CertificateBadge, VisionBadge } from './flag-badge';
import { CsvExportLink, RecordExportLinks } from '../../../components/ui/export-links';
import { FilterSearch, FilterSelect } from '../../../components/ui/list-filter';

const column = createColumnHelper<CertificationView>();

const FLAG_FILTERS = [
  { value: 'attention', label: 'Needs attention' },
  { value: 'expired', label: 'Expired' },
  { value: 'expiring', label: 'Expiring within 60 days' },
  { value: 'vision-overdue', label: 'Near-vision exam overdue' },
];

export function CertificationsTable({ evidencePanel }: { evidencePanel?: (certification: CertificationView) => React.ReactNode }) {
  const list = useListParams({ sort: 'expiresOn' });
  const certifications = useCertifications(list.query);
  const create = useCreateCertification();
  const update = useUpdateCertification();
  const ability = useAbility();
  const canEdit = ability.can('update', 'Certification');
  const [pending, setPending] = useState<{ kind: 'create' } | { kind: 'edit'; certification: CertificationView } | null>(null);

  const close = () => {
    setPending(null);
    create.reset();
    update.reset();
  };

  const columns = useMemo(
    () => [
      column.accessor('personName', { header: 'Person' }),
      column.accessor('method', { header: 'Method' }),
      column.accessor('level', { header: 'Level', cell: (info) => `Level ${info.getValue()}` }),
      column.accessor('scheme', { header: 'Scheme' }),
      column.accessor('certificateNumber', { header: 'Certificate' }),
      column.accessor('expiresOn', {
        header: 'Expires',
        cell: ({ row }) => (
          <div className="flex flex-col items-start gap-1">
            <span>{row.original.expiresOn}</span>
            <CertificateBadge flag={row.original.certificate} />
          </div>
        ),
      }),
      column.accessor('nearVisionExamOn', {
        header: 'Near-vision exam',
        cell: ({ row }) => (
          <div className="flex flex-col items-start gap-1">
            <span>{row.original.nearVisionExamOn ?? '—'}</span>
            <VisionBadge flag={row.original.vision} />
          </div>
        ),
      }),
      column.accessor('sectors', { header: 'Sectors', enableSorting: false, cell: (info) => info.getValue().join(', ') || '—' }),
      column.display({
        id: 'actions',
        header: () => <span className="sr-only">Actions</span>,
        cell: ({ row }) =>
          canEdit || evidencePanel ? (
            <Button variant="ghost" onClick={() => setPending({ kind: 'edit', certification: row.original })} aria-label={`${canEdit ? 'Edit' : 'Open'} ${row.original.certificateNumber}`}>
              {canEdit ? 'Edit' : 'Open'}
            </Button>
          ) : null,
      }),
    ],
    [canEdit, evidencePanel],
  );

  const submitCreate = (values: CertificationFormValues) => {
    if (!values.userId) return create.reset();
    create.mutate({ userId: values.userId, ...toCertificationInput(values) }, { onSuccess: close });
  };
  const submitEdit = (certification: CertificationView) => (values: CertificationFormValues) =>
    update.mutate({ id: certification.id, version: certification.version, ...toCertificationInput(values) }, { onSuccess: close });

  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end justify-between gap-2">
        <div className="flex flex-wrap items-end gap-2">
          <FilterSearch placeholder="Name, certificate, sector" defaultValue={list.q} onChange={(q) => list.update({ q })} />
          <FilterSelect label="Flag" anyLabel="All certificates" value={list.filters.flag} options={FLAG_FILTERS} onChange={(flag) => list.update({ flag })} />
          <FilterSelect
            label="Method"
            value={list.filters.method}
            options={NDT_METHODS.map((method) => ({ value: method, label: method }))}
            onChange={(method) => list.update({ method })}
          />
          <FilterSelect
            label="Scheme"
            value={list.filters.scheme}
            options={CERTIFICATION_SCHEMES.map((scheme) => ({ value: scheme, label: scheme }))}
            onChange={(scheme) => list.update({ scheme })}
          />
        </div>
        <div className="flex gap-2">
          <CsvExportLink path="/certifications.csv" query={list.query} />
          {ability.can('create', 'Certification') && <Button onClick={() => setPending({ kind: 'create' })}>Record a certificate</Button>}
        </div>
      </div>
      <DataTable
        caption="Personnel certifications"
        columns={columns}
        data={certifications.data?.items}
        total={certifications.data?.total ?? 0}
        page={list.page}
        pageSize={list.pageSize}
        sort={list.sort}
        onSortChange={(sort) => list.update({ sort })}
        onPageChange={(page) => list.update({ page }, { resetPage: false })}
        isLoading={certifications.isLoading}
        isRefreshing={certifications.isPlaceholderData}
        error={certifications.error}
        emptyTitle="No certificates match"
        emptyHint="Change the filters, or record a certificate."
        getRowId={(row) => String(row.id)}
      />
      <Dialog open={pending?.kind === 'create'} title="Record a certificate" onClose={close}>
        <CertificationForm pending={create.isPending} error={create.error} onSubmit={submitCreate} onCancel={close} />
      </Dialog>
      {pending?.kind === 'edit' && (
        <Dialog open title={`${pending.certification.personName}: ${pending.certification.method} Level ${pending.certification.level}`} onClose={close}>
          {canEdit ? (
            <CertificationForm certification={pending.certification} pending={update.isPending} error={update.error} onSubmit={submitEdit(pending.certification)} onCancel={close} />
          ) : (
            <p className="text-sm">Certificate {pending.certification.certificateNumber}, expires {pending.certification.expiresOn}.</p>
          )}
          {evidencePanel && <div className="mt-4 border-t border-ink/10 pt-3">{evidencePanel(pending.certification)}</div>}
          <div className="mt-3">
            <RecordExportLinks kind="certification" id={pending.certification.id} />
          </div>
        </Dialog>
      )}
    </div>
  );
}

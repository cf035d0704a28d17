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

const column = createColumnHelper<CertificationView>();

const filterClass = 'rounded-md border border-ink/25 bg-white px-2 py-1.5 text-sm font-normal';

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
            <Button variant="ghost" onClick={() => setPending({ kind: 'edit', certification: row.original })} aria-label={`Open ${row.original.certificateNumber}`}>
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
          <label className="flex flex-col gap-1 text-sm font-bold">
            Search
            <input type="search" className={`${filterClass} w-56`} placeholder="Name, certificate, sector" defaultValue={list.q} onChange={(e) => list.update({ q: e.target.value })} />
          </label>
          <label className="flex flex-col gap-1 text-sm font-bold">
            Flag
            <select className={filterClass} value={list.filters.flag ?? ''} onChange={(e) => list.update({ flag: e.target.value })}>
              <option value="">All certificates</option>
              <option value="attention">Needs attention</option>
              <option value="expired">Expired</option>
              <option value="expiring">Expiring within 60 days</option>
              <option value="vision-overdue">Near-vision exam overdue</option>
            </select>
          </label>
          <label className="flex flex-col gap-1 text-sm font-bold">
            Method
            <select className={filterClass} value={list.filters.method ?? ''} onChange={(e) => list.update({ method: e.target.value })}>
              <option value="">Any</option>
              {NDT_METHODS.map((method) => (
                <option key={method}>{method}</option>
              ))}
            </select>
          </label>
          <label className="flex flex-col gap-1 text-sm font-bold">
            Scheme
            <select className={filterClass} value={list.filters.scheme ?? ''} onChange={(e) => list.update({ scheme: e.target.value })}>
              <option value="">Any</option>
              {CERTIFICATION_SCHEMES.map((scheme) => (
                <option key={scheme}>{scheme}</option>
              ))}
            </select>
          </label>
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

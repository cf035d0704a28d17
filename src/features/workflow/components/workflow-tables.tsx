// The three workflow lists on the shared DataTable: paged, sorted and filtered by the server.
import { useMemo } from 'react';
import { Link } from 'react-router-dom';
import { createColumnHelper } from '@tanstack/react-table';
import { AUDIT_STATES, CORRECTIVE_ACTION_STATES, FINDING_STATES } from '../../../../machines';
import type { ActionView, AuditView, FindingView } from '../../../../shared/schemas/workflow';
import { DataTable } from '../../../components/ui/data-table';
import { useListParams } from '../../../hooks/use-list-params';
import { CsvExportLink } from '../../../components/ui/export-links';
import { useActions, useAudits, useFindings } from '../api/workflow';
import { ListFilters } from './list-filters';
import { ClassBadge, DueDate, StateBadge } from './state-badge';

const link = 'font-bold text-lagoon underline';

export function AuditsTable() {
  const list = useListParams({ sort: '-plannedStart' });
  const audits = useAudits(list.query);
  const column = createColumnHelper<AuditView>();
  const columns = useMemo(
    () => [
      column.accessor('title', { header: 'Audit', cell: (info) => <Link className={link} to={`/audits/${info.row.original.id}`}>{info.getValue()}</Link> }),
      column.accessor('areaName', { header: 'Area', enableSorting: false }),
      column.accessor('leadAuditor', { header: 'Lead auditor', enableSorting: false, cell: (info) => info.getValue()?.displayName ?? '—' }),
      column.accessor('plannedStart', { header: 'Planned', cell: (info) => `${info.getValue()} – ${info.row.original.plannedEnd}` }),
      column.accessor('state', { header: 'State', cell: (info) => <StateBadge state={info.getValue()} /> }),
      column.accessor('openFindingCount', { header: 'Open findings', enableSorting: false }),
    ],
    [column],
  );
  return (
    <>
      <ListFilters list={list} states={AUDIT_STATES} ownerRole="auditor" ownerLabel="Lead auditor" showOverdue={false} searchHint="Audit title" />
      <div className="mb-2 flex justify-end"><CsvExportLink path="/audits.csv" query={list.query} /></div>
      <DataTable caption="Audits" columns={columns} data={audits.data?.items} total={audits.data?.total ?? 0} page={list.page} pageSize={list.pageSize} sort={list.sort}
        onSortChange={(sort) => list.update({ sort })} onPageChange={(page) => list.update({ page })} isLoading={audits.isLoading} isRefreshing={audits.isPlaceholderData} error={audits.error}
        emptyTitle="No audits match" getRowId={(row) => String(row.id)} />
    </>
  );
}

export function FindingsTable() {
  const list = useListParams({ sort: '-number' });
  const findings = useFindings(list.query);
  const column = createColumnHelper<FindingView>();
  const columns = useMemo(
    () => [
      column.accessor('number', { header: 'Number', cell: (info) => <Link className={link} to={`/findings/${info.row.original.id}`}>{info.getValue()}</Link> }),
      column.accessor('title', { header: 'Finding' }),
      column.accessor('class', { header: 'Class', cell: (info) => <ClassBadge value={info.getValue()} /> }),
      column.accessor('state', { header: 'State', cell: (info) => <StateBadge state={info.getValue()} /> }),
      column.accessor('areaName', { header: 'Area', enableSorting: false }),
      column.accessor('action', { header: 'Action owner', enableSorting: false, cell: (info) => info.getValue()?.owner?.displayName ?? '—' }),
      column.accessor('dueDate', { header: 'Due', cell: (info) => <DueDate date={info.row.original.state === 'containment' ? info.row.original.containmentDueDate : info.getValue()} overdue={info.row.original.overdue} /> }),
    ],
    [column],
  );
  return (
    <>
      <ListFilters list={list} states={FINDING_STATES} showClass ownerRole={['level3', 'technician']} ownerLabel="Action owner" searchHint="Number, title or requirement" />
      <div className="mb-2 flex justify-end"><CsvExportLink path="/findings.csv" query={list.query} /></div>
      <DataTable caption="Findings" columns={columns} data={findings.data?.items} total={findings.data?.total ?? 0} page={list.page} pageSize={list.pageSize} sort={list.sort}
        onSortChange={(sort) => list.update({ sort })} onPageChange={(page) => list.update({ page })} isLoading={findings.isLoading} isRefreshing={findings.isPlaceholderData} error={findings.error}
        emptyTitle="No findings match" getRowId={(row) => String(row.id)} />
    </>
  );
}

export function ActionsTable() {
  const list = useListParams({ sort: 'dueDate' });
  const actions = useActions(list.query);
  const column = createColumnHelper<ActionView>();
  const columns = useMemo(
    () => [
      column.accessor('number', { header: 'Number', cell: (info) => <Link className={link} to={`/actions/${info.row.original.id}`}>{info.getValue()}</Link> }),
      column.accessor('finding', { header: 'Finding', enableSorting: false, cell: (info) => (info.getValue() ? `${info.getValue()!.number}: ${info.getValue()!.title}` : '—') }),
      column.accessor('owner', { header: 'Owner', enableSorting: false, cell: (info) => info.getValue()?.displayName ?? '—' }),
      column.accessor('state', { header: 'State', cell: (info) => <StateBadge state={info.getValue()} /> }),
      column.accessor('dueDate', { header: 'Due', cell: (info) => <DueDate date={info.getValue()} overdue={info.row.original.overdue} /> }),
      column.accessor('evidenceCount', { header: 'Evidence', enableSorting: false }),
    ],
    [column],
  );
  return (
    <>
      <ListFilters list={list} states={CORRECTIVE_ACTION_STATES} ownerRole={['level3', 'technician']} searchHint="Number, finding or root cause" />
      <div className="mb-2 flex justify-end"><CsvExportLink path="/actions.csv" query={list.query} /></div>
      <DataTable caption="Corrective actions" columns={columns} data={actions.data?.items} total={actions.data?.total ?? 0} page={list.page} pageSize={list.pageSize} sort={list.sort}
        onSortChange={(sort) => list.update({ sort })} onPageChange={(page) => list.update({ page })} isLoading={actions.isLoading} isRefreshing={actions.isPlaceholderData} error={actions.error}
        emptyTitle="No corrective actions match" getRowId={(row) => String(row.id)} />
    </>
  );
}

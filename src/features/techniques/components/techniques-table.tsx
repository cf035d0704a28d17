import { useMemo } from 'react';
import { Link } from 'react-router-dom';
import { createColumnHelper } from '@tanstack/react-table';
import { TECHNIQUE_REVISION_STATES, TECHNIQUE_STATE_LABELS, VERDICTS, VERDICT_LABELS, type TechniqueListItem } from '../../../../shared/schemas/technique-register';
import { DataTable } from '../../../components/ui/data-table';
import { useListParams } from '../../../hooks/use-list-params';
import { CsvExportLink } from '../../../components/ui/export-links';
import { useAreas, useTechniques } from '../api/techniques';
import { StateBadge, VerdictBadge } from './badges';
import { RULE_LABELS } from './labels';

const column = createColumnHelper<TechniqueListItem>();
const selectClass = 'rounded-md border border-ink/25 bg-white px-2.5 py-1.5 font-normal';

export function TechniquesTable() {
  const list = useListParams({ sort: 'code' });
  const techniques = useTechniques(list.query);
  const areas = useAreas();

  const columns = useMemo(
    () => [
      column.accessor('code', {
        header: 'Code',
        cell: (info) => (
          <Link to={`/techniques/${info.row.original.id}`} className="font-bold text-lagoon underline-offset-2 hover:underline">
            {info.getValue()}
          </Link>
        ),
      }),
      column.accessor('title', { header: 'Title' }),
      column.accessor('areaName', { header: 'Area', enableSorting: false, cell: (info) => info.getValue() ?? '—' }),
      column.accessor('revision', {
        header: 'Revision',
        cell: (info) => (
          <span>
            {info.getValue()}
            {info.row.original.approvedRevision && (
              <span className="block text-xs text-ink-soft">{info.row.original.approvedRevision} in force</span>
            )}
          </span>
        ),
      }),
      column.accessor('state', { header: 'State', cell: (info) => <StateBadge state={info.getValue()} /> }),
      column.accessor('verdict', {
        // Stored per revision from the technique as written; people and equipment are checked on the technique's page.
        header: 'Checklist as written',
        cell: (info) => (
          <div>
            <VerdictBadge verdict={info.getValue()} />
            {info.row.original.failedRules.length > 0 && (
              <span className="mt-0.5 block text-xs text-ink-soft">{info.row.original.failedRules.map((rule) => RULE_LABELS[rule]).join(', ')}</span>
            )}
          </div>
        ),
      }),
      column.accessor('updatedAt', { header: 'Changed', cell: (info) => new Date(info.getValue()).toLocaleDateString() }),
    ],
    [],
  );

  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end gap-3">
        <label className="flex flex-col gap-1 text-sm font-bold">
          Search techniques
          <input
            type="search"
            className="w-72 rounded-md border border-ink/25 bg-white px-2.5 py-1.5 font-normal"
            placeholder="Code or title"
            defaultValue={list.q}
            onChange={(event) => list.update({ q: event.target.value })}
          />
        </label>
        <label className="flex flex-col gap-1 text-sm font-bold">
          State of the latest revision
          <select className={selectClass} value={list.filters.state ?? ''} onChange={(event) => list.update({ state: event.target.value })}>
            <option value="">Any state</option>
            {TECHNIQUE_REVISION_STATES.map((state) => (
              <option key={state} value={state}>
                {TECHNIQUE_STATE_LABELS[state]}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col gap-1 text-sm font-bold">
          Checklist verdict
          <select className={selectClass} value={list.filters.verdict ?? ''} onChange={(event) => list.update({ verdict: event.target.value })}>
            <option value="">Any verdict</option>
            {VERDICTS.map((verdict) => (
              <option key={verdict} value={verdict}>
                {VERDICT_LABELS[verdict]}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col gap-1 text-sm font-bold">
          Area
          <select className={selectClass} value={list.filters.areaId ?? ''} onChange={(event) => list.update({ areaId: event.target.value })}>
            <option value="">Any area</option>
            {areas.data?.items.map((area) => (
              <option key={area.id} value={area.id}>
                {area.name}
              </option>
            ))}
          </select>
        </label>
        <CsvExportLink path="/techniques.csv" query={list.query} />
      </div>
      <DataTable
        caption="Written eddy current techniques"
        columns={columns}
        data={techniques.data?.items}
        total={techniques.data?.total ?? 0}
        page={list.page}
        pageSize={list.pageSize}
        sort={list.sort}
        onSortChange={(sort) => list.update({ sort })}
        onPageChange={(page) => list.update({ page }, { resetPage: false })}
        isLoading={techniques.isLoading}
        isRefreshing={techniques.isPlaceholderData}
        error={techniques.error}
        emptyTitle={list.q || Object.keys(list.filters).length ? 'No technique matches these filters' : 'The register holds no techniques yet'}
        getRowId={(row) => String(row.id)}
      />
    </div>
  );
}

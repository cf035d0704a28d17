import { Link, useSearchParams } from 'react-router-dom';
import { PageHeader, ErrorNotice, Loading } from '../../components/ui/states';
import { Button } from '../../components/ui/button';
import { useDashboard, useDashboardAreas, type DashboardFilters } from '../../features/dashboard/api/dashboard';
import { DashboardCharts, OPEN_FINDING_STATES } from '../../features/dashboard/components/dashboard-charts';
import { FilterDate, FilterSelect } from '../../components/ui/list-filter';

export function Component() {
  const [params, setParams] = useSearchParams();
  const filters: DashboardFilters = {
    from: params.get('from') ?? undefined,
    to: params.get('to') ?? undefined,
    areaId: params.get('areaId') ?? undefined,
  };
  const dashboard = useDashboard(filters);
  const areas = useDashboardAreas();
  const set = (key: keyof DashboardFilters, value: string) =>
    setParams(
      (current) => {
        const next = new URLSearchParams(current);
        if (value) next.set(key, value);
        else next.delete(key);
        return next;
      },
      { replace: true },
    );
  const data = dashboard.data;
  // The tiles count findings raised in the range: their lists filter the same way.
  const raised = data ? `&raisedFrom=${data.range.from}&raisedTo=${data.range.to}` : '';
  const area = data?.range.areaId ? `&areaId=${data.range.areaId}` : '';

  return (
    <div>
      <PageHeader title="Dashboard" />
      <form className="mb-4 flex flex-wrap items-end gap-3" onSubmit={(event) => event.preventDefault()} aria-label="Dashboard filters">
        <FilterDate label="From" value={filters.from ?? data?.range.from} onChange={(value) => set('from', value)} />
        <FilterDate label="To" value={filters.to ?? data?.range.to} onChange={(value) => set('to', value)} />
        <FilterSelect
          label="Area"
          anyLabel="All areas"
          value={filters.areaId}
          options={(areas.data?.items ?? []).map((area) => ({ value: area.id, label: area.name }))}
          onChange={(value) => set('areaId', value)}
        />
        {(filters.from || filters.to || filters.areaId) && (
          <Button variant="secondary" onClick={() => setParams(new URLSearchParams(), { replace: true })}>
            Reset filters
          </Button>
        )}
      </form>
      {dashboard.error ? <ErrorNotice error={dashboard.error} title="The dashboard could not be loaded" /> : null}
      {!data && dashboard.isLoading && <Loading what="Counting the records" />}
      {data && (
        <>
          <dl className="mb-4 grid grid-cols-2 gap-3 md:grid-cols-4">
            {[
              { label: 'Open findings', value: data.totals.openFindings, to: `/findings?state=${OPEN_FINDING_STATES}${raised}${area}` },
              { label: 'Overdue actions', value: data.totals.overdueActions, to: `/actions?overdue=true${area}`, alarm: data.totals.overdueActions > 0 },
              { label: 'Findings closed', value: data.totals.closedFindings, to: `/findings?state=closed${raised}${area}` },
              { label: 'Checklist runs', value: data.totals.checklistRuns, to: '/audits' },
            ].map((tile) => (
              <div key={tile.label} className="rounded-lg border border-ink/10 bg-white p-3 shadow-sm">
                <dt className="text-xs font-bold uppercase tracking-wide text-ink-soft">{tile.label}</dt>
                <dd className={`text-2xl font-bold ${tile.alarm ? 'text-fail' : 'text-ink'}`}>
                  <Link to={tile.to} className="hover:underline">
                    {tile.value}
                  </Link>
                </dd>
              </div>
            ))}
          </dl>
          <p className="mb-3 text-xs text-ink-soft">
            {data.range.from} to {data.range.to}
            {data.range.areaId ? ` · ${areas.data?.items.find((a) => a.id === data.range.areaId)?.name ?? 'one area'}` : ' · all areas'} · ages and overdue as of {data.range.today} (UTC)
          </p>
          <DashboardCharts data={data} />
        </>
      )}
    </div>
  );
}

// The filters of a workflow list, kept in the address bar by useListParams.
import { FINDING_CLASSES } from '../../../../machines';
import { useAreaOptions, usePeopleWithRole } from '../api/workflow';
import { CLASS_LABELS, stateLabel } from './labels';

const selectClass = 'rounded-md border border-ink/25 bg-white px-2 py-1.5 text-sm font-normal';

interface ListParams {
  q: string;
  filters: Record<string, string>;
  update(changes: Record<string, string | number | null | undefined>): void;
}

export function ListFilters({
  list,
  states,
  showClass = false,
  ownerRole,
  ownerLabel = 'Owner',
  showOverdue = true,
  searchHint,
}: {
  list: ListParams;
  states: readonly string[];
  showClass?: boolean;
  ownerRole: string | string[];
  ownerLabel?: string;
  showOverdue?: boolean;
  searchHint: string;
}) {
  const areas = useAreaOptions();
  const roles = Array.isArray(ownerRole) ? ownerRole : [ownerRole];
  const first = usePeopleWithRole(roles[0]);
  const second = usePeopleWithRole(roles[1] ?? roles[0]);
  const people = [...(first.data?.items ?? []), ...(roles[1] ? (second.data?.items ?? []) : [])]
    .filter((person, index, all) => all.findIndex((other) => other.id === person.id) === index)
    .sort((a, b) => a.displayName.localeCompare(b.displayName));

  return (
    <div className="mb-3 flex flex-wrap items-end gap-3" role="search">
      <label className="flex flex-col gap-1 text-sm font-bold">
        Search
        <input type="search" className={`${selectClass} w-60`} placeholder={searchHint} defaultValue={list.q} onChange={(e) => list.update({ q: e.target.value })} />
      </label>
      <label className="flex flex-col gap-1 text-sm font-bold">
        State
        <select className={selectClass} value={list.filters.state ?? ''} onChange={(e) => list.update({ state: e.target.value })}>
          <option value="">Any</option>
          {states.map((state) => (
            <option key={state} value={state}>
              {stateLabel(state)}
            </option>
          ))}
        </select>
      </label>
      {showClass && (
        <label className="flex flex-col gap-1 text-sm font-bold">
          Class
          <select className={selectClass} value={list.filters.class ?? ''} onChange={(e) => list.update({ class: e.target.value })}>
            <option value="">Any</option>
            {FINDING_CLASSES.map((value) => (
              <option key={value} value={value}>
                {CLASS_LABELS[value]}
              </option>
            ))}
          </select>
        </label>
      )}
      <label className="flex flex-col gap-1 text-sm font-bold">
        Area
        <select className={selectClass} value={list.filters.areaId ?? ''} onChange={(e) => list.update({ areaId: e.target.value })}>
          <option value="">Any</option>
          {(areas.data?.items ?? []).map((area) => (
            <option key={area.id} value={area.id}>
              {area.name}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col gap-1 text-sm font-bold">
        {ownerLabel}
        <select className={selectClass} value={list.filters.owner ?? ''} onChange={(e) => list.update({ owner: e.target.value })}>
          <option value="">Anyone</option>
          {people.map((person) => (
            <option key={person.id} value={person.id}>
              {person.displayName}
            </option>
          ))}
        </select>
      </label>
      {showOverdue && (
        <label className="flex items-center gap-2 pb-1.5 text-sm font-bold">
          <input type="checkbox" checked={list.filters.overdue === 'true'} onChange={(e) => list.update({ overdue: e.target.checked ? 'true' : null })} />
          Overdue only
        </label>
      )}
    </div>
  );
}

// The filters of a workflow list, kept in the address bar by useListParams.
import { FINDING_CLASSES } from '../../../../machines';
import { FilterSearch, FilterSelect } from '../../../components/ui/list-filter';
import { useAreaOptions, usePeopleWithRole } from '../api/workflow';
import { CLASS_LABELS, stateLabel } from './labels';


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
      <FilterSearch className="w-60" placeholder={searchHint} defaultValue={list.q} onChange={(q) => list.update({ q })} />
      <FilterSelect label="State" value={list.filters.state} options={states.map((state) => ({ value: state, label: stateLabel(state) }))} onChange={(state) => list.update({ state })} />
      {showClass && (
        <FilterSelect
          label="Class"
          value={list.filters.class}
          options={FINDING_CLASSES.map((value) => ({ value, label: CLASS_LABELS[value] }))}
          onChange={(value) => list.update({ class: value })}
        />
      )}
      <FilterSelect
        label="Area"
        value={list.filters.areaId}
        options={(areas.data?.items ?? []).map((area) => ({ value: area.id, label: area.name }))}
        onChange={(areaId) => list.update({ areaId })}
      />
      <FilterSelect
        label={ownerLabel}
        anyLabel="Anyone"
        value={list.filters.owner}
        options={people.map((person) => ({ value: person.id, label: person.displayName }))}
        onChange={(owner) => list.update({ owner })}
      />
      {showOverdue && (
        <label className="flex items-center gap-2 pb-1.5 text-sm font-bold">
          <input type="checkbox" checked={list.filters.overdue === 'true'} onChange={(e) => list.update({ overdue: e.target.checked ? 'true' : null })} />
          Overdue only
        </label>
      )}
    </div>
  );
}

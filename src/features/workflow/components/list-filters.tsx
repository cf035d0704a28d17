// The filters of a workflow list, kept in the address bar by useListParams.
import { FINDING_CLASSES } from '../../../../machines';
import { FilterSearch, FilterSelect } from '../../../components/ui/list-filter';
import { useAreaOptions, usePeopleWithRole } from '../api/workflow';
import { CLASS_LABELS, stateLabel } from './labels';

const TERMINAL_STATES = ['closed', 'withdrawn', 'verified', 'cancelled'];

/**
 * The State choices, plus the one the address filters by when it is a list of
 * states (the dashboard opens "open" findings as every state but the final ones):
 * the control always shows what the list is filtered by, never "Any".
 */
export function stateOptions(states: readonly string[], current: string | undefined) {
  const options = states.map((state) => ({ value: state, label: stateLabel(state) }));
  if (!current || states.includes(current)) return options;
  const chosen = current.split(',').filter(Boolean);
  const open = states.filter((state) => !TERMINAL_STATES.includes(state));
  const isOpen = chosen.length === open.length && open.every((state) => chosen.includes(state));
  const finals = TERMINAL_STATES.filter((state) => states.includes(state)).map((state) => stateLabel(state).toLowerCase());
  const label = isOpen ? `Open (not ${finals.join(' or ')})` : chosen.map(stateLabel).join(', ');
  return [{ value: current, label }, ...options];
}

/** Filters a dashboard bar adds that have no control of their own: said in words, with a way to drop them. */
const RANGE_FILTERS: { keys: [string, string]; what: string }[] = [
  { keys: ['raisedFrom', 'raisedTo'], what: 'Raised' },
  { keys: ['dueFrom', 'dueTo'], what: 'Due' },
];
const TIMELINESS_LABELS: Record<string, string> = {
  on_time: 'Closed on time',
  late: 'Closed late',
  overdue: 'Overdue',
  not_yet_due: 'Open, not yet due',
};

function RangeFilterNotice({ list }: { list: ListParams }) {
  const parts: string[] = [];
  for (const { keys, what } of RANGE_FILTERS) {
    const [from, to] = keys.map((key) => list.filters[key]);
    if (from && to) parts.push(`${what} ${from} to ${to}`);
    else if (from) parts.push(`${what} on or after ${from}`);
    else if (to) parts.push(`${what} on or before ${to}`);
  }
  const timeliness = list.filters.timeliness;
  if (timeliness) parts.push(TIMELINESS_LABELS[timeliness] ?? timeliness);
  if (!parts.length) return null;
  return (
    <p className="flex basis-full items-center gap-2 text-sm text-ink-soft" data-testid="range-filters">
      <span>
        Also filtered: <strong className="text-ink">{parts.join(' · ')}</strong>
      </span>
      <button
        type="button"
        className="font-bold text-lagoon underline"
        onClick={() => list.update({ raisedFrom: null, raisedTo: null, dueFrom: null, dueTo: null, timeliness: null })}
      >
        Remove
      </button>
    </p>
  );
}

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
      <FilterSelect label="State" value={list.filters.state} options={stateOptions(states, list.filters.state)} onChange={(state) => list.update({ state })} />
      {showClass && (
        <FilterSelect
          label="Class"
          value={list.filters.class}
          options={[...FINDING_CLASSES.map((value) => ({ value, label: CLASS_LABELS[value] })), { value: 'unclassified', label: 'Not yet classified' }]}
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
      <RangeFilterNotice list={list} />
    </div>
  );
}

// The controls of a list's filter bar: a labelled search box, select or date,
// each writing its value back through `onChange` (lists keep them in the address bar).
const controlClass = 'rounded-md border border-ink/25 bg-white px-2 py-1.5 text-sm font-normal';
const labelClass = 'flex flex-col gap-1 text-sm font-bold';

export interface FilterOption {
  value: string | number;
  label: string;
}

/** A select whose empty choice (`anyLabel`) means "no filter". */
export function FilterSelect({
  label,
  value,
  options,
  onChange,
  anyLabel = 'Any',
  className = '',
}: {
  label: string;
  value: string | undefined;
  options: readonly FilterOption[];
  onChange(value: string): void;
  anyLabel?: string;
  className?: string;
}) {
  return (
    <label className={labelClass}>
      {label}
      <select className={`${controlClass} ${className}`} value={value ?? ''} onChange={(e) => onChange(e.target.value)}>
        <option value="">{anyLabel}</option>
        {options.map((option) => (
          <option key={option.value} value={option.value}>
            {option.label}
          </option>
        ))}
      </select>
    </label>
  );
}

/** A search box; uncontrolled, so typing is never undone by a slower address-bar update. */
export function FilterSearch({
  defaultValue,
  placeholder,
  onChange,
  label = 'Search',
  className = 'w-56',
}: {
  defaultValue: string;
  placeholder: string;
  onChange(value: string): void;
  label?: string;
  className?: string;
}) {
  return (
    <label className={labelClass}>
      {label}
      <input type="search" className={`${controlClass} ${className}`} placeholder={placeholder} defaultValue={defaultValue} onChange={(e) => onChange(e.target.value)} />
    </label>
  );
}

export function FilterDate({ label, value, onChange }: { label: string; value: string | undefined; onChange(value: string): void }) {
  return (
    <label className={labelClass}>
      {label}
      <input type="date" className={controlClass} value={value ?? ''} onChange={(e) => onChange(e.target.value)} />
    </label>
  );
}

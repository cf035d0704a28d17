// Inspections in doubt by customer and part number, with counts; a group can be
// chosen to narrow the rows below to it.
import type { ImpactGroup } from '../../../../shared/schemas/impact';

export const groupKey = (group: { customer: string; partNumber: string }) => JSON.stringify([group.customer, group.partNumber]);

export function ImpactGroups({ groups, chosen, onChoose }: { groups: ImpactGroup[]; chosen: string | null; onChoose(key: string | null): void }) {
  if (!groups.length) return null;
  const withDecisions = groups.some((group) => group.undecided !== null);
  return (
    <div className="overflow-x-auto rounded-md border border-ink/10">
      <table className="w-full text-left text-sm">
        <caption className="sr-only">Inspections by customer and part number</caption>
        <thead className="bg-lagoon-soft/60 text-xs uppercase tracking-wide text-ink-soft">
          <tr>
            <th scope="col" className="px-2 py-2">Customer</th>
            <th scope="col" className="px-2 py-2">Part number</th>
            <th scope="col" className="px-2 py-2 text-right">Inspections</th>
            {withDecisions && <th scope="col" className="px-2 py-2 text-right">Undecided</th>}
            <th scope="col" className="px-2 py-2"><span className="sr-only">Show</span></th>
          </tr>
        </thead>
        <tbody>
          {groups.map((group) => {
            const key = groupKey(group);
            const active = chosen === key;
            return (
              <tr key={key} className={`border-t border-ink/5 ${active ? 'bg-copper-soft/40' : ''}`}>
                <td className="px-2 py-1.5">{group.customer}</td>
                <td className="px-2 py-1.5">{group.partNumber}</td>
                <td className="px-2 py-1.5 text-right tabular-nums">{group.count}</td>
                {withDecisions && <td className={`px-2 py-1.5 text-right tabular-nums ${group.undecided ? 'font-bold text-fail' : ''}`}>{group.undecided}</td>}
                <td className="px-2 py-1.5 text-right">
                  <button type="button" className="text-lagoon underline" aria-pressed={active} onClick={() => onChoose(active ? null : key)}>
                    {active ? 'Show all' : 'Show only these'}
                  </button>
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}

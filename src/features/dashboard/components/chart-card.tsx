import type { ReactNode } from 'react';

/** One chart with its title, what a click does, and the numbers as a table. */
export function ChartCard({ id, title, hint, chart, table, empty }: { id: string; title: string; hint: string; chart: ReactNode; table: ReactNode; empty: boolean }) {
  return (
    <section aria-labelledby={`${id}-title`} className="flex flex-col gap-2 rounded-lg border border-ink/10 bg-white p-4 shadow-sm" data-chart={id}>
      <h2 id={`${id}-title`} className="font-bold text-ink">
        {title}
      </h2>
      <p className="text-xs text-ink-soft">{hint}</p>
      {empty ? (
        <p className="rounded border border-dashed border-ink/20 px-3 py-8 text-center text-sm text-ink-soft">No records in this range.</p>
      ) : (
        <>
          {/* The drawing is one image to assistive technology, named; its numbers and links are in the table below. */}
          <div className="h-64 w-full" role="img" aria-label={`${title}: chart; the numbers and links to the lists are in the table below it`}>
            {chart}
          </div>
          <details className="text-sm">
            <summary className="cursor-pointer text-xs font-bold text-lagoon">The numbers behind this chart</summary>
            <div className="mt-2 overflow-x-auto">{table}</div>
          </details>
        </>
      )}
    </section>
  );
}

export function NumberTable({ caption, headers, rows }: { caption: string; headers: string[]; rows: { key: string; cells: ReactNode[] }[] }) {
  return (
    <table className="w-full text-left text-xs">
      <caption className="sr-only">{caption}</caption>
      <thead className="text-ink-soft">
        <tr>
          {headers.map((header) => (
            <th key={header} scope="col" className="py-1 pr-3 font-bold">
              {header}
            </th>
          ))}
        </tr>
      </thead>
      <tbody>
        {rows.map((row) => (
          <tr key={row.key} className="border-t border-ink/5">
            {row.cells.map((cell, index) => (
              <td key={index} className={`py-1 pr-3 ${index > 0 ? 'tabular-nums' : ''}`}>
                {cell}
              </td>
            ))}
          </tr>
        ))}
      </tbody>
    </table>
  );
}

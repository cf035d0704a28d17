// The dashboard's five charts. Every bar opens the list behind it (the list pages
// read their filters from the address: state, class, areaId, overdue, q).
import { Link, useNavigate } from 'react-router-dom';
import { Bar, BarChart, CartesianGrid, Legend, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { AGE_BANDS, type DashboardView } from '../../../../shared/schemas/dashboard';
import { FINDING_STATES } from '../../../../machines';
import { FINDING_CLASS_LABELS } from '../../../../shared/labels';
import { ChartCard, NumberTable } from './chart-card';

/** The list pages filter by a comma-separated state list: "open" is every state but closed and withdrawn. */
export const OPEN_FINDING_STATES = FINDING_STATES.filter((state) => state !== 'closed' && state !== 'withdrawn').join(',');
const stateParam = (state: string) => (state === 'open' ? OPEN_FINDING_STATES : state);

// Theme colours (src/styles.css): a sequence from light to dark for ageing, pass/warn/fail for outcomes.
const COLOURS = {
  ink: '#14343b',
  lagoon: '#1f6f78',
  copper: '#c0652c',
  pass: '#2f7d4f',
  warn: '#a15c00',
  fail: '#b42318',
  soft: '#9fb8bc',
};
const BAND_COLOURS = ['#9fc9cc', COLOURS.lagoon, COLOURS.copper, COLOURS.fail];

const CLASS_LABELS: Record<string, string> = { ...FINDING_CLASS_LABELS, unclassified: 'Not yet classified' };
const classLabel = (value: string) => CLASS_LABELS[value] ?? value;

type Query = Record<string, string | number | undefined>;
type ActionTimeliness = 'on_time' | 'late' | 'overdue' | 'not_yet_due';

function listUrl(path: string, query: Query): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) if (value !== undefined && value !== '') params.set(key, String(value));
  const text = params.toString();
  return text ? `${path}?${text}` : path;
}

/** Legend labels in the text colour: the series colours are for the swatches, too light for text. */
const legendText = (value: string) => <span style={{ color: COLOURS.ink }}>{value}</span>;

/** A count in a chart's table, linked to the list behind it (0 stays plain text). */
function countLink(count: number, to: string, className = 'text-lagoon underline') {
  return count ? (
    <Link className={className} to={to}>
      {count}
    </Link>
  ) : (
    0
  );
}

export function DashboardCharts({ data, animate = true }: { data: DashboardView; animate?: boolean }) {
  const navigate = useNavigate();
  const areaId = data.range.areaId ?? undefined;

  // ---- open findings by class and age
  const classes = [...new Set(data.openFindingsByClassAge.map((row) => row.class))];
  const ageRows = classes.map((cls) => {
    const row: Record<string, string | number> = { class: cls, label: classLabel(cls) };
    for (const band of AGE_BANDS) row[band] = data.openFindingsByClassAge.find((r) => r.class === cls && r.band === band)?.count ?? 0;
    return row;
  });
  // Each drill-down filters exactly as its bar counts (dashboard.service.ts): findings raised in the range, open, of that class
  // ("unclassified" is the list's own filter for findings without a class).
  const raised = { raisedFrom: data.range.from, raisedTo: data.range.to };
  const openFindingsUrl = (cls: string) => listUrl('/findings', { state: OPEN_FINDING_STATES, class: cls, ...raised, areaId });

  // ---- actions by month: due in that month (within the range), of one of the four kinds
  const actionsUrl = (month: string, timeliness: ActionTimeliness) => {
    const [year, monthIndex] = month.split('-').map(Number);
    const first = `${month}-01`;
    const last = new Date(Date.UTC(year, monthIndex, 0)).toISOString().slice(0, 10);
    return listUrl('/actions', {
      dueFrom: first < data.range.from ? data.range.from : first,
      dueTo: last > data.range.to ? data.range.to : last,
      timeliness,
      areaId,
    });
  };
  const monthOf = (entry: unknown) => String((entry as { payload?: { month?: string } }).payload?.month);

  return (
    <div className="grid gap-4 lg:grid-cols-2">
      <ChartCard
        id="open-findings"
        title="Open findings by class and age"
        hint="Findings raised in the range and not yet closed or withdrawn, by days since raised. Click a bar for the list."
        empty={ageRows.length === 0}
        chart={
          <ResponsiveContainer width="100%" height="100%">
            <BarChart accessibilityLayer={false} data={ageRows} margin={{ top: 8, right: 8, bottom: 8, left: 0 }}>
              <CartesianGrid strokeDasharray="3 3" vertical={false} />
              <XAxis dataKey="label" />
              <YAxis allowDecimals={false} />
              <Tooltip />
              <Legend formatter={legendText} />
              {AGE_BANDS.map((band, index) => (
                <Bar
                  key={band}
                  dataKey={band}
                  stackId="age"
                  fill={BAND_COLOURS[index]}
                  isAnimationActive={animate}
                  cursor="pointer"
                  onClick={(entry) => navigate(openFindingsUrl(String((entry as { payload?: { class?: string } }).payload?.class)))}
                />
              ))}
            </BarChart>
          </ResponsiveContainer>
        }
        table={
          <NumberTable
            caption="Open findings by class and age band"
            headers={['Class', ...AGE_BANDS, 'Total']}
            rows={ageRows.map((row) => ({
              key: String(row.class),
              cells: [
                <Link className="text-lagoon underline" to={openFindingsUrl(String(row.class))}>
                  {row.label}
                </Link>,
                ...AGE_BANDS.map((band) => row[band]),
                AGE_BANDS.reduce((sum, band) => sum + Number(row[band]), 0),
              ],
            }))}
          />
        }
      />

      <ChartCard
        id="actions-by-month"
        title="Corrective actions by due month"
        hint="Closed on time (verified by the due date), closed late, overdue and not yet due. Click a bar for the actions list."
        empty={data.actionsByMonth.length === 0}
        chart={
          <ResponsiveContainer width="100%" height="100%">
            <BarChart accessibilityLayer={false} data={data.actionsByMonth} margin={{ top: 8, right: 8, bottom: 8, left: 0 }}>
              <CartesianGrid strokeDasharray="3 3" vertical={false} />
              <XAxis dataKey="month" />
              <YAxis allowDecimals={false} />
              <Tooltip />
              <Legend formatter={legendText} />
              <Bar dataKey="closedOnTime" name="Closed on time" stackId="a" fill={COLOURS.pass} isAnimationActive={animate} cursor="pointer" onClick={(entry) => navigate(actionsUrl(monthOf(entry), 'on_time'))} />
              <Bar dataKey="closedLate" name="Closed late" stackId="a" fill={COLOURS.warn} isAnimationActive={animate} cursor="pointer" onClick={(entry) => navigate(actionsUrl(monthOf(entry), 'late'))} />
              <Bar dataKey="overdue" name="Overdue" stackId="a" fill={COLOURS.fail} isAnimationActive={animate} cursor="pointer" onClick={(entry) => navigate(actionsUrl(monthOf(entry), 'overdue'))} />
              <Bar dataKey="openNotDue" name="Open, not yet due" stackId="a" fill={COLOURS.soft} isAnimationActive={animate} cursor="pointer" onClick={(entry) => navigate(actionsUrl(monthOf(entry), 'not_yet_due'))} />
            </BarChart>
          </ResponsiveContainer>
        }
        table={
          <NumberTable
            caption="Corrective actions by due month"
            headers={['Due month', 'Due', 'Closed on time', 'Closed late', 'Overdue', 'Open, not yet due']}
            rows={data.actionsByMonth.map((row) => ({
              key: row.month,
              cells: [
                row.month,
                row.due,
                countLink(row.closedOnTime, actionsUrl(row.month, 'on_time')),
                countLink(row.closedLate, actionsUrl(row.month, 'late')),
                countLink(row.overdue, actionsUrl(row.month, 'overdue'), 'font-bold text-fail underline'),
                countLink(row.openNotDue, actionsUrl(row.month, 'not_yet_due')),
              ],
            }))}
          />
        }
      />

      <ChartCard
        id="mean-days"
        title="Mean days to close, by class"
        hint="Findings closed in the range: mean days from raising to closure. Click a bar for the closed findings."
        empty={data.meanDaysToClose.length === 0}
        chart={
          <ResponsiveContainer width="100%" height="100%">
            <BarChart accessibilityLayer={false} data={data.meanDaysToClose.map((row) => ({ ...row, label: classLabel(row.class) }))} margin={{ top: 8, right: 8, bottom: 8, left: 0 }}>
              <CartesianGrid strokeDasharray="3 3" vertical={false} />
              <XAxis dataKey="label" />
              <YAxis />
              <Tooltip />
              <Bar
                dataKey="meanDays"
                name="Mean days to close"
                fill={COLOURS.lagoon}
                isAnimationActive={animate}
                cursor="pointer"
                onClick={(entry) => navigate(listUrl('/findings', { state: 'closed', class: (entry as { payload?: { class?: string } }).payload?.class, areaId }))}
              />
            </BarChart>
          </ResponsiveContainer>
        }
        table={
          <NumberTable
            caption="Mean days to close by class"
            headers={['Class', 'Closed', 'Mean days']}
            rows={data.meanDaysToClose.map((row) => ({
              key: row.class,
              cells: [
                <Link className="text-lagoon underline" to={listUrl('/findings', { state: 'closed', class: row.class, areaId })}>
                  {classLabel(row.class)}
                </Link>,
                row.closed,
                row.meanDays.toFixed(1),
              ],
            }))}
          />
        }
      />

      <ChartCard
        id="failing-rules"
        title="Checklist rules that fail most often"
        hint={`Audited techniques failing each rule (of ${data.techniquesAudited} audited in the range). Click a bar for the findings raised against the rule.`}
        empty={data.failingRules.length === 0}
        chart={
          <ResponsiveContainer width="100%" height="100%">
            <BarChart accessibilityLayer={false} layout="vertical" data={data.failingRules} margin={{ top: 8, right: 8, bottom: 8, left: 24 }}>
              <CartesianGrid strokeDasharray="3 3" horizontal={false} />
              <XAxis type="number" allowDecimals={false} />
              <YAxis type="category" dataKey="rule" width={140} />
              <Tooltip />
              <Bar
                dataKey="techniques"
                name="Techniques failing"
                fill={COLOURS.copper}
                isAnimationActive={animate}
                cursor="pointer"
                onClick={(entry) => navigate(listUrl('/findings', { q: (entry as { payload?: { rule?: string } }).payload?.rule, areaId }))}
              />
            </BarChart>
          </ResponsiveContainer>
        }
        table={
          <NumberTable
            caption="Failing checklist rules"
            headers={['Rule', 'Techniques failing', 'Checklist runs', 'Failed results']}
            rows={data.failingRules.map((row) => ({
              key: row.rule,
              cells: [
                <Link className="text-lagoon underline" to={listUrl('/findings', { q: row.rule, areaId })}>
                  {row.rule}
                </Link>,
                row.techniques,
                row.runs,
                row.failures,
              ],
            }))}
          />
        }
      />

      <ChartCard
        id="findings-by-area"
        title="Findings by area"
        hint="Findings raised in the range, by area and outcome. Click a bar for that area's findings."
        empty={data.findingsByArea.every((row) => row.open + row.closed + row.withdrawn === 0)}
        chart={
          <ResponsiveContainer width="100%" height="100%">
            <BarChart accessibilityLayer={false} data={data.findingsByArea} margin={{ top: 8, right: 8, bottom: 8, left: 0 }}>
              <CartesianGrid strokeDasharray="3 3" vertical={false} />
              <XAxis dataKey="areaName" />
              <YAxis allowDecimals={false} />
              <Tooltip />
              <Legend formatter={legendText} />
              {(
                [
                  ['open', 'Open', COLOURS.copper, 'open'],
                  ['closed', 'Closed', COLOURS.pass, 'closed'],
                  ['withdrawn', 'Withdrawn', COLOURS.soft, 'withdrawn'],
                ] as const
              ).map(([key, name, fill, state]) => (
                <Bar
                  key={key}
                  dataKey={key}
                  name={name}
                  stackId="area"
                  fill={fill}
                  isAnimationActive={animate}
                  cursor="pointer"
                  onClick={(entry) => navigate(listUrl('/findings', { state: stateParam(state), ...raised, areaId: (entry as { payload?: { areaId?: number } }).payload?.areaId }))}
                />
              ))}
            </BarChart>
          </ResponsiveContainer>
        }
        table={
          <NumberTable
            caption="Findings by area"
            headers={['Area', 'Open', 'Closed', 'Withdrawn']}
            rows={data.findingsByArea.map((row) => ({
              key: String(row.areaId),
              cells: [
                <Link className="text-lagoon underline" to={listUrl('/findings', { ...raised, areaId: row.areaId })}>
                  {row.areaName}
                </Link>,
                countLink(row.open, listUrl('/findings', { state: OPEN_FINDING_STATES, ...raised, areaId: row.areaId })),
                countLink(row.closed, listUrl('/findings', { state: 'closed', ...raised, areaId: row.areaId })),
                countLink(row.withdrawn, listUrl('/findings', { state: 'withdrawn', ...raised, areaId: row.areaId })),
              ],
            }))}
          />
        }
      />
    </div>
  );
}

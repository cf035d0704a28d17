// Current density against depth for each test frequency: this coil's own field
// (solid), with the plane wave J/J0 = e^(−x/δ) faint beside it, 1δ (36.8 %) and
// 3δ (5 %) marked and the expected flaws' depths drawn across.
import { useDeferredValue, useMemo } from 'react';
import {
  CartesianGrid,
  Label,
  Legend,
  Line,
  LineChart,
  ReferenceDot,
  ReferenceLine,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';
import type { ChecklistValues } from '../../../../shared/domain/checklist';
import type { Technique } from '../../../../shared/schemas/technique';
import { depthCurves } from '../../../../shared/domain/fields/charts';
import { formatHz, formatNumber } from './labels';

const SERIES_COLOURS = ['#c0652c', '#1f6f78', '#6b4c9a', '#2f7d4f', '#a15c00', '#14343b'];
const DASHES = ['', '6 3', '2 3', '8 3 2 3'];
const POINTS = 40;

/** Depth the current must reach for a flaw: the crack tip for surface cracks, the metal above it otherwise. */
function flawDepthMm(flaw: Technique['flaws'][number]): number {
  return flaw.location === 'surface' ? flaw.depthMm : (flaw.metalAboveMm ?? flaw.depthMm);
}

interface Series {
  key: string;
  name: string;
  deltaMm: number;
  colour: string;
  dash: string;
}

export function DepthPlot({ technique: liveTechnique, values: liveValues, penetrationFactor, animate = false }: { technique: Technique; values: ChecklistValues; penetrationFactor: number; animate?: boolean }) {
  // The field models take a moment: typing in the editor stays responsive, the plot follows.
  const technique = useDeferredValue(liveTechnique);
  const values = useDeferredValue(liveValues);
  const { series, data, maxDepthMm } = useMemo(() => {
    const list: Series[] = [];
    technique.coils.forEach((coil, c) =>
      coil.frequenciesHz.forEach((frequencyHz, i) => {
        const deltaMm = values.standardDepthMm[c]?.[i];
        if (!Number.isFinite(deltaMm)) return;
        const n = list.length;
        list.push({
          key: `s${c}_${i}`,
          name: `${technique.coils.length > 1 ? `coil ${c + 1}, ` : ''}${formatHz(frequencyHz)} (δ = ${formatNumber(deltaMm)} mm)`,
          deltaMm,
          colour: SERIES_COLOURS[n % SERIES_COLOURS.length],
          dash: DASHES[Math.floor(n / SERIES_COLOURS.length) % DASHES.length],
        });
      }),
    );
    const deepestFlaw = Math.max(0, ...technique.flaws.map(flawDepthMm));
    const deepestReach = Math.max(0, ...list.map((s) => penetrationFactor * s.deltaMm), ...list.map((s) => 3 * s.deltaMm));
    const max = Math.max(deepestFlaw * 1.15, deepestReach * 1.05, 0.1);
    const curves = depthCurves({ technique, relativePermeability: values.fieldRelativePermeability }, max, POINTS);
    const coilAt = new Map(curves.map((curve) => [`s${curve.coilIndex}_${curve.frequencyIndex}`, curve]));
    const rows = Array.from({ length: POINTS + 1 }, (_, index) => {
      const x = (max * index) / POINTS;
      const row: Record<string, number> = { x };
      for (const s of list) {
        row[`${s.key}_plane`] = 100 * Math.exp(-x / s.deltaMm);
        // Past the metal's end (a plate's far side, a bar's axis) the coil's curve stops.
        const ratio = coilAt.get(s.key)?.points[index]?.coilRatio;
        if (ratio !== null && ratio !== undefined) row[s.key] = 100 * ratio;
      }
      return row;
    });
    return { series: list, data: rows, maxDepthMm: max };
  }, [technique, values, penetrationFactor]);

  if (series.length === 0) return null;
  // Flaws at the same depth share one line and one label.
  const flawLines = new Map<number, string[]>();
  for (const flaw of technique.flaws) {
    const depth = flawDepthMm(flaw);
    if (depth <= maxDepthMm) flawLines.set(depth, [...(flawLines.get(depth) ?? []), flaw.id]);
  }

  return (
    <figure className="rounded-lg border border-ink/10 bg-white p-4" aria-labelledby="depth-plot-title">
      <figcaption id="depth-plot-title" className="text-lg font-bold text-ink">
        Current density against depth
      </figcaption>
      <p className="text-xs text-ink-soft">
        Solid lines: the current density this coil induces, relative to the surface it faces (under the winding for a probe; through the wall or
        towards the axis for an encircling or internal coil), from the coil's own field. Faint dashed lines: the plane wave J/J₀ = e<sup>−x/δ</sup>,
        the familiar figure (36.8 % at 1δ, 5 % at 3δ), which a small probe does not reach. Vertical lines mark the depth each expected flaw needs the
        field to reach (crack tip for surface cracks; metal above the flaw otherwise).
      </p>
      <div className="mt-2 h-80 w-full" data-testid="depth-plot">
        <ResponsiveContainer width="100%" height="100%">
          <LineChart data={data} margin={{ top: 16, right: 64, bottom: 28, left: 8 }}>
            <CartesianGrid stroke="#14343b22" />
            <XAxis dataKey="x" type="number" domain={[0, maxDepthMm]} tickFormatter={(value: number) => formatNumber(value, 2)} stroke="#3f5f66">
              <Label value="Depth below the surface, x (mm)" position="insideBottom" offset={-18} fill="#14343b" />
            </XAxis>
            <YAxis domain={[0, 100]} ticks={[0, 5, 13.5, 36.8, 50, 100]} tickFormatter={(value: number) => `${value}`} stroke="#3f5f66">
              <Label value="J/J₀ (%)" angle={-90} position="insideLeft" fill="#14343b" />
            </YAxis>
            <Tooltip
              formatter={(value) => `${formatNumber(Number(value), 3)} %`}
              labelFormatter={(label) => `x = ${formatNumber(Number(label), 3)} mm`}
            />
            <Legend verticalAlign="top" height={28} />
            <ReferenceLine y={36.8} stroke="#3f5f66" strokeDasharray="4 4" label={{ value: '1δ: 36.8 %', position: 'right', fill: '#3f5f66', fontSize: 11 }} />
            <ReferenceLine y={5} stroke="#3f5f66" strokeDasharray="4 4" label={{ value: '3δ: 5 %', position: 'right', fill: '#3f5f66', fontSize: 11 }} />
            {[...flawLines].map(([depth, ids]) => (
              <ReferenceLine
                key={depth}
                x={depth}
                stroke="#b42318"
                strokeWidth={1.5}
                label={{ value: `${ids.join(', ')} (${formatNumber(depth)} mm)`, position: 'insideTopRight', fill: '#b42318', fontSize: 11, angle: -90, offset: 12 }}
              />
            ))}
            {series.map((s) => (
              <Line
                key={s.key}
                dataKey={s.key}
                name={`${s.name}: this coil`}
                type="monotone"
                dot={false}
                stroke={s.colour}
                strokeDasharray={s.dash}
                strokeWidth={2}
                connectNulls={false}
                isAnimationActive={animate}
              />
            ))}
            {series.map((s) => (
              <Line
                key={`${s.key}_plane`}
                dataKey={`${s.key}_plane`}
                name={`${s.name}: plane wave`}
                legendType="none"
                type="monotone"
                dot={false}
                stroke={s.colour}
                strokeOpacity={0.35}
                strokeDasharray="3 4"
                strokeWidth={1.5}
                isAnimationActive={animate}
              />
            ))}
            {series.flatMap((s) => [
              <ReferenceDot key={`${s.key}-1`} x={s.deltaMm} y={36.8} r={4} fill={s.colour} stroke="white" label={{ value: 'δ', position: 'top', fill: s.colour, fontSize: 12 }} />,
              <ReferenceDot key={`${s.key}-3`} x={3 * s.deltaMm} y={5} r={4} fill={s.colour} stroke="white" label={{ value: '3δ', position: 'top', fill: s.colour, fontSize: 12 }} />,
            ])}
          </LineChart>
        </ResponsiveContainer>
      </div>
      <table className="mt-2 w-full text-left text-xs">
        <caption className="sr-only">Standard and effective depths of penetration per frequency</caption>
        <thead className="text-ink-soft">
          <tr>
            <th scope="col" className="py-1 font-bold">Frequency</th>
            <th scope="col" className="py-1 font-bold">δ (mm)</th>
            <th scope="col" className="py-1 font-bold">3δ (mm)</th>
            <th scope="col" className="py-1 font-bold">Reach at k = {formatNumber(penetrationFactor)} (mm)</th>
          </tr>
        </thead>
        <tbody>
          {series.map((s) => (
            <tr key={s.key} className="border-t border-ink/5">
              <td className="py-0.5">
                <span aria-hidden="true" className="mr-1 inline-block h-2 w-4 align-middle" style={{ background: s.colour }} />
                {s.name.replace(/ \(δ.*$/, '')}
              </td>
              <td>{formatNumber(s.deltaMm)}</td>
              <td>{formatNumber(3 * s.deltaMm)}</td>
              <td>{formatNumber(penetrationFactor * s.deltaMm)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </figure>
  );
}

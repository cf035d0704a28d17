// The eddy current density in the r–z plane under a probe: where the field goes,
// how deep and how wide, with the winding outlined. It takes a second or so to
// work out, so it is drawn when asked for, for the coil and frequency chosen.
import { useState, useTransition } from 'react';
import type { ChecklistValues } from '../../../../shared/domain/checklist';
import type { Technique } from '../../../../shared/schemas/technique';
import { densityMap, type DensityMap } from '../../../../shared/domain/fields/charts';
import { isLongCoil } from '../../../../shared/domain/checklist/coil-field';
import { Button } from '../../../components/ui/button';
import { formatHz, formatNumber } from './labels';

const WIDTH = 420;
const HEIGHT = 260;
const PAD = { left: 44, top: 14, right: 10, bottom: 34 };

// From paper (no current) through lagoon to ink (the densest current): Whorl's own scale.
function shade(value: number): string {
  const stops = [
    [246, 244, 239],
    [214, 235, 236],
    [31, 111, 120],
    [20, 52, 59],
  ];
  const t = Math.min(1, Math.max(0, value)) * (stops.length - 1);
  const i = Math.min(stops.length - 2, Math.floor(t));
  const f = t - i;
  const [r, g, b] = stops[i].map((channel, k) => Math.round(channel + (stops[i + 1][k] - channel) * f));
  return `rgb(${r},${g},${b})`;
}

function Map({ map }: { map: DensityMap }) {
  const plotW = WIDTH - PAD.left - PAD.right;
  const plotH = HEIGHT - PAD.top - PAD.bottom;
  const rEnd = map.radiiMm.at(-1)! + map.radiiMm[0];
  const zEnd = map.depthsMm.at(-1)! + map.depthsMm[0];
  const cellW = plotW / map.radiiMm.length;
  const cellH = plotH / map.depthsMm.length;
  const x = (r: number) => PAD.left + (r / rEnd) * plotW;
  return (
    <svg viewBox={`0 0 ${WIDTH} ${HEIGHT}`} className="h-auto w-full max-w-xl" role="img" aria-label={`Current density under the coil at ${formatHz(map.frequencyHz)}`}>
      {map.relative.map((row, j) =>
        row.map((value, i) => (
          <rect key={`${i}-${j}`} x={PAD.left + i * cellW} y={PAD.top + j * cellH} width={cellW + 0.5} height={cellH + 0.5} fill={shade(value)} />
        )),
      )}
      <rect x={x(map.winding.innerRadiusMm)} y={PAD.top - 8} width={Math.max(2, x(map.winding.outerRadiusMm) - x(map.winding.innerRadiusMm))} height={6} fill="#c0652c" />
      <text x={x(map.winding.outerRadiusMm) + 4} y={PAD.top - 2} fontSize="10" fill="#14343b">
        winding
      </text>
      <rect x={PAD.left} y={PAD.top} width={plotW} height={plotH} fill="none" stroke="#14343b55" />
      {[0, 0.5, 1].map((f) => (
        <text key={`r${f}`} x={PAD.left + f * plotW} y={HEIGHT - PAD.bottom + 14} textAnchor="middle" fontSize="10" fill="#14343b">
          {formatNumber(f * rEnd, 2)}
        </text>
      ))}
      <text x={PAD.left + plotW / 2} y={HEIGHT - 4} textAnchor="middle" fontSize="11" fill="#14343b">
        Distance from the coil's axis, r (mm)
      </text>
      {[0, 0.5, 1].map((f) => (
        <text key={`z${f}`} x={PAD.left - 4} y={PAD.top + f * plotH + 4} textAnchor="end" fontSize="10" fill="#14343b">
          {formatNumber(f * zEnd, 2)}
        </text>
      ))}
      <text x={12} y={PAD.top + plotH / 2} textAnchor="middle" fontSize="11" fill="#14343b" transform={`rotate(-90 12 ${PAD.top + plotH / 2})`}>
        Depth, z (mm)
      </text>
    </svg>
  );
}

export function DensityMapPanel({ technique, values }: { technique: Technique; values: ChecklistValues }) {
  const probes = technique.coils.flatMap((coil, c) => (isLongCoil(coil) ? [] : coil.frequenciesHz.map((frequencyHz, i) => ({ c, i, frequencyHz }))));
  const [choice, setChoice] = useState(0);
  const [map, setMap] = useState<{ key: string; map: DensityMap | null; error?: string } | null>(null);
  const [pending, startTransition] = useTransition();
  if (probes.length === 0) return null;
  const chosen = probes[Math.min(choice, probes.length - 1)];
  const key = `${JSON.stringify(technique)}|${chosen.c}|${chosen.i}|${values.fieldRelativePermeability}`;
  const draw = () =>
    startTransition(() => {
      try {
        setMap({ key, map: densityMap({ technique, relativePermeability: values.fieldRelativePermeability }, chosen.c, chosen.i, { columns: 28, rows: 18 }) });
      } catch (error) {
        setMap({ key, map: null, error: error instanceof Error ? error.message : String(error) });
      }
    });
  const current = map && map.key === key ? map : null;

  return (
    <figure className="rounded-lg border border-ink/10 bg-white p-4" aria-labelledby="density-map-title">
      <figcaption id="density-map-title" className="text-lg font-bold text-ink">
        Current density under the probe
      </figcaption>
      <p className="text-xs text-ink-soft">
        The eddy current density in a cut through the coil's axis, to 3δ deep or the metal's end, darkest where the current is densest. No current
        flows under the coil's centre; it is strongest under the winding and fades with depth faster for a small coil than the plane wave suggests.
      </p>
      <div className="mt-2 flex flex-wrap items-end gap-3">
        <label className="flex flex-col gap-1 text-sm font-bold">
          Coil and frequency
          <select className="rounded-md border border-ink/25 bg-white px-2 py-1.5 text-sm font-normal" value={choice} onChange={(e) => setChoice(Number(e.target.value))}>
            {probes.map((probe, index) => (
              <option key={`${probe.c}-${probe.i}`} value={index}>
                Coil {probe.c + 1}, {formatHz(probe.frequencyHz)}
              </option>
            ))}
          </select>
        </label>
        <Button variant="secondary" onClick={draw} disabled={pending}>
          {pending ? 'Working out the field…' : current ? 'Draw again' : 'Draw the density map'}
        </Button>
      </div>
      {current?.map && <Map map={current.map} />}
      {current?.error && <p className="mt-2 text-sm text-fail">The map could not be drawn: {current.error}</p>}
    </figure>
  );
}

// The impedance plane of each coil on this part: the normalised impedance as the
// frequency sweeps (the coil in air sits at 0, 1), the operating point at each test
// frequency, the lift-off direction (grey) and each flaw's direction (red) from it,
// and the angle between them that lets an inspector tell the two apart.
import { useDeferredValue, useMemo } from 'react';
import type { ChecklistValues } from '../../../../shared/domain/checklist';
import type { Technique } from '../../../../shared/schemas/technique';
import { impedancePlane, type ImpedancePlane as Plane, type PlanePoint } from '../../../../shared/domain/fields/charts';
import { formatHz, formatNumber } from './labels';

const SIZE = 280;
const PAD = 34;
const ARROW = 0.22;

function bounds(plane: Plane) {
  const xs = [0, ...plane.locus.map((p) => p.resistance), ...plane.testPoints.map((p) => p.resistance)];
  const ys = [1, ...plane.locus.map((p) => p.reactance), ...plane.testPoints.map((p) => p.reactance)];
  const minX = Math.min(...xs);
  const maxX = Math.max(...xs);
  const minY = Math.min(...ys);
  const maxY = Math.max(...ys);
  // Equal scales on both axes, so an angle on screen is the angle on the plane.
  const span = Math.max(maxX - minX, maxY - minY, 0.05) * 1.35;
  const cx = (minX + maxX) / 2;
  const cy = (minY + maxY) / 2;
  return { x0: cx - span / 2, y0: cy - span / 2, span };
}

function Diagram({ plane, title }: { plane: Plane; title: string }) {
  const { x0, y0, span } = bounds(plane);
  const sx = (x: number) => PAD + ((x - x0) / span) * SIZE;
  const sy = (y: number) => PAD + SIZE - ((y - y0) / span) * SIZE;
  const arrow = (from: PlanePoint, direction: PlanePoint) => ({
    x1: sx(from.resistance),
    y1: sy(from.reactance),
    x2: sx(from.resistance + direction.resistance * ARROW * span),
    y2: sy(from.reactance + direction.reactance * ARROW * span),
  });
  const path = plane.locus.map((p, i) => `${i === 0 ? 'M' : 'L'}${sx(p.resistance).toFixed(1)},${sy(p.reactance).toFixed(1)}`).join(' ');
  return (
    <svg viewBox={`0 0 ${SIZE + 2 * PAD} ${SIZE + 2 * PAD}`} className="h-auto w-full max-w-sm" role="img" aria-label={title}>
      <defs>
        <marker id="arrow-grey" viewBox="0 0 10 10" refX="9" refY="5" markerWidth="6" markerHeight="6" orient="auto-start-reverse">
          <path d="M0,0 L10,5 L0,10 z" fill="#3f5f66" />
        </marker>
        <marker id="arrow-red" viewBox="0 0 10 10" refX="9" refY="5" markerWidth="6" markerHeight="6" orient="auto-start-reverse">
          <path d="M0,0 L10,5 L0,10 z" fill="#b42318" />
        </marker>
      </defs>
      <rect x={PAD} y={PAD} width={SIZE} height={SIZE} fill="white" stroke="#14343b22" />
      <text x={PAD + SIZE / 2} y={SIZE + 2 * PAD - 6} textAnchor="middle" fontSize="11" fill="#14343b">
        Resistance R/ωL₀
      </text>
      <text x={10} y={PAD + SIZE / 2} textAnchor="middle" fontSize="11" fill="#14343b" transform={`rotate(-90 10 ${PAD + SIZE / 2})`}>
        Reactance X/ωL₀
      </text>
      <circle cx={sx(0)} cy={sy(1)} r={3.5} fill="none" stroke="#14343b" />
      <text x={sx(0) + 6} y={sy(1) - 6} fontSize="10" fill="#14343b">
        in air
      </text>
      <path d={path} fill="none" stroke="#1f6f78" strokeWidth={2} />
      <text x={sx(plane.locus[0].resistance) + 4} y={sy(plane.locus[0].reactance) + 12} fontSize="10" fill="#1f6f78">
        low f
      </text>
      <text x={sx(plane.locus.at(-1)!.resistance) + 4} y={sy(plane.locus.at(-1)!.reactance) + 12} fontSize="10" fill="#1f6f78">
        high f
      </text>
      {plane.testPoints.map((point) => (
        <g key={point.frequencyHz}>
          <line {...arrow(point, point.liftOff)} stroke="#3f5f66" strokeWidth={1.5} markerEnd="url(#arrow-grey)" />
          {point.flaws
            .filter((flaw) => flaw.direction.resistance !== 0 || flaw.direction.reactance !== 0)
            .map((flaw) => (
              <line key={flaw.flawId} {...arrow(point, flaw.direction)} stroke="#b42318" strokeWidth={1.5} markerEnd="url(#arrow-red)" />
            ))}
          <circle cx={sx(point.resistance)} cy={sy(point.reactance)} r={4} fill="#c0652c" stroke="white" />
          <text x={sx(point.resistance) - 6} y={sy(point.reactance) + 4} textAnchor="end" fontSize="10" fill="#14343b">
            {formatHz(point.frequencyHz)}
          </text>
        </g>
      ))}
    </svg>
  );
}

export function ImpedancePlaneDiagram({ technique: liveTechnique, values: liveValues, separationMinDeg }: { technique: Technique; values: ChecklistValues; separationMinDeg?: number }) {
  const technique = useDeferredValue(liveTechnique);
  const values = useDeferredValue(liveValues);
  const planes = useMemo(() => {
    const setting = { technique, relativePermeability: values.fieldRelativePermeability };
    return technique.coils.map((_, c) => {
      try {
        return impedancePlane(setting, c);
      } catch {
        // A technique being typed may not describe a solvable coil yet; the checklist says why.
        return null;
      }
    });
  }, [technique, values]);

  return (
    <figure className="rounded-lg border border-ink/10 bg-white p-4" aria-labelledby="impedance-plane-title">
      <figcaption id="impedance-plane-title" className="text-lg font-bold text-ink">
        Impedance plane
      </figcaption>
      <p className="text-xs text-ink-soft">
        The coil's normalised impedance on this part as the frequency rises (blue), the operating point at each test frequency (orange), the
        direction a change of lift-off moves it (grey arrow) and the direction each expected flaw below the surface moves it (red arrows). The wider
        the angle between grey and red, the easier an inspector tells a flaw from a wobble of the probe.
      </p>
      <div className="mt-2 grid gap-4 md:grid-cols-2">
        {planes.map((plane, c) => {
          const title = `Coil ${c + 1}: ${technique.coils[c].type} coil, ${formatNumber(technique.coils[c].diameterMm)} mm`;
          if (!plane) return <p key={c} className="text-sm text-ink-soft">{title}: the model cannot draw this coil until its geometry is complete.</p>;
          return (
            <div key={c} className="flex flex-col gap-2">
              <p className="text-sm font-bold text-ink">{title}</p>
              <Diagram plane={plane} title={`${title}: impedance plane`} />
              <table className="w-full text-left text-xs">
                <caption className="sr-only">{title}: angle between lift-off and each flaw</caption>
                <thead className="text-ink-soft">
                  <tr>
                    <th scope="col" className="py-1 pr-3 font-bold">Frequency</th>
                    <th scope="col" className="py-1 pr-3 font-bold">Flaw</th>
                    <th scope="col" className="py-1 pr-3 font-bold">Angle from lift-off</th>
                  </tr>
                </thead>
                <tbody>
                  {plane.testPoints.flatMap((point) =>
                    point.flaws.length === 0
                      ? [
                          <tr key={point.frequencyHz} className="border-t border-ink/5">
                            <td className="py-0.5 pr-3">{formatHz(point.frequencyHz)}</td>
                            <td colSpan={2} className="text-ink-soft">No expected flaw lies below the surface.</td>
                          </tr>,
                        ]
                      : point.flaws.map((flaw) => {
                          const silent = flaw.direction.resistance === 0 && flaw.direction.reactance === 0;
                          const low = separationMinDeg !== undefined && !silent && flaw.separationDeg < separationMinDeg;
                          return (
                            <tr key={`${point.frequencyHz}-${flaw.flawId}`} className="border-t border-ink/5">
                              <td className="py-0.5 pr-3">{formatHz(point.frequencyHz)}</td>
                              <td className="pr-3">{flaw.flawId}</td>
                              <td className={low ? 'font-bold text-fail' : ''}>
                                {silent ? 'no signal: the field does not reach it' : `${formatNumber(flaw.separationDeg, 2)}°${low ? ' (below the organisation’s minimum)' : ''}`}
                              </td>
                            </tr>
                          );
                        }),
                  )}
                </tbody>
              </table>
            </div>
          );
        })}
      </div>
    </figure>
  );
}

// The signals measured on flaw-free sites as a histogram, with the decision threshold and the
// false-call probability it gives.
import { Bar, BarChart, CartesianGrid, Label, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import type { FalseCallEstimate } from '../../../../shared/domain/pod/false-calls';

const BINS = 12;

export function NoisePlot({ noise, falseCalls, units, animate = false }: { noise: number[]; falseCalls: FalseCallEstimate; units: string; animate?: boolean }) {
  const top = Math.max(...noise, falseCalls.decisionThreshold) * 1.05;
  const width = top / BINS;
  const bins = Array.from({ length: BINS }, (_, i) => ({
    from: i * width,
    label: `${Number((i * width).toPrecision(2))}–${Number(((i + 1) * width).toPrecision(2))}`,
    count: noise.filter((v) => v >= i * width && (v < (i + 1) * width || (i === BINS - 1 && v <= top))).length,
    aboveThreshold: (i + 1) * width > falseCalls.decisionThreshold,
  }));
  const percent = (p: number | null) => (p === null ? 'not estimated' : `${Number((p * 100).toPrecision(2))} %`);
  return (
    <figure aria-label="Signals on flaw-free sites">
      <ResponsiveContainer width="100%" height={220}>
        <BarChart data={bins} margin={{ top: 10, right: 20, bottom: 20, left: 10 }}>
          <CartesianGrid strokeDasharray="3 3" />
          <XAxis dataKey="label">
            <Label value={`signal on flaw-free sites, ${units}`} position="insideBottom" offset={-10} />
          </XAxis>
          <YAxis allowDecimals={false}>
            <Label value="sites" angle={-90} position="insideLeft" />
          </YAxis>
          <Tooltip />
          <Bar dataKey="count" name="sites" fill="#1f6f78" isAnimationActive={animate} />
        </BarChart>
      </ResponsiveContainer>
      <figcaption className="text-xs text-ink-soft">
        At the decision threshold of {falseCalls.decisionThreshold} {units}: false-call probability {percent(falseCalls.normalFitProbability)} from a
        log-normal fit to the {falseCalls.n} flaw-free sites; {percent(falseCalls.empiricalFraction)} of them were at or above it.
      </figcaption>
    </figure>
  );
}

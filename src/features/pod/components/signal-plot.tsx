// Signal against flaw size on log scales: the calls, the fitted line ln â = β0 + β1·ln a, the
// recording threshold and saturation (censoring limits) and the decision threshold.
import { CartesianGrid, Label, Line, ComposedChart, ReferenceLine, ResponsiveContainer, Scatter, Tooltip, XAxis, YAxis } from 'recharts';
import type { SignalResponseAnalysis } from '../../../../shared/domain/pod/signal-response';

export function SignalPlot({ analysis, units, dimension, animate = false }: { analysis: SignalResponseAnalysis; units: string; dimension: string; animate?: boolean }) {
  const points = analysis.residuals.map((r) => ({ sizeMm: r.sizeMm, signal: r.signal > 0 ? r.signal : (analysis.recordingThreshold ?? 1e-3) }));
  const sizes = points.map((p) => p.sizeMm);
  const lo = Math.min(...sizes);
  const hi = Math.max(...sizes);
  const { beta0, beta1 } = analysis.parameters;
  const fit = [lo, hi].map((a) => ({ sizeMm: a, fit: Math.exp(beta0 + beta1 * Math.log(a)) }));
  return (
    <figure aria-label="Signal against flaw size">
      <ResponsiveContainer width="100%" height={280}>
        <ComposedChart margin={{ top: 10, right: 20, bottom: 20, left: 10 }}>
          <CartesianGrid strokeDasharray="3 3" />
          <XAxis type="number" dataKey="sizeMm" scale="log" domain={['auto', 'auto']} tickFormatter={(v: number) => String(Number(v.toFixed(2)))}>
            <Label value={`flaw ${dimension}, mm (log scale)`} position="insideBottom" offset={-10} />
          </XAxis>
          <YAxis type="number" scale="log" domain={['auto', 'auto']} tickFormatter={(v: number) => String(Number(v.toPrecision(2)))}>
            <Label value={`signal, ${units}`} angle={-90} position="insideLeft" />
          </YAxis>
          <Tooltip />
          <Scatter data={points} dataKey="signal" name="calls" fill="#14343b" isAnimationActive={animate} />
          <Line data={fit} dataKey="fit" name="fit" stroke="#1f6f78" strokeWidth={2} dot={false} isAnimationActive={animate} />
          {analysis.recordingThreshold !== null && <ReferenceLine y={analysis.recordingThreshold} stroke="#6b4c9a" strokeDasharray="4 3" label={{ value: 'recording threshold', position: 'insideBottomRight' }} />}
          {analysis.saturation !== null && <ReferenceLine y={analysis.saturation} stroke="#6b4c9a" strokeDasharray="4 3" label={{ value: 'saturation', position: 'insideTopRight' }} />}
          <ReferenceLine y={analysis.decisionThreshold} stroke="#c0652c" label={{ value: 'decision threshold', position: 'insideTopLeft' }} />
        </ComposedChart>
      </ResponsiveContainer>
    </figure>
  );
}

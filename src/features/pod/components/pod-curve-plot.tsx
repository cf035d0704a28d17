// POD against flaw size: the fitted curve, its lower 95 % confidence bound, and a50, a90 and
// a90/95 marked. The bound is drawn as the size at which each POD is reached with 95 % confidence.
import { CartesianGrid, Label, Legend, Line, LineChart, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import type { PodCurvePoint } from '../../../../shared/domain/pod/types';

export interface PodMarks {
  a50Mm: number;
  a90Mm: number;
  a9095Mm: number | null;
}

const mm = (value: number) => `${Number(value.toFixed(3))} mm`;

export function PodCurvePlot({ curve, marks, dimension, animate = false }: { curve: PodCurvePoint[]; marks: PodMarks; dimension: string; animate?: boolean }) {
  const fitted = curve.map((p) => ({ sizeMm: p.sizeMm, pod: p.pod * 100 }));
  const bound = curve.filter((p) => p.bound95SizeMm !== null).map((p) => ({ sizeMm: p.bound95SizeMm!, pod: p.pod * 100 }));
  const maxMm = Math.max(...fitted.map((p) => p.sizeMm), ...bound.map((p) => p.sizeMm)) * 1.05;
  return (
    <figure aria-label="Probability of detection against flaw size">
      <ResponsiveContainer width="100%" height={280}>
        <LineChart margin={{ top: 10, right: 20, bottom: 20, left: 10 }}>
          <CartesianGrid strokeDasharray="3 3" />
          <XAxis type="number" dataKey="sizeMm" domain={[0, Number(maxMm.toFixed(2))]} tickFormatter={(v: number) => String(Number(v.toFixed(2)))}>
            <Label value={`flaw ${dimension}, mm`} position="insideBottom" offset={-10} />
          </XAxis>
          <YAxis type="number" domain={[0, 100]} unit=" %">
            <Label value="POD" angle={-90} position="insideLeft" />
          </YAxis>
          <Tooltip formatter={(value) => `${Number(Number(value).toFixed(1))} %`} labelFormatter={(label) => mm(Number(label))} />
          <Legend verticalAlign="top" />
          <Line data={fitted} dataKey="pod" name="POD (fitted)" stroke="#1f6f78" strokeWidth={2} dot={false} isAnimationActive={animate} />
          <Line data={bound} dataKey="pod" name="95 % confidence bound" stroke="#c0652c" strokeDasharray="6 3" dot={false} isAnimationActive={animate} />
          <ReferenceLine x={marks.a50Mm} stroke="#6b4c9a" strokeDasharray="2 3" label={{ value: 'a50', position: 'insideBottomLeft' }} />
          <ReferenceLine x={marks.a90Mm} stroke="#1f6f78" strokeDasharray="2 3" label={{ value: 'a90', position: 'insideBottomLeft' }} />
          {marks.a9095Mm !== null && <ReferenceLine x={marks.a9095Mm} stroke="#c0652c" label={{ value: 'a90/95', position: 'insideBottomRight' }} />}
        </LineChart>
      </ResponsiveContainer>
      <figcaption className="text-xs text-ink-soft">
        a50 {mm(marks.a50Mm)} · a90 {mm(marks.a90Mm)} · a90/95 {marks.a9095Mm === null ? 'not bounded by these data' : mm(marks.a9095Mm)}
      </figcaption>
    </figure>
  );
}

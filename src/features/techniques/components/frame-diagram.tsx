// The part's local frame (u, v, n) with, for each coil, the directions its induced
// current takes and the trace of each expected flaw's plane on the surface. A flaw
// is found when the current crosses it (|current · normal| at or above the policy's
// threshold) and missed when the current runs along it.
import { useId } from 'react';
import { COIL_CURRENT_DIRECTIONS, COIL_CURRENT_WORDS, flawNormal } from '../../../../shared/domain/orientation';
import type { ChecklistValues } from '../../../../shared/domain/checklist';
import type { Technique } from '../../../../shared/schemas/technique';
import { COIL_TYPE_LABELS, formatNumber } from './labels';

const SIZE = 240;
const C = SIZE / 2;
/** The drawing is SIZE square; the frame's key sits in a strip below it. */
const HEIGHT = SIZE + 44;
const FLAW_DASHES = ['', '6 3', '2 3'];
/** Where flaws are drawn: the four quadrants around the centre, then between them. */
const FLAW_SPOTS: readonly (readonly [number, number])[] = [
  [C - 58, C - 62],
  [C + 58, C - 62],
  [C + 58, C + 40],
  [C - 58, C + 40],
  [C, C - 92],
  [C + 92, C - 10],
];
const COPPER = '#c0652c';
const PASS = '#2f7d4f';
const FAIL = '#b42318';

function axisNames(form: Technique['part']['form']) {
  return form === 'plate' ? { u: 'u: longitudinal', v: 'v: transverse' } : { u: 'u: axial', v: 'v: circumferential' };
}

function CoilPanel({
  technique,
  coilIndex,
  values,
  threshold,
}: {
  technique: Technique;
  coilIndex: number;
  values: ChecklistValues;
  threshold: number;
}) {
  const id = useId().replace(/:/g, '');
  const coil = technique.coils[coilIndex];
  const directions = COIL_CURRENT_DIRECTIONS[coil.type];
  const names = axisNames(technique.part.form);
  const flaws = technique.flaws.map((flaw, f) => {
    const normal = flawNormal(flaw.orientation, flaw.angleDeg);
    const inPlane = Math.hypot(normal[0], normal[1]);
    const sensitivity = values.orientationSensitivity[f]?.[coilIndex] ?? 0;
    return { flaw, f, normal, inPlane, sensitivity, covered: sensitivity + 1e-9 >= threshold };
  });

  return (
    <div className="rounded-md border border-ink/10 p-2" data-testid={`frame-coil-${coilIndex}`}>
      <p className="text-sm font-bold text-ink">
        Coil {coilIndex + 1}: {COIL_TYPE_LABELS[coil.type]}
      </p>
      <p className="text-xs text-ink-soft">Induced current flows {COIL_CURRENT_WORDS[coil.type]}.</p>
      <svg viewBox={`0 0 ${SIZE} ${HEIGHT}`} className="mt-1 h-[17rem] w-60" role="img" aria-label={`Coil ${coilIndex + 1} current directions against the expected flaws`}>
        <defs>
          <marker id={`${id}-arrow`} viewBox="0 0 10 10" refX="8" refY="5" markerWidth="6" markerHeight="6" orient="auto-start-reverse">
            <path d="M0,0 L10,5 L0,10 z" fill={COPPER} />
          </marker>
          <marker id={`${id}-axis`} viewBox="0 0 10 10" refX="8" refY="5" markerWidth="5" markerHeight="5" orient="auto-start-reverse">
            <path d="M0,0 L10,5 L0,10 z" fill="#14343b" />
          </marker>
        </defs>
        <rect x="1" y="1" width={SIZE - 2} height={HEIGHT - 2} rx="8" fill="#f6f4ef" stroke="#14343b22" />

        {/* Induced current */}
        {directions.kind === 'in-plane' ? (
          <g>
            <circle cx={C} cy={C} r={62} fill="none" stroke={COPPER} strokeWidth={3} opacity={0.75} />
            {[0, 90, 180, 270].map((angle) => {
              const a = (angle * Math.PI) / 180;
              const x = C + 62 * Math.cos(a);
              const y = C - 62 * Math.sin(a);
              const tx = -Math.sin(a);
              const ty = -Math.cos(a);
              return (
                <line key={angle} x1={x - tx * 6} y1={y - ty * 6} x2={x + tx * 6} y2={y + ty * 6} stroke={COPPER} strokeWidth={3} markerEnd={`url(#${id}-arrow)`} />
              );
            })}
          </g>
        ) : (
          directions.directions.map((direction, index) => (
            <line
              key={index}
              x1={C - 88 * direction[0]}
              y1={C + 88 * direction[1]}
              x2={C + 88 * direction[0]}
              y2={C - 88 * direction[1]}
              stroke={COPPER}
              strokeWidth={4}
              markerStart={`url(#${id}-arrow)`}
              markerEnd={`url(#${id}-arrow)`}
            />
          ))
        )}

        {/* Flaw traces on the surface, each in a quadrant of its own so none hides a current arrow or another flaw */}
        {flaws.map(({ flaw, f, normal, inPlane, covered }) => {
          const colour = covered ? PASS : FAIL;
          const dash = FLAW_DASHES[Math.floor(f / FLAW_SPOTS.length) % FLAW_DASHES.length];
          const [cx, cy] = FLAW_SPOTS[f % FLAW_SPOTS.length];
          const label = (
            <text x={cx} y={cy + 26} fontSize="10" fill={colour} textAnchor="middle">
              {flaw.id.length > 16 ? `${flaw.id.slice(0, 15)}…` : flaw.id}
            </text>
          );
          if (inPlane < 1e-6) {
            return (
              <g key={flaw.id}>
                <ellipse cx={cx} cy={cy} rx={20} ry={9} fill="none" stroke={colour} strokeWidth={2.5} strokeDasharray="3 2" />
                {label}
              </g>
            );
          }
          // The crack's trace on the surface runs perpendicular to its plane's in-plane normal.
          const tu = -normal[1] / inPlane;
          const tv = normal[0] / inPlane;
          return (
            <g key={flaw.id}>
              <line x1={cx - 18 * tu} y1={cy + 18 * tv} x2={cx + 18 * tu} y2={cy - 18 * tv} stroke={colour} strokeWidth={4} strokeLinecap="round" strokeDasharray={dash} />
              {label}
            </g>
          );
        })}

        {/* The frame: u to the right, v up, n out of the page */}
        <g fontSize="10" fill="#14343b">
          <line x1={0} y1={SIZE} x2={SIZE} y2={SIZE} stroke="#14343b22" />
          <line x1={24} y1={HEIGHT - 12} x2={60} y2={HEIGHT - 12} stroke="#14343b" strokeWidth={1.5} markerEnd={`url(#${id}-axis)`} />
          <line x1={24} y1={HEIGHT - 12} x2={24} y2={HEIGHT - 38} stroke="#14343b" strokeWidth={1.5} markerEnd={`url(#${id}-axis)`} />
          <circle cx={24} cy={HEIGHT - 12} r={4} fill="none" stroke="#14343b" />
          <circle cx={24} cy={HEIGHT - 12} r={1.2} fill="#14343b" />
          <text x={64} y={HEIGHT - 9}>{names.u}</text>
          <text x={30} y={HEIGHT - 32}>{names.v}</text>
          <text x={8} y={HEIGHT - 20}>n</text>
        </g>
      </svg>
      <ul className="mt-1 text-xs">
        {flaws.map(({ flaw, sensitivity, covered }) => (
          <li key={flaw.id} className={covered ? 'text-pass' : 'text-fail'}>
            <span aria-hidden="true">{covered ? '✓ ' : '✗ '}</span>
            <span className="font-bold">{flaw.id}</span>: |current · normal| = {formatNumber(sensitivity, 2)} {covered ? '≥' : '<'} {formatNumber(threshold, 2)},{' '}
            {covered ? 'current crosses it (found)' : flaw.orientation === 'laminar' ? 'parallel to the surface (missed)' : 'current runs along it (missed)'}
          </li>
        ))}
      </ul>
    </div>
  );
}

export function FrameDiagram({ technique, values, threshold }: { technique: Technique; values: ChecklistValues; threshold: number }) {
  return (
    <figure className="rounded-lg border border-ink/10 bg-white p-4" aria-labelledby="frame-diagram-title">
      <figcaption id="frame-diagram-title" className="text-lg font-bold text-ink">
        Induced current against flaw orientation
      </figcaption>
      <p className="text-xs text-ink-soft">
        The part's local frame: u along the part, v across it, n out of the surface. Copper shows the induced current; each line is the trace
        of an expected flaw on the surface, green when some current crosses it, red when the current runs along it. Several coils cover a
        flaw if any one of them does.
      </p>
      <div className="mt-2 flex flex-wrap gap-3">
        {technique.coils.map((_, index) => (
          <CoilPanel key={index} technique={technique} coilIndex={index} values={values} threshold={threshold} />
        ))}
      </div>
    </figure>
  );
}

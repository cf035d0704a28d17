// A revision's content, read-only, in the words of the trade.
import type { Technique } from '../../../../shared/schemas/technique';
import { COIL_TYPE_LABELS, LOCATION_LABELS, ORIENTATION_LABELS, PART_FORM_LABELS, formatHz, orientationWord } from './labels';

const mm = (value: number | undefined) => (value === undefined ? '—' : `${value} mm`);

function Row({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div className="contents">
      <dt className="font-bold text-ink-soft">{label}</dt>
      <dd>{children}</dd>
    </div>
  );
}

export function TechniqueSummary({ technique }: { technique: Technique }) {
  const { material, part, coils, scan, flaws, reference } = technique;
  return (
    <section aria-labelledby="summary-heading" className="rounded-lg border border-ink/10 bg-white p-4 text-sm">
      <h2 id="summary-heading" className="text-lg font-bold text-ink">
        As written
      </h2>
      <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">
        <Row label="Material">
          {material.name}: {material.conductivityIacs} %IACS, μr {material.relativePermeability}
          {material.saturated ? ', magnetic saturation' : ''}
        </Row>
        <Row label="Part">
          {PART_FORM_LABELS[part.form]}; thickness {mm(part.thicknessMm)}, diameter {mm(part.diameterMm)}
          {part.form === 'tube' ? `, wall ${mm(part.wallMm)}` : ''}
        </Row>
        {coils.map((coil, index) => (
          <Row key={index} label={`Coil ${index + 1}`}>
            {COIL_TYPE_LABELS[coil.type]}, {coil.diameterMm} mm, {coil.shielded ? 'shielded' : 'unshielded'}, {coil.mode}; {coil.frequenciesHz.map(formatHz).join(', ')}
          </Row>
        ))}
        <Row label="Scan">
          index {mm(scan.indexMm)}, closest edge {mm(scan.minEdgeDistanceMm)}, {scan.edgeGuide ? 'edge guide used' : 'no edge guide'}
        </Row>
        {flaws.map((flaw) => (
          <Row key={flaw.id} label={`Flaw “${flaw.id}”`}>
            {ORIENTATION_LABELS[flaw.orientation]}
            {flaw.angleDeg !== undefined ? ` at ${flaw.angleDeg}°` : ''}, {LOCATION_LABELS[flaw.location].toLowerCase()}; depth {flaw.depthMm} mm, length {flaw.lengthMm} mm
            {flaw.metalAboveMm !== undefined ? `, under ${flaw.metalAboveMm} mm of metal` : ''}
          </Row>
        ))}
        <Row label="Reference standard">
          {reference.conductivityIacs} %IACS;{' '}
          {reference.notches.length === 0
            ? 'no notches'
            : reference.notches
                .map((notch) => `${orientationWord(notch.orientation).toLowerCase()} notch ${notch.depthMm} × ${notch.lengthMm} mm${notch.edgeDistanceMm !== undefined ? ` at ${notch.edgeDistanceMm} mm from the edge` : ''}`)
                .join('; ')}
        </Row>
      </dl>
    </section>
  );
}

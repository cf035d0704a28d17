// The numbers behind a checklist result, in words with their units:
// "Orientation sensitivity 1; sensitivity needed at least 0.5; best coil: coil 1",
// never the engine's value keys. Units come from the key's suffix (depthMm → mm).
import { humanizeCode } from './humanize';

type ValueKind = 'number' | 'coil' | 'notch' | 'date' | 'text' | 'yesno' | 'count';

interface ValueLabel {
  label: string;
  kind?: ValueKind;
}

/** Every value key the rules report today; a key missing here is still put in words by humanizeCode. */
export const VALUE_LABELS: Readonly<Record<string, ValueLabel>> = {
  sensitivity: { label: 'Orientation sensitivity' },
  sensitivityMin: { label: 'Sensitivity needed, at least' },
  bestCoil: { label: 'Best coil', kind: 'coil' },
  depthMm: { label: 'Flaw depth' },
  radiusMm: { label: 'Bar radius' },
  encirclingCoils: { label: 'Encircling coils', kind: 'count' },
  fillFactor: { label: 'Fill factor η' },
  fillFactorMin: { label: 'Fill factor needed, at least' },
  limitFrequencyHz: { label: 'Limit frequency f_g' },
  frequencyRatio: { label: 'Frequency ratio f/f_g' },
  windowLowHz: { label: 'Crack-detection window from' },
  windowHighHz: { label: 'Crack-detection window to' },
  relativePermeability: { label: 'Relative permeability μr' },
  saturated: { label: 'Magnetic saturation', kind: 'yesno' },
  justified: { label: 'Justification given', kind: 'yesno' },
  referenceConductivityIacs: { label: 'Reference standard conductivity' },
  partConductivityIacs: { label: 'Part conductivity' },
  deviationPercent: { label: 'Deviation' },
  tolerancePercent: { label: 'Tolerance' },
  flawDepthMm: { label: 'Flaw depth' },
  notchDepthMm: { label: 'Notch depth' },
  notchDepthMaxMm: { label: 'Deepest notch allowed' },
  notch: { label: 'Notch', kind: 'notch' },
  approved: { label: 'Approved', kind: 'yesno' },
  approverLevel: { label: 'Approver certified at level', kind: 'text' },
  certificateExpiresOn: { label: 'Certificate expires', kind: 'date' },
  performers: { label: 'People qualified to perform it', kind: 'count' },
  kind: { label: 'Kind', kind: 'text' },
  description: { label: 'Item', kind: 'text' },
  calibrationDueOn: { label: 'Calibration due', kind: 'date' },
  indexMm: { label: 'Scan index' },
  maxIndexMm: { label: 'Scan index allowed, at most' },
  coilDiameterMm: { label: 'Coil diameter' },
  fraction: { label: 'Fraction of the coil diameter' },
  minEdgeDistanceMm: { label: 'Closest approach to an edge' },
  edgeZoneMm: { label: 'Edge zone' },
  edgeGuide: { label: 'Edge guide', kind: 'yesno' },
  edgeNotchDistanceMm: { label: 'Edge notch distance from the edge' },
  lengthMm: { label: 'Crack length' },
  shortCrackLengthMm: { label: 'Shortest crack reliably found' },
  frequencyHz: { label: 'Frequency f' },
  standardDepthMm: { label: 'Standard depth of penetration δ' },
  reachDepthMm: { label: 'Depth reached' },
  effectiveDepthMm: { label: 'Depth reached' },
  penetrationDepthFactor: { label: 'Penetration factor k' },
  currentDensityRatio: { label: 'Current density at the flaw, of the surface value' },
  phaseLagDeg: { label: 'Phase lag at the flaw' },
  suggestedFrequencyHz: { label: 'Suggested frequency' },
  phaseSeparationFrequencyHz: { label: 'Frequency separating flaw and lift-off signals' },
  conductivityMsPerM: { label: 'Conductivity σ' },
  resistivityMicroOhmCm: { label: 'Resistivity ρ' },
  conductivityIacs: { label: 'Conductivity' },
  // The coil's own field (engine 2): densities relative to the surface, phases and frequencies.
  densityRatioAtFlaw: { label: "This coil's current density at the flaw, relative to the surface" },
  planeWaveDensityRatio: { label: 'Plane-wave density there, e^(−x/δ)' },
  densityRatioMin: { label: 'Density needed at the flaw, at least' },
  lowFrequencyDensityRatio: { label: 'Density there at the lowest frequencies' },
  flawRadiusMm: { label: 'Radius of the flaw from the axis' },
  currentPhaseLagDeg: { label: 'Phase lag of the current at the flaw' },
  flawSignalPhaseLagDeg: { label: "Phase turn of the flaw's signal" },
  highestReachingFrequencyHz: { label: 'Highest frequency that still reaches the flaw' },
  recommendedFrequencyHz: { label: 'Recommended frequency' },
  recommendedPhaseSeparationDeg: { label: 'Angle from lift-off at the recommended frequency' },
  phaseSeparationDeg: { label: 'Angle between the flaw and lift-off signals' },
  phaseSeparationMinDeg: { label: 'Angle needed, at least' },
  fieldModel: { label: 'Field model', kind: 'text' },
  fieldRelativePermeability: { label: 'Relative permeability the field is worked out with' },
  ferromagneticPermeabilityMin: { label: 'Ferromagnetic from a relative permeability of' },
  coatingMm: { label: 'Non-conductive coating' },
  coilRadiusMm: { label: 'Coil radius' },
  clearCentreDistanceMm: { label: 'Coil centre to edge needed, at least' },
  coilSpacingMm: { label: 'Spacing of the differential windings' },
  coilSpacingGiven: { label: 'Spacing given in the technique', kind: 'yesno' },
  pairAxisDeg: { label: 'Axis of the differential pair, to the part axis' },
  pairAxisSensitivity: { label: 'Sensitivity of the differential pair to this crack' },
  flawLengthAlongScanMm: { label: 'Flaw length along the scan' },
  failLengthMm: { label: 'Flaw length past which a differential coil misses it' },
  flawLocation: { label: 'Flaw location', kind: 'text' },
  notchLocation: { label: 'Notch location', kind: 'text' },
  flawThroughWallMm: { label: "Flaw's through-wall extent" },
  limitFrequencyThinWallHz: { label: 'Limit frequency by the thin-wall formula' },
  shimMm: { label: 'Calibration shim' },
  shimToleranceMm: { label: 'Shim tolerance' },
  liftOffBareMm: { label: 'Lift-off on bare metal' },
  flawSignalRatioCoatedToBare: { label: 'Flaw signal through the coating, relative to bare metal' },
  sensitivityLossPercent: { label: 'Loss of flaw signal to the coating' },
  sensitivityLossMaxPercent: { label: 'Loss allowed before review, at most' },
  claimedMm: { label: 'Flaw size the technique claims' },
  dimension: { label: 'Dimension', kind: 'text' },
  a9095Mm: { label: 'Demonstrated a90/95' },
  demonstrationId: { label: 'Demonstration', kind: 'count' },
  expired: { label: 'Demonstration expired', kind: 'yesno' },
};

/** Unit suffixes of value keys and the units they print. */
export const UNIT_SUFFIXES: readonly [RegExp, string][] = [
  [/MsPerM$/, ' MS/m'],
  [/MicroOhmCm$/, ' µΩ·cm'],
  [/Iacs$/, ' %IACS'],
  [/Mm$/, ' mm'],
  [/Deg$/, '°'],
  [/Percent$/, ' %'],
];

export function formatNumber(value: number): string {
  if (!Number.isFinite(value)) return String(value);
  if (value !== 0 && (Math.abs(value) >= 1e5 || Math.abs(value) < 1e-3)) return value.toPrecision(3);
  return String(Number(value.toPrecision(4)));
}

export function formatHz(value: number): string {
  if (Math.abs(value) >= 1e6) return `${formatNumber(value / 1e6)} MHz`;
  if (Math.abs(value) >= 1e3) return `${formatNumber(value / 1e3)} kHz`;
  return `${formatNumber(value)} Hz`;
}

export function valueLabel(key: string): string {
  return VALUE_LABELS[key]?.label ?? humanizeCode(key.replace(/(MsPerM|MicroOhmCm|Iacs|Mm|Hz|Deg|Percent)$/, ''));
}

function formatScalar(key: string, value: unknown, kind: ValueKind): string {
  if (value === null || value === undefined || value === '') return '—';
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (Array.isArray(value)) return value.map((item) => formatScalar(key, item, kind)).join(', ');
  if (typeof value === 'number') {
    if (kind === 'coil') return `coil ${value + 1}`;
    if (kind === 'notch') return `notch ${value + 1}`;
    if (kind === 'count') return String(value);
    if (/Hz$/.test(key)) return formatHz(value);
    const unit = UNIT_SUFFIXES.find(([pattern]) => pattern.test(key))?.[1] ?? '';
    return `${formatNumber(value)}${unit}`;
  }
  if (typeof value === 'string') return kind === 'text' ? humanizeIfCode(value) : value;
  return '—';
}

/** Codes such as "reference-standard" in words; free text as written. */
const humanizeIfCode = (value: string) => (/^[a-z0-9]+(?:[-_][a-z0-9]+)+$/.test(value) ? humanizeCode(value) : value);

/** One value as "Label: value unit". */
export function formatResultValue(key: string, value: unknown): string {
  const kind = VALUE_LABELS[key]?.kind ?? 'number';
  return `${valueLabel(key)}: ${formatScalar(key, value, kind)}`;
}

/** A result's values as label and text pairs, in the engine's order. */
export function resultValueItems(values: Record<string, unknown> | null | undefined): { key: string; label: string; text: string }[] {
  if (!values) return [];
  return Object.entries(values).map(([key, value]) => ({ key, label: valueLabel(key), text: formatScalar(key, value, VALUE_LABELS[key]?.kind ?? 'number') }));
}

export function formatResultValues(values: Record<string, unknown> | null | undefined): string {
  return resultValueItems(values)
    .map((item) => `${item.label}: ${item.text}`)
    .join('; ');
}

import type { RuleId, RuleStatus } from '../../../../shared/domain/checklist';
import type { CoilType, FlawLocation, FlawOrientation, PartForm } from '../../../../shared/schemas/technique';

export const RULE_LABELS: Record<RuleId, string> = {
  'orientation-coverage': 'Orientation coverage',
  'center-effect': 'Center effect',
  'scan-index': 'Scan index',
  'penetration-depth': 'Penetration depth',
  'edge-effect': 'Edge effect',
  'fill-factor': 'Fill factor',
  'limit-frequency': 'Limit frequency',
  ferromagnetic: 'Ferromagnetic material',
  'reference-standard': 'Reference standard',
  'coil-size': 'Coil size against crack length',
  personnel: 'People',
  equipment: 'Equipment',
};

/** Status words and symbols: the colour is never the only signal. */
export const STATUS_TEXT: Record<RuleStatus, { label: string; symbol: string; className: string }> = {
  pass: { label: 'Pass', symbol: '✓', className: 'border-pass/40 bg-green-50 text-pass' },
  fail: { label: 'Fail', symbol: '✗', className: 'border-fail/40 bg-red-50 text-fail' },
  warn: { label: 'Warning', symbol: '!', className: 'border-warn/40 bg-amber-50 text-warn' },
  not_applicable: { label: 'Not applicable', symbol: '–', className: 'border-ink/20 bg-white text-ink-soft' },
};

export const PART_FORM_LABELS: Record<PartForm, string> = {
  plate: 'Plate or sheet (flat or gently curved surface)',
  bar: 'Solid bar or rod',
  tube: 'Tube',
  bore: 'Bore or fastener hole',
};

export const COIL_TYPE_LABELS: Record<CoilType, string> = {
  surface: 'Surface (flat) coil',
  pencil: 'Pencil probe',
  rotating: 'Rotating probe',
  encircling: 'Encircling coil',
  bobbin: 'Internal bobbin coil',
  multidirectional: 'Multi-directional assembly',
};

export const ORIENTATION_LABELS: Record<FlawOrientation, string> = {
  axial: 'Axial (along a bar or tube)',
  circumferential: 'Circumferential (around a bar or tube)',
  radial: 'Radial',
  laminar: 'Laminar (parallel to the surface)',
  longitudinal: 'Longitudinal (along a plate’s main direction)',
  transverse: 'Transverse (across a plate’s main direction)',
};

/** The orientation alone, without the explanation the editor's select gives: "Axial". */
export const orientationWord = (orientation: FlawOrientation) => ORIENTATION_LABELS[orientation].replace(/ \(.*\)$/, '');

/**
 * Why the list holds two names for each direction: the trade says axial and
 * circumferential of bars and tubes, longitudinal and transverse of plates and
 * sheet; the physics is the same (a crack is found where the eddy currents cross it).
 */
export const ORIENTATION_HELP =
  'Axial and circumferential are said of bars and tubes, longitudinal and transverse of plates and sheet: an axial crack and a longitudinal crack lie along the part in the same way, and the checks treat them alike. Choose the words of your part’s form.';

export const LOCATION_LABELS: Record<FlawLocation, string> = {
  surface: 'Open to the inspected surface',
  subsurface: 'Below the surface',
  'far-side': 'Far side (opposite wall)',
  center: 'At the centre of a bar',
};

export function formatHz(value: number): string {
  if (value >= 1e6) return `${+(value / 1e6).toPrecision(4)} MHz`;
  if (value >= 1e3) return `${+(value / 1e3).toPrecision(4)} kHz`;
  return `${+value.toPrecision(4)} Hz`;
}

export function formatNumber(value: number, digits = 3): string {
  return Number.isFinite(value) ? String(+value.toPrecision(digits)) : String(value);
}

// The technique screens' words come from the shared labels, so screens, PDFs and e-mails say the same.
export { RULE_LABELS, PART_FORM_LABELS, COIL_TYPE_LABELS, ORIENTATION_LABELS, LOCATION_LABELS } from '../../../../shared/labels';
import type { RuleStatus } from '../../../../shared/domain/checklist';
import type { FlawOrientation } from '../../../../shared/schemas/technique';
import { ORIENTATION_LABELS } from '../../../../shared/labels';
import { RULE_STATUS_LABELS } from '../../../../shared/labels';

/** Status words and symbols: the colour is never the only signal. */
export const STATUS_TEXT: Record<RuleStatus, { label: string; symbol: string; className: string }> = {
  pass: { label: RULE_STATUS_LABELS.pass, symbol: '✓', className: 'border-pass/40 bg-green-50 text-pass' },
  fail: { label: RULE_STATUS_LABELS.fail, symbol: '✗', className: 'border-fail/40 bg-red-50 text-fail' },
  warn: { label: RULE_STATUS_LABELS.warn, symbol: '!', className: 'border-warn/40 bg-amber-50 text-warn' },
  not_applicable: { label: RULE_STATUS_LABELS.not_applicable, symbol: '–', className: 'border-ink/20 bg-white text-ink-soft' },
};

export function formatHz(value: number): string {
  if (value >= 1e6) return `${+(value / 1e6).toPrecision(4)} MHz`;
  if (value >= 1e3) return `${+(value / 1e3).toPrecision(4)} kHz`;
  return `${+value.toPrecision(4)} Hz`;
}

export function formatNumber(value: number, digits = 3): string {
  return Number.isFinite(value) ? String(+value.toPrecision(digits)) : String(value);
}

/** The orientation with the explanation the editor's select gives: "Axial (along a bar or tube)". */
export const ORIENTATION_CHOICES: Record<FlawOrientation, string> = {
  axial: 'Axial (along a bar or tube)',
  circumferential: 'Circumferential (around a bar or tube)',
  radial: 'Radial',
  laminar: 'Laminar (parallel to the surface)',
  longitudinal: 'Longitudinal (along a plate’s main direction)',
  transverse: 'Transverse (across a plate’s main direction)',
};

/** The orientation alone: "Axial". */
export const orientationWord = (orientation: FlawOrientation) => ORIENTATION_LABELS[orientation];

/**
 * Why the list holds two names for each direction: the trade says axial and
 * circumferential of bars and tubes, longitudinal and transverse of plates and
 * sheet; the physics is the same (a crack is found where the eddy currents cross it).
 */
export const ORIENTATION_HELP =
  'Axial and circumferential are said of bars and tubes, longitudinal and transverse of plates and sheet: an axial crack and a longitudinal crack lie along the part in the same way, and the checks treat them alike. Choose the words of your part’s form.';

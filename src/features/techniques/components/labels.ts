// The technique screens' words come from the shared labels, so screens, PDFs and e-mails say the same.
export { RULE_LABELS, PART_FORM_LABELS, COIL_TYPE_LABELS, ORIENTATION_LABELS, LOCATION_LABELS } from '../../../../shared/labels';
import type { RuleStatus } from '../../../../shared/domain/checklist';
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

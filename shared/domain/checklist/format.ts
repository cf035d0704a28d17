// Number formatting for messages: three significant figures, units spelled out.
import type { Coil } from '../../schemas/technique';

/** Three significant figures, trailing zeros dropped ("0.624", "200", "1.5"). */
export function sig(value: number, digits = 3): string {
  if (!Number.isFinite(value)) return String(value);
  if (value === 0) return '0';
  return String(Number(value.toPrecision(digits)));
}

export function mm(value: number): string {
  return `${sig(value)} mm`;
}

export function hz(value: number): string {
  if (value >= 1e6) return `${sig(value / 1e6)} MHz`;
  if (value >= 1e3) return `${sig(value / 1e3)} kHz`;
  return `${sig(value)} Hz`;
}

export function percent(ratio: number): string {
  return `${sig(ratio * 100)} %`;
}

/** Rounds down to `digits` significant figures, so a suggested limit still satisfies the limit. */
export function floorSig(value: number, digits = 3): number {
  if (!Number.isFinite(value) || value <= 0) return value;
  const scale = 10 ** (Math.floor(Math.log10(value)) - digits + 1);
  const floored = Math.floor(value / scale) * scale;
  return Number(floored.toPrecision(digits));
}

/** Rounds up to `digits` significant figures (for a suggested minimum). */
export function ceilSig(value: number, digits = 3): number {
  if (!Number.isFinite(value) || value <= 0) return value;
  const scale = 10 ** (Math.floor(Math.log10(value)) - digits + 1);
  const ceiled = Math.ceil(value / scale) * scale;
  return Number(ceiled.toPrecision(digits));
}

/** "coil 1 (5 mm shielded surface)": one-based, as the technique's reader counts. */
export function coilName(coil: Coil, index: number): string {
  return `coil ${index + 1} (${sig(coil.diameterMm)} mm ${coil.shielded ? 'shielded ' : ''}${coil.type})`;
}

export function list(items: readonly string[]): string {
  if (items.length <= 1) return items.join('');
  return `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`;
}

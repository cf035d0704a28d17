// Number formatting for messages: three significant figures, units spelled out.
import type { Coil } from '../../schemas/technique';

// Exact powers of ten for the mantissa arithmetic below (faster than ** in the hot path).
const POW10: readonly number[] = Array.from({ length: 61 }, (_, i) => Number(`1e${i - 30}`));
const pow10 = (exponent: number): number => (exponent >= -30 && exponent <= 30 ? POW10[exponent + 30] : 10 ** exponent);

// Text of mantissa × 10^shift for mantissa < 1000 and shift in [-20, 19]: a bounded set,
// filled as met. Number-to-text conversion otherwise dominates the engine's run time.
const SHIFT_OFFSET = 20;
const SHIFT_SLOTS = 40;
const textCache: (string | undefined)[] = new Array(1000 * SHIFT_SLOTS);

function mantissaText(mantissa: number, shift: number): string {
  if (shift >= 0) return String(mantissa * pow10(shift));
  let decimals = -shift;
  while (decimals > 0 && mantissa % 10 === 0) {
    mantissa /= 10;
    decimals--;
  }
  const digitsText = String(mantissa);
  if (decimals === 0) return digitsText;
  if (digitsText.length > decimals) {
    return `${digitsText.slice(0, digitsText.length - decimals)}.${digitsText.slice(digitsText.length - decimals)}`;
  }
  return `0.${'0'.repeat(decimals - digitsText.length)}${digitsText}`;
}

/**
 * Three significant figures, trailing zeros dropped ("0.624", "200", "1.5"): the same text
 * as String(Number(value.toPrecision(digits))), for up to three digits.
 */
export function sig(value: number, digits = 3): string {
  if (!Number.isFinite(value) || digits > 3 || digits < 1) return String(Number(value.toPrecision(digits)));
  if (value === 0) return '0';
  const negative = value < 0;
  const magnitude = negative ? -value : value;
  if (magnitude < 1e-6 || magnitude >= 1e21) return String(Number(value.toPrecision(digits))); // exponent notation
  let shift = Math.floor(Math.log10(magnitude)) - digits + 1;
  let mantissa = Math.round(shift >= 0 ? magnitude / pow10(shift) : magnitude * pow10(-shift));
  if (mantissa >= pow10(digits)) {
    // Rounding carried into a new digit (999.6 → 1000): drop one.
    mantissa = Math.round(mantissa / 10);
    shift++;
  }
  let text: string;
  const slot = shift + SHIFT_OFFSET;
  if (slot >= 0 && slot < SHIFT_SLOTS) {
    const key = mantissa * SHIFT_SLOTS + slot;
    text = textCache[key] ??= mantissaText(mantissa, shift);
  } else {
    text = String(Number(magnitude.toPrecision(digits)));
  }
  return negative ? `-${text}` : text;
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
  return roundSig(value, digits, Math.floor);
}

/** Rounds up to `digits` significant figures (for a suggested minimum). */
export function ceilSig(value: number, digits = 3): number {
  return roundSig(value, digits, Math.ceil);
}

function roundSig(value: number, digits: number, round: (x: number) => number): number {
  if (!Number.isFinite(value) || value <= 0) return value;
  const shift = Math.floor(Math.log10(value)) - digits + 1;
  // Integer mantissa, then one exact scaling by a power of ten (no decimal conversion).
  return shift >= 0 ? round(value / pow10(shift)) * pow10(shift) : round(value * pow10(-shift)) / pow10(-shift);
}

/** "coil 1 (5 mm shielded surface)": one-based, as the technique's reader counts. */
export function coilName(coil: Coil, index: number): string {
  return `coil ${index + 1} (${sig(coil.diameterMm)} mm ${coil.shielded ? 'shielded ' : ''}${coil.type})`;
}

export function list(items: readonly string[]): string {
  if (items.length <= 1) return items.join('');
  return `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`;
}

// Test frequencies typed as text: "40 kHz, 160k" or "40000 160000". The box keeps
// what was typed; the form holds the parsed list (NaN for a word it cannot read,
// so the schema reports it rather than the box silently dropping it).
import { useEffect, useState } from 'react';
import { useController } from 'react-hook-form';
import { InputField, firstMessage, type TechniqueFormApi } from './form-kit';

// Every unit a person may type is read, even one far out of range ("1 THz"), so
// that the schema can say "must be at most 100 MHz" rather than "not a number".
const MULTIPLIERS: Record<string, number> = { '': 1, hz: 1, k: 1e3, khz: 1e3, m: 1e6, mhz: 1e6, g: 1e9, ghz: 1e9, t: 1e12, thz: 1e12 };

/** A signed decimal with an optional exponent ("-500", "1e12", "2.5E3"), then a unit. */
const FREQUENCY = /^([+-]?\d+(?:[.]\d+)?(?:e[+-]?\d+)?)\s*([a-z]*)$/i;

export function parseFrequencies(text: string): number[] {
  return text
    .split(/[,;]+|\s+(?=[+-]?\d)/)
    .map((part) => part.trim())
    .filter(Boolean)
    .map((part) => {
      const match = FREQUENCY.exec(part);
      const multiplier = match ? MULTIPLIERS[match[2].toLowerCase()] : undefined;
      return match && multiplier !== undefined ? Number(match[1]) * multiplier : Number.NaN;
    });
}

/** Exact, so that the text reads back to the same numbers: 40000 → "40 kHz", 12345 → "12345 Hz". */
function exactHz(value: number): string {
  if (value >= 1e6 && Number.isInteger(value / 1e6)) return `${value / 1e6} MHz`;
  if (value >= 1e3 && Number.isInteger(value / 1e3)) return `${value / 1e3} kHz`;
  return `${value} Hz`;
}

export function formatFrequencies(values: unknown): string {
  return Array.isArray(values) ? values.filter((value) => Number.isFinite(value)).map((value) => exactHz(value)).join(', ') : '';
}

/** Text that is not a number with a unit is said as such, not as "must be a finite number". */
export function unreadable(text: string): string | undefined {
  const parts = text.split(/[,;]+|\s+(?=[+-]?\d)/).map((part) => part.trim()).filter(Boolean);
  const bad = parts.find((part) => {
    const match = FREQUENCY.exec(part);
    return !match || MULTIPLIERS[match[2].toLowerCase()] === undefined;
  });
  return bad === undefined ? undefined : `“${bad}” is not a frequency: enter a number in Hz, kHz or MHz (e.g. 40 kHz)`;
}

export function FrequencyInput({ form, index }: { form: TechniqueFormApi; index: number }) {
  const { field, fieldState } = useController({ control: form.control, name: `coils.${index}.frequenciesHz` });
  const [text, setText] = useState(() => formatFrequencies(field.value));

  // A value set from outside (import, reset) replaces the text; the user's own typing does not get reformatted.
  useEffect(() => {
    const current = parseFrequencies(text);
    const value = (field.value ?? []) as number[];
    if (current.length !== value.length || current.some((item, i) => !(item === value[i] || (Number.isNaN(item) && Number.isNaN(value[i]))))) {
      setText(formatFrequencies(value));
    }
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [field.value]);

  return (
    <InputField
      label="Test frequencies"
      name={field.name}
      ref={field.ref}
      value={text}
      onBlur={field.onBlur}
      onChange={(event) => {
        setText(event.target.value);
        field.onChange(parseFrequencies(event.target.value));
      }}
      hint="Separate with commas; Hz, kHz or MHz (e.g. 40 kHz, 160 kHz)"
      error={unreadable(text) ?? firstMessage(fieldState.error)}
    />
  );
}

// Small form pieces for the technique editor: labelled inputs that take
// react-hook-form's register() (ref included), number parsing that keeps an empty
// box as "not given", and the first error message under a nested path.
import { useId, type ComponentProps, type ReactNode } from 'react';
import { get, useFormState, type UseFormReturn } from 'react-hook-form';
import type { Technique, TechniqueInput } from '../../../../../shared/schemas/technique';
import { messageAtField } from '../../../../lib/field-errors';

export type TechniqueFormApi = UseFormReturn<TechniqueInput, unknown, Technique>;

/** An empty box is "not given" (undefined), so optional numbers stay optional; "1,5" reads as 1.5. */
export function toNumber(value: unknown): number | undefined {
  if (value === '' || value === null || value === undefined) return undefined;
  if (typeof value === 'number') return value;
  const text = String(value).trim().replace(',', '.');
  return text === '' ? undefined : Number(text);
}

export const numberOptions = { setValueAs: toNumber } as const;

/** The first message at or below `path` (array fields put theirs on items or on the list). */
export function firstMessage(error: unknown): string | undefined {
  if (!error || typeof error !== 'object') return undefined;
  const record = error as Record<string, unknown>;
  if (typeof record.message === 'string' && record.message) return messageAtField(record.message);
  for (const value of Object.values(record)) {
    if (value && typeof value === 'object' && value !== record.ref) {
      const nested = firstMessage(value);
      if (nested) return nested;
    }
  }
  return undefined;
}

export function useFieldError(form: TechniqueFormApi, path: string): string | undefined {
  const { errors } = useFormState({ control: form.control, name: path as never });
  return firstMessage(get(errors, path));
}

const inputClass =
  'w-full rounded-md border border-ink/25 bg-white px-2.5 py-1.5 text-sm text-ink shadow-inner shadow-ink/5 aria-[invalid=true]:border-fail';
// Selects and checkboxes match :read-only too, so only text boxes get the read-only look.
const textInputClass = `${inputClass} read-only:bg-paper read-only:text-ink-soft`;

function Shell({ label, error, hint, children }: { label: string; error?: string; hint?: ReactNode; children: (id: string, describedBy?: string) => ReactNode }) {
  const id = useId();
  const describedBy = error ? `${id}-error` : hint ? `${id}-hint` : undefined;
  return (
    <div className="flex min-w-0 flex-col gap-1">
      <label htmlFor={id} className="text-sm font-bold text-ink">
        {label}
      </label>
      {children(id, describedBy)}
      {hint && !error && (
        <p id={`${id}-hint`} className="text-xs text-ink-soft">
          {hint}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} className="text-xs font-bold text-fail">
          {error}
        </p>
      )}
    </div>
  );
}

export function InputField({ label, error, hint, unit, ...props }: ComponentProps<'input'> & { label: string; error?: string; hint?: ReactNode; unit?: string }) {
  return (
    <Shell label={unit ? `${label} (${unit})` : label} error={error} hint={hint}>
      {(id, describedBy) => <input id={id} aria-invalid={Boolean(error)} aria-describedby={describedBy} className={textInputClass} {...props} />}
    </Shell>
  );
}

export function ChoiceField({ label, error, hint, children, ...props }: ComponentProps<'select'> & { label: string; error?: string; hint?: ReactNode }) {
  return (
    <Shell label={label} error={error} hint={hint}>
      {(id, describedBy) => (
        <select id={id} aria-invalid={Boolean(error)} aria-describedby={describedBy} className={inputClass} {...props}>
          {children}
        </select>
      )}
    </Shell>
  );
}

export function TextBoxField({ label, error, hint, ...props }: ComponentProps<'textarea'> & { label: string; error?: string; hint?: ReactNode }) {
  return (
    <Shell label={label} error={error} hint={hint}>
      {(id, describedBy) => <textarea id={id} aria-invalid={Boolean(error)} aria-describedby={describedBy} className={inputClass} rows={3} {...props} />}
    </Shell>
  );
}

export function CheckField({ label, hint, ...props }: ComponentProps<'input'> & { label: string; hint?: ReactNode }) {
  const id = useId();
  return (
    <div className="flex flex-col gap-0.5">
      <label htmlFor={id} className="flex items-center gap-2 text-sm font-bold text-ink">
        <input id={id} type="checkbox" className="h-4 w-4 accent-lagoon" {...props} />
        {label}
      </label>
      {hint && <p className="pl-6 text-xs text-ink-soft">{hint}</p>}
    </div>
  );
}

export function Section({ title, children, actions }: { title: string; children: ReactNode; actions?: ReactNode }) {
  return (
    <fieldset className="rounded-lg border border-ink/10 bg-white p-4">
      <legend className="px-1 text-base font-bold text-ink">{title}</legend>
      {actions && <div className="-mt-1 mb-2 flex justify-end gap-2">{actions}</div>}
      <div className="flex flex-col gap-3">{children}</div>
    </fieldset>
  );
}

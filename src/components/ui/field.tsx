import { useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes, type TextareaHTMLAttributes } from 'react';

interface FieldShellProps {
  label: string;
  error?: string;
  hint?: ReactNode;
  children: (id: string, describedBy: string | undefined) => ReactNode;
}

function FieldShell({ label, error, hint, children }: FieldShellProps) {
  const id = useId();
  const describedBy = error ? `${id}-error` : hint ? `${id}-hint` : undefined;
  return (
    <div className="flex flex-col gap-1">
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

const inputClass =
  'rounded-md border border-ink/25 bg-white px-2.5 py-1.5 text-sm text-ink shadow-inner shadow-ink/5 aria-[invalid=true]:border-fail';

export function TextField({ label, error, hint, ...props }: InputHTMLAttributes<HTMLInputElement> & { label: string; error?: string; hint?: ReactNode }) {
  return (
    <FieldShell label={label} error={error} hint={hint}>
      {(id, describedBy) => <input id={id} aria-invalid={Boolean(error)} aria-describedby={describedBy} className={inputClass} {...props} />}
    </FieldShell>
  );
}

export function SelectField({ label, error, hint, children, ...props }: SelectHTMLAttributes<HTMLSelectElement> & { label: string; error?: string; hint?: ReactNode }) {
  return (
    <FieldShell label={label} error={error} hint={hint}>
      {(id, describedBy) => (
        <select id={id} aria-invalid={Boolean(error)} aria-describedby={describedBy} className={inputClass} {...props}>
          {children}
        </select>
      )}
    </FieldShell>
  );
}

export function TextAreaField({ label, error, hint, ...props }: TextareaHTMLAttributes<HTMLTextAreaElement> & { label: string; error?: string; hint?: ReactNode }) {
  return (
    <FieldShell label={label} error={error} hint={hint}>
      {(id, describedBy) => <textarea id={id} aria-invalid={Boolean(error)} aria-describedby={describedBy} className={inputClass} {...props} />}
    </FieldShell>
  );
}

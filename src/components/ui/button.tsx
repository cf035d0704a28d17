import type { ButtonHTMLAttributes } from 'react';

type Variant = 'primary' | 'secondary' | 'danger' | 'ghost';

const VARIANTS: Record<Variant, string> = {
  primary: 'bg-ink text-white hover:bg-lagoon disabled:bg-ink-soft',
  secondary: 'bg-white text-ink border border-ink/20 hover:border-ink/50',
  danger: 'bg-fail text-white hover:bg-red-800',
  ghost: 'text-ink hover:bg-ink/5',
};

interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  variant?: Variant;
  /** A request started by this button is in flight: the button is disabled and reads `busyLabel`. */
  busy?: boolean;
  busyLabel?: string;
}

export function Button({ variant = 'primary', className = '', type = 'button', busy = false, busyLabel = 'Working…', disabled, children, ...props }: ButtonProps) {
  return (
    <button
      type={type}
      disabled={busy || disabled}
      aria-busy={busy || undefined}
      className={`inline-flex items-center justify-center gap-2 rounded-md px-3 py-1.5 text-sm font-bold transition-colors focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-lagoon disabled:cursor-not-allowed disabled:opacity-60 ${VARIANTS[variant]} ${className}`}
      {...props}
    >
      {busy ? busyLabel : children}
    </button>
  );
}

import type { ReactNode } from 'react';
import { Button } from './button';
import { Dialog } from './dialog';
import { ErrorNotice } from './states';

/** Asks before an irreversible or consequential step. */
export function ConfirmDialog({
  open,
  title,
  children,
  confirmLabel,
  danger = false,
  pending = false,
  confirmDisabled = false,
  error,
  onConfirm,
  onCancel,
}: {
  open: boolean;
  title: string;
  children: ReactNode;
  confirmLabel: string;
  danger?: boolean;
  pending?: boolean;
  /** The confirm button waits, e.g. for what the dialog must show first. */
  confirmDisabled?: boolean;
  error?: unknown;
  onConfirm(): void;
  onCancel(): void;
}) {
  return (
    <Dialog open={open} title={title} onClose={onCancel}>
      <div className="text-sm text-ink-soft">{children}</div>
      {error ? <div className="mt-3"><ErrorNotice error={error} /></div> : null}
      <div className="mt-5 flex justify-end gap-2">
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
        <Button variant={danger ? 'danger' : 'primary'} onClick={onConfirm} busy={pending} disabled={confirmDisabled}>
          {confirmLabel}
        </Button>
      </div>
    </Dialog>
  );
}

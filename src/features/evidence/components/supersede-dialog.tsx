import { useState, type FormEvent } from 'react';
import type { EvidenceView } from '../../../../shared/schemas/evidence';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { TextAreaField } from '../../../components/ui/field';
import { ErrorNotice } from '../../../components/ui/states';
import { ApiError } from '../../../lib/api-client';

/** Asks for the reason, then for confirmation: superseding cannot be undone. */
export function SupersedeDialog({
  file,
  pending,
  error,
  onConfirm,
  onCancel,
}: {
  file: EvidenceView;
  pending: boolean;
  error: unknown;
  onConfirm(reason: string): void;
  onCancel(): void;
}) {
  const [reason, setReason] = useState('');
  const [confirming, setConfirming] = useState(false);
  const tooShort = reason.trim().length < 3;
  const fieldError = error instanceof ApiError ? error.fieldErrors.find((detail) => detail.path === 'reason')?.message : undefined;

  const submit = (event: FormEvent) => {
    event.preventDefault();
    if (tooShort) return;
    if (!confirming) setConfirming(true);
    else onConfirm(reason.trim());
  };

  return (
    <Dialog open title={`Mark “${file.fileName}” superseded?`} onClose={onCancel}>
      <form onSubmit={submit} className="flex flex-col gap-3">
        <p className="text-sm text-ink-soft">
          The file stays on the record and in storage, with its hash, and can still be downloaded; it no longer counts as current evidence.
          This cannot be undone.
        </p>
        <TextAreaField
          label="Reason"
          rows={3}
          required
          value={reason}
          onChange={(event) => {
            setReason(event.target.value);
            setConfirming(false);
          }}
          error={fieldError}
          hint="For example: “Replaced by the signed calibration sheet”."
          autoFocus
        />
        {confirming && (
          <p role="alert" className="rounded-md border border-warn/40 bg-amber-50 px-3 py-2 text-sm text-ink">
            Press “Yes, mark superseded” to confirm.
          </p>
        )}
        {error && !fieldError ? <ErrorNotice error={error} title="Not superseded" /> : null}
        <div className="flex justify-end gap-2">
          <Button variant="secondary" onClick={onCancel}>
            Cancel
          </Button>
          <Button type="submit" variant="danger" disabled={tooShort || pending}>
            {pending ? 'Working…' : confirming ? 'Yes, mark superseded' : 'Mark superseded'}
          </Button>
        </div>
      </form>
    </Dialog>
  );
}

import { useState, type FormEvent } from 'react';
import { ApiError } from '../../../lib/api-client';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { useChangePassword } from '../api/session';

/** Current password, a new one twice; the server's reasons (a common or breached password) show at the field. */
export function PasswordChangeForm({ onDone, onCancel }: { onDone(): void; onCancel?: () => void }) {
  const change = useChangePassword();
  const [currentPassword, setCurrent] = useState('');
  const [newPassword, setNew] = useState('');
  const [repeated, setRepeated] = useState('');
  const [mismatch, setMismatch] = useState(false);
  const error = change.error instanceof ApiError ? change.error : null;
  const fieldError = (path: string) => error?.fieldErrors.find((detail) => detail.path === path)?.message;

  const submit = (event: FormEvent) => {
    event.preventDefault();
    if (newPassword !== repeated) return setMismatch(true);
    setMismatch(false);
    change.mutate({ currentPassword, newPassword }, { onSuccess: onDone });
  };

  return (
    <form onSubmit={submit} className="flex flex-col gap-3" noValidate>
      <TextField
        label="Current password"
        type="password"
        autoComplete="current-password"
        required
        value={currentPassword}
        onChange={(e) => setCurrent(e.target.value)}
        error={fieldError('currentPassword')}
      />
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        required
        value={newPassword}
        onChange={(e) => setNew(e.target.value)}
        hint="At least 12 characters; a phrase of several words works well. Common and breached passwords are refused."
        error={fieldError('newPassword')}
      />
      <TextField
        label="New password again"
        type="password"
        autoComplete="new-password"
        required
        value={repeated}
        onChange={(e) => setRepeated(e.target.value)}
        error={mismatch ? 'the two new passwords differ' : undefined}
      />
      {error && error.fieldErrors.length === 0 && (
        <p role="alert" className="rounded-md bg-red-50 px-3 py-2 text-sm font-bold text-fail">
          {error.message}
        </p>
      )}
      <p className="text-xs text-ink-soft">Your other sessions end when the password changes; this one goes on.</p>
      <div className="mt-2 flex justify-end gap-2">
        {onCancel && (
          <Button variant="secondary" onClick={onCancel}>
            Cancel
          </Button>
        )}
        <Button type="submit" disabled={change.isPending}>
          {change.isPending ? 'Saving…' : 'Change password'}
        </Button>
      </div>
    </form>
  );
}

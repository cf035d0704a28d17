import { useState, type FormEvent } from 'react';
import { ROLES, ROLE_LABELS, type Role } from '../../../../shared/roles';
import { SIGNING_ROLES, type UserView } from '../../../../shared/schemas/user';
import { useSession } from '../../auth/api/session';
import { ApiError } from '../../../lib/api-client';
import { Button } from '../../../components/ui/button';
import { SelectField, TextField } from '../../../components/ui/field';
import { FormErrorNotice } from '../../../components/ui/form-error';
import { formErrors } from '../../../lib/field-errors';
import { useAreas } from '../api/users';

export interface UserFormValues {
  email: string;
  displayName: string;
  password: string;
  roles: Role[];
  areaId: number | null;
  mailDigest: boolean;
}

const USER_FIELDS = { email: 'E-mail address', displayName: 'Name', password: 'Password', roles: 'Roles', areaId: 'Area' };

export function UserForm({
  user,
  pending,
  error,
  onSubmit,
  onCancel,
}: {
  user?: UserView;
  pending: boolean;
  error: unknown;
  onSubmit(values: UserFormValues): void;
  onCancel(): void;
}) {
  const areas = useAreas();
  const me = useSession().data?.user;
  // Nobody gives themself a signing role: another administrator must (the server refuses it too).
  const editingSelf = Boolean(user && me && user.id === me.id);
  const mayNotGrant = (role: Role) => editingSelf && (SIGNING_ROLES as readonly Role[]).includes(role) && !user!.roles.includes(role);
  const [values, setValues] = useState<UserFormValues>({
    email: user?.email ?? '',
    displayName: user?.displayName ?? '',
    password: '',
    roles: (user?.roles as Role[]) ?? [],
    areaId: user?.areaId ?? null,
    mailDigest: user?.mailDigest ?? false,
  });
  const apiError = error instanceof ApiError ? error : null;
  const fieldError = formErrors(apiError, USER_FIELDS).at;
  const set = <K extends keyof UserFormValues>(key: K, value: UserFormValues[K]) => setValues((current) => ({ ...current, [key]: value }));

  const submit = (event: FormEvent) => {
    event.preventDefault();
    onSubmit(values);
  };

  return (
    <form onSubmit={submit} className="flex flex-col gap-3" noValidate>
      {!user && (
        <TextField label="E-mail address" type="email" required value={values.email} onChange={(e) => set('email', e.target.value)} error={fieldError('email')} />
      )}
      <TextField
        label="Name as printed on signatures"
        required
        value={values.displayName}
        onChange={(e) => set('displayName', e.target.value)}
        error={fieldError('displayName')}
      />
      <TextField
        label={user ? 'New password (leave empty to keep)' : 'Initial password'}
        type="password"
        autoComplete="new-password"
        value={values.password}
        onChange={(e) => set('password', e.target.value)}
        hint={
          editingSelf
            ? 'At least 12 characters; a phrase of several words works well. Common and breached passwords are refused.'
            : 'At least 12 characters; common and breached passwords are refused. The person chooses their own at next sign-in, and their open sessions end.'
        }
        error={fieldError('password')}
      />
      <fieldset className="flex flex-col gap-1">
        <legend className="text-sm font-bold">Roles</legend>
        <div className="grid grid-cols-2 gap-1">
          {ROLES.map((role) => (
            <label key={role} className={`flex items-center gap-2 text-sm ${mayNotGrant(role) ? 'text-ink-soft' : ''}`}>
              <input
                type="checkbox"
                checked={values.roles.includes(role)}
                disabled={mayNotGrant(role)}
                onChange={(e) => set('roles', e.target.checked ? [...values.roles, role] : values.roles.filter((r) => r !== role))}
              />
              {ROLE_LABELS[role]}
            </label>
          ))}
        </div>
        {editingSelf && (
          <p className="text-xs text-ink-soft">Quality manager and accountable manager sign records: another administrator gives you these roles.</p>
        )}
        {user && !editingSelf && <p className="text-xs text-ink-soft">A change of roles ends the person’s open sessions.</p>}
        {fieldError('roles') && <p className="text-xs font-bold text-fail">{fieldError('roles')}</p>}
      </fieldset>
      <SelectField label="Area" value={values.areaId ?? ''} onChange={(e) => set('areaId', e.target.value ? Number(e.target.value) : null)} error={fieldError('areaId')}>
        <option value="">No production area</option>
        {areas.data?.items.map((area) => (
          <option key={area.id} value={area.id}>
            {area.name}
          </option>
        ))}
      </SelectField>
      {user && (
        <label className="flex items-center gap-2 text-sm">
          <input type="checkbox" checked={values.mailDigest} onChange={(e) => set('mailDigest', e.target.checked)} />
          Send reminders as one daily digest
        </label>
      )}
      {apiError && <FormErrorNotice error={apiError} fields={USER_FIELDS} />}
      <div className="mt-2 flex justify-end gap-2">
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
        <Button type="submit" busy={pending} busyLabel="Saving…">
          {user ? 'Save changes' : 'Create user'}
        </Button>
      </div>
    </form>
  );
}

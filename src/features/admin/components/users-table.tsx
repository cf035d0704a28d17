import { useMemo, useState } from 'react';
import { createColumnHelper } from '@tanstack/react-table';
import type { UserView } from '../../../../shared/schemas/user';
import { ROLE_LABELS, type Role } from '../../../../shared/roles';
import { DataTable } from '../../../components/ui/data-table';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { useListParams } from '../../../hooks/use-list-params';
import { CsvExportLink } from '../../../components/ui/export-links';
import { useCreateUser, useUnlockUser, useUpdateUser, useUsers } from '../api/users';
import { UserForm, type UserFormValues } from './user-form';

const column = createColumnHelper<UserView>();

/** The end of a temporary sign-in lock, in the reader's local time. */
const lockEnd = (iso: string) => new Date(iso).toLocaleTimeString(undefined, { hour: '2-digit', minute: '2-digit' });

type Pending = { kind: 'create' } | { kind: 'edit'; user: UserView } | { kind: 'deactivate'; user: UserView } | { kind: 'unlock'; user: UserView } | null;

export function UsersTable() {
  const list = useListParams({ sort: 'displayName' });
  const users = useUsers(list.query);
  const createUser = useCreateUser();
  const updateUser = useUpdateUser();
  const unlockUser = useUnlockUser();
  const [pending, setPending] = useState<Pending>(null);

  const close = () => {
    setPending(null);
    createUser.reset();
    updateUser.reset();
    unlockUser.reset();
  };

  const columns = useMemo(
    () => [
      column.accessor('displayName', { header: 'Name' }),
      column.accessor('email', { header: 'E-mail' }),
      column.accessor('roles', {
        header: 'Roles',
        enableSorting: false,
        cell: (info) => info.getValue().map((role) => ROLE_LABELS[role as Role]).join(', '),
      }),
      column.accessor('areaName', { header: 'Area', enableSorting: false, cell: (info) => info.getValue() ?? '—' }),
      column.display({
        id: 'status',
        header: 'Status',
        cell: ({ row }) => (
          <div className="flex flex-col">
            {row.original.active ? <span className="text-pass">Active</span> : <span className="text-ink-soft">Deactivated</span>}
            {row.original.locked && row.original.lockedUntil && (
              <span className="text-xs font-bold text-fail">Sign-in paused until {lockEnd(row.original.lockedUntil)} after failed passwords</span>
            )}
            {row.original.passwordChangeRequired && <span className="text-xs text-ink-soft">Chooses a new password at next sign-in</span>}
          </div>
        ),
      }),
      column.display({
        id: 'actions',
        header: () => <span className="sr-only">Actions</span>,
        cell: ({ row }) => (
          <div className="flex justify-end gap-1">
            <Button variant="ghost" onClick={() => setPending({ kind: 'edit', user: row.original })} aria-label={`Edit ${row.original.displayName}`}>
              Edit
            </Button>
            {row.original.locked && (
              <Button variant="ghost" onClick={() => setPending({ kind: 'unlock', user: row.original })}>
                Unlock
              </Button>
            )}
            {row.original.active && (
              <Button variant="ghost" onClick={() => setPending({ kind: 'deactivate', user: row.original })}>
                Deactivate
              </Button>
            )}
            {!row.original.active && (
              <Button
                variant="ghost"
                onClick={() => updateUser.mutate({ id: row.original.id, version: row.original.version, active: true })}
              >
                Reactivate
              </Button>
            )}
          </div>
        ),
      }),
    ],
    [updateUser],
  );

  const submitCreate = (values: UserFormValues) =>
    createUser.mutate(
      { email: values.email, displayName: values.displayName, password: values.password, roles: values.roles, areaId: values.areaId },
      { onSuccess: close },
    );

  const submitEdit = (user: UserView) => (values: UserFormValues) =>
    updateUser.mutate(
      {
        id: user.id,
        version: user.version,
        displayName: values.displayName,
        roles: values.roles,
        areaId: values.areaId,
        mailDigest: values.mailDigest,
        ...(values.password ? { password: values.password } : {}),
      },
      { onSuccess: close },
    );

  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end justify-between gap-2">
        <label className="flex flex-col gap-1 text-sm font-bold">
          Search people
          <input
            type="search"
            className="w-72 rounded-md border border-ink/25 bg-white px-2.5 py-1.5 font-normal"
            placeholder="Name or e-mail"
            defaultValue={list.q}
            onChange={(event) => list.update({ q: event.target.value })}
          />
        </label>
        <div className="flex gap-2">
          <CsvExportLink path="/users.csv" query={list.query} />
          <Button onClick={() => setPending({ kind: 'create' })}>Add a person</Button>
        </div>
      </div>
      <DataTable
        caption="People who can sign in to Whorl"
        columns={columns}
        data={users.data?.items}
        total={users.data?.total ?? 0}
        page={list.page}
        pageSize={list.pageSize}
        sort={list.sort}
        onSortChange={(sort) => list.update({ sort })}
        onPageChange={(page) => list.update({ page }, { resetPage: false })}
        isLoading={users.isLoading}
        isRefreshing={users.isPlaceholderData}
        error={users.error}
        emptyTitle="No one matches this search"
        getRowId={(row) => String(row.id)}
      />
      <Dialog open={pending?.kind === 'create'} title="Add a person" onClose={close}>
        <UserForm pending={createUser.isPending} error={createUser.error} onSubmit={submitCreate} onCancel={close} />
      </Dialog>
      {pending?.kind === 'edit' && (
        <Dialog open title={`Edit ${pending.user.displayName}`} onClose={close}>
          <UserForm user={pending.user} pending={updateUser.isPending} error={updateUser.error} onSubmit={submitEdit(pending.user)} onCancel={close} />
        </Dialog>
      )}
      {pending?.kind === 'deactivate' && (
        <ConfirmDialog
          open
          title={`Deactivate ${pending.user.displayName}?`}
          confirmLabel="Deactivate"
          danger
          pending={updateUser.isPending}
          error={updateUser.error}
          onCancel={close}
          onConfirm={() => updateUser.mutate({ id: pending.user.id, version: pending.user.version, active: false }, { onSuccess: close })}
        >
          They are signed out at once and cannot sign in again until reactivated. Their records, signatures and trail entries stay as they
          are: people are never deleted.
        </ConfirmDialog>
      )}
      {pending?.kind === 'unlock' && (
        <ConfirmDialog
          open
          title={`Unlock ${pending.user.displayName}?`}
          confirmLabel="Unlock"
          pending={unlockUser.isPending}
          error={unlockUser.error}
          onCancel={close}
          onConfirm={() => unlockUser.mutate(pending.user.id, { onSuccess: close })}
        >
          Sign-in to this account is paused for a few minutes after repeated failed passwords; the pause ends by itself. Unlock it now only once
          you know the person, not someone else, was trying to sign in.
        </ConfirmDialog>
      )}
    </div>
  );
}

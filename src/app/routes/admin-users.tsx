import { PageHeader } from '../../components/ui/states';
import { RoleGate } from '../../components/ui/not-for-role';
import { useAbility } from '../../lib/ability';
import { UsersTable } from '../../features/admin/components/users-table';

export function Component() {
  const ability = useAbility();
  return (
    <RoleGate allowed={ability.can('create', 'User')} title="People" who="Only an administrator adds, edits and deactivates people.">
      <div>
        <PageHeader title="People" />
        <UsersTable />
      </div>
    </RoleGate>
  );
}

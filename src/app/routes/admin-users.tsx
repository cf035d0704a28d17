import { PageHeader } from '../../components/ui/states';
import { UsersTable } from '../../features/admin/components/users-table';

export function Component() {
  return (
    <div>
      <PageHeader title="People" />
      <UsersTable />
    </div>
  );
}

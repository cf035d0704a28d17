import { PageHeader } from '../../components/ui/states';
import { ActionsTable } from '../../features/workflow/components/workflow-tables';

export function Component() {
  return (
    <div>
      <PageHeader title="Corrective actions" />
      <ActionsTable />
    </div>
  );
}

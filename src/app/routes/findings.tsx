import { PageHeader } from '../../components/ui/states';
import { FindingsTable } from '../../features/workflow/components/workflow-tables';

export function Component() {
  return (
    <div>
      <PageHeader title="Findings" />
      <FindingsTable />
    </div>
  );
}

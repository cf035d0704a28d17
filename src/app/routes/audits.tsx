import { useState } from 'react';
import { PageHeader } from '../../components/ui/states';
import { Button } from '../../components/ui/button';
import { Dialog } from '../../components/ui/dialog';
import { useAbility } from '../../lib/ability';
import { useSession } from '../../features/auth/api/session';
import { AuditsTable } from '../../features/workflow/components/workflow-tables';
import { PlanAuditForm } from '../../features/workflow/components/plan-audit-form';

export function Component() {
  const ability = useAbility();
  const { data: session } = useSession();
  const [planning, setPlanning] = useState(false);
  const user = session?.user;
  return (
    <div>
      <PageHeader title="Audits">
        {user && ability.can('create', 'Audit') && <Button onClick={() => setPlanning(true)}>Plan an audit</Button>}
      </PageHeader>
      <AuditsTable />
      {planning && user && (
        <Dialog open title="Plan an audit" onClose={() => setPlanning(false)}>
          <PlanAuditForm leadAuditorId={user.id} leadAreaId={user.areaId} onCancel={() => setPlanning(false)} />
        </Dialog>
      )}
    </div>
  );
}

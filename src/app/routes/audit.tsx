import { useParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { AuditPage } from '../../features/workflow/components/audit-page';
import { workflowKeys } from '../../features/workflow/api/workflow';
import { EvidencePanel } from '../../features/evidence/components/evidence-panel';

export function Component() {
  const { id } = useParams();
  const queryClient = useQueryClient();
  return (
    <AuditPage
      key={id}
      id={Number(id)}
      evidence={(audit) => (
        <EvidencePanel
          recordType="audit"
          recordId={audit.id}
          recordOwnerId={audit.leadAuditor?.id ?? null}
          onChange={() => void queryClient.invalidateQueries({ queryKey: workflowKeys.all })}
        />
      )}
    />
  );
}

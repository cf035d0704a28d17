import { useParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { FindingPage } from '../../features/workflow/components/finding-page';
import { workflowKeys } from '../../features/workflow/api/workflow';
import { EvidencePanel } from '../../features/evidence/components/evidence-panel';

export function Component() {
  const { id } = useParams();
  const queryClient = useQueryClient();
  return (
    <FindingPage
      key={id}
      id={Number(id)}
      evidence={(finding) => (
        <EvidencePanel
          recordType="finding"
          recordId={finding.id}
          recordOwnerId={finding.author?.id ?? null}
          onChange={() => void queryClient.invalidateQueries({ queryKey: workflowKeys.all })}
        />
      )}
    />
  );
}

import { useParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { ActionPage } from '../../features/workflow/components/action-page';
import { workflowKeys } from '../../features/workflow/api/workflow';
import { EvidencePanel } from '../../features/evidence/components/evidence-panel';

export function Component() {
  const { id } = useParams();
  const queryClient = useQueryClient();
  return (
    <ActionPage
      key={id}
      id={Number(id)}
      evidence={(action) => (
        <EvidencePanel
          recordType="action"
          recordId={action.id}
          recordOwnerId={action.owner?.id ?? null}
          // The action's evidence count (and whether it may be submitted) changes with the files.
          onChange={() => void queryClient.invalidateQueries({ queryKey: workflowKeys.all })}
        />
      )}
    />
  );
}

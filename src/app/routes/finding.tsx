import { useParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { FindingPage } from '../../features/workflow/components/finding-page';
import { workflowKeys } from '../../features/workflow/api/workflow';
import { EvidencePanel } from '../../features/evidence/components/evidence-panel';
import { ExtentPanel } from '../../features/impact/components/extent-panel';
import { ImpactWorksheet } from '../../features/impact/components/impact-worksheet';

export function Component() {
  const { id } = useParams();
  const queryClient = useQueryClient();
  // Evidence, decisions and linked findings change what the finding allows next: refresh it.
  const refreshWorkflow = () => void queryClient.invalidateQueries({ queryKey: workflowKeys.all });
  return (
    <FindingPage
      key={id}
      id={Number(id)}
      evidence={(finding) => (
        <EvidencePanel recordType="finding" recordId={finding.id} recordOwnerId={finding.author?.id ?? null} onChange={refreshWorkflow} />
      )}
      sections={(finding) => (
        <>
          <ExtentPanel finding={finding} onChange={refreshWorkflow} />
          <ImpactWorksheet finding={finding} onChange={refreshWorkflow} />
        </>
      )}
    />
  );
}

import { useParams } from 'react-router-dom';
import { ActionPage } from '../../features/workflow/components/action-page';

// The evidence panel (upload, list) mounts through ActionPage's `evidence` prop once the evidence feature provides one.
export function Component() {
  const { id } = useParams();
  return <ActionPage key={id} id={Number(id)} />;
}

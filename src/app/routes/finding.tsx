import { useParams } from 'react-router-dom';
import { FindingPage } from '../../features/workflow/components/finding-page';

// The evidence panel mounts through FindingPage's `evidence` prop once the evidence feature provides one.
export function Component() {
  const { id } = useParams();
  return <FindingPage key={id} id={Number(id)} />;
}

import { useParams } from 'react-router-dom';
import { AuditPage } from '../../features/workflow/components/audit-page';

export function Component() {
  const { id } = useParams();
  return <AuditPage key={id} id={Number(id)} />;
}

import { Link } from 'react-router-dom';
import { EmptyState } from '../../components/ui/states';

export function Component() {
  return (
    <EmptyState title="There is no page at this address">
      <Link to="/" className="font-bold text-lagoon underline">
        Back to what is waiting on you
      </Link>
    </EmptyState>
  );
}

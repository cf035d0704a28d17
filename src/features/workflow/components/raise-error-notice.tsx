// Why a finding was not raised. When an open finding already names the same
// check, say which one and link to it: that is where the new evidence belongs.
import { Link } from 'react-router-dom';
import { ApiError } from '../../../lib/api-client';
import { ErrorNotice } from '../../../components/ui/states';

interface DuplicateDetails {
  findingId: number;
  number: string;
}

function duplicateOf(error: unknown): DuplicateDetails | null {
  if (!(error instanceof ApiError) || error.code !== 'duplicate_finding') return null;
  const details = error.details as Partial<DuplicateDetails> | undefined;
  return typeof details?.findingId === 'number' && typeof details.number === 'string' ? { findingId: details.findingId, number: details.number } : null;
}

export function RaiseErrorNotice({ error }: { error: unknown }) {
  const duplicate = duplicateOf(error);
  if (!duplicate) return <ErrorNotice error={error} title="The finding was not raised" />;
  return (
    <div role="alert" className="mt-3 rounded border border-warn/60 bg-warn/10 p-3 text-sm">
      <p className="font-bold">This check already has an open finding</p>
      <p className="mt-1">
        {(error as ApiError).message}{' '}
        <Link className="font-bold underline" to={`/findings/${duplicate.findingId}`}>
          Open {duplicate.number}
        </Link>
      </p>
    </div>
  );
}

import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { EmptyState, PageHeader } from './states';

/**
 * A page opened by address by someone whose role may not use it: said at once,
 * instead of showing controls that the server refuses only on save.
 */
export function RoleGate({ allowed, title, who, children }: { allowed: boolean; title: string; who: string; children: ReactNode }) {
  if (allowed) return <>{children}</>;
  return (
    <div>
      <PageHeader title={title} />
      <EmptyState title="This page is not available to your role">
        <p className="mb-2">{who}</p>
        <Link to="/" className="font-bold text-lagoon underline">
          Back to what is waiting on you
        </Link>
      </EmptyState>
    </div>
  );
}

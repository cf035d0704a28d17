import { Link } from 'react-router-dom';
import { EmptyState, ErrorNotice, Loading } from '../../../components/ui/states';
import { useHome } from '../api/workflow';
import { StateBadge } from './state-badge';

const PATHS = { audit: 'audits', finding: 'findings', action: 'actions' } as const;

/** What this person must act on now, overdue first, then by due date. */
export function WaitingOnYou() {
  const home = useHome();
  if (home.isLoading) return <Loading what="Finding what waits on you" />;
  if (home.error) return <ErrorNotice error={home.error} title="Your list could not be loaded" />;
  const items = home.data?.items ?? [];
  if (!items.length) return <EmptyState title="Nothing waits on you right now">New work shows here as soon as it is yours.</EmptyState>;
  return (
    <ul className="flex flex-col divide-y divide-ink/5 overflow-hidden rounded-lg border border-ink/10 bg-white" aria-label="Waiting on you">
      {items.map((item) => (
        <li key={`${item.recordType}-${item.id}`} className={`flex flex-wrap items-center gap-3 px-4 py-3 ${item.overdue ? 'border-l-4 border-fail' : ''}`}>
          <div className="min-w-0 flex-1">
            <p className="font-bold">{item.todo}</p>
            <p className="truncate text-sm text-ink-soft">
              <Link to={`/${PATHS[item.recordType]}/${item.id}`} className="font-bold text-lagoon underline">
                {item.label}
              </Link>{' '}
              {item.title}
            </p>
          </div>
          <StateBadge state={item.state} />
          <p className={`w-36 text-right text-sm ${item.overdue ? 'font-bold text-fail' : 'text-ink-soft'}`}>
            {item.dueDate ? (item.overdue ? `Overdue since ${item.dueDate}` : `Due ${item.dueDate}`) : 'No due date'}
          </p>
        </li>
      ))}
    </ul>
  );
}

import { Link } from 'react-router-dom';
import { useSession } from '../../features/auth/api/session';
import { PageHeader } from '../../components/ui/states';
import { ROLE_LABELS, type Role } from '../../../shared/roles';

const ROLE_WORK: Record<Role, { text: string; to: string; link: string }> = {
  auditor: { text: 'Plan and perform audits, run the technique checklist, raise findings, check effectiveness.', to: '/audits', link: 'Your audits' },
  quality_manager: { text: 'Review and classify findings, assign corrective actions, approve plans, issue audit reports.', to: '/findings', link: 'Findings to review' },
  accountable_manager: { text: 'Close findings with your electronic signature once their effectiveness is confirmed.', to: '/findings', link: 'Findings awaiting signature' },
  level3: { text: 'Write and approve techniques; investigate and act on corrective actions you own.', to: '/techniques', link: 'Techniques' },
  technician: { text: 'Carry out the corrective actions assigned to you and upload the evidence.', to: '/actions', link: 'Your actions' },
  admin: { text: 'Manage people, areas and policy settings; check the trail.', to: '/admin/users', link: 'People' },
};

export function Component() {
  const { data } = useSession();
  if (!data) return null;
  const { user } = data;
  return (
    <div>
      <PageHeader title={`Good to see you, ${user.displayName.split(' ')[0]}`} />
      <p className="mb-4 text-sm text-ink-soft">
        Signed in as {user.roles.map((role) => ROLE_LABELS[role]).join(', ')}
        {user.areaName ? ` · ${user.areaName}` : ''}
      </p>
      <section aria-labelledby="your-work" className="grid gap-4 md:grid-cols-2">
        <h2 id="your-work" className="sr-only">
          Your work
        </h2>
        {user.roles.map((role) => (
          <article key={role} className="rounded-lg border border-ink/10 bg-white p-4 shadow-sm">
            <h3 className="font-bold text-ink">{ROLE_LABELS[role]}</h3>
            <p className="mt-1 text-sm text-ink-soft">{ROLE_WORK[role].text}</p>
            <Link to={ROLE_WORK[role].to} className="mt-3 inline-block text-sm font-bold text-lagoon underline">
              {ROLE_WORK[role].link}
            </Link>
          </article>
        ))}
      </section>
    </div>
  );
}

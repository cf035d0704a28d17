import { useSession } from '../../features/auth/api/session';
import { PageHeader } from '../../components/ui/states';
import { ROLE_LABELS } from '../../../shared/roles';
import { WaitingOnYou } from '../../features/workflow/components/waiting-on-you';

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
      <h2 className="mb-2 text-lg font-bold">Waiting on you</h2>
      <WaitingOnYou />
    </div>
  );
}

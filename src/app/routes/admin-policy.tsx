import { Caution } from '../../components/ui/caution';
import { ErrorNotice, Loading, PageHeader } from '../../components/ui/states';
import { useAbility } from '../../lib/ability';
import { usePolicy } from '../../features/policy/api/policy';
import { PolicySettings } from '../../features/policy/components/policy-settings';

export function Component() {
  const ability = useAbility();
  const policy = usePolicy();
  const canEdit = ability.can('update', 'Policy');
  return (
    <div className="flex flex-col gap-4">
      <PageHeader title="Policy settings" />
      <p className="-mt-3 text-sm text-ink-soft">
        The thresholds the checklist and the workflows use. Each has a default with its basis; the organisation may set its own value, for
        example to follow a customer specification. {canEdit ? '' : 'Only an administrator changes them.'}
      </p>
      <div className="rounded-lg border border-copper/40 bg-copper-soft/30 p-3">
        <Caution />
      </div>
      {policy.isLoading && <Loading what="Loading the policy" />}
      {policy.error ? <ErrorNotice error={policy.error} title="The policy could not be loaded" /> : null}
      {policy.data && <PolicySettings view={policy.data} canEdit={canEdit} />}
    </div>
  );
}

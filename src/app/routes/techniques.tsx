import { Link } from 'react-router-dom';
import { PageHeader } from '../../components/ui/states';
import { Caution } from '../../components/ui/caution';
import { useAbility } from '../../lib/ability';
import { TechniquesTable } from '../../features/techniques/components/techniques-table';

export function Component() {
  const ability = useAbility();
  return (
    <div className="flex flex-col gap-4">
      <PageHeader title="Techniques">
        <Link to="/materials" className="rounded-md border border-ink/20 bg-white px-3 py-1.5 text-sm font-bold text-ink hover:border-ink/50">
          Materials library
        </Link>
        {ability.can('create', 'Technique') && (
          <Link to="/techniques/new" className="rounded-md bg-ink px-3 py-1.5 text-sm font-bold text-white hover:bg-lagoon">
            New technique
          </Link>
        )}
      </PageHeader>
      <p className="-mt-3 text-sm text-ink-soft">
        The register of written eddy current techniques. Each row shows its latest revision and what the checklist computes for it under the
        organisation's policy.
      </p>
      <TechniquesTable />
      <div className="rounded-lg border border-copper/40 bg-copper-soft/30 p-3">
        <Caution />
      </div>
    </div>
  );
}

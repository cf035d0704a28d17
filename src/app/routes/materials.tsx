import { Link } from 'react-router-dom';
import { PageHeader } from '../../components/ui/states';
import { useAbility } from '../../lib/ability';
import { MaterialsLibrary } from '../../features/techniques/components/materials-library';

export function Component() {
  const ability = useAbility();
  return (
    <div className="flex flex-col gap-4">
      <p className="text-sm">
        <Link to="/techniques" className="font-bold text-lagoon underline-offset-2 hover:underline">
          ← Techniques
        </Link>
      </p>
      <PageHeader title="Materials library" />
      <p className="-mt-3 text-sm text-ink-soft">
        Nominal values for the technique editor. A technique should state the conductivity measured on the part or its reference standard
        where it matters.
      </p>
      <MaterialsLibrary canEdit={ability.can('update', 'Material')} />
    </div>
  );
}

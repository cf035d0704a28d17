import { Link, useNavigate } from 'react-router-dom';
import type { TechniqueView } from '../../../shared/schemas/technique-register';
import type { TechniqueInput } from '../../../shared/schemas/technique';
import { EmptyState } from '../../components/ui/states';
import { useAbility } from '../../lib/ability';
import { useCreateTechnique } from '../../features/techniques/api/techniques';
import { TechniqueEditor } from '../../features/techniques/components/technique-editor';

// A starting point, not a technique: the checklist lists what is still missing.
const TEMPLATE = {
  code: '',
  title: '',
  revision: 'A',
  material: { name: '', conductivityIacs: undefined, relativePermeability: 1, saturated: false },
  part: { form: 'plate', thicknessMm: undefined },
  coils: [{ type: 'surface', diameterMm: 5, shielded: true, mode: 'absolute', frequenciesHz: [100_000] }],
  scan: { edgeGuide: false },
  flaws: [{ id: 'crack-1', orientation: 'transverse', location: 'surface', depthMm: 0.5, lengthMm: 2 }],
  reference: { conductivityIacs: undefined, notches: [] },
} as unknown as TechniqueInput;

export function Component() {
  const ability = useAbility();
  const navigate = useNavigate();
  const create = useCreateTechnique();
  if (!ability.can('create', 'Technique')) {
    return (
      <EmptyState title="Only an ET Level 3 writes techniques">
        <Link to="/techniques" className="font-bold text-lagoon underline">
          Back to the register
        </Link>
      </EmptyState>
    );
  }
  return (
    <TechniqueEditor
      mode="create"
      initial={TEMPLATE}
      initialAreaId={null}
      heading={
        <div>
          <p className="text-sm">
            <Link to="/techniques" className="font-bold text-lagoon underline-offset-2 hover:underline">
              ← Techniques
            </Link>
          </p>
          <h1 className="text-2xl font-bold text-ink">New technique</h1>
          <p className="text-sm text-ink-soft">Fill in the form or import a technique file; it is saved as a draft revision.</p>
        </div>
      }
      saving={create.isPending}
      saveError={create.error}
      onSave={(technique, areaId) => create.mutateAsync({ technique, areaId })}
      onSaved={(result) => navigate(`/techniques/${(result as TechniqueView).id}/edit`, { replace: true })}
    />
  );
}

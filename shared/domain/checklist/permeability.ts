// The relative permeability the field models use. Placeholder until the ferromagnetic
// rules supply the incremental permeability of a saturated part: the material's own μr.
import type { Policy } from '../policy';
import type { Technique } from '../../schemas/technique';

export function fieldRelativePermeability(technique: Technique, _policy: Policy): number {
  return technique.material.relativePermeability;
}

// The relative permeability every field calculation of the engine uses (δ, f_g,
// the working window, the coil field models).
import type { Policy } from '../policy';
import type { Technique } from '../../schemas/technique';

/** The μr the field calculations use: the material's own μr. */
export function fieldRelativePermeability(technique: Technique, policy: Policy): number {
  void policy;
  return technique.material.relativePermeability;
}

// The relative permeability every field calculation of the engine uses (δ, f_g,
// the working window, the coil field models), and the words that explain it.
// A material below the policy's ferromagnetic threshold keeps its own μr (it is
// near 1 and does not vary); a saturated ferromagnetic material is seen through its
// incremental permeability, not its static μr (docs/domain-rules.md, "Ferromagnetic
// material").
import type { Policy } from '../policy';
import type { Technique } from '../../schemas/technique';

/** True when the material's μr reaches the policy's ferromagnetic threshold. */
export function isFerromagnetic(technique: Technique, policy: Policy): boolean {
  return technique.material.relativePermeability >= policy.ferromagneticPermeabilityMin;
}

export type PermeabilitySource = 'material' | 'incremental-entered' | 'incremental-policy';

export interface FieldPermeability {
  relativePermeability: number;
  source: PermeabilitySource;
}

/** The μr the field calculations use, and where it comes from. */
export function fieldPermeability(technique: Technique, policy: Policy): FieldPermeability {
  const { material } = technique;
  const staticMu = material.relativePermeability;
  if (!material.saturated || !isFerromagnetic(technique, policy)) return { relativePermeability: staticMu, source: 'material' };
  if (material.incrementalPermeability !== undefined) {
    return { relativePermeability: Math.min(material.incrementalPermeability, staticMu), source: 'incremental-entered' };
  }
  return { relativePermeability: Math.min(policy.saturatedIncrementalPermeability, staticMu), source: 'incremental-policy' };
}

/** The μr every field calculation must use: δ, f_g, the working window and the coil field models. */
export function fieldRelativePermeability(technique: Technique, policy: Policy): number {
  return fieldPermeability(technique, policy).relativePermeability;
}

/** μr as text: enough digits that 1.00005 never reads as "1". */
export function permeabilityText(mu: number): string {
  if (mu === 1) return '1';
  if (mu < 1.01) return String(Number(mu.toPrecision(7)));
  return String(Number(mu.toPrecision(3)));
}

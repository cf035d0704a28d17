// Rule 6: in ferromagnetic material permeability variations swamp flaw signals and
// shrink the depth of penetration, unless the material is magnetically saturated.
// Below the policy's threshold (titanium, austenitic stainless) a material is not
// ferromagnetic in any eddy current sense; a saturated material is seen through its
// incremental permeability, which every depth and limit frequency then uses.
import { sig } from '../format';
import { fieldPermeability, isFerromagnetic, permeabilityText } from '../permeability';
import type { Rule } from '../types';

const BASIS =
  '[pub] ASTM E309 (eddy current examination of steel tubular products using magnetic saturation); [trade] ferromagnetic from policy ferromagneticPermeabilityMin (default μr 1.05); [mem] incremental μr under saturation, policy saturatedIncrementalPermeability (default 2) when the technique gives none';

export const ferromagnetic: Rule = ({ technique, policy }, results) => {
  const { material } = technique;
  const mu = material.relativePermeability;
  const muText = permeabilityText(mu);
  const threshold = policy.ferromagneticPermeabilityMin;
  const justification = material.ferromagneticJustification?.trim();
  const field = fieldPermeability(technique, policy);
  const values = {
    relativePermeability: mu,
    ferromagneticPermeabilityMin: threshold,
    fieldRelativePermeability: field.relativePermeability,
    saturated: material.saturated,
    justified: Boolean(justification),
  };

  if (!isFerromagnetic(technique, policy)) {
    const saturationNote = material.saturated ? ' Magnetic saturation is not needed for it.' : '';
    results.push({
      rule: 'ferromagnetic',
      status: mu === 1 ? 'not_applicable' : 'pass',
      message:
        mu === 1
          ? `${material.name} is non-magnetic (μr = 1).${saturationNote}`
          : `${material.name} (μr = ${muText}) is below the ferromagnetic threshold of μr ${permeabilityText(threshold)}: its permeability neither varies enough to give signals nor changes the depth of penetration measurably.${saturationNote}`,
      values,
      basis: BASIS,
    });
    return;
  }

  if (material.saturated) {
    const incremental = permeabilityText(field.relativePermeability);
    const where =
      field.source === 'incremental-entered'
        ? `the incremental permeability the technique gives, μr = ${incremental}`
        : `the policy's incremental permeability under saturation, μr = ${incremental}, because the technique gives none (enter the value measured or stated for this material and saturating field)`;
    results.push({
      rule: 'ferromagnetic',
      status: 'pass',
      message:
        `${material.name} is ferromagnetic (static μr = ${muText}) and the technique uses magnetic saturation, which suppresses permeability variations. ` +
        `Depths of penetration, the limit frequency and the working window use ${where}.`,
      values,
      basis: BASIS,
    });
    return;
  }

  if (justification) {
    results.push({
      rule: 'ferromagnetic',
      status: 'warn',
      message: `${material.name} is ferromagnetic (μr = ${muText}, at or above the threshold of ${permeabilityText(threshold)}) without magnetic saturation; the technique records a justification for a Level 3 to review: "${justification}".`,
      values,
      basis: BASIS,
    });
    return;
  }
  results.push({
    rule: 'ferromagnetic',
    status: 'fail',
    message:
      `${material.name} is ferromagnetic (μr = ${muText}, at or above the threshold of ${permeabilityText(threshold)}) and the technique neither saturates it nor records a justification. ` +
      `Permeability variations give signals larger than flaws, and at μr = ${sig(mu)} the depth of penetration is ${sig(Math.sqrt(mu))} times smaller than in a non-magnetic metal of the same conductivity. ` +
      'Use magnetic saturation (and give the incremental permeability under it), or record why the technique is valid without it.',
    values,
    basis: BASIS,
  });
};

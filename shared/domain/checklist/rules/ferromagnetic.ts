// Rule 6: in ferromagnetic material permeability variations swamp flaw signals and
// shrink the depth of penetration, unless the material is magnetically saturated.
import { sig } from '../format';
import type { Rule } from '../types';

const BASIS = '[pub] ASTM E309 (eddy current examination of steel tubular products using magnetic saturation)';

export const ferromagnetic: Rule = ({ technique }, results) => {
  const { material } = technique;
  const mu = material.relativePermeability;
  const justification = material.ferromagneticJustification?.trim();
  const values = { relativePermeability: mu, saturated: material.saturated, justified: Boolean(justification) };
  if (mu <= 1) {
    results.push({
      rule: 'ferromagnetic',
      status: 'not_applicable',
      message: `${material.name} is not ferromagnetic (μr = ${sig(mu)}).`,
      values,
      basis: BASIS,
    });
    return;
  }
  if (material.saturated) {
    results.push({
      rule: 'ferromagnetic',
      status: 'pass',
      message:
        `${material.name} is ferromagnetic (μr = ${sig(mu)}) and the technique uses magnetic saturation, which suppresses permeability variations. ` +
        'Depths here use the μr entered; enter the incremental permeability under saturation for realistic depths.',
      values,
      basis: BASIS,
    });
    return;
  }
  if (justification) {
    results.push({
      rule: 'ferromagnetic',
      status: 'warn',
      message: `${material.name} is ferromagnetic (μr = ${sig(mu)}) without magnetic saturation; the technique records a justification for a Level 3 to review: "${justification}".`,
      values,
      basis: BASIS,
    });
    return;
  }
  results.push({
    rule: 'ferromagnetic',
    status: 'fail',
    message:
      `${material.name} is ferromagnetic (μr = ${sig(mu)}) and the technique neither saturates it nor records a justification. ` +
      'Permeability variations give signals larger than flaws and shrink the depth of penetration. Use magnetic saturation, or record why the technique is valid without it.',
    values,
    basis: BASIS,
  });
};

// Rule 5 (first part): the fill factor of encircling and internal coils. A loose
// coil couples less of its field into the part and loses sensitivity.
import { ceilSig, floorSig, mm, sig } from '../format';
import { insideDiameterMm } from '../../../schemas/technique';
import type { Rule } from '../types';

const BASIS =
  '[pub] fill factor η = (d_part/D_coil)² encircling, (D_coil/ID)² internal; [trade] minimum policy fillFactorMinEncircling (default 0.7) / fillFactorMinInternal (default 0.8)';

export const fillFactor: Rule = ({ technique, policy, values, coilNames }, results) => {
  const { coils, part } = technique;
  let any = false;
  coils.forEach((coil, c) => {
    const eta = values.fillFactor[c];
    if (eta === null) return;
    any = true;
    const internal = coil.type === 'bobbin';
    const minimum = internal ? policy.fillFactorMinInternal : policy.fillFactorMinEncircling;
    const resultValues = { fillFactor: eta, fillFactorMin: minimum };
    if (eta >= minimum - 1e-9) {
      results.push({
        rule: 'fill-factor',
        status: 'pass',
        coil: c,
        message: `Fill factor of ${coilNames[c]} is ${sig(eta)} (minimum ${sig(minimum)} for ${internal ? 'an internal' : 'an encircling'} coil).`,
        values: resultValues,
        basis: BASIS,
      });
      return;
    }
    const fix = internal
      ? `use a bobbin coil of at least ${mm(ceilSig(Math.sqrt(minimum) * (insideDiameterMm(part) ?? 0)))} diameter`
      : `use an encircling coil of at most ${mm(floorSig((part.diameterMm ?? 0) / Math.sqrt(minimum)))} inside diameter`;
    results.push({
      rule: 'fill-factor',
      status: 'fail',
      coil: c,
      message:
        `Fill factor of ${coilNames[c]} is ${sig(eta)}, below the minimum ${sig(minimum)}: a loose coil couples less of its field into the part, ` +
        `so flaw signals shrink against noise from wobble. To fix: ${fix}.`,
      values: resultValues,
      basis: BASIS,
    });
  });
  if (!any) {
    results.push({
      rule: 'fill-factor',
      status: 'not_applicable',
      message: 'No encircling or bobbin coil: fill factor applies only to coils that go round or inside the part.',
      values: {},
      basis: BASIS,
    });
  }
};

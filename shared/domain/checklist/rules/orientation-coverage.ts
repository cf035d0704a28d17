// Rule 1: a flaw is found when the induced current crosses it. Every flaw must be
// crossed by the current of at least one coil, at or above the policy's sensitivity.
import { COIL_CURRENT_WORDS } from '../../orientation';
import { sig } from '../format';
import type { Rule } from '../types';

const BASIS =
  '[pub] eddy currents find a flaw they cross and miss one lying along the current or parallel to the surface; sensitivity threshold: policy orientationSensitivityMin (Whorl product default 0.5)';
const EPSILON = 1e-9;

export const orientationCoverage: Rule = ({ technique, policy, values, coilNames }, results) => {
  const threshold = policy.orientationSensitivityMin;
  technique.flaws.forEach((flaw, flawIndex) => {
    const sensitivities = values.orientationSensitivity[flawIndex];
    let bestCoil = 0;
    for (let c = 1; c < sensitivities.length; c++) if (sensitivities[c] > sensitivities[bestCoil]) bestCoil = c;
    const best = sensitivities[bestCoil];
    const described = flaw.angleDeg === undefined ? flaw.orientation : `${flaw.orientation}, ${sig(flaw.angleDeg)}° to the axis`;
    const resultValues = { sensitivity: best, sensitivityMin: threshold, bestCoil: bestCoil };

    if (flaw.orientation === 'laminar') {
      results.push({
        rule: 'orientation-coverage',
        status: 'fail',
        flaw: flaw.id,
        message:
          `Flaw "${flaw.id}" is laminar: it lies parallel to the surface, and eddy currents, which flow parallel to the surface, never cross it. ` +
          'No coil or frequency can cover it (sensitivity 0 for every coil). Use another method, such as ultrasonic testing, for laminations.',
        values: resultValues,
        basis: BASIS,
      });
      return;
    }

    if (best + EPSILON >= threshold) {
      const coil = technique.coils[bestCoil];
      results.push({
        rule: 'orientation-coverage',
        status: 'pass',
        flaw: flaw.id,
        coil: bestCoil,
        message: `Flaw "${flaw.id}" (${described}) is crossed by the current of ${coilNames[bestCoil]}, which flows ${COIL_CURRENT_WORDS[coil.type]}: sensitivity ${sig(best, 2)} ≥ ${sig(threshold, 2)}.`,
        values: resultValues,
        basis: BASIS,
      });
      return;
    }

    const coilWords = technique.coils.map((coil, c) => `${coilNames[c]} flows ${COIL_CURRENT_WORDS[coil.type]}`);
    results.push({
      rule: 'orientation-coverage',
      status: 'fail',
      flaw: flaw.id,
      coil: bestCoil,
      message:
        `Flaw "${flaw.id}" (${described}) is not covered: the current of ${coilWords.join('; ')}, ` +
        `so it runs along this flaw instead of across it (best sensitivity ${sig(best, 2)} < ${sig(threshold, 2)}). ` +
        'Add a coil whose current crosses it: a rotating, surface or pencil probe (current in every direction parallel to the surface) or a multidirectional array.',
      values: resultValues,
      basis: BASIS,
    });
  });
};

// Rule 2 (short cracks): a crack much shorter than the coil disturbs little of its
// field. Cracks shorter than about half the coil diameter are hard to detect: warn.
import { floorSig, mm, sig } from '../format';
import { isScanningCoil } from '../context';
import type { Rule } from '../types';

const BASIS =
  '[pub] a published military eddy current manual: cracks shorter than about half the coil diameter are hard to detect (policy shortCrackFraction, default 0.5)';

export const coilSize: Rule = ({ technique, policy, values, coilNames }, results) => {
  const { coils, flaws } = technique;
  const scanning = coils.flatMap((coil, c) => (isScanningCoil(coil) ? [c] : []));
  if (scanning.length === 0) {
    results.push({
      rule: 'coil-size',
      status: 'not_applicable',
      message: 'No surface, pencil or rotating coil: the short-crack check applies to coils scanned over a surface.',
      values: {},
      basis: BASIS,
    });
    return;
  }
  const fraction = policy.shortCrackFraction;
  let any = false;
  flaws.forEach((flaw, f) => {
    if (flaw.orientation === 'laminar') return; // no coil finds it (orientation-coverage)
    any = true;
    const crossing = scanning.filter((c) => values.orientationSensitivity[f][c] + 1e-9 >= policy.orientationSensitivityMin);
    const candidates = crossing.length > 0 ? crossing : scanning;
    let smallest = candidates[0];
    for (const c of candidates) if (coils[c].diameterMm < coils[smallest].diameterMm) smallest = c;
    const coil = coils[smallest];
    const shortestMm = fraction * coil.diameterMm;
    const resultValues = { lengthMm: flaw.lengthMm, coilDiameterMm: coil.diameterMm, shortCrackLengthMm: shortestMm, fraction };
    if (flaw.lengthMm >= shortestMm - 1e-9) {
      results.push({
        rule: 'coil-size',
        status: 'pass',
        flaw: flaw.id,
        coil: smallest,
        message: `Flaw "${flaw.id}" (${mm(flaw.lengthMm)} long) is at least ${sig(fraction)} × the diameter of ${coilNames[smallest]} = ${mm(shortestMm)}.`,
        values: resultValues,
        basis: BASIS,
      });
    } else {
      results.push({
        rule: 'coil-size',
        status: 'warn',
        flaw: flaw.id,
        coil: smallest,
        message:
          `Flaw "${flaw.id}" is ${mm(flaw.lengthMm)} long, shorter than ${sig(fraction)} × the diameter of ${coilNames[smallest]} = ${mm(shortestMm)}: ` +
          `it disturbs little of the coil's field and is hard to detect. Consider a coil of at most ${mm(floorSig(flaw.lengthMm / fraction))} diameter, or show detection on a notch of this length.`,
        values: resultValues,
        basis: BASIS,
      });
    }
  });
  if (!any) {
    results.push({
      rule: 'coil-size',
      status: 'not_applicable',
      message: 'Every expected flaw is laminar: no coil finds it at any size (see orientation-coverage).',
      values: {},
      basis: BASIS,
    });
  }
};

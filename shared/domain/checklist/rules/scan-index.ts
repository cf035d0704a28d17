// Rule 2 (second part): a surface coil has no current directly under its centre,
// so the step between passes must let every point pass under the winding.
import { mm, sig } from '../format';
import { isScanningCoil } from '../context';
import type { Rule } from '../types';

const BASIS = '[trade] scan index ≤ policy scanIndexFractionMax × coil diameter (default 0.5), common practice, no single source';

export const scanIndex: Rule = ({ technique, policy, coilNames }, results) => {
  const { coils, scan } = technique;
  const fraction = policy.scanIndexFractionMax;
  let any = false;
  coils.forEach((coil, c) => {
    if (!isScanningCoil(coil)) return;
    any = true;
    const maxIndexMm = fraction * coil.diameterMm;
    const values = { indexMm: scan.indexMm ?? null, maxIndexMm, coilDiameterMm: coil.diameterMm, fraction };
    if (scan.indexMm === undefined) {
      results.push({
        rule: 'scan-index',
        status: 'fail',
        coil: c,
        message:
          `The technique states no scan index for ${coilNames[c]}. A surface coil has no current under its centre, ` +
          `so coverage depends on the step between passes: state an index of at most ${mm(maxIndexMm)} (${sig(fraction)} × coil diameter).`,
        values,
        basis: BASIS,
      });
    } else if (scan.indexMm <= maxIndexMm * (1 + 1e-9)) {
      results.push({
        rule: 'scan-index',
        status: 'pass',
        coil: c,
        message: `Scan index ${mm(scan.indexMm)} is no more than ${sig(fraction)} × the diameter of ${coilNames[c]} = ${mm(maxIndexMm)}: every point passes under the winding.`,
        values,
        basis: BASIS,
      });
    } else {
      results.push({
        rule: 'scan-index',
        status: 'fail',
        coil: c,
        message:
          `Scan index ${mm(scan.indexMm)} exceeds ${sig(fraction)} × the diameter of ${coilNames[c]} = ${mm(maxIndexMm)}. ` +
          'A surface coil has no current directly under its centre, so strips between passes can go unscanned. ' +
          `Reduce the index to at most ${mm(maxIndexMm)}.`,
        values,
        basis: BASIS,
      });
    }
  });
  if (!any) {
    results.push({
      rule: 'scan-index',
      status: 'not_applicable',
      message: 'No surface, pencil or rotating coil is scanned: encircling, bobbin and multidirectional coils cover the circumference or width at once.',
      values: {},
      basis: BASIS,
    });
  }
};

// Rule 7: the reference standard must represent the part (conductivity within
// tolerance) and the flaws (a notch per orientation, no deeper than the flaw).
import { normalAlignment, flawNormal } from '../../orientation';
import { mm, sig } from '../format';
import type { Rule } from '../types';

const CONDUCTIVITY_BASIS = '[trade] reference standard conductivity within policy referenceConductivityTolerancePercent (default ±15 %) of the part';
const NOTCH_BASIS =
  '[trade] a reference notch matching each expected flaw orientation (within policy notchOrientationToleranceDeg, product default 10°), no deeper than the flaw (policy notchDepthRatioMax, default 1)';

export const referenceStandard: Rule = ({ technique, policy, flawNormals }, results) => {
  const { material, reference, flaws } = technique;
  const partIacs = material.conductivityIacs;
  const deviationPercent = ((reference.conductivityIacs - partIacs) / partIacs) * 100;
  const tolerance = policy.referenceConductivityTolerancePercent;
  const lowIacs = partIacs * (1 - tolerance / 100);
  const highIacs = partIacs * (1 + tolerance / 100);
  const conductivityValues = { referenceConductivityIacs: reference.conductivityIacs, partConductivityIacs: partIacs, deviationPercent, tolerancePercent: tolerance };
  if (Math.abs(deviationPercent) <= tolerance + 1e-9) {
    results.push({
      rule: 'reference-standard',
      status: 'pass',
      message: `Reference standard conductivity ${sig(reference.conductivityIacs)} %IACS is within ±${sig(tolerance)} % of the part (${sig(partIacs)} %IACS).`,
      values: conductivityValues,
      basis: CONDUCTIVITY_BASIS,
    });
  } else {
    results.push({
      rule: 'reference-standard',
      status: 'fail',
      message:
        `Reference standard conductivity ${sig(reference.conductivityIacs)} %IACS differs from the part (${sig(partIacs)} %IACS) by ${sig(deviationPercent, 2)} %, beyond ±${sig(tolerance)} %. ` +
        'Conductivity sets the depth of penetration and the phase and amplitude of flaw signals, so calibration on this standard does not represent the part. ' +
        `Use a standard between ${sig(lowIacs)} and ${sig(highIacs)} %IACS.`,
      values: conductivityValues,
      basis: CONDUCTIVITY_BASIS,
    });
  }

  const cosTolerance = Math.cos((policy.notchOrientationToleranceDeg * Math.PI) / 180) - 1e-9;
  const notchNormals = reference.notches.map((notch) => flawNormal(notch.orientation, notch.angleDeg));
  flaws.forEach((flaw, f) => {
    if (flaw.orientation === 'laminar') {
      results.push({
        rule: 'reference-standard',
        status: 'not_applicable',
        flaw: flaw.id,
        message: `Flaw "${flaw.id}" is laminar: eddy currents cannot find it, so no notch can stand for it (see orientation-coverage).`,
        values: { flawDepthMm: flaw.depthMm },
        basis: NOTCH_BASIS,
      });
      return;
    }
    let shallowest = -1;
    for (let n = 0; n < notchNormals.length; n++) {
      if (normalAlignment(flawNormals[f], notchNormals[n]) < cosTolerance) continue;
      if (shallowest < 0 || reference.notches[n].depthMm < reference.notches[shallowest].depthMm) shallowest = n;
    }
    const described = flaw.angleDeg === undefined ? flaw.orientation : `${flaw.orientation} at ${sig(flaw.angleDeg)}°`;
    if (shallowest < 0) {
      results.push({
        rule: 'reference-standard',
        status: 'fail',
        flaw: flaw.id,
        message:
          `The reference standard has no notch matching flaw "${flaw.id}" (${described}). Response to a flaw depends on its orientation to the current, ` +
          `so sensitivity must be set on a notch of the same orientation: add a ${described} notch no deeper than ${mm(flaw.depthMm * policy.notchDepthRatioMax)}.`,
        values: { flawDepthMm: flaw.depthMm, notchDepthMm: null },
        basis: NOTCH_BASIS,
      });
      return;
    }
    const notch = reference.notches[shallowest];
    const maxDepthMm = flaw.depthMm * policy.notchDepthRatioMax;
    const values = { flawDepthMm: flaw.depthMm, notchDepthMm: notch.depthMm, notchDepthMaxMm: maxDepthMm, notch: shallowest };
    if (notch.depthMm <= maxDepthMm * (1 + 1e-9)) {
      results.push({
        rule: 'reference-standard',
        status: 'pass',
        flaw: flaw.id,
        message: `Notch ${shallowest + 1} (${notch.orientation}, ${mm(notch.depthMm)} deep) matches flaw "${flaw.id}" (${described}, ${mm(flaw.depthMm)}) and is no deeper than it.`,
        values,
        basis: NOTCH_BASIS,
      });
    } else {
      results.push({
        rule: 'reference-standard',
        status: 'fail',
        flaw: flaw.id,
        message:
          `The shallowest notch matching flaw "${flaw.id}" (${described}) is ${mm(notch.depthMm)} deep, deeper than the flaw (${mm(flaw.depthMm)}). ` +
          `Calibrating on a larger reflector sets the reject level above the signal of the smallest flaw to be found: add a notch no deeper than ${mm(maxDepthMm)}.`,
        values,
        basis: NOTCH_BASIS,
      });
    }
  });
};

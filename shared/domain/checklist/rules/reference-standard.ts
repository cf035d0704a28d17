// Rule 7: the reference standard must represent the part (conductivity within
// tolerance) and the flaws: a notch of the same orientation at the same location
// (inspected surface, far side, subsurface at the flaw's depth or deeper, centre),
// no deeper than the flaw's own through-wall extent (docs/domain-rules.md,
// "Reference standard").
import { normalAlignment, flawNormal } from '../../orientation';
import { mm, sig } from '../format';
import type { Flaw, FlawLocation, Notch, Part } from '../../../schemas/technique';
import type { Rule } from '../types';

const CONDUCTIVITY_BASIS = '[trade] reference standard conductivity within policy referenceConductivityTolerancePercent (default ±15 %) of the part';
const NOTCH_BASIS =
  "[trade] a reference notch matching each expected flaw's orientation (within policy notchOrientationToleranceDeg, product default 10°) and location, no deeper than the flaw's own through-wall extent (policy notchDepthRatioMax, default 1)";

const LOCATION_WORDS: Readonly<Record<FlawLocation, string>> = {
  surface: 'on the inspected surface',
  'far-side': 'on the far side',
  subsurface: 'below the surface',
  center: 'at the centre',
};

function notchLocationWords(notch: Notch): string {
  return notch.location === 'subsurface' && notch.depthBelowSurfaceMm !== undefined ? `${mm(notch.depthBelowSurfaceMm)} below the surface` : LOCATION_WORDS[notch.location];
}

function flawLocationWords(flaw: Flaw): string {
  return flaw.location === 'subsurface' ? `${mm(flaw.depthMm)} below the surface` : LOCATION_WORDS[flaw.location];
}

/**
 * A notch stands for a flaw only where the flaw is: the same location, and a subsurface
 * notch no shallower than the flaw (a deeper one gives a weaker signal: a conservative calibration).
 */
export function notchLocationMatches(notch: Notch, flaw: Flaw): boolean {
  if (notch.location !== flaw.location) return false;
  if (flaw.location !== 'subsurface') return true;
  return (notch.depthBelowSurfaceMm ?? 0) >= flaw.depthMm * (1 - 1e-9);
}

function wallMm(part: Part): number | undefined {
  if (part.form === 'tube') return part.wallMm;
  if (part.form === 'plate') return part.thicknessMm;
  return undefined;
}

/**
 * The flaw's own extent through the wall: as given, or the crack depth of a surface flaw,
 * or the wall left below depthMm for a far-side flaw. Undefined when it cannot be known.
 */
export function flawThroughWallMm(flaw: Flaw, part: Part): number | undefined {
  if (flaw.throughWallMm !== undefined) return flaw.throughWallMm;
  if (flaw.location === 'surface') return flaw.depthMm;
  const wall = wallMm(part);
  if (flaw.location === 'far-side' && wall !== undefined && wall - flaw.depthMm > 1e-9) return wall - flaw.depthMm;
  return undefined;
}

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
        message: `Flaw "${flaw.id}" is laminar: eddy currents cannot find it, so no notch can stand for it (see orientation coverage).`,
        values: { flawDepthMm: flaw.depthMm },
        basis: NOTCH_BASIS,
      });
      return;
    }
    const described = flaw.angleDeg === undefined ? flaw.orientation : `${flaw.orientation} at ${sig(flaw.angleDeg)}°`;
    const where = flawLocationWords(flaw);
    const extentMm = flawThroughWallMm(flaw, technique.part);
    const maxDepthMm = extentMm === undefined ? undefined : extentMm * policy.notchDepthRatioMax;
    const depthWords = maxDepthMm === undefined ? '' : ` no deeper than ${mm(maxDepthMm)}`;
    const placeWords = flaw.location === 'subsurface' ? `at least ${mm(flaw.depthMm)} below the surface` : where;

    const oriented: number[] = [];
    for (let n = 0; n < notchNormals.length; n++) {
      if (normalAlignment(flawNormals[f], notchNormals[n]) >= cosTolerance) oriented.push(n);
    }
    const placed = oriented.filter((n) => notchLocationMatches(reference.notches[n], flaw));
    const baseValues = { flawDepthMm: flaw.depthMm, flawLocation: flaw.location, flawThroughWallMm: extentMm ?? null };

    if (oriented.length === 0) {
      results.push({
        rule: 'reference-standard',
        status: 'fail',
        flaw: flaw.id,
        message:
          `The reference standard has no notch matching flaw "${flaw.id}" (${described}, ${where}). Response to a flaw depends on its orientation to the current, ` +
          `so sensitivity must be set on a notch of the same orientation: add a notch (${described}) ${placeWords}${depthWords}.`,
        values: { ...baseValues, notchDepthMm: null },
        basis: NOTCH_BASIS,
      });
      return;
    }
    if (placed.length === 0) {
      const first = reference.notches[oriented[0]];
      results.push({
        rule: 'reference-standard',
        status: 'fail',
        flaw: flaw.id,
        message:
          `Flaw "${flaw.id}" (${described}) lies ${where}, but the notch of that orientation sits ${notchLocationWords(first)}. ` +
          'A notch elsewhere does not represent it: the metal between coil and flaw weakens and rotates the flaw signal, so a reject level set on the notch would not hold for the flaw. ' +
          `Add a notch (${described}) ${placeWords}${depthWords}.`,
        values: { ...baseValues, notchDepthMm: first.depthMm, notchLocation: first.location, notch: oriented[0] },
        basis: NOTCH_BASIS,
      });
      return;
    }

    let shallowest = placed[0];
    for (const n of placed) if (reference.notches[n].depthMm < reference.notches[shallowest].depthMm) shallowest = n;
    const notch = reference.notches[shallowest];
    const values = { ...baseValues, notchDepthMm: notch.depthMm, notchDepthMaxMm: maxDepthMm ?? null, notchLocation: notch.location, notch: shallowest };
    const notchWords = `Notch ${shallowest + 1} (${notch.orientation}, ${notchLocationWords(notch)}, ${mm(notch.depthMm)} deep)`;
    if (maxDepthMm === undefined) {
      results.push({
        rule: 'reference-standard',
        status: 'warn',
        flaw: flaw.id,
        message:
          `${notchWords} matches flaw "${flaw.id}" (${described}, ${where}) in orientation and location, but the technique does not give the flaw's own extent through the wall, ` +
          'so the notch depth cannot be compared with it. Give the flaw\'s through-wall extent (throughWallMm).',
        values,
        basis: NOTCH_BASIS,
      });
      return;
    }
    if (notch.depthMm <= maxDepthMm * (1 + 1e-9)) {
      results.push({
        rule: 'reference-standard',
        status: 'pass',
        flaw: flaw.id,
        message: `${notchWords} matches flaw "${flaw.id}" (${described}, ${where}, ${mm(extentMm!)} through the wall) and is no deeper than it.`,
        values,
        basis: NOTCH_BASIS,
      });
    } else {
      results.push({
        rule: 'reference-standard',
        status: 'fail',
        flaw: flaw.id,
        message:
          `The shallowest notch matching flaw "${flaw.id}" (${described}, ${where}) is ${mm(notch.depthMm)} deep, deeper than the flaw's own extent through the wall (${mm(extentMm!)}). ` +
          `Calibrating on a larger reflector sets the reject level above the signal of the smallest flaw to be found: add a notch no deeper than ${mm(maxDepthMm)}.`,
        values,
        basis: NOTCH_BASIS,
      });
    }
  });
};

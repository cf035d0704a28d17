// Rule 2 (first part): the center effect. In an encircling coil on a solid bar the
// induced current falls from the surface towards the axis as |J1(kr)/J1(ka)| (the
// long-cylinder solution), faster than the plane wave's e^(−x/δ), and is zero at the
// axis at every frequency. A flaw below the surface is reached only where this coil's
// density at the flaw's radius is at least the policy's minimum fraction of the
// surface density. Lowering the frequency raises the density at radius r only up to
// r/a (the low-frequency limit J ∝ r), so for a flaw near the axis no frequency helps.
import { conductivityMsPerMFromIacs, currentDensityRatio } from '../../physics';
import { solveLongCoil } from '../../fields/cylinder';
import { floorSig, hz, list, mm, percent } from '../format';
import { fieldRelativePermeability } from '../permeability';
import type { Coil, Flaw, Technique } from '../../../schemas/technique';
import type { Policy } from '../../policy';
import type { ResultValue, Rule, RuleResult } from '../types';

const BASIS =
  "[pub] long solid cylinder in an encircling coil: J(r)/J(a) = J1(kr)/J1(ka), k = (1−j)/δ (the solution behind Förster's effective permeability), zero at the axis at every frequency; minimum density at the flaw: the organisation's policy setting (default 5 %, the plane wave's density at 3δ)";

/** True when the flaw sits at the axis of a solid bar (or as deep as its radius). */
export function isAtBarCenter(flaw: Flaw, technique: Technique): boolean {
  const { part } = technique;
  if (part.form !== 'bar' || part.diameterMm === undefined) return false;
  return flaw.location === 'center' || flaw.depthMm >= part.diameterMm / 2;
}

/** Depth of a flaw below the bar's surface: its radius for a flaw at the centre. */
function depthBelowSurfaceMm(flaw: Flaw, radiusMm: number): number {
  return flaw.location === 'center' ? radiusMm : Math.min(flaw.depthMm, radiusMm);
}

interface BarField {
  radiusMm: number;
  conductivityMsPerM: number;
  relativePermeability: number;
}

/** |J| at that depth below the surface of a solid bar, relative to the surface, in an encircling coil at f. */
export function barDensityRatio(bar: BarField, coil: Coil, frequencyHz: number, depthMm: number): number {
  return solveLongCoil({
    placement: 'encircling',
    outerRadiusMm: bar.radiusMm,
    coilRadiusMm: Math.max(coil.diameterMm / 2, bar.radiusMm),
    conductivityMsPerM: bar.conductivityMsPerM,
    relativePermeability: bar.relativePermeability,
    frequencyHz,
  }).densityRatioAtDepth(depthMm);
}

/** The highest frequency at which the density at that depth still reaches `ratio` (the density falls as f rises). */
function highestFrequencyForRatio(bar: BarField, coil: Coil, depthMm: number, ratio: number, aboveHz: number): number {
  let high = Math.log(aboveHz);
  let low = high - Math.log(1e6);
  if (barDensityRatio(bar, coil, Math.exp(low), depthMm) < ratio) return NaN;
  for (let i = 0; i < 50 && high - low > 1e-4; i++) {
    const mid = (low + high) / 2;
    if (barDensityRatio(bar, coil, Math.exp(mid), depthMm) >= ratio) low = mid;
    else high = mid;
  }
  return Math.exp(low);
}

function applies(technique: Technique): number[] {
  if (technique.part.form !== 'bar' || technique.part.diameterMm === undefined) return [];
  return technique.coils.flatMap((coil, c) => (coil.type === 'encircling' ? [c] : []));
}

function judgeFlaw(technique: Technique, policy: Policy, bar: BarField, encircling: number[], flaw: Flaw, coilNames: string[]): RuleResult {
  const minimum = policy.fieldDensityRatioMin;
  const depthMm = depthBelowSurfaceMm(flaw, bar.radiusMm);
  const flawRadiusMm = bar.radiusMm - depthMm;
  // The best coil and frequency for this flaw: the highest density at its radius.
  let best = { coil: encircling[0], frequencyHz: technique.coils[encircling[0]].frequenciesHz[0], ratio: -1 };
  for (const c of encircling) {
    for (const frequencyHz of technique.coils[c].frequenciesHz) {
      const ratio = barDensityRatio(bar, technique.coils[c], frequencyHz, depthMm);
      if (ratio > best.ratio) best = { coil: c, frequencyHz, ratio };
    }
  }
  const coil = technique.coils[best.coil];
  const delta = solveLongCoil({
    placement: 'encircling',
    outerRadiusMm: bar.radiusMm,
    coilRadiusMm: Math.max(coil.diameterMm / 2, bar.radiusMm),
    conductivityMsPerM: bar.conductivityMsPerM,
    relativePermeability: bar.relativePermeability,
    frequencyHz: best.frequencyHz,
  }).standardDepthMm;
  const planeWave = currentDensityRatio(depthMm, delta);
  const ceiling = flawRadiusMm / bar.radiusMm; // the density as f → 0: J ∝ r
  const names = list(encircling.map((c) => coilNames[c]));
  const where =
    flaw.location === 'center' || flawRadiusMm <= 0
      ? 'at the centre of the solid bar'
      : `${mm(depthMm)} below the surface of the ${mm(bar.radiusMm * 2)} bar (${mm(flawRadiusMm)} from the axis)`;
  const values: Record<string, ResultValue> = {
    depthMm,
    radiusMm: bar.radiusMm,
    flawRadiusMm,
    frequencyHz: best.frequencyHz,
    standardDepthMm: delta,
    densityRatioAtFlaw: best.ratio,
    planeWaveDensityRatio: planeWave,
    densityRatioMin: minimum,
    lowFrequencyDensityRatio: ceiling,
  };
  const others = technique.coils.flatMap((c, i) => (c.type === 'encircling' ? [] : [i]));
  const shortfall = flawRadiusMm <= 0 ? '' : `, below the ${percent(minimum)} minimum`;
  const figures =
    flawRadiusMm <= 0
      ? `no current flows there at any frequency (at ${hz(best.frequencyHz)}, δ = ${mm(delta)}, a plane wave would suggest ${percent(planeWave)} of the surface density)`
      : `the current density there is ${percent(best.ratio)} of the surface density at ${hz(best.frequencyHz)} (δ = ${mm(delta)}; a plane wave would give ${percent(planeWave)})`;

  if (best.ratio >= minimum) {
    return {
      rule: 'center-effect',
      status: 'pass',
      flaw: flaw.id,
      coil: best.coil,
      message: `Flaw "${flaw.id}" lies ${where}. In ${coilNames[best.coil]} ${figures}, at least the ${percent(minimum)} minimum.`,
      values,
      basis: BASIS,
    };
  }

  let remedy: string;
  if (ceiling < minimum) {
    const why =
      ceiling <= 0
        ? 'the induced current is zero at the axis of a bar at every frequency'
        : `the current in a bar falls towards the axis at every frequency, and even at the lowest frequencies it reaches only ${percent(ceiling)} of the surface density at this radius`;
    remedy =
      `Lowering the frequency will not help: ${why}. ` +
      'Use another method for the core, such as ultrasonic testing, or remove the flaw from the scope of this technique.';
  } else {
    const highest = highestFrequencyForRatio(bar, coil, depthMm, minimum, best.frequencyHz);
    remedy = Number.isFinite(highest)
      ? `A frequency of ${hz(floorSig(highest))} or lower gives at least ${percent(minimum)} there; check that flaw and dimensional signals still separate at it, or use another method.`
      : 'Use another method for the core, such as ultrasonic testing.';
    values.suggestedMaxFrequencyHz = Number.isFinite(highest) ? floorSig(highest) : null;
  }
  if (others.length > 0) {
    return {
      rule: 'center-effect',
      status: 'warn',
      flaw: flaw.id,
      coil: best.coil,
      message:
        `Flaw "${flaw.id}" lies ${where}. In ${names} ${figures}${shortfall}; ` +
        `finding it rests on ${list(others.map((c) => coilNames[c]))} (see the penetration depth check). ${remedy}`,
      values,
      basis: BASIS,
    };
  }
  return {
    rule: 'center-effect',
    status: 'fail',
    flaw: flaw.id,
    coil: best.coil,
    message: `Flaw "${flaw.id}" lies ${where}. In ${names} ${figures}${shortfall}, so the technique cannot find it. ${remedy}`,
    values,
    basis: BASIS,
  };
}

export const centerEffect: Rule = ({ technique, policy, coilNames }, results) => {
  const encircling = applies(technique);
  if (encircling.length === 0) {
    results.push({
      rule: 'center-effect',
      status: 'not_applicable',
      message: 'No encircling coil on a solid bar: the center effect does not apply.',
      values: {},
      basis: BASIS,
    });
    return;
  }
  const bar: BarField = {
    radiusMm: (technique.part.diameterMm as number) / 2,
    conductivityMsPerM: conductivityMsPerMFromIacs(technique.material.conductivityIacs),
    relativePermeability: fieldRelativePermeability(technique, policy),
  };
  let any = false;
  for (const flaw of technique.flaws) {
    if (flaw.location === 'surface' && flaw.depthMm < bar.radiusMm) continue; // open to the surface, where the density is highest
    any = true;
    results.push(judgeFlaw(technique, policy, bar, encircling, flaw, coilNames));
  }
  if (!any) {
    results.push({
      rule: 'center-effect',
      status: 'pass',
      message: `No flaw lies below the surface of the bar: the fall of the current towards the axis in ${list(encircling.map((c) => coilNames[c]))} does not limit this technique.`,
      values: { radiusMm: bar.radiusMm },
      basis: BASIS,
    });
  }
};

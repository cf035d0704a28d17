// Rule 3: a flaw below the surface is found only if this coil's field reaches it: the eddy
// current density of the coil's own field at the flaw (under the winding; at the flaw's
// radius in a bar or tube) must be at least the policy's fraction of the surface density.
// The plane wave e^(−x/δ) and the familiar δ and 3δ are reported beside it: a small coil's
// field dies away with distance long before δ says it should.
import { frequencyForDepthMm, phaseLagDeg, PHASE_SEPARATION_DEPTH_FACTOR } from '../../physics';
import { floorSig, hz, list, mm, percent, sig } from '../format';
import { isAtBarCenter } from './center-effect';
import { smallestReachingDiameterMm } from '../coil-field';
import type { Flaw } from '../../../schemas/technique';
import type { Rule, RuleContext } from '../types';

const BASIS =
  "[pub] Dodd–Deeds solution for a circular coil over a layered conductor (J. Appl. Phys. 39, 1968) and the long-coil (Bessel function) solution for bars and tubes: the density of the coil's own field at the flaw; [trade] least density at the flaw e^(−3) ≈ 5 % of the surface value, the density a plane wave has at the effective depth 3δ (policy densityRatioMin); [pub] δ = 1/√(π f μ0 μr σ)";
const EPSILON = 1e-9;

/** Depth of metal the field must pass to reach the flaw: in a layered structure only the metal above it (an air gap is lift-off, not attenuation). */
export function metalDepthMm(flaw: Flaw): number {
  return flaw.metalAboveMm ?? flaw.depthMm;
}

/** Coils that could find the flaw by orientation (or all coils when none can, since orientation-coverage already fails). */
export function candidateCoils(context: RuleContext, flawIndex: number): number[] {
  const { technique, policy, values } = context;
  const flaw = technique.flaws[flawIndex];
  const atCenter = isAtBarCenter(flaw, technique);
  const sensitivity = values.orientationSensitivity[flawIndex];
  const usable: number[] = [];
  const crossing: number[] = [];
  for (let c = 0; c < technique.coils.length; c++) {
    if (atCenter && technique.coils[c].type === 'encircling') continue;
    usable.push(c);
    if (sensitivity[c] + EPSILON >= policy.orientationSensitivityMin) crossing.push(c);
  }
  return crossing.length > 0 ? crossing : usable;
}

/** The coil and frequency whose field is densest at the flaw. */
export function deepestReaching(context: RuleContext, flawIndex: number, candidates: readonly number[]): { coil: number; frequency: number } {
  let best = { coil: candidates[0], frequency: 0 };
  let bestRatio = -1;
  for (const c of candidates) {
    const frequencies = context.technique.coils[c].frequenciesHz;
    for (let i = 0; i < frequencies.length; i++) {
      const ratio = context.fields.at(c, i, flawIndex).densityRatio;
      if (ratio > bestRatio) {
        bestRatio = ratio;
        best = { coil: c, frequency: i };
      }
    }
  }
  return best;
}

export const penetrationDepth: Rule = (context, results) => {
  const { technique, policy, values, coilNames, fields } = context;
  const { material, coils } = technique;
  const k = policy.penetrationDepthFactor;
  const minimum = policy.densityRatioMin;
  const mu = values.fieldRelativePermeability;
  let any = false;

  technique.flaws.forEach((flaw, flawIndex) => {
    if (flaw.location === 'surface') return;
    any = true;
    const xMm = metalDepthMm(flaw);
    if (flaw.orientation === 'laminar') {
      results.push({
        rule: 'penetration-depth',
        status: 'not_applicable',
        flaw: flaw.id,
        message:
          `Flaw "${flaw.id}" is laminar: it lies parallel to the surface, and so do the eddy currents of these coils, which flow along it rather than across it. ` +
          `Reaching its depth would not make it visible: see orientation coverage.`,
        values: { depthMm: xMm },
        basis: BASIS,
      });
      return;
    }
    const depthWords = flaw.metalAboveMm === undefined ? `${mm(xMm)} below the inspected surface` : `under ${mm(xMm)} of metal (air gaps excluded)`;
    const candidates = candidateCoils(context, flawIndex);
    if (candidates.length === 0) {
      results.push({
        rule: 'penetration-depth',
        status: 'not_applicable',
        flaw: flaw.id,
        message: `Flaw "${flaw.id}" lies at the axis of the bar, which no frequency of an encircling coil reaches: see center-effect.`,
        values: { depthMm: xMm },
        basis: BASIS,
      });
      return;
    }

    const best = deepestReaching(context, flawIndex, candidates);
    const coil = coils[best.coil];
    const field = fields.at(best.coil, best.frequency, flawIndex);
    const deltaMm = values.standardDepthMm[best.coil][best.frequency];
    const frequencyHz = coil.frequenciesHz[best.frequency];
    const reachMm = k * deltaMm;
    const highestHz = fields.highestReachingHz(best.coil, flawIndex, minimum);
    const highestReachingFrequencyHz = highestHz === null ? null : floorSig(highestHz);
    const separation = fields.bestSeparation(best.coil, flawIndex, highestHz);
    const recommendedFrequencyHz = highestHz === null ? null : floorSig(separation.frequencyHz);
    const crossCheckFrequencyHz = floorSig(frequencyForDepthMm(PHASE_SEPARATION_DEPTH_FACTOR * xMm, material.conductivityIacs, mu));
    const currentLagDeg = phaseLagDeg(xMm, deltaMm);
    const resultValues = {
      depthMm: xMm,
      frequencyHz,
      fieldModel: field.model,
      densityRatioAtFlaw: field.densityRatio,
      densityRatioMin: minimum,
      planeWaveDensityRatio: field.planeWaveRatio,
      standardDepthMm: deltaMm,
      reachDepthMm: reachMm,
      penetrationDepthFactor: k,
      currentPhaseLagDeg: currentLagDeg,
      flawSignalPhaseLagDeg: 2 * currentLagDeg,
      highestReachingFrequencyHz,
      recommendedFrequencyHz,
      recommendedPhaseSeparationDeg: highestHz === null ? null : separation.phaseSeparationDeg,
      phaseSeparationFrequencyHz: crossCheckFrequencyHz,
    };
    const figures =
      `At ${hz(frequencyHz)} with ${coilNames[best.coil]}, δ = ${mm(deltaMm)} and ${sig(k)}δ = ${mm(reachMm)}; ` +
      `this coil's field at the flaw is ${percent(field.densityRatio)} of its surface density (a plane wave, e^(−x/δ), would give ${percent(field.planeWaveRatio)}); ` +
      `the current there lags by ${sig(currentLagDeg)}°, the flaw's signal by about twice that.`;
    const recommendation =
      recommendedFrequencyHz === null
        ? ''
        : ` The frequency that best separates its signal from lift-off while still reaching it is about ${hz(recommendedFrequencyHz)} ` +
          `(δ ≈ 1.25 × ${mm(xMm)} gives ${hz(crossCheckFrequencyHz)} as the rule of thumb).`;
    const coilsWord = candidates.length === 1 ? coilNames[best.coil] : list(candidates.map((c) => coilNames[c]));

    if (field.densityRatio + EPSILON >= minimum) {
      results.push({
        rule: 'penetration-depth',
        status: 'pass',
        flaw: flaw.id,
        coil: best.coil,
        message: `Flaw "${flaw.id}" lies ${depthWords}. ${figures} That is at least the ${percent(minimum)} asked, so the field reaches it.${recommendation}`,
        values: resultValues,
        basis: BASIS,
      });
      return;
    }
    let remedy: string;
    if (highestReachingFrequencyHz !== null) {
      remedy = `The highest frequency at which this coil's field still reaches ${mm(xMm)} is ${hz(highestReachingFrequencyHz)}.${recommendation}`;
    } else {
      const diameterMm = smallestReachingDiameterMm(fields, best.coil, flawIndex, minimum);
      remedy =
        `No frequency of this coil reaches it: even at low frequency its field falls below ${percent(minimum)} at that depth, because a coil's field spreads and weakens with distance on the scale of its own size, whatever δ is. ` +
        (diameterMm === null ? 'A larger coil or another method is needed.' : `A coil of about ${mm(diameterMm)} diameter or more would reach it at a low frequency.`);
    }
    results.push({
      rule: 'penetration-depth',
      status: 'fail',
      flaw: flaw.id,
      coil: best.coil,
      message: `Flaw "${flaw.id}" lies ${depthWords}, beyond the reach of ${coilsWord}. ${figures} That is below the ${percent(minimum)} asked. ${remedy}`,
      values: resultValues,
      basis: BASIS,
    });
  });

  if (!any) {
    const depths = coils.map((coil, c) => `${coilNames[c]}: ${coil.frequenciesHz.map((f, i) => `${hz(f)} δ = ${mm(values.standardDepthMm[c][i])}, 3δ = ${mm(3 * values.standardDepthMm[c][i])}`).join('; ')}`);
    results.push({
      rule: 'penetration-depth',
      status: 'not_applicable',
      message: `Every expected flaw is open to the inspected surface. Standard depths: ${depths.join('; ')}.`,
      values: {},
      basis: BASIS,
    });
  }
};

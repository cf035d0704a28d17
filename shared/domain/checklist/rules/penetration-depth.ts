// Rule 3: a flaw below the surface is found only if the field reaches it:
// x ≤ k·δ at some test frequency, counting only metal above the flaw.
import { currentDensityRatio, frequencyForDepthMm, phaseLagDeg, PHASE_SEPARATION_DEPTH_FACTOR } from '../../physics';
import { floorSig, hz, list, mm, percent, sig } from '../format';
import { isAtBarCenter } from './center-effect';
import type { Flaw } from '../../../schemas/technique';
import type { Rule, RuleContext } from '../types';

const BASIS =
  '[pub] standard depth of penetration δ = 1/√(π f μ0 μr σ); [trade] flaw reached when x ≤ k·δ (policy penetrationDepthFactor, default 3); [pub] δ ≈ 1.25 × flaw depth separates flaw and lift-off signals by about 90° (ET formula references)';
const EPSILON = 1e-9;

/** Depth of metal the field must pass to reach the flaw: in a layered structure only the metal above it (an air gap is lift-off, not attenuation). */
export function metalDepthMm(flaw: Flaw): number {
  return flaw.metalAboveMm ?? flaw.depthMm;
}

/** Coils that could find the flaw by orientation (or all coils when none can, since orientation-coverage already fails). */
function candidateCoils(context: RuleContext, flawIndex: number): number[] {
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

export const penetrationDepth: Rule = (context, results) => {
  const { technique, policy, values, coilNames } = context;
  const { material, coils } = technique;
  const k = policy.penetrationDepthFactor;
  let any = false;

  technique.flaws.forEach((flaw, flawIndex) => {
    if (flaw.location === 'surface') return;
    any = true;
    const xMm = metalDepthMm(flaw);
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

    // The deepest-reaching frequency among the candidate coils: the largest δ.
    let bestCoil = candidates[0];
    let bestFrequency = 0;
    for (const c of candidates) {
      const depths = values.standardDepthMm[c];
      for (let i = 0; i < depths.length; i++) {
        if (depths[i] > values.standardDepthMm[bestCoil][bestFrequency]) {
          bestCoil = c;
          bestFrequency = i;
        }
      }
    }
    const deltaMm = values.standardDepthMm[bestCoil][bestFrequency];
    const frequencyHz = coils[bestCoil].frequenciesHz[bestFrequency];
    const reachMm = k * deltaMm;
    const exactMaxFrequencyHz = frequencyForDepthMm(xMm / k, material.conductivityIacs, material.relativePermeability);
    const suggestedFrequencyHz = floorSig(exactMaxFrequencyHz);
    const phaseSeparationFrequencyHz = floorSig(
      frequencyForDepthMm(PHASE_SEPARATION_DEPTH_FACTOR * xMm, material.conductivityIacs, material.relativePermeability),
    );
    const densityRatio = currentDensityRatio(xMm, deltaMm);
    const resultValues = {
      depthMm: xMm,
      frequencyHz,
      standardDepthMm: deltaMm,
      reachDepthMm: reachMm,
      penetrationDepthFactor: k,
      currentDensityRatio: densityRatio,
      phaseLagDeg: phaseLagDeg(xMm, deltaMm),
      suggestedFrequencyHz,
      phaseSeparationFrequencyHz,
    };
    const phaseAdvice = `For about 90° between flaw and lift-off signals, δ ≈ 1.25 × ${mm(xMm)} gives ${hz(phaseSeparationFrequencyHz)}.`;
    const coilsWord = candidates.length === 1 ? coilNames[bestCoil] : list(candidates.map((c) => coilNames[c]));

    if (xMm <= reachMm * (1 + EPSILON)) {
      results.push({
        rule: 'penetration-depth',
        status: 'pass',
        flaw: flaw.id,
        coil: bestCoil,
        message:
          `Flaw "${flaw.id}" lies ${depthWords}; at ${hz(frequencyHz)} with ${coilNames[bestCoil]}, δ = ${mm(deltaMm)} and ${sig(k)}δ = ${mm(reachMm)}, so the field reaches it ` +
          `(current density there ${percent(densityRatio)} of the surface value, phase lag ${sig(resultValues.phaseLagDeg)}°). ${phaseAdvice}`,
        values: resultValues,
        basis: BASIS,
      });
    } else {
      results.push({
        rule: 'penetration-depth',
        status: 'fail',
        flaw: flaw.id,
        coil: bestCoil,
        message:
          `Flaw "${flaw.id}" lies ${depthWords}, beyond the reach of ${coilsWord}: at the lowest useful frequency, ${hz(frequencyHz)}, δ = ${mm(deltaMm)} and ${sig(k)}δ = ${mm(reachMm)} ` +
          `(current density at the flaw ${percent(densityRatio)} of the surface value). Current density falls as e^(−x/δ), and δ shrinks as frequency rises. ` +
          `The highest frequency that reaches ${mm(xMm)} is ${hz(suggestedFrequencyHz)}. ${phaseAdvice}`,
        values: resultValues,
        basis: BASIS,
      });
    }
  });

  if (!any) {
    const depths = coils.map((coil, c) => `${coilNames[c]}: ${coil.frequenciesHz.map((f, i) => `${hz(f)} δ = ${mm(values.standardDepthMm[c][i])}`).join(', ')}`);
    results.push({
      rule: 'penetration-depth',
      status: 'not_applicable',
      message: `Every expected flaw is open to the inspected surface. Standard depths: ${depths.join('; ')}.`,
      values: {},
      basis: BASIS,
    });
  }
};

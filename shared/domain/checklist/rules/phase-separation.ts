// A flaw below the surface must give a signal the inspector can tell from lift-off. On the
// impedance plane the flaw's signal turns with depth (about twice the current's phase lag,
// 2x/δ) while lift-off keeps its own direction; the angle between them, computed from this
// coil's field, is checked against the policy minimum. The trade's δ ≈ 1.25·x (about 90°
// for a plane wave) is kept as a cross-check.
import { frequencyForDepthMm, PHASE_SEPARATION_DEPTH_FACTOR } from '../../physics';
import { floorSig, hz, mm, sig } from '../format';
import { candidateCoils, deepestReaching, metalDepthMm } from './penetration-depth';
import type { Rule } from '../types';

const BASIS =
  "[pub] first-order (Born, reciprocity) flaw response ∝ ∫E² over the flaw, from this coil's field (Dodd–Deeds planar solution; long-coil Bessel solution), against the lift-off direction dZ/d(lift-off) of the same model; [pub] δ ≈ 1.25 × flaw depth separates flaw and lift-off by about 90° (ET formula references); least angle: policy phaseSeparationMinDeg";

export const phaseSeparation: Rule = (context, results) => {
  const { technique, policy, values, coilNames, fields } = context;
  const { material, coils } = technique;
  const minimum = policy.phaseSeparationMinDeg;
  let any = false;

  technique.flaws.forEach((flaw, flawIndex) => {
    if (flaw.location === 'surface') return;
    if (flaw.orientation === 'laminar') return;
    const candidates = candidateCoils(context, flawIndex);
    if (candidates.length === 0) return;
    any = true;
    const xMm = metalDepthMm(flaw);
    const { coil: c } = deepestReaching(context, flawIndex, candidates);
    const coil = coils[c];
    // The best angle among the coil's frequencies that reach the flaw (all of them if none does).
    const reaching = coil.frequenciesHz.map((_, i) => i).filter((i) => fields.at(c, i, flawIndex).densityRatio >= policy.densityRatioMin);
    const considered = reaching.length > 0 ? reaching : coil.frequenciesHz.map((_, i) => i);
    let bestIndex = considered[0];
    for (const i of considered) if (fields.at(c, i, flawIndex).phaseSeparationDeg > fields.at(c, bestIndex, flawIndex).phaseSeparationDeg) bestIndex = i;
    const angleDeg = fields.at(c, bestIndex, flawIndex).phaseSeparationDeg;
    const highestHz = fields.highestReachingHz(c, flawIndex, policy.densityRatioMin);
    const recommended = fields.bestSeparation(c, flawIndex, highestHz);
    const crossCheckHz = floorSig(frequencyForDepthMm(PHASE_SEPARATION_DEPTH_FACTOR * xMm, material.conductivityIacs, values.fieldRelativePermeability));
    const perFrequency = coil.frequenciesHz.map((f, i) => `${sig(fields.at(c, i, flawIndex).phaseSeparationDeg)}° at ${hz(f)} (δ = ${mm(values.standardDepthMm[c][i])})`).join(', ');
    const resultValues = {
      depthMm: xMm,
      frequencyHz: coil.frequenciesHz[bestIndex],
      phaseSeparationDeg: angleDeg,
      phaseSeparationMinDeg: minimum,
      recommendedFrequencyHz: floorSig(recommended.frequencyHz),
      recommendedPhaseSeparationDeg: recommended.phaseSeparationDeg,
      phaseSeparationFrequencyHz: crossCheckHz,
      standardDepthMm: values.standardDepthMm[c][bestIndex],
      fieldModel: fields.at(c, bestIndex, flawIndex).model,
    };
    const advice =
      `The angle is largest, about ${sig(recommended.phaseSeparationDeg)}°, near ${hz(floorSig(recommended.frequencyHz))}` +
      `${highestHz === null ? '' : ' among frequencies that still reach the flaw'}; the rule of thumb δ ≈ 1.25 × ${mm(xMm)} gives ${hz(crossCheckHz)}.`;
    const ok = angleDeg + 1e-9 >= minimum;
    results.push({
      rule: 'phase-separation',
      status: ok ? 'pass' : 'warn',
      flaw: flaw.id,
      coil: c,
      message: ok
        ? `Flaw "${flaw.id}" (${mm(xMm)} down) and lift-off are ${sig(angleDeg)}° apart on the impedance plane with ${coilNames[c]}: ${perFrequency}. ${advice}`
        : `Flaw "${flaw.id}" (${mm(xMm)} down) and lift-off are only ${sig(angleDeg)}° apart with ${coilNames[c]} (${perFrequency}), less than the ${sig(minimum)}° asked: its signal is hard to tell from probe wobble by phase. ${advice}`,
      values: resultValues,
      basis: BASIS,
    });
  });

  if (!any) {
    results.push({
      rule: 'phase-separation',
      status: 'not_applicable',
      message:
        'No expected flaw lies below the surface (or the only ones are laminar or out of every coil\'s reach): a crack open to the surface is told from lift-off by its own signal at the surface, not by the phase a depth of metal adds.',
      values: {},
      basis: BASIS,
    });
  }
};

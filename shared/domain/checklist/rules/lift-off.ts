// A non-conductive coating is lift-off: it weakens every flaw signal and must be present at
// calibration. With part.coatingMm declared, the reference standard must be calibrated over
// a non-conductive shim of that thickness, and the coil field model reports how much flaw
// signal the coating costs.
import { hz, mm, percent, sig } from '../format';
import { coilGeometry } from '../../fields/geometry';
import { isLongCoil } from '../coil-field';
import type { Rule } from '../types';

const BASIS =
  "[trade] calibrate over a non-conductive shim equal to the coating (common practice, no single source; shim tolerance: policy shimTolerancePercent); [pub] loss of flaw signal with lift-off from this coil's field (Dodd–Deeds planar solution, first-order flaw response), warned past policy liftOffSensitivityLossMaxPercent";

export const liftOff: Rule = (context, results) => {
  const { technique, policy, coilNames, fields } = context;
  const { part, reference, coils, flaws } = technique;
  const coatingMm = part.coatingMm ?? 0;
  if (coatingMm <= 0) {
    results.push({
      rule: 'lift-off',
      status: 'not_applicable',
      message: 'No coating is declared on the inspected surface (part coating thickness): the probe sits on bare metal, with only its own wear face as lift-off.',
      values: { coatingMm },
      basis: BASIS,
    });
    return;
  }

  const toleranceMm = (policy.shimTolerancePercent / 100) * coatingMm;
  const shimMm = reference.shimMm;
  const shimValues = { coatingMm, shimMm: shimMm ?? null, shimToleranceMm: toleranceMm };
  if (shimMm === undefined) {
    results.push({
      rule: 'lift-off',
      status: 'fail',
      message: `The part carries ${mm(coatingMm)} of non-conductive coating, but no calibration shim is declared on the reference standard: calibrated on bare metal, the instrument overstates every flaw signal on the coated part. Calibrate over a non-conductive shim of ${mm(coatingMm)} (within ±${sig(policy.shimTolerancePercent)} %).`,
      values: shimValues,
      basis: BASIS,
    });
  } else if (Math.abs(shimMm - coatingMm) > toleranceMm + 1e-9) {
    results.push({
      rule: 'lift-off',
      status: 'fail',
      message: `The calibration shim (${mm(shimMm)}) does not match the coating on the part (${mm(coatingMm)}, within ±${sig(policy.shimTolerancePercent)} % = ±${mm(toleranceMm)}): the sensitivity set at calibration is not the sensitivity on the part. Use a shim of ${mm(coatingMm)}.`,
      values: shimValues,
      basis: BASIS,
    });
  } else {
    results.push({
      rule: 'lift-off',
      status: 'pass',
      message: `Calibration over a ${mm(shimMm)} non-conductive shim matches the ${mm(coatingMm)} coating on the part.`,
      values: shimValues,
      basis: BASIS,
    });
  }

  coils.forEach((coil, c) => {
    if (isLongCoil(coil)) {
      results.push({
        rule: 'lift-off',
        status: 'not_applicable',
        coil: c,
        message: `For ${coilNames[c]} the coating widens the gap between coil and metal, which the fill factor already counts; the planar lift-off model does not apply.`,
        values: { coatingMm },
        basis: BASIS,
      });
      return;
    }
    const bareMm = coilGeometry(coil, {}).liftOffMm;
    let worstRatio = Infinity;
    let worstFlaw = 0;
    flaws.forEach((_, f) => {
      const bare = fields.flawResponseWithLiftOff(c, 0, f, bareMm);
      const coated = fields.flawResponseWithLiftOff(c, 0, f, bareMm + coatingMm);
      if (!bare || !coated) return;
      const ratio = coated.abs() / bare.abs();
      if (ratio < worstRatio) {
        worstRatio = ratio;
        worstFlaw = f;
      }
    });
    if (!Number.isFinite(worstRatio)) return;
    const lossPercent = (1 - worstRatio) * 100;
    const resultValues = {
      coatingMm,
      liftOffBareMm: bareMm,
      frequencyHz: coil.frequenciesHz[0],
      flawSignalRatioCoatedToBare: worstRatio,
      sensitivityLossPercent: lossPercent,
      sensitivityLossMaxPercent: policy.liftOffSensitivityLossMaxPercent,
    };
    const words = `With ${coilNames[c]} at ${hz(coil.frequenciesHz[0])}, the ${mm(coatingMm)} coating leaves flaw "${flaws[worstFlaw].id}" ${percent(worstRatio)} of its signal on bare metal (a loss of ${sig(lossPercent)} %)`;
    const tooMuch = lossPercent > policy.liftOffSensitivityLossMaxPercent + 1e-9;
    results.push({
      rule: 'lift-off',
      status: tooMuch ? 'warn' : 'pass',
      coil: c,
      message: tooMuch
        ? `${words}, more than the ${sig(policy.liftOffSensitivityLossMaxPercent)} % allowed before review: a larger coil, a lower frequency or removing the coating would keep more of it.`
        : `${words}; the shim at calibration accounts for it.`,
      values: resultValues,
      basis: BASIS,
    });
  });
};

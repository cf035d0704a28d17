// Rule 5 (second part): the test frequency against the limit (characteristic)
// frequency f_g of a bar or tube, for encircling and internal coils. Bars use Förster's
// solid-cylinder f_g; tubes the long-coil tube model's f_g (the thin-wall formula is
// reported beside it and agrees with it for thin walls).
import { hz, sig } from '../format';
import { partLimitFrequency } from '../context';
import { fieldRelativePermeability } from '../permeability';
import type { Rule } from '../types';

const BASIS =
  '[pub] solid cylinder f_g = 2/(π μ0 μr σ d²) = 5066/(σ[MS/m]·μr·d[cm]²) (after Förster); tube f_g from the long-coil tube model: the frequency at which the field reaching the bore lags the outer surface field by 45°, which for thin walls is the thin-walled tube formula 5066/(σ·d_i·w), recalled; [mem] crack-detection window f/f_g ≈ 5–15 (a policy setting of the organisation)';

/**
 * f/f_g as text with enough digits that the text never contradicts the verdict:
 * 15.03 outside a window ending at 15 prints "15.03", not "15".
 */
export function ratioText(ratio: number, low: number, high: number): string {
  const inside = ratio >= low && ratio <= high;
  let text = sig(ratio);
  for (let digits = 4; digits <= 10; digits++) {
    const shown = Number(text);
    if ((shown >= low && shown <= high) === inside && shown !== low && shown !== high) return text;
    if (shown === ratio) return text;
    text = String(Number(ratio.toPrecision(digits)));
  }
  return text;
}

export const limitFrequency: Rule = ({ technique, policy, values, coilNames }, results) => {
  const { coils, part, material } = technique;
  const fg = values.limitFrequencyHz;
  const low = policy.limitFrequencyRatioMin;
  const high = policy.limitFrequencyRatioMax;
  const limit = fg === null ? null : partLimitFrequency(part, material.conductivityIacs, fieldRelativePermeability(technique, policy));
  let any = false;
  coils.forEach((coil, c) => {
    if (coil.type !== 'encircling' && coil.type !== 'bobbin') return;
    any = true;
    if (fg === null) {
      results.push({
        rule: 'limit-frequency',
        status: 'not_applicable',
        coil: c,
        message: `${coilNames[c]} works in a bore of a larger part: the limit frequency of a bar or tube does not apply.`,
        values: {},
        basis: BASIS,
      });
      return;
    }
    const ratios = values.frequencyRatio[c] as number[];
    const inWindow = ratios.findIndex((ratio) => ratio >= low && ratio <= high);
    const shape = part.form === 'bar' ? 'solid bar' : 'tube';
    const listed = coil.frequenciesHz.map((f, i) => `${hz(f)} (f/f_g = ${ratioText(ratios[i], low, high)})`).join(', ');
    const window = `${hz(low * fg)} to ${hz(high * fg)}`;
    const thinWallHz = limit?.thinWallHz;
    const fromModel =
      thinWallHz === undefined ? '' : ` from the tube model (the thin-walled tube formula gives ${hz(thinWallHz)}; it holds for thin walls only)`;
    const resultValues = {
      limitFrequencyHz: fg,
      limitFrequencyThinWallHz: thinWallHz ?? null,
      frequencyRatio: inWindow >= 0 ? ratios[inWindow] : ratios[0],
      windowLowHz: low * fg,
      windowHighHz: high * fg,
    };
    if (inWindow >= 0) {
      results.push({
        rule: 'limit-frequency',
        status: 'pass',
        coil: c,
        message: `Limit frequency of the ${shape} f_g = ${hz(fg)}${fromModel}; ${coilNames[c]} tests at ${listed}, within the crack-detection window f/f_g = ${sig(low)}–${sig(high)} (${window}).`,
        values: resultValues,
        basis: BASIS,
      });
    } else {
      results.push({
        rule: 'limit-frequency',
        status: 'warn',
        coil: c,
        message:
          `Limit frequency of the ${shape} f_g = ${hz(fg)}${fromModel}; ${coilNames[c]} tests at ${listed}, outside the crack-detection window f/f_g = ${sig(low)}–${sig(high)}, ` +
          `where flaw and dimensional signals separate best. Consider a frequency from ${window}, or record why this one was chosen.`,
        values: resultValues,
        basis: BASIS,
      });
    }
  });
  if (!any) {
    results.push({
      rule: 'limit-frequency',
      status: 'not_applicable',
      message: 'No encircling or bobbin coil: the limit frequency applies only to coils that go round or inside a bar or tube.',
      values: {},
      basis: BASIS,
    });
  }
};

// Rule 5 (second part): the test frequency against the limit (characteristic)
// frequency f_g of a bar or tube, for encircling and internal coils.
import { hz, sig } from '../format';
import type { Rule } from '../types';

const BASIS =
  '[pub] solid cylinder f_g = 2/(π μ0 μr σ d²) = 5066/(σ[MS/m]·μr·d[cm]²) (after Förster); [mem] thin-walled tube f_g = 5066/(σ·μr·d_i·w); [mem] crack-detection window f/f_g ≈ 5–15 (policy limitFrequencyRatioMin/Max)';

export const limitFrequency: Rule = ({ technique, policy, values, coilNames }, results) => {
  const { coils, part } = technique;
  const fg = values.limitFrequencyHz;
  const low = policy.limitFrequencyRatioMin;
  const high = policy.limitFrequencyRatioMax;
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
    const shape = part.form === 'bar' ? 'solid bar' : 'thin-walled tube';
    const listed = coil.frequenciesHz.map((f, i) => `${hz(f)} (f/f_g = ${sig(ratios[i])})`).join(', ');
    const window = `${hz(low * fg)} to ${hz(high * fg)}`;
    const resultValues = {
      limitFrequencyHz: fg,
      frequencyRatio: inWindow >= 0 ? ratios[inWindow] : ratios[0],
      windowLowHz: low * fg,
      windowHighHz: high * fg,
    };
    if (inWindow >= 0) {
      results.push({
        rule: 'limit-frequency',
        status: 'pass',
        coil: c,
        message: `Limit frequency of the ${shape} f_g = ${hz(fg)}; ${coilNames[c]} tests at ${listed}, within the crack-detection window f/f_g = ${sig(low)}–${sig(high)} (${window}).`,
        values: resultValues,
        basis: BASIS,
      });
    } else {
      results.push({
        rule: 'limit-frequency',
        status: 'warn',
        coil: c,
        message:
          `Limit frequency of the ${shape} f_g = ${hz(fg)}; ${coilNames[c]} tests at ${listed}, outside the crack-detection window f/f_g = ${sig(low)}–${sig(high)}, ` +
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

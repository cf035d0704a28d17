// Rule 2 (first part): in an encircling coil on a solid bar the current density
// falls to zero at the axis whatever the frequency, so a flaw at the centre
// (or deeper than the radius) cannot be found by that coil.
import { list, mm } from '../format';
import type { Flaw, Technique } from '../../../schemas/technique';
import type { Rule } from '../types';

const BASIS = '[pub] center effect: with an encircling coil on a solid bar, induced current density is zero at the axis at every frequency';

/** True when the flaw sits at the axis of a solid bar (or as deep as its radius). */
export function isAtBarCenter(flaw: Flaw, technique: Technique): boolean {
  const { part } = technique;
  if (part.form !== 'bar' || part.diameterMm === undefined) return false;
  return flaw.location === 'center' || flaw.depthMm >= part.diameterMm / 2;
}

export const centerEffect: Rule = ({ technique, coilNames }, results) => {
  const { part, coils } = technique;
  const encircling = coils.flatMap((coil, c) => (coil.type === 'encircling' ? [c] : []));
  if (part.form !== 'bar' || encircling.length === 0) {
    results.push({
      rule: 'center-effect',
      status: 'not_applicable',
      message: 'No encircling coil on a solid bar: the center effect does not apply.',
      values: {},
      basis: BASIS,
    });
    return;
  }
  const radiusMm = (part.diameterMm ?? 0) / 2;
  const others = coils.flatMap((coil, c) => (coil.type === 'encircling' ? [] : [c]));
  const names = list(encircling.map((c) => coilNames[c]));
  let any = false;

  technique.flaws.forEach((flaw) => {
    if (!isAtBarCenter(flaw, technique)) return;
    any = true;
    const where = flaw.location === 'center' ? 'at the centre of the solid bar' : `${mm(flaw.depthMm)} deep, as deep as the bar radius (${mm(radiusMm)})`;
    const values = { depthMm: flaw.depthMm, radiusMm, encirclingCoils: encircling.length };
    if (others.length === 0) {
      results.push({
        rule: 'center-effect',
        status: 'fail',
        flaw: flaw.id,
        coil: encircling[0],
        message:
          `Flaw "${flaw.id}" lies ${where}. In ${names} the induced current falls to zero at the axis whatever the frequency, ` +
          'so the technique cannot find it; lowering the frequency will not help. ' +
          'Use another method for the core, such as ultrasonic testing, or remove the flaw from the scope of this technique.',
        values,
        basis: BASIS,
      });
    } else {
      results.push({
        rule: 'center-effect',
        status: 'warn',
        flaw: flaw.id,
        coil: encircling[0],
        message:
          `Flaw "${flaw.id}" lies ${where}, where ${names} induces no current at any frequency; ` +
          `finding it rests on ${list(others.map((c) => coilNames[c]))} (see penetration-depth). Lowering the encircling coil's frequency will not help.`,
        values,
        basis: BASIS,
      });
    }
  });

  if (!any) {
    results.push({
      rule: 'center-effect',
      status: 'pass',
      message: `No flaw lies at the axis of the bar, where ${names} induces no current.`,
      values: { radiusMm },
      basis: BASIS,
    });
  }
};

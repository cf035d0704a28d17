// Coil mode: a differential coil compares two windings and sees only change along
// the scan. A flaw longer (along the scan) than the spacing of its windings shows
// only at its ends, and a long uniform flaw such as a seam gives no signal along its
// length. A differential surface or rotating probe is also directional: a crack
// lying along the axis of its coil pair and longer than their spacing sits under
// both coils at once and cancels. Absolute coils see a flaw along its whole length.
// (docs/domain-rules.md, "Coil mode".)
import { mm, sig } from '../format';
import { isAtBarCenter } from './center-effect';
import type { Coil } from '../../../schemas/technique';
import type { Vec3 } from '../../orientation';
import type { Policy } from '../../policy';
import type { ResultValue, Rule, RuleContext, RuleResult } from '../types';

const BASIS =
  '[trade] a differential coil sees only change along the scan, so a flaw longer than its winding spacing shows only at its ends and a differential pair is blind to a crack along its own axis; [product default] spacing policy differentialSpacingDiameters (0.5 × diameter) when not given, fail beyond differentialLengthFailMultiple (5) × spacing';

const EPSILON = 1e-9;

/** Differential pairs whose windings follow each other along the part (encircling, bobbin, arrays). */
function isAlongScanPair(coil: Coil): boolean {
  return coil.type === 'encircling' || coil.type === 'bobbin' || coil.type === 'multidirectional';
}

export interface CoilSpacing {
  mm: number;
  given: boolean;
}

/** The distance between the two windings' centres: as given, or the policy's fraction of the coil diameter. */
export function differentialSpacing(coil: Coil, policy: Policy): CoilSpacing {
  if (coil.spacingMm !== undefined) return { mm: coil.spacingMm, given: true };
  return { mm: policy.differentialSpacingDiameters * coil.diameterMm, given: false };
}

/** Extent of a crack along the part axis u: length × |t·u| with t the crack's line in the surface, t ⟂ normal. */
export function extentAlongAxisMm(lengthMm: number, normal: Vec3): number {
  const inPlane = Math.hypot(normal[0], normal[1]);
  return inPlane === 0 ? 0 : (lengthMm * Math.abs(normal[1])) / inPlane;
}

/** Sensitivity of a coil pair with axis at pairAxisDeg to the part axis: |n·a|, 0 for a crack lying along the pair's axis. */
export function pairAxisSensitivity(normal: Vec3, pairAxisDeg: number): number {
  const a = (pairAxisDeg * Math.PI) / 180;
  const inPlane = Math.hypot(normal[0], normal[1]);
  return inPlane === 0 ? 0 : Math.abs(normal[0] * Math.cos(a) + normal[1] * Math.sin(a)) / inPlane;
}

type Judgement = { status: RuleResult['status']; message: string; values: Record<string, ResultValue> };

function judgeAlongScan(context: RuleContext, c: number, f: number, absoluteCover: string | null): Judgement {
  const { technique, policy, coilNames, flawNormals } = context;
  const coil = technique.coils[c];
  const flaw = technique.flaws[f];
  const spacing = differentialSpacing(coil, policy);
  const alongMm = extentAlongAxisMm(flaw.lengthMm, flawNormals[f]);
  const failMm = policy.differentialLengthFailMultiple * spacing.mm;
  const spacingWords = spacing.given
    ? `the ${mm(spacing.mm)} spacing of the windings of differential ${coilNames[c]}`
    : `the spacing of the windings of differential ${coilNames[c]}, about ${mm(spacing.mm)} (${sig(policy.differentialSpacingDiameters)} × diameter; the technique gives none)`;
  const values = { coilSpacingMm: spacing.mm, coilSpacingGiven: spacing.given, flawLengthAlongScanMm: alongMm, failLengthMm: failMm };
  if (alongMm <= spacing.mm * (1 + EPSILON)) {
    return {
      status: 'pass',
      values,
      message: `Flaw "${flaw.id}" runs ${mm(alongMm)} along the scan, no longer than ${spacingWords}: the windings see it one after the other.`,
    };
  }
  const ends = `Flaw "${flaw.id}" runs ${mm(alongMm)} along the scan, longer than ${spacingWords}: both windings see it at once along its length, so it gives a signal only at its ends, and a uniform flaw (a seam) gives none between them.`;
  if (absoluteCover !== null) {
    return { status: 'pass', values, message: `${ends} ${absoluteCover} sees it along its whole length.` };
  }
  if (alongMm <= failMm * (1 + EPSILON)) {
    return {
      status: 'warn',
      values,
      message: `${ends} Calibrate and judge on the end signals of a notch of the flaw's length, or add an absolute coil.`,
    };
  }
  return {
    status: 'fail',
    values,
    message: `${ends} At more than ${sig(policy.differentialLengthFailMultiple)} times the spacing its ends may lie outside the part or be missed altogether: add an absolute coil (or run the coil in absolute mode) for this flaw.`,
  };
}

function judgeDirectional(context: RuleContext, c: number, f: number, absoluteCover: string | null): Judgement {
  const { technique, policy, coilNames, flawNormals } = context;
  const coil = technique.coils[c];
  const flaw = technique.flaws[f];
  const spacing = differentialSpacing(coil, policy);
  const values: Record<string, ResultValue> = { coilSpacingMm: spacing.mm, coilSpacingGiven: spacing.given, pairAxisDeg: coil.pairAxisDeg ?? null };
  if (flaw.lengthMm <= spacing.mm * (1 + EPSILON)) {
    return {
      status: 'pass',
      values,
      message: `Flaw "${flaw.id}" (${mm(flaw.lengthMm)} long) is no longer than the spacing of the coil pair of differential ${coilNames[c]} (${mm(spacing.mm)}): it passes under one coil at a time, whatever its direction.`,
    };
  }
  if (coil.pairAxisDeg === undefined) {
    return {
      status: absoluteCover === null ? 'warn' : 'pass',
      values,
      message:
        `Differential ${coilNames[c]} is directional: a crack longer than the spacing of its coil pair (${mm(spacing.mm)}) and lying along the pair's axis sits under both coils at once and cancels. ` +
        (absoluteCover === null
          ? `The technique does not give the pair's axis (pairAxisDeg), so whether flaw "${flaw.id}" lies across it cannot be checked: give it.`
          : `${absoluteCover} covers flaw "${flaw.id}" in any case.`),
    };
  }
  const sensitivity = pairAxisSensitivity(flawNormals[f], coil.pairAxisDeg);
  values.pairAxisSensitivity = sensitivity;
  if (sensitivity + EPSILON >= policy.orientationSensitivityMin) {
    return {
      status: 'pass',
      values,
      message: `Flaw "${flaw.id}" lies across the coil pair of differential ${coilNames[c]} (pair axis ${sig(coil.pairAxisDeg)}° to the part axis, sensitivity ${sig(sensitivity, 2)}): the two coils meet it one after the other.`,
    };
  }
  const along = `Flaw "${flaw.id}" (${mm(flaw.lengthMm)} long) lies nearly along the coil pair of differential ${coilNames[c]} (pair axis ${sig(coil.pairAxisDeg)}° to the part axis, sensitivity ${sig(sensitivity, 2)} below ${sig(policy.orientationSensitivityMin)}) and is longer than their spacing (${mm(spacing.mm)}): both coils see it at once and the signals cancel.`;
  if (absoluteCover !== null) return { status: 'pass', values, message: `${along} ${absoluteCover} covers it.` };
  return { status: 'fail', values, message: `${along} Turn the probe so its coil pair lies across the flaw, scan a second pass at 90°, or add an absolute coil.` };
}

export const coilMode: Rule = (context, results) => {
  const { technique, policy, values, coilNames } = context;
  const { coils, flaws } = technique;
  const differential = coils.flatMap((coil, c) => (coil.mode === 'differential' ? [c] : []));
  if (differential.length === 0) {
    results.push({
      rule: 'coil-mode',
      status: 'not_applicable',
      message: 'Every coil is absolute: each sees a flaw along its whole length, whatever its direction.',
      values: {},
      basis: BASIS,
    });
    return;
  }

  let judgedAny = false;
  flaws.forEach((flaw, f) => {
    if (flaw.orientation === 'laminar') return; // no coil finds it: orientation coverage says so
    const atCenter = isAtBarCenter(flaw, technique);
    // An absolute coil that crosses the flaw sees it along its whole length.
    const absolute = coils.findIndex(
      (coil, c) => coil.mode === 'absolute' && values.orientationSensitivity[f][c] + EPSILON >= policy.orientationSensitivityMin,
    );
    const absoluteCover = absolute < 0 ? null : `Absolute ${coilNames[absolute]}`;
    const judged: { c: number; judgement: Judgement }[] = [];
    for (const c of differential) {
      if (values.orientationSensitivity[f][c] + EPSILON < policy.orientationSensitivityMin) continue; // misses it anyway: orientation coverage
      if (atCenter && coils[c].type === 'encircling') continue; // no current at the axis: center effect
      judged.push({ c, judgement: isAlongScanPair(coils[c]) ? judgeAlongScan(context, c, f, absoluteCover) : judgeDirectional(context, c, f, absoluteCover) });
    }
    // Coils combine: a flaw one differential coil sees in full is covered by the technique.
    const covering = judged.find(({ judgement }) => judgement.status === 'pass');
    for (const { c, judgement } of judged) {
      judgedAny = true;
      const coveredElsewhere = covering !== undefined && judgement.status !== 'pass';
      results.push({
        rule: 'coil-mode',
        status: coveredElsewhere ? 'pass' : judgement.status,
        flaw: flaw.id,
        coil: c,
        message: coveredElsewhere ? `${judgement.message} Differential ${coilNames[covering.c]} sees it in full, so the technique covers it.` : judgement.message,
        values: judgement.values,
        basis: BASIS,
      });
    }
  });
  if (!judgedAny) {
    results.push({
      rule: 'coil-mode',
      status: 'not_applicable',
      message: 'No differential coil crosses an expected flaw, so coil mode changes nothing here (see orientation coverage).',
      values: {},
      basis: BASIS,
    });
  }
};

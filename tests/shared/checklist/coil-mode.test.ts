import { describe, expect, it } from 'vitest';
import { DEFAULT_POLICY } from '../../../shared/domain/policy';
import { extentAlongAxisMm, pairAxisSensitivity } from '../../../shared/domain/checklist/rules/coil-mode';
import { flawNormal } from '../../../shared/domain/orientation';
import { barTechnique, evaluate, plateTechnique, resultOf } from './techniques';

// A differential coil compares two windings: a flaw longer than their spacing shows only at its ends,
// a uniform seam gives no signal along its length, and a differential surface pair is blind to a crack
// lying along its own axis [common practice, no single source]. The verdict thresholds are policy
// settings (product defaults: spacing 0.5 × diameter when not given, fail beyond 5 × spacing).

const seam3m = { id: 'seam', orientation: 'axial' as const, location: 'surface' as const, depthMm: 0.3, lengthMm: 3000 };
const differentialEncircling = { type: 'encircling' as const, diameterMm: 22, mode: 'differential' as const, frequenciesHz: [500], spacingMm: 3 };

describe('coil-mode', () => {
  it('fails a 3 m continuous seam through a differential encircling coil', () => {
    const output = evaluate(barTechnique({ coils: [differentialEncircling], flaws: [seam3m], reference: { notches: [{ orientation: 'axial', depthMm: 0.3, lengthMm: 3000 }] } }));
    const result = resultOf(output, 'coil-mode', 'seam');
    expect(result.status).toBe('fail');
    expect(result.values.flawLengthAlongScanMm).toBe(3000);
    expect(result.values.coilSpacingMm).toBe(3);
    expect(result.message).toMatch(/only at its ends/);
    expect(result.message).toMatch(/absolute coil/);
    expect(output.verdict).toBe('does-not-conform');
  });

  it('passes the same seam when an absolute coil also covers it', () => {
    const absolute = { ...differentialEncircling, mode: 'absolute' as const, spacingMm: undefined };
    const output = evaluate(barTechnique({ coils: [differentialEncircling, absolute], flaws: [seam3m], reference: { notches: [{ orientation: 'axial', depthMm: 0.3, lengthMm: 3000 }] } }));
    const result = resultOf(output, 'coil-mode', 'seam');
    expect(result.status).toBe('pass');
    expect(result.message).toMatch(/Absolute coil 2/);
  });

  it('passes a short crack, no longer than the winding spacing', () => {
    const crack = { id: 'crack', orientation: 'axial' as const, location: 'surface' as const, depthMm: 0.3, lengthMm: 2 };
    const output = evaluate(barTechnique({ coils: [differentialEncircling], flaws: [crack], reference: { notches: [{ orientation: 'axial', depthMm: 0.3, lengthMm: 2 }] } }));
    expect(resultOf(output, 'coil-mode', 'crack').status).toBe('pass');
    expect(output.verdict).toBe('conforms');
  });

  it('warns between the spacing and the policy multiple of it, and uses the documented default spacing when none is given', () => {
    // 22 mm coil, no spacing given: 0.5 × 22 = 11 mm (policy default); a 20 mm seam is longer, but below 5 × 11 mm.
    const result = resultOf(evaluate(barTechnique()), 'coil-mode', 'seam');
    expect(result.status).toBe('warn');
    expect(result.values.coilSpacingMm).toBe(DEFAULT_POLICY.differentialSpacingDiameters * 22);
    expect(result.values.coilSpacingGiven).toBe(false);
    expect(result.message).toMatch(/the technique gives none/);
  });

  it('sees a circumferential crack in an encircling coil as a point along the scan', () => {
    // The crack's line is around the part: no extent along the axis (geometry).
    expect(extentAlongAxisMm(50, flawNormal('circumferential'))).toBeCloseTo(0, 12);
    expect(extentAlongAxisMm(50, flawNormal('axial'))).toBeCloseTo(50, 12);
    // A crack at 60° to the axis runs 50·cos 60° = 25 mm along it (trigonometry).
    expect(extentAlongAxisMm(50, flawNormal('axial', 60))).toBeCloseTo(25, 9);
  });

  it('fails a directional differential surface probe on a crack along its coil pair axis', () => {
    // Pair axis along the part axis (0°); a longitudinal crack lies along it: |n·a| = 0 (geometry).
    const probe = { type: 'surface' as const, diameterMm: 5, shielded: true, mode: 'differential' as const, frequenciesHz: [100_000], pairAxisDeg: 0, spacingMm: 2.5 };
    const crack = { id: 'crack', orientation: 'longitudinal' as const, location: 'surface' as const, depthMm: 0.5, lengthMm: 5 };
    const output = evaluate(plateTechnique({ coils: [probe], flaws: [crack], reference: { notches: [{ orientation: 'longitudinal', depthMm: 0.5, lengthMm: 5 }] } }));
    const result = resultOf(output, 'coil-mode', 'crack');
    expect(result.status).toBe('fail');
    expect(result.values.pairAxisSensitivity).toBeCloseTo(0, 12);
    expect(result.message).toMatch(/signals cancel/);
    expect(output.verdict).toBe('does-not-conform');

    // The same probe passes a transverse crack (across the pair axis: |n·a| = 1).
    const across = evaluate(plateTechnique({ coils: [probe] }));
    expect(resultOf(across, 'coil-mode', 'crack').status).toBe('pass');
    expect(resultOf(across, 'coil-mode', 'crack').values.pairAxisSensitivity).toBeCloseTo(1, 12);
  });

  it('gives sensitivity |cos| of the angle between the crack normal and the pair axis', () => {
    // A crack at 45° to a pair along the axis: cos 45° = 0.7071 (trigonometry).
    expect(pairAxisSensitivity(flawNormal('transverse', 45), 0)).toBeCloseTo(Math.SQRT1_2, 12);
  });

  it('warns on a directional probe whose pair axis is not given', () => {
    const probe = { type: 'rotating' as const, diameterMm: 2, shielded: true, mode: 'differential' as const, frequenciesHz: [500_000] };
    const result = resultOf(evaluate(plateTechnique({ coils: [probe] })), 'coil-mode', 'crack');
    expect(result.status).toBe('warn');
    expect(result.message).toMatch(/does not give the pair's axis/);
  });

  it('does not apply when every coil is absolute', () => {
    expect(resultOf(evaluate(plateTechnique()), 'coil-mode').status).toBe('not_applicable');
  });
});

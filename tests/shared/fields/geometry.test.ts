import { describe, expect, it } from 'vitest';
import { coilGeometry } from '../../../shared/domain/fields/geometry';
import { parseTechnique } from '../../../shared/domain/checklist/index';
import { plateTechnique } from '../checklist/techniques';

describe('coil geometry', () => {
  it('derives an unstated winding from the coil diameter (documented defaults: outer = D/2, inner = 0.6 × outer, length = D/2, 0.1 mm wear face)', () => {
    const coil = { type: 'pencil' as const, diameterMm: 10, shielded: false, mode: 'absolute' as const, frequenciesHz: [1000] };
    expect(coilGeometry(coil, {})).toEqual({ outerRadiusMm: 5, innerRadiusMm: 3, lengthMm: 5, liftOffMm: 0.1 });
  });

  it('takes the stated winding and adds a coating to the lift-off', () => {
    const coil = { type: 'surface' as const, diameterMm: 8, innerDiameterMm: 2, lengthMm: 1.5, liftOffMm: 0.2, shielded: false, mode: 'absolute' as const, frequenciesHz: [1000] };
    const geometry = coilGeometry(coil, { coatingMm: 0.3 });
    expect(geometry).toMatchObject({ outerRadiusMm: 4, innerRadiusMm: 1, lengthMm: 1.5 });
    expect(geometry.liftOffMm).toBeCloseTo(0.5, 12);
  });

  it('keeps every earlier technique valid and names a bad winding in plain words', () => {
    expect(parseTechnique(plateTechnique()).success).toBe(true);
    const bad = plateTechnique({ coils: [{ type: 'surface', diameterMm: 5, innerDiameterMm: 6, mode: 'absolute', frequenciesHz: [100_000] }] });
    const parsed = parseTechnique(bad);
    expect(parsed.success).toBe(false);
    if (!parsed.success) expect(parsed.issues[0]).toMatchObject({ path: 'coils[0].innerDiameterMm', message: expect.stringMatching(/winding inside diameter.*smaller than the coil diameter/) });
    const spacing = parseTechnique(plateTechnique({ coils: [{ type: 'surface', diameterMm: 5, spacingMm: 3, mode: 'absolute', frequenciesHz: [100_000] }] }));
    expect(spacing.success).toBe(false);
    if (!spacing.success) expect(spacing.issues[0].message).toMatch(/differential coil/);
  });
});

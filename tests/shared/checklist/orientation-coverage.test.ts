import { describe, expect, it } from 'vitest';
import { COIL_TYPES, type CoilType } from '../../../shared/schemas/technique';
import { orientationSensitivity, flawNormal } from '../../../shared/domain/orientation';
import { barTechnique, evaluate, plateTechnique, resultOf, tubeTechnique } from './techniques';
import type { TechniqueInput } from '../../../shared/domain/checklist/index';

// Rule 1 (docs/domain.md, [pub]): a flaw is found when the induced current crosses it and
// missed when it lies along the current or parallel to the surface.

describe('orientation-coverage', () => {
  it('finds axial cracks and misses circumferential ones with an encircling coil on a bar', () => {
    const output = evaluate(
      barTechnique({
        flaws: [
          { id: 'axial', orientation: 'axial', location: 'surface', depthMm: 0.3, lengthMm: 20 },
          { id: 'circ', orientation: 'circumferential', location: 'surface', depthMm: 0.3, lengthMm: 5 },
        ],
        reference: {
          notches: [
            { orientation: 'axial', depthMm: 0.3, lengthMm: 20 },
            { orientation: 'circumferential', depthMm: 0.3, lengthMm: 5 },
          ],
        },
      }),
    );
    expect(resultOf(output, 'orientation-coverage', 'axial')).toMatchObject({ status: 'pass', values: { sensitivity: 1 } });
    const circ = resultOf(output, 'orientation-coverage', 'circ');
    expect(circ.status).toBe('fail');
    expect(circ.values.sensitivity).toBe(0);
    expect(circ.message).toMatch(/runs along this flaw/);
    expect(circ.message).toMatch(/rotating|multidirectional/);
    expect(output.verdict).toBe('does-not-conform');
  });

  it('fails a lamination for every coil type', () => {
    const techniques: Record<CoilType, TechniqueInput> = {
      surface: plateTechnique({ coils: [{ type: 'surface', diameterMm: 5, mode: 'absolute', frequenciesHz: [100_000] }] }),
      pencil: plateTechnique({ coils: [{ type: 'pencil', diameterMm: 2, mode: 'absolute', frequenciesHz: [500_000] }] }),
      rotating: plateTechnique({ coils: [{ type: 'rotating', diameterMm: 2, mode: 'differential', frequenciesHz: [500_000] }] }),
      multidirectional: plateTechnique({ coils: [{ type: 'multidirectional', diameterMm: 3, mode: 'differential', frequenciesHz: [200_000] }] }),
      encircling: barTechnique(),
      bobbin: tubeTechnique(),
    };
    for (const type of COIL_TYPES) {
      const input = techniques[type];
      const output = evaluate({
        ...input,
        flaws: [{ id: 'lamination', orientation: 'laminar', location: 'subsurface', depthMm: 0.5, lengthMm: 10 }],
        reference: { ...input.reference, notches: [{ orientation: 'laminar', depthMm: 0.5, lengthMm: 10 }] },
      });
      const result = resultOf(output, 'orientation-coverage', 'lamination');
      expect(result.status, type).toBe('fail');
      expect(result.message).toMatch(/parallel to the surface/);
      expect(result.message).toMatch(/another method/);
      expect(output.verdict).toBe('does-not-conform');
    }
  });

  it('fails a lamination even when every kind of coil is combined', () => {
    const output = evaluate(
      plateTechnique({
        coils: (['surface', 'pencil', 'rotating', 'multidirectional'] as const).map((type) => ({
          type,
          diameterMm: 3,
          mode: 'absolute' as const,
          frequenciesHz: [10_000, 100_000],
        })),
        flaws: [{ id: 'lamination', orientation: 'laminar', location: 'subsurface', depthMm: 0.5, lengthMm: 10 }],
      }),
    );
    expect(resultOf(output, 'orientation-coverage', 'lamination').status).toBe('fail');
  });

  it('covers a circumferential crack in a tube when a rotating probe joins the bobbin coil (coils combine)', () => {
    const circ = { id: 'circ', orientation: 'circumferential' as const, location: 'far-side' as const, depthMm: 1, lengthMm: 10 };
    const bobbinOnly = evaluate(tubeTechnique({ flaws: [circ] }));
    expect(resultOf(bobbinOnly, 'orientation-coverage', 'circ').status).toBe('fail');

    const combined = evaluate(
      tubeTechnique({
        coils: [
          { type: 'bobbin', diameterMm: 15.5, mode: 'differential', frequenciesHz: [10_000] },
          { type: 'rotating', diameterMm: 3, shielded: true, mode: 'absolute', frequenciesHz: [10_000] },
        ],
        scan: { indexMm: 1 },
        flaws: [circ],
      }),
    );
    expect(resultOf(combined, 'orientation-coverage', 'circ')).toMatchObject({ status: 'pass', coil: 1 });
  });

  it('covers both axial and circumferential cracks with a multidirectional array', () => {
    const output = evaluate(
      tubeTechnique({
        coils: [{ type: 'multidirectional', diameterMm: 3, mode: 'differential', frequenciesHz: [10_000] }],
        flaws: [
          { id: 'axial', orientation: 'axial', location: 'far-side', depthMm: 1, lengthMm: 10 },
          { id: 'circ', orientation: 'circumferential', location: 'far-side', depthMm: 1, lengthMm: 10 },
        ],
      }),
    );
    expect(resultOf(output, 'orientation-coverage', 'axial').status).toBe('pass');
    expect(resultOf(output, 'orientation-coverage', 'circ').status).toBe('pass');
  });

  it('uses angleDeg: an encircling coil sees a crack at 45° (|cos 45°| = 0.71) but not at 70° (0.34)', () => {
    // Normal of a crack at angle a to the axis is (−sin a, cos a, 0) (docs/domain.md rule 1); encircling current is along v.
    const at = (angleDeg: number) =>
      evaluate(
        barTechnique({
          flaws: [{ id: 'oblique', orientation: 'axial', angleDeg, location: 'surface', depthMm: 0.3, lengthMm: 20 }],
          reference: { notches: [{ orientation: 'axial', angleDeg, depthMm: 0.3, lengthMm: 20 }] },
        }),
      );
    const at45 = resultOf(at(45), 'orientation-coverage', 'oblique');
    expect(at45.status).toBe('pass');
    expect(at45.values.sensitivity).toBeCloseTo(Math.SQRT1_2, 12);
    const at70 = resultOf(at(70), 'orientation-coverage', 'oblique');
    expect(at70.status).toBe('fail');
    expect(at70.values.sensitivity).toBeCloseTo(Math.cos((70 * Math.PI) / 180), 12);
  });

  it('takes the threshold from the policy (the product default 0.5)', () => {
    const input = barTechnique({
      flaws: [{ id: 'oblique', orientation: 'axial', angleDeg: 45, location: 'surface', depthMm: 0.3, lengthMm: 20 }],
      reference: { notches: [{ orientation: 'axial', angleDeg: 45, depthMm: 0.3, lengthMm: 20 }] },
    });
    expect(resultOf(evaluate(input), 'orientation-coverage', 'oblique').status).toBe('pass');
    expect(resultOf(evaluate(input, { policy: { orientationSensitivityMin: 0.8 } }), 'orientation-coverage', 'oblique').status).toBe('fail');
    expect(resultOf(evaluate({ ...input, policy: { orientationSensitivityMin: 0.8 } }), 'orientation-coverage', 'oblique').status).toBe('fail');
  });

  it('computes sensitivity as max |current · normal| for each coil type', () => {
    // Current directions from docs/domain.md rule 1: in-plane (surface, pencil, rotating), v only (encircling, bobbin), u and v (multidirectional).
    const oblique = flawNormal('axial', 30); // (−0.5, 0.866, 0)
    expect(orientationSensitivity('surface', oblique)).toBeCloseTo(1, 12);
    expect(orientationSensitivity('encircling', oblique)).toBeCloseTo(Math.cos(Math.PI / 6), 12);
    expect(orientationSensitivity('bobbin', flawNormal('circumferential'))).toBe(0);
    expect(orientationSensitivity('multidirectional', flawNormal('axial', 45))).toBeCloseTo(Math.SQRT1_2, 12);
    expect(orientationSensitivity('rotating', flawNormal('laminar'))).toBe(0);
  });
});

import { describe, expect, it } from 'vitest';
import { frequencyForDepthMm, standardDepthMm } from '../../../shared/domain/physics';
import { evaluate, plateTechnique, resultOf, resultsOf, tubeTechnique } from './techniques';
import type { TechniqueInput } from '../../../shared/domain/checklist/index';

// Rule 3 (DOMAIN.md): x ≤ k·δ with k = 3 ([trade]); δ ≈ 1.25 × depth for ~90° phase separation ([pub]).

function farSidePlate(frequencyHz: number, depthMm = 2): TechniqueInput {
  return plateTechnique({
    part: { form: 'plate', thicknessMm: 3 },
    coils: [{ type: 'surface', diameterMm: 10, mode: 'absolute', frequenciesHz: [frequencyHz] }],
    scan: { indexMm: 4 },
    flaws: [{ id: 'far', orientation: 'transverse', location: 'far-side', depthMm, lengthMm: 10 }],
    // A far-side notch through the wall left below the flaw (3 − 2 = 1 mm).
    reference: { notches: [{ orientation: 'transverse', location: 'far-side', depthMm: 1, lengthMm: 10 }] },
  });
}

describe('penetration-depth', () => {
  it('fails a far-side flaw beyond 3δ, suggests the highest frequency that reaches it, and that frequency passes', () => {
    // 7075-T6 at 32 %IACS, 100 kHz: δ = 0.369 mm, 3δ = 1.11 mm < 2 mm.
    const failing = evaluate(farSidePlate(100_000));
    const result = resultOf(failing, 'penetration-depth', 'far');
    expect(result.status).toBe('fail');
    expect(failing.verdict).toBe('does-not-conform');
    const suggested = result.values.suggestedFrequencyHz as number;
    // Highest frequency with 3δ = 2 mm: δ = 0.667 mm, f = (660.9/0.667)²/32 ≈ 30.7 kHz (engineering form of δ).
    expect(suggested).toBeCloseTo(30_700, -2);
    expect(suggested).toBeLessThanOrEqual(frequencyForDepthMm(2 / 3, 32));
    expect(result.message).toMatch(/highest frequency that reaches 2 mm is 30\.7 kHz/);

    const fixed = evaluate(farSidePlate(suggested));
    expect(resultOf(fixed, 'penetration-depth', 'far').status).toBe('pass');
    expect(fixed.verdict).toBe('conforms');
  });

  it('suggests the frequency giving δ = 1.25 × depth for about 90° phase separation', () => {
    const result = resultOf(evaluate(farSidePlate(100_000)), 'penetration-depth', 'far');
    const f90 = result.values.phaseSeparationFrequencyHz as number;
    expect(standardDepthMm(f90, 32) / (1.25 * 2)).toBeCloseTo(1, 2);
    expect(result.message).toMatch(/1\.25 × 2 mm/);
  });

  it('passes a far-side flaw within 3δ and reports δ, density and phase lag', () => {
    // Shared heat-exchanger example: at 40 kHz, δ = 660.9/√(40000 × 28) ≈ 0.62 mm and 3δ ≈ 1.87 mm ≥ 1.0 mm.
    const output = evaluate(
      tubeTechnique({ coils: [{ type: 'bobbin', diameterMm: 15.5, mode: 'differential', frequenciesHz: [40_000, 160_000] }] }),
    );
    const result = resultOf(output, 'penetration-depth', 'axial-crack');
    expect(result.status).toBe('pass');
    expect(result.values.standardDepthMm).toBeCloseTo(0.62, 2);
    expect(result.values.reachDepthMm).toBeCloseTo(1.87, 2);
    expect(result.values.frequencyHz).toBe(40_000);
    expect(output.values.standardDepthMm[0][0]).toBeCloseTo(0.624, 3);
    // 160 kHz: δ = 660.9/√(160000 × 28) ≈ 0.312 mm, 3δ ≈ 0.937 mm.
    expect(output.values.effectiveDepthMm[0][1]).toBeCloseTo(0.937, 3);
    // e^(−1.0/0.624) ≈ 20.2 % and 1.0/0.624 rad ≈ 91.8° (J/J0 = e^(−x/δ), θ = x/δ).
    expect(result.values.currentDensityRatio).toBeCloseTo(0.202, 3);
    expect(result.values.phaseLagDeg).toBeCloseTo(91.8, 1);
  });

  it('uses the deepest-reaching frequency of a multi-frequency coil', () => {
    const input = farSidePlate(100_000);
    input.coils[0].frequenciesHz = [100_000, 10_000];
    expect(resultOf(evaluate(input), 'penetration-depth', 'far')).toMatchObject({ status: 'pass', values: { frequencyHz: 10_000 } });
  });

  it('counts only metal above the flaw in a layered structure (air gap excluded)', () => {
    // At 20 kHz in 32 %IACS: 3δ = 2.48 mm. The flaw is 2.6 mm down but under only 2.4 mm of metal.
    const base = farSidePlate(20_000, 2.6);
    expect(resultOf(evaluate(base), 'penetration-depth', 'far').status).toBe('fail');
    const layered = { ...base, flaws: [{ ...base.flaws[0], location: 'subsurface' as const, metalAboveMm: 2.4 }] };
    const result = resultOf(evaluate(layered), 'penetration-depth', 'far');
    expect(result.status).toBe('pass');
    expect(result.values.depthMm).toBe(2.4);
  });

  it('takes k from the policy', () => {
    // 10 kHz: δ = 1.17 mm; 2 mm is within 3δ but not within 1δ.
    expect(resultOf(evaluate(farSidePlate(10_000)), 'penetration-depth', 'far').status).toBe('pass');
    expect(resultOf(evaluate(farSidePlate(10_000), { policy: { penetrationDepthFactor: 1 } }), 'penetration-depth', 'far').status).toBe('fail');
  });

  it('does not apply when every flaw is open to the surface, and still reports δ', () => {
    const output = evaluate(plateTechnique());
    expect(resultsOf(output, 'penetration-depth').map((result) => result.status)).toEqual(['not_applicable']);
    expect(resultOf(output, 'penetration-depth').message).toMatch(/δ = 0\.369 mm/);
  });
});

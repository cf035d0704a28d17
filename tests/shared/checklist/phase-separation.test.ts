import { describe, expect, it } from 'vitest';
import { standardDepthMm } from '../../../shared/domain/physics';
import { evaluate, plateTechnique, resultOf } from './techniques';
import type { TechniqueInput } from '../../../shared/domain/checklist/index';

// The flaw's signal turns with depth about twice as fast as the current (≈ 2x/δ) while lift-off
// keeps its direction; the trade aims for δ ≈ 1.25 × depth, about 90° [pub: ET formula references].

function secondLayer(frequencyHz: number): TechniqueInput {
  return plateTechnique({
    material: { name: '2024-T3', conductivityIacs: 30 },
    part: { form: 'plate', thicknessMm: 3.3 },
    coils: [{ type: 'surface', diameterMm: 12.7, mode: 'absolute', frequenciesHz: [frequencyHz] }],
    scan: { indexMm: 5 },
    flaws: [{ id: 'second-layer', orientation: 'transverse', location: 'subsurface', depthMm: 1.7, lengthMm: 5, metalAboveMm: 1.6 }],
    reference: { conductivityIacs: 30, notches: [{ orientation: 'transverse', depthMm: 1, lengthMm: 5 }] },
  });
}

describe('phase-separation', () => {
  it('warns when the flaw and lift-off signals lie close together, and suggests the frequency that separates them most', () => {
    // At 100 Hz in 30 %IACS, δ = 12.1 mm ≫ 1.6 mm: the flaw's signal has hardly turned from lift-off.
    const result = resultOf(evaluate(secondLayer(100)), 'phase-separation', 'second-layer');
    expect(result.status).toBe('warn');
    expect(result.values.phaseSeparationDeg as number).toBeLessThan(30);
    const recommended = result.values.recommendedFrequencyHz as number;
    const fixed = resultOf(evaluate(secondLayer(recommended)), 'phase-separation', 'second-layer');
    expect(fixed.status).toBe('pass');
    expect(fixed.values.phaseSeparationDeg as number).toBeGreaterThan(result.values.phaseSeparationDeg as number);
    // The rule of thumb stays in the message as a cross-check: δ = 1.25 × 1.6 mm = 2 mm.
    expect(standardDepthMm(result.values.phaseSeparationFrequencyHz as number, 30)).toBeCloseTo(2, 1);
    expect(result.message).toMatch(/δ ≈ 1\.25 × 1\.6 mm/);
  });

  it('passes near the rule-of-thumb frequency, where the model puts the angle at several tens of degrees', () => {
    const result = resultOf(evaluate(secondLayer(3_600)), 'phase-separation', 'second-layer');
    expect(result.status).toBe('pass');
    expect(result.values.phaseSeparationDeg as number).toBeGreaterThan(30);
  });

  it('does not apply to cracks open to the surface, and says why', () => {
    const result = resultOf(evaluate(plateTechnique()), 'phase-separation');
    expect(result.status).toBe('not_applicable');
    expect(result.message).toMatch(/open to the surface/);
  });
});

import { describe, expect, it } from 'vitest';
import { barTechnique, evaluate, plateTechnique, resultOf, resultsOf } from './techniques';

// Rule 2 ([pub]): with an encircling coil on a solid bar the current density falls
// towards the axis as |J1(kr)/J1(ka)| and is zero at the axis whatever the frequency.

const coreFlaw = { id: 'core', orientation: 'axial' as const, location: 'center' as const, depthMm: 10, lengthMm: 40 };

describe('center-effect', () => {
  it('fails a centre flaw in a solid bar, says lower frequency will not help and points to another method', () => {
    const output = evaluate(barTechnique({ flaws: [coreFlaw] }));
    const result = resultOf(output, 'center-effect', 'core');
    expect(result.status).toBe('fail');
    expect(result.message).toMatch(/lowering the frequency will not help/i);
    expect(result.message).toMatch(/another method/i);
    expect(result.values.densityRatioAtFlaw).toBe(0);
    expect(output.verdict).toBe('does-not-conform');
    // No frequency to suggest: penetration-depth defers to this rule.
    expect(resultOf(output, 'penetration-depth', 'core').status).toBe('not_applicable');
  });

  it('still fails at a far lower frequency', () => {
    const output = evaluate(
      barTechnique({ flaws: [coreFlaw], coils: [{ type: 'encircling', diameterMm: 22, mode: 'absolute', frequenciesHz: [1, 10] }] }),
    );
    expect(resultOf(output, 'center-effect', 'core').status).toBe('fail');
  });

  it('treats a flaw as deep as the radius like a centre flaw', () => {
    const output = evaluate(barTechnique({ flaws: [{ ...coreFlaw, location: 'subsurface', depthMm: 10 }] }));
    expect(resultOf(output, 'center-effect', 'core').status).toBe('fail');
  });

  it('warns instead when another coil can look for it, and leaves that coil to penetration-depth', () => {
    const output = evaluate(
      barTechnique({
        flaws: [coreFlaw],
        coils: [
          { type: 'encircling', diameterMm: 22, mode: 'differential', frequenciesHz: [500] },
          { type: 'surface', diameterMm: 10, mode: 'absolute', frequenciesHz: [100] },
        ],
        scan: { indexMm: 4 },
      }),
    );
    expect(resultOf(output, 'center-effect', 'core').status).toBe('warn');
    expect(resultOf(output, 'penetration-depth', 'core')).toMatchObject({ coil: 1 });
  });

  // The work item's worked example: a 25 mm 6061 bar (42 %IACS) in an encircling coil at 50 Hz, δ = 14.42 mm.
  // Density relative to the surface from |J1(kr)/J1(ka)| [pub: the long-cylinder solution]: 0.119 at 11 mm deep,
  // 0.040 at 12 mm, where the plane wave gives 0.435; minimum 5 % (policy default, common practice, no single source).
  const bar6061 = (depthMm: number, frequenciesHz = [50]) =>
    barTechnique({
      material: { name: '6061-T6', conductivityIacs: 42 },
      part: { form: 'bar', diameterMm: 25 },
      coils: [{ type: 'encircling', diameterMm: 27, mode: 'absolute', frequenciesHz }],
      flaws: [{ id: 'inclusion', orientation: 'axial', location: 'subsurface', depthMm, lengthMm: 20 }],
      reference: { conductivityIacs: 42 },
    });

  it('fails a flaw 12 mm deep in a 25 mm 6061 bar at 50 Hz and reports the plane-wave figure beside it', () => {
    const output = evaluate(bar6061(12));
    const result = resultOf(output, 'center-effect', 'inclusion');
    expect(result.status).toBe('fail');
    expect(result.values.densityRatioAtFlaw as number).toBeCloseTo(0.04, 3);
    expect(result.values.planeWaveDensityRatio as number).toBeCloseTo(0.435, 3);
    expect(result.values.densityRatioMin).toBe(0.05);
    expect(result.message).toMatch(/3\.98 % of the surface density/);
    expect(result.message).toMatch(/a plane wave would give 43\.5 %/);
    // At radius 0.5 mm the density cannot exceed r/a = 4 % at any frequency (J ∝ r as f → 0).
    expect(result.values.lowFrequencyDensityRatio as number).toBeCloseTo(0.04, 6);
    expect(result.message).toMatch(/lowering the frequency will not help/i);
    expect(output.verdict).toBe('does-not-conform');
  });

  it('passes the same flaw 11 mm deep (11.9 % of the surface density)', () => {
    const result = resultOf(evaluate(bar6061(11)), 'center-effect', 'inclusion');
    expect(result.status).toBe('pass');
    expect(result.values.densityRatioAtFlaw as number).toBeCloseTo(0.119, 3);
  });

  it('suggests a lower frequency when one reaches the flaw, and only then', () => {
    // 11 mm deep at 2 kHz falls short; at radius 1.5 mm the low-frequency limit is 12 % (r/a), above the 5 % minimum.
    const result = resultOf(evaluate(bar6061(11, [2000])), 'center-effect', 'inclusion');
    expect(result.status).toBe('fail');
    expect(result.message).not.toMatch(/will not help/);
    const suggested = result.values.suggestedMaxFrequencyHz as number;
    expect(suggested).toBeGreaterThan(50);
    expect(suggested).toBeLessThan(2000);
    expect(resultOf(evaluate(bar6061(11, [suggested])), 'center-effect', 'inclusion').status).toBe('pass');
  });

  it('judges the density as a gradual fall: deeper flaws get less at the same frequency', () => {
    const ratios = [5, 8, 11, 12].map((depth) => resultOf(evaluate(bar6061(depth)), 'center-effect', 'inclusion').values.densityRatioAtFlaw as number);
    // Work item figures [pub: the long-cylinder solution]: 0.597, 0.358, 0.119, 0.040.
    expect(ratios.map((ratio) => Number(ratio.toFixed(3)))).toEqual([0.597, 0.358, 0.119, 0.04]);
  });

  it('passes a bar with no flaw below the surface', () => {
    expect(resultOf(evaluate(barTechnique()), 'center-effect').status).toBe('pass');
  });

  it('does not apply without an encircling coil on a bar', () => {
    const output = evaluate(plateTechnique({ flaws: [{ ...coreFlaw, orientation: 'transverse', depthMm: 5 }] }));
    expect(resultsOf(output, 'center-effect').map((result) => result.status)).toEqual(['not_applicable']);
  });
});

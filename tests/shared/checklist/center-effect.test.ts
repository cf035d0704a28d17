import { describe, expect, it } from 'vitest';
import { barTechnique, evaluate, plateTechnique, resultOf, resultsOf } from './techniques';

// Rule 2 (DOMAIN.md, [pub]): with an encircling coil on a solid bar the current density
// goes to zero at the axis whatever the frequency.

const coreFlaw = { id: 'core', orientation: 'axial' as const, location: 'center' as const, depthMm: 10, lengthMm: 40 };

describe('center-effect', () => {
  it('fails a centre flaw in a solid bar, says lower frequency will not help and points to another method', () => {
    const output = evaluate(barTechnique({ flaws: [coreFlaw] }));
    const result = resultOf(output, 'center-effect', 'core');
    expect(result.status).toBe('fail');
    expect(result.message).toMatch(/lowering the frequency will not help/i);
    expect(result.message).toMatch(/another method/i);
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

  it('passes a bar with no flaw at the axis', () => {
    expect(resultOf(evaluate(barTechnique()), 'center-effect').status).toBe('pass');
  });

  it('does not apply without an encircling coil on a bar', () => {
    const output = evaluate(plateTechnique({ flaws: [{ ...coreFlaw, orientation: 'transverse', depthMm: 5 }] }));
    expect(resultsOf(output, 'center-effect').map((result) => result.status)).toEqual(['not_applicable']);
  });
});

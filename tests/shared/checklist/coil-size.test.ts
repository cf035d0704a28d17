import { describe, expect, it } from 'vitest';
import { evaluate, plateTechnique, resultOf, tubeTechnique } from './techniques';

// docs/domain.md rule 2 [pub: a published military ET manual]: cracks shorter than about half the coil diameter are hard to detect.

describe('coil-size', () => {
  it('warns on a crack shorter than half the coil diameter, without changing the verdict', () => {
    const output = evaluate(plateTechnique({ flaws: [{ id: 'crack', orientation: 'transverse', location: 'surface', depthMm: 0.5, lengthMm: 2 }] }));
    const result = resultOf(output, 'coil-size', 'crack');
    expect(result.status).toBe('warn');
    expect(result.message).toMatch(/hard to detect/);
    expect(result.message).toMatch(/at most 4 mm/);
    expect(output.verdict).toBe('conforms');
  });

  it('passes a crack of half the coil diameter or more', () => {
    const output = evaluate(plateTechnique({ flaws: [{ id: 'crack', orientation: 'transverse', location: 'surface', depthMm: 0.5, lengthMm: 2.5 }] }));
    expect(resultOf(output, 'coil-size', 'crack').status).toBe('pass');
  });

  it('judges by the smallest coil that crosses the crack', () => {
    const output = evaluate(
      plateTechnique({
        coils: [
          { type: 'surface', diameterMm: 10, mode: 'absolute', frequenciesHz: [100_000] },
          { type: 'pencil', diameterMm: 2, shielded: true, mode: 'absolute', frequenciesHz: [500_000] },
        ],
        scan: { indexMm: 1 },
        flaws: [{ id: 'crack', orientation: 'transverse', location: 'surface', depthMm: 0.5, lengthMm: 2 }],
      }),
    );
    expect(resultOf(output, 'coil-size', 'crack')).toMatchObject({ status: 'pass', coil: 1 });
  });

  it('does not apply to a bobbin coil', () => {
    expect(resultOf(evaluate(tubeTechnique()), 'coil-size').status).toBe('not_applicable');
  });
});

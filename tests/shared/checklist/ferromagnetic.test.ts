import { describe, expect, it } from 'vitest';
import { evaluate, plateTechnique, resultOf } from './techniques';

// Rule 6 (DOMAIN.md, [pub: ASTM E309]): μr > 1 fails unless saturated or justified.

const steel = { name: 'carbon steel', conductivityIacs: 10, relativePermeability: 100 };

describe('ferromagnetic', () => {
  it('fails ferromagnetic material without saturation or justification, citing ASTM E309', () => {
    const output = evaluate(plateTechnique({ material: steel, reference: { conductivityIacs: 10 } }));
    const result = resultOf(output, 'ferromagnetic');
    expect(result.status).toBe('fail');
    expect(result.basis).toMatch(/ASTM E309/);
    expect(result.message).toMatch(/saturation/);
    expect(output.verdict).toBe('does-not-conform');
  });

  it('passes with magnetic saturation', () => {
    expect(resultOf(evaluate(plateTechnique({ material: { ...steel, saturated: true }, reference: { conductivityIacs: 10 } })), 'ferromagnetic').status).toBe('pass');
  });

  it('warns with a recorded justification, quoting it for review', () => {
    const result = resultOf(
      evaluate(plateTechnique({ material: { ...steel, ferromagneticJustification: 'Surface cracks only; permeability checked on the reference block.' }, reference: { conductivityIacs: 10 } })),
      'ferromagnetic',
    );
    expect(result.status).toBe('warn');
    expect(result.message).toMatch(/permeability checked on the reference block/);
  });

  it('does not apply to non-magnetic material', () => {
    expect(resultOf(evaluate(plateTechnique()), 'ferromagnetic').status).toBe('not_applicable');
  });

  it('shrinks the standard depth by √μr', () => {
    const output = evaluate(plateTechnique({ material: { ...steel, saturated: true }, reference: { conductivityIacs: 10 } }));
    // 660.9/√(100000 × 100 × 10) mm (engineering form of δ).
    expect(output.values.standardDepthMm[0][0]).toBeCloseTo(660.9 / Math.sqrt(1e8), 4);
  });
});

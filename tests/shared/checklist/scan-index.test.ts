import { describe, expect, it } from 'vitest';
import { evaluate, plateTechnique, resultOf, tubeTechnique } from './techniques';

// Rule 2 (docs/domain.md): a surface coil has no current under its centre; index ≤ 0.5 × coil diameter ([trade], policy).

describe('scan-index', () => {
  it('passes an index of half the coil diameter', () => {
    expect(resultOf(evaluate(plateTechnique({ scan: { indexMm: 2.5 } })), 'scan-index').status).toBe('pass');
  });

  it('fails a wider index and says the largest that would do', () => {
    const result = resultOf(evaluate(plateTechnique({ scan: { indexMm: 3 } })), 'scan-index');
    expect(result.status).toBe('fail');
    expect(result.values.maxIndexMm).toBe(2.5);
    expect(result.message).toMatch(/no current directly under its centre/);
    expect(result.message).toMatch(/at most 2\.5 mm/);
  });

  it('fails a scanned coil with no index stated', () => {
    expect(resultOf(evaluate(plateTechnique({ scan: {} })), 'scan-index').status).toBe('fail');
  });

  it('takes the fraction from the policy', () => {
    expect(resultOf(evaluate(plateTechnique({ scan: { indexMm: 2 } }), { policy: { scanIndexFractionMax: 0.3 } }), 'scan-index').status).toBe('fail');
  });

  it('does not apply to a bobbin coil', () => {
    expect(resultOf(evaluate(tubeTechnique()), 'scan-index').status).toBe('not_applicable');
  });
});

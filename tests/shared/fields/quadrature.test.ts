import { describe, expect, it } from 'vitest';
import { gaussLegendreRule, integrateAdaptive, integrateToInfinity } from '../../../shared/domain/fields/quadrature';

describe('quadrature', () => {
  it('gives the Gauss–Legendre nodes and weights of Abramowitz & Stegun Table 25.4', () => {
    // n = 2: ±0.57735 02691 89626, weight 1; n = 5: 0.90617 98459 38664 with weight 0.23692 68850 56189.
    expect(gaussLegendreRule(2).nodes[1]).toBeCloseTo(0.577350269189626, 14);
    expect(gaussLegendreRule(2).weights[0]).toBeCloseTo(1, 14);
    expect(gaussLegendreRule(5).nodes[4]).toBeCloseTo(0.906179845938664, 14);
    expect(gaussLegendreRule(5).weights[4]).toBeCloseTo(0.236926885056189, 14);
  });

  it('integrates closed forms adaptively', () => {
    // ∫0^1 √x dx = 2/3; ∫0^π sin = 2; ∫0^∞ e^(−x) cos x dx = 1/2 (calculus).
    expect(integrateAdaptive(Math.sqrt, 0, 1, { relTol: 1e-10 })).toBeCloseTo(2 / 3, 9);
    expect(integrateAdaptive(Math.sin, 0, Math.PI)).toBeCloseTo(2, 12);
    expect(integrateToInfinity((x) => [Math.exp(-x) * Math.cos(x), 0], 0, 2).re).toBeCloseTo(0.5, 10);
  });
});

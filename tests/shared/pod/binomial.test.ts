import { describe, expect, it } from 'vitest';
import { binomialDemonstration, lowerPodBound, trialsNeeded } from '../../../shared/domain/pod/binomial';

/** P(X ≥ k) for X ~ Binomial(n, p), summed term by term. */
function upperTail(n: number, k: number, p: number): number {
  let total = 0;
  for (let x = k; x <= n; x++) {
    let coefficient = 1;
    for (let j = 1; j <= x; j++) coefficient = (coefficient * (n - x + j)) / j;
    total += coefficient * p ** x * (1 - p) ** (n - x);
  }
  return total;
}

describe('binomial demonstration', () => {
  it('when 29 of 29 flaws are found, then 90 % POD is demonstrated at 95 % confidence and 28 of 28 is not', () => {
    // Arithmetic: 0.9^29 = 0.0471 < 0.05, 0.9^28 = 0.0523 > 0.05.
    expect(0.9 ** 29).toBeLessThan(0.05);
    expect(0.9 ** 28).toBeGreaterThan(0.05);
    const result = binomialDemonstration(29, 29);
    expect(result.demonstrated).toBe(true);
    // Arithmetic: the bound solves p^29 = 0.05, p = 0.05^(1/29).
    expect(result.podLowerBound).toBeCloseTo(0.05 ** (1 / 29), 12);
    expect(binomialDemonstration(28, 28).demonstrated).toBe(false);
    expect(trialsNeeded(0)).toBe(29);
  });

  it('when one flaw is missed, then 45 of 46 demonstrates 90/95 and 44 of 45 does not', () => {
    // Arithmetic: P(X ≥ 45 | n = 46, p = 0.9) = 0.9^46 + 46·0.1·0.9^45 = 0.0480 < 0.05; for n = 45, 0.0524.
    expect(upperTail(46, 45, 0.9)).toBeLessThan(0.05);
    expect(upperTail(45, 44, 0.9)).toBeGreaterThan(0.05);
    expect(binomialDemonstration(45, 46).demonstrated).toBe(true);
    expect(binomialDemonstration(44, 45).demonstrated).toBe(false);
    expect(trialsNeeded(1)).toBe(46);
  });

  it('when any n − k of n, then the Clopper–Pearson bound is where the upper tail reaches 5 %', () => {
    // The exact bound's definition: P(X ≥ hits | p_L) = 1 − confidence, checked by direct summation.
    for (const [hits, n] of [
      [58, 61],
      [10, 12],
      [95, 100],
      [1, 5],
    ]) {
      const bound = lowerPodBound(hits, n);
      expect(upperTail(n, hits, bound)).toBeCloseTo(0.05, 9);
    }
    expect(lowerPodBound(0, 10)).toBe(0);
  });

  it('when the counts are impossible, then it throws', () => {
    expect(() => binomialDemonstration(5, 4)).toThrow(RangeError);
    expect(() => binomialDemonstration(1.5, 4)).toThrow(RangeError);
  });
});

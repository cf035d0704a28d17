import { describe, expect, it } from 'vitest';
import { analyseHitMiss, type HitMissAnalysis, type Link } from '../../../shared/domain/pod/hit-miss';
import { bisect, goldenMaximise, gridMaximise2, hitMissLogLik, inverse, numericHessian } from './reference-fits';

// A fixed hit/miss dataset: 40 flaws from 0.20 to 2.93 mm drawn once from a logit curve with
// a50 = 0.8 mm and slope 3.5 on ln(size); the outcomes overlap, so the fit exists.
const FIXED: [number, number][] = [
  [0.2, 0], [0.27, 0], [0.34, 0], [0.41, 1], [0.48, 1], [0.55, 1], [0.62, 0], [0.69, 0], [0.76, 0], [0.83, 0],
  [0.9, 1], [0.97, 1], [1.04, 1], [1.11, 0], [1.18, 0], [1.25, 1], [1.32, 1], [1.39, 1], [1.46, 1], [1.53, 1],
  [1.6, 1], [1.67, 1], [1.74, 1], [1.81, 1], [1.88, 1], [1.95, 1], [2.02, 1], [2.09, 1], [2.16, 1], [2.23, 1],
  [2.3, 1], [2.37, 1], [2.44, 0], [2.51, 1], [2.58, 1], [2.65, 1], [2.72, 1], [2.79, 1], [2.86, 1], [2.93, 1],
];
const data = FIXED.map(([sizeMm, hit]) => ({ sizeMm, hit: hit === 1 }));
const xs = FIXED.map(([a]) => Math.log(a));
const ys = FIXED.map(([, h]) => h);

// Φ⁻¹(0.9), Φ⁻¹(0.95) and χ²₁(0.90) from published tables; logit(0.9) = ln 9.
const Z90 = 1.2815515655446;
const Z95 = 1.6448536269515;
const CHI2_1_90 = 2.7055434540955;
const QUANTILE_90: Record<Link, number> = { logit: Math.log(9), probit: Z90 };

/** The reference: brute-force maximum likelihood, numeric information, delta-method and profile bounds. */
function reference(link: Link) {
  const f = (b0: number, b1: number) => hitMissLogLik(link, xs, ys, b0, b1);
  const [b0, b1] = gridMaximise2(f, [0, 5], [10, 10]);
  const maxLogLik = f(b0, b1);
  const cov = inverse(numericHessian(([a, b]) => -f(a, b), [b0, b1]));
  const q = QUANTILE_90[link];
  const x90 = (q - b0) / b1;
  const wald = x90 + Z95 * Math.sqrt((cov[0][0] + 2 * x90 * cov[0][1] + x90 * x90 * cov[1][1]) / (b1 * b1));
  // Profile over β1 with β0 = q − β1·θ; the crossing of the deviance with χ²₁(0.90) by bisection.
  const profile = (theta: number) => goldenMaximise((s) => f(q - s * theta, s), 1e-9, 5 * b1).value;
  const lr = bisect((theta) => 2 * (maxLogLik - profile(theta)) - CHI2_1_90, x90, x90 + 3);
  return { b0, b1, a50: Math.exp(-b0 / b1), a90: Math.exp(x90), a9095: Math.exp(lr), a9095Wald: Math.exp(wald) };
}

function fit(link: Link): HitMissAnalysis {
  const result = analyseHitMiss(data, { link });
  if (!result.ok) throw new Error(result.reason);
  return result;
}

describe('hit/miss POD against an independent brute-force computation', () => {
  for (const link of ['logit', 'probit'] as const) {
    it(`when the ${link} model is fitted to the fixed dataset, then β, a50, a90 and both a90/95 bounds match`, () => {
      const ref = reference(link);
      const result = fit(link);
      expect(result.convergence.converged).toBe(true);
      expect(result.convergence.gradientNorm).toBeLessThan(1e-6);
      expect(result.parameters.beta0).toBeCloseTo(ref.b0, 5);
      expect(result.parameters.beta1).toBeCloseTo(ref.b1, 5);
      expect(result.a50Mm).toBeCloseTo(ref.a50, 6);
      expect(result.a90Mm).toBeCloseTo(ref.a90, 6);
      expect(result.a9095Mm!).toBeCloseTo(ref.a9095, 5);
      // The Wald bound rests on a numeric Hessian (finite differences), so four decimals.
      expect(result.a9095WaldMm).toBeCloseTo(ref.a9095Wald, 4);
    });
  }

  it('when fitted, then the logit fit is near the curve the data were drawn from and the bounds lie above a90', () => {
    const result = fit('logit');
    // Drawn from a50 = 0.8 mm, slope 3.5; 40 points give a loose estimate.
    expect(result.a50Mm).toBeGreaterThan(0.5);
    expect(result.a50Mm).toBeLessThan(1.1);
    expect(result.a9095Mm!).toBeGreaterThan(result.a90Mm);
    expect(result.a9095WaldMm).toBeGreaterThan(result.a90Mm);
    expect(result.lrCriticalValue).toBeCloseTo(CHI2_1_90, 9);
    expect(result.warnings.map((w) => w.code)).toContain('few_specimens');
  });

  it('when the size scale is linear, then the fit is on size itself and matches the brute-force fit', () => {
    const result = analyseHitMiss(data, { scale: 'linear' });
    if (!result.ok) throw new Error(result.reason);
    const sizes = FIXED.map(([a]) => a);
    const [b0, b1] = gridMaximise2((a, b) => hitMissLogLik('logit', sizes, ys, a, b), [0, 3], [10, 10]);
    expect(result.parameters.beta0).toBeCloseTo(b0, 5);
    expect(result.parameters.beta1).toBeCloseTo(b1, 5);
    expect(result.a50Mm).toBeCloseTo(-b0 / b1, 6);
  });

  it('when the POD curve is listed, then the 90 % point carries a90 and the likelihood-ratio a90/95', () => {
    const result = fit('logit');
    const p90 = result.curve.find((p) => p.pod === 0.9)!;
    expect(p90.sizeMm).toBeCloseTo(result.a90Mm, 10);
    expect(p90.bound95SizeMm!).toBeCloseTo(result.a9095Mm!, 10);
    for (const point of result.curve) expect(point.bound95SizeMm!).toBeGreaterThan(point.sizeMm);
  });
});

describe('hit/miss refusals', () => {
  const sizes = [0.5, 0.8, 1.0, 1.5, 2.0];
  it('when every flaw is found, then the data are refused as all hits', () => {
    const result = analyseHitMiss(sizes.map((sizeMm) => ({ sizeMm, hit: true })));
    expect(result).toMatchObject({ ok: false, code: 'all_hits' });
  });
  it('when no flaw is found, then the data are refused as all misses', () => {
    expect(analyseHitMiss(sizes.map((sizeMm) => ({ sizeMm, hit: false })))).toMatchObject({ ok: false, code: 'all_misses' });
  });
  it('when every miss is smaller than every hit, then the data are refused as completely separated', () => {
    const result = analyseHitMiss(sizes.map((sizeMm) => ({ sizeMm, hit: sizeMm > 0.9 })));
    expect(result).toMatchObject({ ok: false, code: 'complete_separation' });
    if (!result.ok) expect(result.reason).toMatch(/transition region/);
  });
  it('when hits and misses meet at one size only, then the data are refused as quasi-completely separated', () => {
    const result = analyseHitMiss([...sizes.map((sizeMm) => ({ sizeMm, hit: sizeMm >= 1 })), { sizeMm: 1.0, hit: false }]);
    expect(result).toMatchObject({ ok: false, code: 'quasi_complete_separation' });
  });
  it('when every flaw has the same size, then the data are refused for too few sizes', () => {
    expect(analyseHitMiss([{ sizeMm: 1, hit: true }, { sizeMm: 1, hit: false }, { sizeMm: 1, hit: true }])).toMatchObject({ ok: false, code: 'too_few_sizes' });
  });
  it('when a size is zero in a log model, then the data are refused; the linear model accepts it', () => {
    const withZero = [{ sizeMm: 0, hit: false }, ...data];
    expect(analyseHitMiss(withZero)).toMatchObject({ ok: false, code: 'non_positive_size' });
    expect(analyseHitMiss(withZero, { scale: 'linear' }).ok).toBe(true);
  });
  it('when hits are all smaller than misses, then the data are refused as decreasing', () => {
    expect(analyseHitMiss(sizes.map((sizeMm) => ({ sizeMm, hit: sizeMm < 0.9 })))).toMatchObject({ ok: false, code: 'decreasing_with_size' });
  });
});

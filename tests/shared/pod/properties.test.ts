import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyseHitMiss, type HitMissObservation } from '../../../shared/domain/pod/hit-miss';
import { analyseSignalResponse } from '../../../shared/domain/pod/signal-response';
import { goldenMaximise, hitMissLogLik } from './reference-fits';

/** A small seeded generator (Park–Miller) so each property case is reproducible from its seed. */
function random(seed: number) {
  let state = (seed % 2147483646) + 1;
  const uniform = () => {
    state = (state * 16807) % 2147483647;
    return state / 2147483647;
  };
  const gaussian = () => Math.sqrt(-2 * Math.log(uniform())) * Math.cos(2 * Math.PI * uniform());
  return { uniform, gaussian };
}

/** n flaws log-uniform over a50·[0.2, 5], each found with the logit probability of the true curve. */
function hitMissSample(a50: number, slope: number, n: number, seed: number): HitMissObservation[] {
  const rng = random(seed);
  return Array.from({ length: n }, () => {
    const sizeMm = a50 * Math.exp(Math.log(0.2) + rng.uniform() * Math.log(25));
    const pod = 1 / (1 + Math.exp(-slope * Math.log(sizeMm / a50)));
    return { sizeMm, hit: rng.uniform() < pod };
  });
}

const trueA90 = (a50: number, slope: number) => a50 * Math.exp(Math.log(9) / slope);

describe('POD properties', () => {
  it('when hit/miss data come from a known logit curve, then a50 and a90 are recovered and the error shrinks as n grows', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.5, max: 3, noNaN: true }), fc.double({ min: 2, max: 8, noNaN: true }), fc.integer({ min: 1, max: 1e9 }), (a50, slope, seed) => {
        const large = analyseHitMiss(hitMissSample(a50, slope, 1500, seed));
        expect(large.ok).toBe(true);
        if (!large.ok) return;
        // Standard error of ln a50 at n = 1500 is at most about 0.04 across this range: 0.16 is four of them.
        expect(Math.abs(Math.log(large.a50Mm / a50))).toBeLessThan(0.16);
        expect(Math.abs(Math.log(large.a90Mm / trueA90(a50, slope)))).toBeLessThan(0.24);
      }),
      { numRuns: 8, seed: 20261202 },
    );
    // Mean error over the same seeds at growing n.
    const meanError = (n: number) => {
      let total = 0;
      for (let seed = 1; seed <= 8; seed++) {
        const r = analyseHitMiss(hitMissSample(1, 4, n, seed));
        if (r.ok) total += Math.abs(Math.log(r.a90Mm / trueA90(1, 4)));
        else total += 1;
      }
      return total / 8;
    };
    expect(meanError(1500)).toBeLessThan(meanError(80));
  }, 180_000);

  it('when any hit/miss data give a curve, then a90/95 (likelihood ratio and Wald) is never below a90', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.3, max: 3, noNaN: true }), fc.double({ min: 1, max: 10, noNaN: true }), fc.integer({ min: 8, max: 80 }), fc.integer({ min: 1, max: 1e9 }), fc.constantFrom('logit' as const, 'probit' as const), (a50, slope, n, seed, link) => {
        const result = analyseHitMiss(hitMissSample(a50, slope, n, seed), { link });
        if (!result.ok) return;
        expect(result.a9095WaldMm).toBeGreaterThanOrEqual(result.a90Mm);
        if (result.a9095Mm !== null) expect(result.a9095Mm).toBeGreaterThanOrEqual(result.a90Mm);
        else expect(result.warnings.map((w) => w.code)).toContain('no_upper_bound');
      }),
      { numRuns: 100, seed: 20261202 },
    );
  }, 180_000);

  it('when every miss is smaller than every hit, then the data are refused, never fitted', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 0.05, max: 10, noNaN: true }), { minLength: 2, maxLength: 40 }), fc.double({ min: 0.05, max: 10, noNaN: true }), (sizes, cut) => {
        const data = sizes.map((sizeMm) => ({ sizeMm, hit: sizeMm >= cut }));
        const result = analyseHitMiss(data);
        expect(result.ok).toBe(false);
      }),
      { numRuns: 300, seed: 20261202 },
    );
  });

  it('when â data come from a known line with censoring, then a50 and a90 are recovered and a90/95 ≥ a90', () => {
    fc.assert(
      fc.property(fc.double({ min: -0.5, max: 1.5, noNaN: true }), fc.double({ min: 0.8, max: 2, noNaN: true }), fc.double({ min: 0.15, max: 0.6, noNaN: true }), fc.integer({ min: 1, max: 1e9 }), (b0, b1, tau, seed) => {
        const rng = random(seed);
        const data = Array.from({ length: 1500 }, () => {
          const sizeMm = 0.2 * Math.exp(rng.uniform() * Math.log(20));
          return { sizeMm, signal: Math.exp(b0 + b1 * Math.log(sizeMm) + tau * rng.gaussian()) };
        });
        // Thresholds at fixed points of the true line so that some signals are censored at each end.
        const recordingThreshold = Math.exp(b0 + b1 * Math.log(0.35));
        const saturation = Math.exp(b0 + b1 * Math.log(3));
        const decisionThreshold = Math.exp(b0 + b1 * Math.log(0.6));
        const result = analyseSignalResponse(data, { decisionThreshold, recordingThreshold, saturation });
        expect(result.ok).toBe(true);
        if (!result.ok) return;
        const mu = (Math.log(decisionThreshold) - b0) / b1;
        const sigma = tau / b1;
        // With n = 1500, censoring at both ends and σ up to 0.75, the standard error of μ is up to about
        // 0.025 and of ln a90 about 0.03: 0.1 and 0.12 are four of them.
        expect(Math.abs(Math.log(result.a50Mm) - mu)).toBeLessThan(0.1);
        expect(Math.abs(Math.log(result.a90Mm) - (mu + 1.2815515655 * sigma))).toBeLessThan(0.12);
        expect(result.a9095Mm).toBeGreaterThanOrEqual(result.a90Mm);
      }),
      { numRuns: 10, seed: 20261202 },
    );
  }, 180_000);

  it('when a likelihood-ratio bound is reported, then the deviance there is χ²₁(0.90) by an independent profile', () => {
    fc.assert(
      fc.property(fc.integer({ min: 20, max: 300 }), fc.integer({ min: 1, max: 1e9 }), (n, seed) => {
        const data = hitMissSample(1, 4, n, seed);
        const result = analyseHitMiss(data);
        if (!result.ok || result.a9095Mm === null) return;
        const xs = data.map((d) => Math.log(d.sizeMm));
        const ys = data.map((d) => (d.hit ? 1 : 0));
        const theta = Math.log(result.a9095Mm);
        const q = Math.log(9);
        // Golden-section profile over β1 of the directly written likelihood; χ²₁(0.90) = 2.7055 (published tables).
        const profile = goldenMaximise((b1) => hitMissLogLik('logit', xs, ys, q - b1 * theta, b1), 1e-9, 10 * result.parameters.beta1);
        expect(2 * (result.convergence.logLikelihood - profile.value)).toBeCloseTo(2.7055434541, 6);
      }),
      { numRuns: 20, seed: 20261202 },
    );
  }, 180_000);
});

import jstat from 'jstat';
import { describe, expect, it } from 'vitest';
import { analyseSignalResponse, signalPod, type SignalResponseAnalysis, type SignalResponseOptions } from '../../../shared/domain/pod/signal-response';
import { censoredLogLik, inverse, numericHessian } from './reference-fits';

const { jStat } = jstat;

// A fixed â vs a dataset: 42 flaws from 0.25 to 4 mm, drawn once from ln â = 0.6 + 1.3·ln a + N(0, 0.35²);
// with a recording threshold of 0.3 three signals are censored below, with saturation at 10 three above.
const FIXED: [number, number][] = [
  [0.25, 0.11], [0.267, 0.337], [0.286, 0.247], [0.306, 0.265], [0.328, 0.343], [0.351, 0.448], [0.375, 0.742],
  [0.401, 0.713], [0.429, 0.487], [0.459, 0.539], [0.492, 0.608], [0.526, 1.334], [0.563, 0.532], [0.602, 1.249],
  [0.644, 0.867], [0.689, 1.269], [0.738, 1.418], [0.789, 2.301], [0.844, 1.105], [0.904, 1.752], [0.967, 1.361],
  [1.034, 1.523], [1.107, 2.068], [1.184, 1.75], [1.267, 3.017], [1.356, 3.016], [1.451, 3.868], [1.552, 2.913],
  [1.661, 2.953], [1.777, 3.017], [1.901, 4.696], [2.034, 2.274], [2.176, 5.193], [2.329, 7.241], [2.492, 3.384],
  [2.666, 6.125], [2.852, 4.821], [3.052, 13.55], [3.266, 5.414], [3.494, 7.608], [3.738, 19.794], [4, 14.237],
];
const NOISE = [
  0.093, 0.175, 0.202, 0.143, 0.342, 0.285, 0.234, 0.152, 0.291, 0.193, 0.249, 0.274, 0.249, 0.291, 0.159, 0.227, 0.271, 0.209,
  0.165, 0.123, 0.291, 0.369, 0.163, 0.446, 0.149, 0.148, 0.286, 0.251, 0.164, 0.234,
];
const data = FIXED.map(([sizeMm, signal]) => ({ sizeMm, signal }));
const OPTIONS: SignalResponseOptions = { decisionThreshold: 0.5, recordingThreshold: 0.3, saturation: 10, noise: NOISE };
const xs = FIXED.map(([a]) => Math.log(a));
const ys = FIXED.map(([, s]) => Math.log(s));

// Φ⁻¹(0.9) and Φ⁻¹(0.95) from published tables.
const Z90 = 1.2815515655446;
const Z95 = 1.6448536269515;

/** Maximises f over three parameters by repeated 17³ grids, each a third the width of the last. */
function gridMaximise3(f: (p: number[]) => number, centre: number[], halfWidth: number[], rounds = 30): number[] {
  let c = [...centre];
  let w = [...halfWidth];
  for (let r = 0; r < rounds; r++) {
    let best = -Infinity;
    let bestPoint = c;
    for (let i = -8; i <= 8; i++)
      for (let j = -8; j <= 8; j++)
        for (let k = -8; k <= 8; k++) {
          const p = [c[0] + (w[0] * i) / 8, c[1] + (w[1] * j) / 8, c[2] + (w[2] * k) / 8];
          if (p[2] <= 0) continue;
          const v = f(p);
          if (v > best) [best, bestPoint] = [v, p];
        }
    c = bestPoint;
    w = w.map((x) => x / 3);
  }
  return c;
}

/** The reference: brute-force censored maximum likelihood and the handbook's delta method on (μ, σ). */
function reference() {
  const f = ([b0, b1, tau]: number[]) => censoredLogLik(xs, ys, Math.log(0.3), Math.log(10), b0, b1, tau);
  const [b0, b1, tau] = gridMaximise3(f, [0.5, 1.2, 0.5], [1, 1, 0.45]);
  const v = inverse(numericHessian((p) => -f(p), [b0, b1, tau], 1e-5));
  const lnDec = Math.log(0.5);
  const mu = (lnDec - b0) / b1;
  const sigma = tau / b1;
  // Jacobian of (μ, σ) in (β0, β1, τ), then V(μ, σ) = J V Jᵀ.
  const J = [
    [-1 / b1, -mu / b1, 0],
    [0, -sigma / b1, 1 / b1],
  ];
  const vms = J.map((ri) => J.map((rj) => ri.reduce((s, a, p) => s + a * rj.reduce((t, b, q) => t + v[p][q] * b, 0), 0)));
  const sd = Math.sqrt(vms[0][0] + 2 * Z90 * vms[0][1] + Z90 * Z90 * vms[1][1]);
  return { b0, b1, tau, mu, sigma, a50: Math.exp(mu), a90: Math.exp(mu + Z90 * sigma), a9095: Math.exp(mu + Z90 * sigma + Z95 * sd) };
}

function analyse(options: SignalResponseOptions = OPTIONS): SignalResponseAnalysis {
  const result = analyseSignalResponse(data, options);
  if (!result.ok) throw new Error(result.reason);
  return result;
}

describe('signal-response POD against an independent computation', () => {
  it('when fitted with censoring at both ends, then β0, β1, τ, a50, a90 and the delta-method a90/95 match the brute-force reference', () => {
    const ref = reference();
    const result = analyse();
    expect(result.censoredBelow).toBe(3);
    expect(result.censoredAbove).toBe(3);
    expect(result.convergence.converged).toBe(true);
    expect(result.convergence.gradientNorm).toBeLessThan(1e-6);
    expect(result.parameters.beta0).toBeCloseTo(ref.b0, 5);
    expect(result.parameters.beta1).toBeCloseTo(ref.b1, 5);
    expect(result.parameters.tau).toBeCloseTo(ref.tau, 5);
    expect(result.pod.mu).toBeCloseTo(ref.mu, 5);
    expect(result.pod.sigma).toBeCloseTo(ref.sigma, 5);
    expect(result.a50Mm).toBeCloseTo(ref.a50, 5);
    expect(result.a90Mm).toBeCloseTo(ref.a90, 5);
    // The reference covariance comes from a finite-difference Hessian, so four decimals.
    expect(result.a9095Mm).toBeCloseTo(ref.a9095, 4);
    expect(result.a9095Mm).toBeGreaterThan(result.a90Mm);
  });

  it('when nothing is censored, then the fit is ordinary least squares with τ² = RSS/n (the textbook closed form)', () => {
    const result = analyse({ decisionThreshold: 0.5 });
    const n = xs.length;
    const mx = xs.reduce((a, b) => a + b) / n;
    const my = ys.reduce((a, b) => a + b) / n;
    const sxy = xs.reduce((s, x, i) => s + (x - mx) * (ys[i] - my), 0);
    const sxx = xs.reduce((s, x) => s + (x - mx) ** 2, 0);
    const b1 = sxy / sxx;
    const b0 = my - b1 * mx;
    const rss = xs.reduce((s, x, i) => s + (ys[i] - b0 - b1 * x) ** 2, 0);
    expect(result.parameters.beta1).toBeCloseTo(b1, 9);
    expect(result.parameters.beta0).toBeCloseTo(b0, 9);
    expect(result.parameters.tau).toBeCloseTo(Math.sqrt(rss / n), 9);
    // Textbook: with no censoring the inverse information of β is τ²(XᵀX)⁻¹, so Var(β1) = τ²/Sxx.
    expect(result.covariance[1][1]).toBeCloseTo(rss / n / sxx, 9);
  });

  it('when the decision threshold is set, then POD(a) = Φ((ln a − μ)/σ) gives 50 % at a50 and 90 % at a90', () => {
    const result = analyse();
    expect(signalPod(result, result.a50Mm)).toBeCloseTo(0.5, 10);
    expect(signalPod(result, result.a90Mm)).toBeCloseTo(0.9, 10);
  });

  it('when noise is given, then the false-call probability is the normal fit to ln(noise) and the empirical fraction is beside it', () => {
    const result = analyse();
    const logs = NOISE.map(Math.log);
    const m = logs.reduce((a, b) => a + b) / logs.length;
    const s = Math.sqrt(logs.reduce((a, b) => a + (b - m) ** 2, 0) / (logs.length - 1));
    // jstat 1.9.6 normal CDF as the reference.
    expect(result.falseCalls!.normalFitProbability!).toBeCloseTo(1 - jStat.normal.cdf(Math.log(0.5), m, s), 10);
    expect(result.falseCalls!.empiricalFraction).toBe(0);
    expect(result.falseCalls!.method).toMatch(/normal distribution fitted to ln\(noise\)/);
  });

  it('when the decision threshold rises, then the trade-off rows give larger a90/95 and fewer false calls', () => {
    const result = analyse();
    const rows = result.tradeOff;
    expect(rows.length).toBeGreaterThanOrEqual(5);
    expect(rows.some((r) => r.decisionThreshold === 0.5)).toBe(true);
    for (let i = 1; i < rows.length; i++) {
      expect(rows[i].a9095Mm).toBeGreaterThan(rows[i - 1].a9095Mm);
      expect(rows[i].falseCallProbability!).toBeLessThanOrEqual(rows[i - 1].falseCallProbability!);
    }
    const chosen = rows.find((r) => r.decisionThreshold === 0.5)!;
    expect(chosen.a9095Mm).toBeCloseTo(result.a9095Mm, 12);
  });

  it('when the diagnostics run, then residuals exist for uncensored points only and both checks report a statistic', () => {
    const result = analyse();
    expect(result.residuals.filter((r) => r.standardised !== null)).toHaveLength(42 - 6);
    expect(result.linearity.statistic).not.toBeNull();
    expect(result.constantVariance.statistic).not.toBeNull();
    // χ²₁(0.95) = 3.8415 (published tables).
    expect(result.linearity.criticalValue).toBeCloseTo(3.8414588207, 9);
  });
});

describe('signal-response refusals', () => {
  it('when the thresholds are inconsistent, then the analysis is refused with the reason', () => {
    expect(analyseSignalResponse(data, { decisionThreshold: 0.2, recordingThreshold: 0.3 })).toMatchObject({ ok: false, code: 'invalid_thresholds' });
    expect(analyseSignalResponse(data, { decisionThreshold: 12, saturation: 10 })).toMatchObject({ ok: false, code: 'invalid_thresholds' });
  });
  it('when almost everything is censored, then the analysis is refused', () => {
    expect(analyseSignalResponse(data, { decisionThreshold: 5.5, recordingThreshold: 5, saturation: 6 })).toMatchObject({ ok: false, code: 'too_few_uncensored' });
  });
  it('when a recorded signal is not positive, then the log model refuses it', () => {
    expect(analyseSignalResponse([...data, { sizeMm: 1, signal: 0 }], { decisionThreshold: 0.5 })).toMatchObject({ ok: false, code: 'non_positive_signal' });
  });
  it('when all signals come from one size, then the slope cannot be estimated', () => {
    expect(analyseSignalResponse([1, 1.2, 0.9].map((signal) => ({ sizeMm: 1, signal })), { decisionThreshold: 0.5 })).toMatchObject({ ok: false, code: 'too_few_sizes' });
  });
  it('when the signal falls with size, then there is no POD curve', () => {
    const falling = data.map((d) => ({ sizeMm: d.sizeMm, signal: 1 / d.signal }));
    expect(analyseSignalResponse(falling, { decisionThreshold: 0.5 })).toMatchObject({ ok: false, code: 'decreasing_with_size' });
  });
});

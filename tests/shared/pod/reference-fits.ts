// Independent reference computations for the POD tests: the likelihoods written out directly and
// maximised by brute force (zooming grids, golden-section search, bisection), sharing no code with
// the engine's Newton iterations, analytic derivatives or root finder. Normal functions from jstat 1.9.6.
import jstat from 'jstat';

const { jStat } = jstat;

export type Link = 'logit' | 'probit';

export function hitMissLogLik(link: Link, xs: number[], hits: number[], b0: number, b1: number): number {
  let l = 0;
  for (let i = 0; i < xs.length; i++) {
    const eta = b0 + b1 * xs[i];
    // P(miss) as F(−η): both links are symmetric, and this keeps ln P(miss) finite far in the tail.
    const F = (t: number) => (link === 'logit' ? 1 / (1 + Math.exp(-t)) : jStat.normal.cdf(t, 0, 1));
    l += Math.log(hits[i] ? F(eta) : F(-eta));
  }
  return l;
}

/** Maximises f over a box by repeated 41×41 grids, each a quarter the width of the last, centred on the best point. */
export function gridMaximise2(f: (a: number, b: number) => number, centre: [number, number], halfWidth: [number, number], rounds = 22): [number, number] {
  let [ca, cb] = centre;
  let [wa, wb] = halfWidth;
  for (let r = 0; r < rounds; r++) {
    let best = -Infinity;
    let bestA = ca;
    let bestB = cb;
    for (let i = -20; i <= 20; i++)
      for (let j = -20; j <= 20; j++) {
        const a = ca + (wa * i) / 20;
        const b = cb + (wb * j) / 20;
        const v = f(a, b);
        if (v > best) [best, bestA, bestB] = [v, a, b];
      }
    [ca, cb] = [bestA, bestB];
    wa /= 4;
    wb /= 4;
  }
  return [ca, cb];
}

/** Golden-section search for the maximum of a unimodal f on [lo, hi]. */
export function goldenMaximise(f: (x: number) => number, lo: number, hi: number, tolerance = 1e-12): { x: number; value: number } {
  const g = (Math.sqrt(5) - 1) / 2;
  let a = lo;
  let b = hi;
  let c = b - g * (b - a);
  let d = a + g * (b - a);
  let fc = f(c);
  let fd = f(d);
  while (b - a > tolerance * Math.max(1, Math.abs(a))) {
    if (fc > fd) {
      b = d;
      d = c;
      fd = fc;
      c = b - g * (b - a);
      fc = f(c);
    } else {
      a = c;
      c = d;
      fc = fd;
      d = a + g * (b - a);
      fd = f(d);
    }
  }
  const x = (a + b) / 2;
  return { x, value: f(x) };
}

/** Bisection for the root of f between lo (f < 0) and hi (f > 0). */
export function bisect(f: (x: number) => number, lo: number, hi: number): number {
  let a = lo;
  let b = hi;
  if (!(f(a) < 0 && f(b) > 0)) throw new Error('bisect: no sign change');
  for (let i = 0; i < 200 && b - a > 1e-13; i++) {
    const m = (a + b) / 2;
    if (f(m) > 0) b = m;
    else a = m;
  }
  return (a + b) / 2;
}

/** Central-difference Hessian of f at x. */
export function numericHessian(f: (v: number[]) => number, x: number[], h = 1e-4): number[][] {
  const n = x.length;
  const at = (di: number, dj: number, i: number, j: number) => {
    const v = [...x];
    v[i] += di;
    v[j] += dj;
    return f(v);
  };
  return Array.from({ length: n }, (_, i) =>
    Array.from({ length: n }, (_, j) => (at(h, h, i, j) - at(h, -h, i, j) - at(-h, h, i, j) + at(-h, -h, i, j)) / (4 * h * h)),
  );
}

/** Inverse of a symmetric matrix by Gauss–Jordan elimination (for 2×2 and 3×3 reference covariances). */
export function inverse(m: number[][]): number[][] {
  const n = m.length;
  const a = m.map((row, i) => [...row, ...Array.from({ length: n }, (_, j) => (i === j ? 1 : 0))]);
  for (let c = 0; c < n; c++) {
    const p = a[c][c];
    for (let k = 0; k < 2 * n; k++) a[c][k] /= p;
    for (let r = 0; r < n; r++) {
      if (r === c) continue;
      const f = a[r][c];
      for (let k = 0; k < 2 * n; k++) a[r][k] -= f * a[c][k];
    }
  }
  return a.map((row) => row.slice(n));
}

/** Log-likelihood of ln â = β0 + β1·ln a + N(0, τ²) with left-censoring at cL and right-censoring at cR (logs). */
export function censoredLogLik(xs: number[], ys: number[], cL: number, cR: number, b0: number, b1: number, tau: number): number {
  let l = 0;
  for (let i = 0; i < xs.length; i++) {
    const mu = b0 + b1 * xs[i];
    if (ys[i] <= cL) l += Math.log(jStat.normal.cdf((cL - mu) / tau, 0, 1));
    else if (ys[i] >= cR) l += Math.log(1 - jStat.normal.cdf((cR - mu) / tau, 0, 1));
    else l += Math.log(jStat.normal.pdf(ys[i], mu, tau));
  }
  return l;
}

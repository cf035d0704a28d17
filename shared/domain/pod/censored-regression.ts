// Normal linear regression with left- and right-censored responses (a Tobit model), fitted by
// maximum likelihood in θ = (β…, s) with τ = eˢ. Analytic score and Hessian; observed information.
import { logNormalCdf, millsRatio } from './distributions';
import { solve, type Matrix } from './linear-algebra';
import { maximise, type MaximiseResult, type Objective } from './maximise';

export type Censoring = 'none' | 'left' | 'right';

export interface CensoredObservation {
  /** Design row (1, x, …). */
  row: number[];
  /** The response; for a censored observation, the censoring limit. */
  y: number;
  censoring: Censoring;
}

const HALF_LOG_2PI = 0.5 * Math.log(2 * Math.PI);

/** ℓᵢ and its derivatives in (μ, s) for one observation. */
function contribution(obs: CensoredObservation, mu: number, s: number) {
  const tau = Math.exp(s);
  if (obs.censoring === 'none') {
    const z = (obs.y - mu) / tau;
    return { l: -s - HALF_LOG_2PI - 0.5 * z * z, lMu: z / tau, lS: -1 + z * z, lMuMu: -1 / (tau * tau), lMuS: (-2 * z) / tau, lSS: -2 * z * z };
  }
  if (obs.censoring === 'left') {
    // ℓ = ln Φ(z), z = (c − μ)/τ
    const z = (obs.y - mu) / tau;
    const lambda = millsRatio(z);
    const d2 = -lambda * (z + lambda);
    return { l: logNormalCdf(z), lMu: -lambda / tau, lS: -lambda * z, lMuMu: d2 / (tau * tau), lMuS: (d2 * z + lambda) / tau, lSS: d2 * z * z + lambda * z };
  }
  // Right: ℓ = ln Φ(w), w = (μ − c)/τ
  const w = (mu - obs.y) / tau;
  const lambda = millsRatio(w);
  const d2 = -lambda * (w + lambda);
  return { l: logNormalCdf(w), lMu: lambda / tau, lS: -lambda * w, lMuMu: d2 / (tau * tau), lMuS: -(d2 * w + lambda) / tau, lSS: d2 * w * w + lambda * w };
}

export function censoredObjective(data: CensoredObservation[]): Objective {
  const p = data[0].row.length;
  const muOf = (theta: number[], row: number[]) => row.reduce((acc, x, j) => acc + x * theta[j], 0);
  return {
    value(theta) {
      const s = theta[p];
      let l = 0;
      for (const obs of data) l += contribution(obs, muOf(theta, obs.row), s).l;
      return l;
    },
    derivatives(theta) {
      const s = theta[p];
      const k = p + 1;
      const gradient = new Array<number>(k).fill(0);
      const hessian: Matrix = Array.from({ length: k }, () => new Array<number>(k).fill(0));
      let value = 0;
      for (const obs of data) {
        const c = contribution(obs, muOf(theta, obs.row), s);
        value += c.l;
        for (let a = 0; a < p; a++) {
          gradient[a] += c.lMu * obs.row[a];
          for (let b = 0; b < p; b++) hessian[a][b] += c.lMuMu * obs.row[a] * obs.row[b];
          hessian[a][p] += c.lMuS * obs.row[a];
          hessian[p][a] += c.lMuS * obs.row[a];
        }
        gradient[p] += c.lS;
        hessian[p][p] += c.lSS;
      }
      return { value, gradient, hessian };
    },
  };
}

/** Least squares on the uncensored points as the starting value, then Newton. */
export function fitCensored(data: CensoredObservation[]): MaximiseResult {
  const p = data[0].row.length;
  const exact = data.filter((d) => d.censoring === 'none');
  const start = leastSquares(exact, p);
  return maximise(censoredObjective(data), start);
}

function leastSquares(data: CensoredObservation[], p: number): number[] {
  const xtx: Matrix = Array.from({ length: p }, () => new Array<number>(p).fill(0));
  const xty = new Array<number>(p).fill(0);
  for (const d of data)
    for (let a = 0; a < p; a++) {
      xty[a] += d.row[a] * d.y;
      for (let b = 0; b < p; b++) xtx[a][b] += d.row[a] * d.row[b];
    }
  // A tiny ridge keeps the start defined when the uncensored points alone are degenerate.
  for (let a = 0; a < p; a++) xtx[a][a] += 1e-9;
  const beta = solve(xtx, xty) ?? new Array<number>(p).fill(0);
  const residualSq = data.reduce((acc, d) => acc + (d.y - d.row.reduce((m, x, j) => m + x * beta[j], 0)) ** 2, 0);
  const variance = residualSq / Math.max(1, data.length - p);
  return [...beta, Math.log(Math.sqrt(Math.max(variance, 1e-6)))];
}

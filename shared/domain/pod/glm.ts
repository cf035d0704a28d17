// The binomial GLM behind hit/miss POD: P(hit) = F(η), η = Xβ, with F the logistic or the
// standard normal distribution function. Per-observation log-likelihood and its η-derivatives.
import { logNormalCdf, millsRatio, normalCdf, normalQuantile } from './distributions';
import type { Matrix } from './linear-algebra';
import type { Objective } from './maximise';

export type Link = 'logit' | 'probit';

export function inverseLink(link: Link, eta: number): number {
  return link === 'logit' ? 1 / (1 + Math.exp(-eta)) : normalCdf(eta);
}

export function linkQuantile(link: Link, p: number): number {
  return link === 'logit' ? Math.log(p / (1 - p)) : normalQuantile(p);
}

/** ln(1 + eᵗ) without overflow. */
function softplus(t: number): number {
  return t > 0 ? t + Math.log1p(Math.exp(-t)) : Math.log1p(Math.exp(t));
}

/** ℓᵢ and its first and second derivatives in η for one observation (hit = 1, miss = 0). */
export function contribution(link: Link, hit: boolean, eta: number): { l: number; d1: number; d2: number } {
  if (link === 'logit') {
    const p = 1 / (1 + Math.exp(-eta));
    return { l: (hit ? eta : 0) - softplus(eta), d1: (hit ? 1 : 0) - p, d2: -p * (1 - p) };
  }
  // Probit: ℓ = ln Φ(qη) with q = ±1, so both outcomes use the lower-tail-safe ln Φ and λ = φ/Φ.
  const q = hit ? 1 : -1;
  const z = q * eta;
  const lambda = millsRatio(z);
  return { l: logNormalCdf(z), d1: q * lambda, d2: -lambda * (z + lambda) };
}

export function glmObjective(link: Link, rows: number[][], hits: boolean[]): Objective {
  const etaOf = (theta: number[], row: number[]) => row.reduce((s, x, j) => s + x * theta[j], 0);
  return {
    value(theta) {
      let l = 0;
      for (let i = 0; i < rows.length; i++) l += contribution(link, hits[i], etaOf(theta, rows[i])).l;
      return l;
    },
    derivatives(theta) {
      const k = theta.length;
      const gradient = new Array<number>(k).fill(0);
      const hessian: Matrix = Array.from({ length: k }, () => new Array<number>(k).fill(0));
      let value = 0;
      for (let i = 0; i < rows.length; i++) {
        const row = rows[i];
        const c = contribution(link, hits[i], etaOf(theta, row));
        value += c.l;
        for (let a = 0; a < k; a++) {
          gradient[a] += c.d1 * row[a];
          for (let b = 0; b < k; b++) hessian[a][b] += c.d2 * row[a] * row[b];
        }
      }
      return { value, gradient, hessian };
    },
  };
}

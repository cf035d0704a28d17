// Maximises a smooth log-likelihood by Newton's method with step halving, falling back to a
// damped (Levenberg–Marquardt) step where the Hessian is not negative definite.
import { isPositiveDefinite, norm, solve, type Matrix } from './linear-algebra';

export interface Objective {
  /** ℓ(θ); −Infinity or NaN outside the domain. */
  value(theta: number[]): number;
  /** ℓ, its gradient and Hessian at θ. */
  derivatives(theta: number[]): { value: number; gradient: number[]; hessian: Matrix };
}

export interface Convergence {
  converged: boolean;
  iterations: number;
  /** Euclidean norm of the score (gradient of ℓ) at the solution. */
  gradientNorm: number;
  logLikelihood: number;
}

export interface MaximiseResult extends Convergence {
  theta: number[];
  /** Observed information −H at the solution. */
  information: Matrix;
}

export interface MaximiseOptions {
  maxIterations?: number;
  /** Converged when the Newton decrement gᵀ I⁻¹ g / 2 falls below this. */
  tolerance?: number;
}

export function maximise(objective: Objective, start: number[], options: MaximiseOptions = {}): MaximiseResult {
  const maxIterations = options.maxIterations ?? 200;
  const tolerance = options.tolerance ?? 1e-12;
  let theta = [...start];
  let current = objective.derivatives(theta);
  let iterations = 0;
  let converged = false;
  for (; iterations < maxIterations; iterations++) {
    const information = current.hessian.map((row) => row.map((v) => -v));
    const newton = isPositiveDefinite(information) ? solve(information, current.gradient) : null;
    if (newton) {
      const decrement = newton.reduce((s, d, i) => s + d * current.gradient[i], 0) / 2;
      if (decrement < tolerance) {
        // One last full Newton step: near the maximum it squares the remaining error.
        const candidate = theta.map((t, i) => t + newton[i]);
        const next = objective.derivatives(candidate);
        if (Number.isFinite(next.value) && next.value >= current.value - 1e-12 * Math.abs(current.value)) {
          theta = candidate;
          current = next;
        }
        converged = true;
        break;
      }
    }
    const step = newton ?? dampedStep(information, current.gradient);
    if (!step) break;
    let scale = 1;
    let accepted = false;
    for (let halvings = 0; halvings < 60; halvings++) {
      const candidate = theta.map((t, i) => t + scale * step[i]);
      const value = objective.value(candidate);
      if (Number.isFinite(value) && value >= current.value - 1e-12 * Math.abs(current.value)) {
        theta = candidate;
        accepted = true;
        break;
      }
      scale /= 2;
    }
    if (!accepted) break;
    current = objective.derivatives(theta);
  }
  const information = current.hessian.map((row) => row.map((v) => -v));
  if (!converged) {
    // A stalled line search at a point where the score is already negligible is a maximum too.
    converged = isPositiveDefinite(information) && norm(current.gradient) < 1e-6 * Math.max(1, Math.abs(current.value));
  }
  return { theta, information, converged, iterations, gradientNorm: norm(current.gradient), logLikelihood: current.value };
}

/** Solves (I + μ·diag) δ = g with μ raised until the damped matrix is positive definite. */
function dampedStep(information: Matrix, gradient: number[]): number[] | null {
  const scale = Math.max(1e-8, ...information.map((row, i) => Math.abs(row[i])));
  for (let mu = 1e-6 * scale; mu < 1e12 * scale; mu *= 10) {
    const damped = information.map((row, i) => row.map((v, j) => (i === j ? v + mu : v)));
    if (isPositiveDefinite(damped)) return solve(damped, gradient);
  }
  return null;
}

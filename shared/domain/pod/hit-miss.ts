// Hit/miss POD: a binomial GLM (logit or probit link) on ln(size) or size, fitted by maximum
// likelihood (Newton with step halving), a50 and a90, and a90/95 by the likelihood-ratio method
// with the Wald (delta-method) bound beside it, the methods of MIL-HDBK-1823A (2009).
import { chiSquareQuantile, normalQuantile } from './distributions';
import { contribution, glmObjective, inverseLink, linkQuantile, type Link } from './glm';
import { invert, quadraticForm, type Matrix } from './linear-algebra';
import { maximise, type Convergence } from './maximise';
import { findRoot } from './root-finding';
import { refuse, type PodCurvePoint, type PodOutcome, type SizeScale, type Warning } from './types';

export type { Link };

export interface HitMissObservation {
  sizeMm: number;
  hit: boolean;
}

export interface HitMissOptions {
  link?: Link;
  /** 'log' models ln(size) (the usual choice), 'linear' the size itself. */
  scale?: SizeScale;
}

/** Critical value of χ²₁ for a one-sided 95 % bound (two-sided 90 %): 2.7055. */
export const LR_CRITICAL_VALUE = chiSquareQuantile(0.9, 1);
/** z for a one-sided 95 % bound: 1.6449. */
export const Z_95 = normalQuantile(0.95);
/** The handbook's guidance on the number of flawed sites for a hit/miss demonstration (from memory). */
export const HIT_MISS_MIN_SPECIMENS = 60;

export interface HitMissResidual {
  sizeMm: number;
  hit: boolean;
  fittedPod: number;
  pearson: number;
  deviance: number;
}

export interface HitMissAnalysis {
  model: 'hit-miss';
  link: Link;
  scale: SizeScale;
  n: number;
  hits: number;
  distinctSizes: number;
  /** η = β0 + β1·x with x = ln(size in mm) or size in mm. */
  parameters: { beta0: number; beta1: number };
  /** Inverse observed information of (β0, β1). */
  covariance: Matrix;
  convergence: Convergence;
  a50Mm: number;
  a90Mm: number;
  /** Upper end of the one-sided 95 % profile-likelihood interval of a90; null when the data do not bound it. */
  a9095Mm: number | null;
  /** One-sided 95 % delta-method (Wald) bound on a90. */
  a9095WaldMm: number;
  lrCriticalValue: number;
  curve: PodCurvePoint[];
  residuals: HitMissResidual[];
  linearity: { statistic: number | null; criticalValue: number; note: string };
  warnings: Warning[];
}

const CURVE_PODS = [0.02, 0.05, 0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 0.95, 0.98, 0.99];

function toX(scale: SizeScale, sizeMm: number): number {
  return scale === 'log' ? Math.log(sizeMm) : sizeMm;
}

function toSize(scale: SizeScale, x: number): number {
  return scale === 'log' ? Math.exp(x) : x;
}

/** Refusals that need no fit: checked before anything is estimated. */
function checkData(data: HitMissObservation[], scale: SizeScale): ReturnType<typeof refuse> | null {
  if (data.length < 2) return refuse('too_few_observations', 'At least two observations are needed.');
  if (data.some((d) => !Number.isFinite(d.sizeMm))) return refuse('invalid_input', 'Every size must be a number.');
  if (scale === 'log' && data.some((d) => d.sizeMm <= 0))
    return refuse('non_positive_size', 'A log-size model needs every size greater than zero.');
  const hits = data.filter((d) => d.hit);
  const misses = data.filter((d) => !d.hit);
  if (misses.length === 0) return refuse('all_hits', 'Every flaw was found: the data hold no information on where detection falls off.');
  if (hits.length === 0) return refuse('all_misses', 'No flaw was found: the data hold no information on where detection rises.');
  const distinct = new Set(data.map((d) => d.sizeMm)).size;
  if (distinct < 2) return refuse('too_few_sizes', `Only ${distinct} distinct size for 2 parameters: the slope cannot be estimated.`);
  // With one covariate the maximum-likelihood estimate is finite exactly when the hits and misses
  // overlap in size both ways; otherwise a step function fits perfectly and β1 runs to infinity.
  const largestMiss = Math.max(...misses.map((d) => d.sizeMm));
  const smallestHit = Math.min(...hits.map((d) => d.sizeMm));
  if (largestMiss < smallestHit)
    return refuse(
      'complete_separation',
      `Every miss (largest ${largestMiss} mm) is smaller than every hit (smallest ${smallestHit} mm): the curve would be a step and its slope infinite. Add flaws in the transition region.`,
    );
  if (largestMiss === smallestHit)
    return refuse(
      'quasi_complete_separation',
      `Hits and misses overlap only at ${largestMiss} mm: the slope cannot be estimated. Add flaws in the transition region.`,
    );
  const largestHit = Math.max(...hits.map((d) => d.sizeMm));
  const smallestMiss = Math.min(...misses.map((d) => d.sizeMm));
  if (largestHit <= smallestMiss)
    return refuse('decreasing_with_size', 'Every hit is smaller than every miss: detection falls with size, which is not a POD curve.');
  return null;
}

export function analyseHitMiss(data: HitMissObservation[], options: HitMissOptions = {}): PodOutcome<HitMissAnalysis> {
  const link = options.link ?? 'logit';
  const scale = options.scale ?? 'log';
  const refused = checkData(data, scale);
  if (refused) return refused;

  const xs = data.map((d) => toX(scale, d.sizeMm));
  const hits = data.map((d) => d.hit);
  const hitRate = hits.filter(Boolean).length / hits.length;
  const fit = maximise(
    glmObjective(
      link,
      xs.map((x) => [1, x]),
      hits,
    ),
    [linkQuantile(link, hitRate), 0],
  );
  if (!fit.converged) return refuse('not_converged', `The fit did not converge in ${fit.iterations} iterations.`);
  const [beta0, beta1] = fit.theta;
  if (!(beta1 > 0)) return refuse('decreasing_with_size', 'The fitted probability of detection falls with size: no POD curve.');
  const covariance = invert(fit.information);
  if (!covariance) return refuse('not_converged', 'The information matrix is singular at the fit.');

  const xAt = (p: number) => (linkQuantile(link, p) - beta0) / beta1;
  const x90 = xAt(0.9);
  const waldX = (x: number) => x + Z_95 * Math.sqrt(quadraticForm(covariance, [1, x]) / (beta1 * beta1));
  const profile = profileBound(link, xs, hits, fit.logLikelihood, beta1);
  const x9095 = profile(0.9, x90, waldX(x90) - x90);

  const warnings: Warning[] = [];
  if (data.length < HIT_MISS_MIN_SPECIMENS)
    warnings.push({
      code: 'few_specimens',
      message: `${data.length} flawed sites: below the ${HIT_MISS_MIN_SPECIMENS} the handbook recommends for a hit/miss demonstration (from memory); the bound is wide and less reliable.`,
    });
  if (x9095 === null)
    warnings.push({
      code: 'no_upper_bound',
      message: 'The data do not bound a90/95 from above: no size can be claimed at 90 % POD with 95 % confidence.',
    });

  const linearity = linearityCheck(link, xs, hits, fit.logLikelihood);
  if (linearity.statistic !== null && linearity.statistic > linearity.criticalValue)
    warnings.push({ code: 'nonlinear', message: linearity.note });

  const curve = CURVE_PODS.map((p) => {
    const x = xAt(p);
    const bound = profile(p, x, waldX(x) - x);
    return { pod: p, sizeMm: toSize(scale, x), bound95SizeMm: bound === null ? null : toSize(scale, bound) };
  });

  return {
    ok: true,
    model: 'hit-miss',
    link,
    scale,
    n: data.length,
    hits: hits.filter(Boolean).length,
    distinctSizes: new Set(data.map((d) => d.sizeMm)).size,
    parameters: { beta0, beta1 },
    covariance,
    convergence: { converged: fit.converged, iterations: fit.iterations, gradientNorm: fit.gradientNorm, logLikelihood: fit.logLikelihood },
    a50Mm: toSize(scale, xAt(0.5)),
    a90Mm: toSize(scale, x90),
    a9095Mm: x9095 === null ? null : toSize(scale, x9095),
    a9095WaldMm: toSize(scale, waldX(x90)),
    lrCriticalValue: LR_CRITICAL_VALUE,
    curve,
    residuals: residuals(link, data, xs, beta0, beta1),
    linearity,
    warnings,
  };
}

/**
 * The likelihood-ratio bound: reparametrise η = q_p + β1·(x − θ), where θ is the x at which POD
 * reaches p and q_p = F⁻¹(p); profile ℓ over β1 > 0 for each θ, and find the θ above the estimate
 * where the deviance 2(ℓ̂ − ℓ_p(θ)) reaches the χ²₁ critical value. Returns null when it never does.
 */
function profileBound(link: Link, xs: number[], hits: boolean[], maxLogLik: number, beta1Hat: number) {
  /** The β1-score of ℓ(q + β1·(x − θ)) and its derivative. */
  const score = (q: number, theta: number, beta1: number) => {
    let d1 = 0;
    let d2 = 0;
    for (let i = 0; i < xs.length; i++) {
      const u = xs[i] - theta;
      const c = contribution(link, hits[i], q + beta1 * u);
      d1 += c.d1 * u;
      d2 += c.d2 * u * u;
    }
    return { d1, d2 };
  };
  const logLik = (q: number, theta: number, beta1: number) => {
    let l = 0;
    for (let i = 0; i < xs.length; i++) l += contribution(link, hits[i], q + beta1 * (xs[i] - theta)).l;
    return l;
  };
  // ℓ is concave in β1 for both links, so its maximum over β1 > 0 is at β1 → 0 when the score
  // there is not positive, and otherwise at the single root of the score: Newton's method kept
  // inside a bracket that shrinks at every step (bisection when Newton would leave it).
  // Successive calls move θ a little, so the last solution is a good start for the next.
  let warm = beta1Hat;
  const profileLogLik = (q: number, theta: number) => {
    if (score(q, theta, 0).d1 <= 0) return logLik(q, theta, 0);
    let lo = 0;
    let hi = Math.max(2 * warm, 1e-3);
    for (let k = 0; score(q, theta, hi).d1 > 0 && k < 200; k++) [lo, hi] = [hi, hi * 2];
    // An error of ε in β1 changes ℓ by O(ε²): 1e-10 relative is far below what the bound needs.
    let beta1 = warm > lo && warm < hi ? warm : (lo + hi) / 2;
    for (let k = 0; k < 100; k++) {
      const { d1, d2 } = score(q, theta, beta1);
      if (d1 > 0) lo = beta1;
      else hi = beta1;
      const newton = d2 < 0 ? beta1 - d1 / d2 : NaN;
      const next = newton > lo && newton < hi ? newton : (lo + hi) / 2;
      const done = Math.abs(next - beta1) < 1e-10 * beta1 || hi - lo < 1e-12;
      beta1 = next;
      if (done) break;
    }
    warm = beta1;
    return logLik(q, theta, beta1);
  };
  const span = Math.max(...xs) - Math.min(...xs);
  return (p: number, thetaHat: number, waldHalfWidth: number): number | null => {
    const q = linkQuantile(link, p);
    const excess = (theta: number) => 2 * (maxLogLik - profileLogLik(q, theta)) - LR_CRITICAL_VALUE;
    let step = Number.isFinite(waldHalfWidth) && waldHalfWidth > 0 ? waldHalfWidth / 2 : span / 10;
    let lo = thetaHat;
    const limit = Math.max(...xs) + 50 * span;
    for (let theta = thetaHat + step; theta < limit; theta = lo + step) {
      if (excess(theta) > 0) return findRoot(excess, lo, theta, 1e-12);
      lo = theta;
      step *= 2;
    }
    return null;
  };
}

function residuals(link: Link, data: HitMissObservation[], xs: number[], beta0: number, beta1: number): HitMissResidual[] {
  return data.map((d, i) => {
    const eta = beta0 + beta1 * xs[i];
    const p = inverseLink(link, eta);
    const y = d.hit ? 1 : 0;
    const l = contribution(link, d.hit, eta).l;
    return {
      sizeMm: d.sizeMm,
      hit: d.hit,
      fittedPod: p,
      pearson: (y - p) / Math.sqrt(p * (1 - p)),
      deviance: Math.sign(y - p) * Math.sqrt(Math.max(0, -2 * l)),
    };
  });
}

/** Compares the fit with one that adds x² by likelihood ratio (χ²₁, 95 %). */
function linearityCheck(link: Link, xs: number[], hits: boolean[], linearLogLik: number) {
  const criticalValue = chiSquareQuantile(0.95, 1);
  const mean = xs.reduce((s, x) => s + x, 0) / xs.length;
  // Centring x before squaring keeps the three columns far from collinear.
  const fit = maximise(
    glmObjective(
      link,
      xs.map((x) => [1, x - mean, (x - mean) ** 2]),
      hits,
    ),
    [0, 0, 0],
  );
  if (!fit.converged || new Set(xs).size < 3)
    return { statistic: null, criticalValue, note: 'A quadratic term could not be fitted to these data; linearity was not checked.' };
  const statistic = Math.max(0, 2 * (fit.logLikelihood - linearLogLik));
  return {
    statistic,
    criticalValue,
    note:
      statistic > criticalValue
        ? 'A quadratic term in size improves the fit significantly (5 % level): the model may not describe these data.'
        : 'A quadratic term in size does not improve the fit significantly (5 % level).',
  };
}

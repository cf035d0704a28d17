// Distribution functions the POD analyses need, from the stdlib project's packages
// (@stdlib/stats-base-dists-*: double-precision implementations, relative error near machine epsilon).
import normalCdfImpl from '@stdlib/stats-base-dists-normal-cdf';
import normalQuantileImpl from '@stdlib/stats-base-dists-normal-quantile';
import chiSquareQuantileImpl from '@stdlib/stats-base-dists-chisquare-quantile';
import betaQuantileImpl from '@stdlib/stats-base-dists-beta-quantile';

/** Φ(z), the standard normal distribution function. */
export function normalCdf(z: number): number {
  return normalCdfImpl(z, 0, 1);
}

/** φ(z), the standard normal density. */
export function normalPdf(z: number): number {
  return Math.exp(-0.5 * z * z) / Math.sqrt(2 * Math.PI);
}

/** Φ⁻¹(p). */
export function normalQuantile(p: number): number {
  return normalQuantileImpl(p, 0, 1);
}

/** The p quantile of χ² with `df` degrees of freedom. */
export function chiSquareQuantile(p: number, df: number): number {
  return chiSquareQuantileImpl(p, df);
}

/** The p quantile of the Beta(a, b) distribution. */
export function betaQuantile(p: number, a: number, b: number): number {
  return betaQuantileImpl(p, a, b);
}

/**
 * λ(z) = φ(z)/Φ(z), the inverse Mills ratio, without underflow: below z = −37 Φ(z) is
 * denormal, and the asymptotic series −z − 1/z + 2/z³ − 10/z⁵ is accurate to about 1e-10 there.
 */
export function millsRatio(z: number): number {
  if (z < -37) return -z - 1 / z + 2 / z ** 3 - 10 / z ** 5;
  return normalPdf(z) / normalCdf(z);
}

/** ln Φ(z), accurate in the lower tail (asymptotic expansion below z = −37, error about 1e-8). */
export function logNormalCdf(z: number): number {
  if (z < -37) return -0.5 * z * z - Math.log(-z) - 0.5 * Math.log(2 * Math.PI) + Math.log1p(-1 / z ** 2 + 3 / z ** 4);
  return Math.log(normalCdf(z));
}

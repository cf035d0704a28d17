// The false-call probability at a decision threshold from â measured on flaw-free sites.
import { normalCdf } from './distributions';

export interface FalseCallEstimate {
  decisionThreshold: number;
  n: number;
  /** 1 − Φ((ln â_dec − m)/s) with m and s the mean and sample standard deviation of ln(noise). */
  normalFitProbability: number | null;
  /** Fraction of the noise values at or above the threshold. */
  empiricalFraction: number;
  lnMean: number | null;
  lnSd: number | null;
  method: string;
}

export function falseCalls(noise: number[], decisionThreshold: number): FalseCallEstimate {
  const empiricalFraction = noise.filter((v) => v >= decisionThreshold).length / noise.length;
  const positive = noise.filter((v) => v > 0);
  const method =
    'A normal distribution fitted to ln(noise) (mean and sample standard deviation), with the empirical fraction of noise values at or above the threshold beside it.';
  if (positive.length < 2 || positive.length !== noise.length)
    return { decisionThreshold, n: noise.length, normalFitProbability: null, empiricalFraction, lnMean: null, lnSd: null, method };
  const logs = positive.map(Math.log);
  const lnMean = logs.reduce((a, b) => a + b, 0) / logs.length;
  const lnSd = Math.sqrt(logs.reduce((a, b) => a + (b - lnMean) ** 2, 0) / (logs.length - 1));
  const normalFitProbability = lnSd > 0 ? 1 - normalCdf((Math.log(decisionThreshold) - lnMean) / lnSd) : empiricalFraction;
  return { decisionThreshold, n: noise.length, normalFitProbability, empiricalFraction, lnMean, lnSd, method };
}

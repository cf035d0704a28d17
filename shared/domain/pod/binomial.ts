// Binomial demonstration: n trials at one size with k misses. The lower one-sided confidence bound
// on POD is the exact (Clopper–Pearson) bound: the p at which P(X ≥ hits | p) = 1 − confidence,
// which is the (1 − confidence) quantile of Beta(hits, misses + 1); for n of n it is (1 − C)^(1/n).
import { betaQuantile } from './distributions';

export interface BinomialDemonstration {
  model: 'binomial';
  trials: number;
  hits: number;
  misses: number;
  confidence: number;
  requiredPod: number;
  /** Lower confidence bound on POD. */
  podLowerBound: number;
  demonstrated: boolean;
  /** Fewest trials that would demonstrate the required POD with this many misses. */
  trialsNeededWithSameMisses: number;
}

export function lowerPodBound(hits: number, trials: number, confidence = 0.95): number {
  if (hits <= 0) return 0;
  if (hits === trials) return (1 - confidence) ** (1 / trials);
  return betaQuantile(1 - confidence, hits, trials - hits + 1);
}

export function trialsNeeded(misses: number, requiredPod = 0.9, confidence = 0.95): number {
  let n = misses + 1;
  while (lowerPodBound(n - misses, n, confidence) < requiredPod) n++;
  return n;
}

export function binomialDemonstration(hits: number, trials: number, options: { requiredPod?: number; confidence?: number } = {}): BinomialDemonstration {
  const requiredPod = options.requiredPod ?? 0.9;
  const confidence = options.confidence ?? 0.95;
  if (!Number.isInteger(hits) || !Number.isInteger(trials) || trials < 1 || hits < 0 || hits > trials)
    throw new RangeError('hits and trials must be whole numbers with 0 ≤ hits ≤ trials and trials ≥ 1');
  const podLowerBound = lowerPodBound(hits, trials, confidence);
  return {
    model: 'binomial',
    trials,
    hits,
    misses: trials - hits,
    confidence,
    requiredPod,
    podLowerBound,
    demonstrated: podLowerBound >= requiredPod,
    trialsNeededWithSameMisses: trialsNeeded(trials - hits, requiredPod, confidence),
  };
}

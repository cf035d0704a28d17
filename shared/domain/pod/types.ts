// Results of the probability-of-detection analyses. Sizes are in millimetres throughout.
import type { Convergence } from './maximise';

export type { Convergence };

/** Version of the POD analyses: stored with every analysis; raise it when a method or default changes. */
export const POD_ENGINE_VERSION = 1;

/** Why the data cannot give a result: a code for programs and a sentence for people. */
export interface PodRefusal {
  ok: false;
  code:
    | 'too_few_observations'
    | 'non_positive_size'
    | 'non_positive_signal'
    | 'all_hits'
    | 'all_misses'
    | 'too_few_sizes'
    | 'complete_separation'
    | 'quasi_complete_separation'
    | 'decreasing_with_size'
    | 'not_converged'
    | 'too_few_uncensored'
    | 'invalid_thresholds'
    | 'invalid_input';
  reason: string;
}

export type PodOutcome<T> = ({ ok: true } & T) | PodRefusal;

export function refuse(code: PodRefusal['code'], reason: string): PodRefusal {
  return { ok: false, code, reason };
}

export type SizeScale = 'log' | 'linear';

/** One point of a POD curve with its lower 95 % confidence bound (as the size at which the bound reaches `pod`). */
export interface PodCurvePoint {
  pod: number;
  sizeMm: number;
  /** Size at which POD reaches `pod` with 95 % confidence; null when the data do not bound it. */
  bound95SizeMm: number | null;
}

export interface Warning {
  code: 'few_specimens' | 'nonlinear' | 'non_constant_variance' | 'few_sizes' | 'wide_bound' | 'no_upper_bound' | 'not_converged';
  message: string;
}

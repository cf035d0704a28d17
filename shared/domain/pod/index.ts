export { analyseHitMiss, LR_CRITICAL_VALUE, HIT_MISS_MIN_SPECIMENS, type HitMissAnalysis, type HitMissObservation, type HitMissOptions, type Link } from './hit-miss';
export { analyseSignalResponse, signalPod, SIGNAL_RESPONSE_MIN_SPECIMENS, type SignalObservation, type SignalResponseAnalysis, type SignalResponseOptions, type TradeOffRow } from './signal-response';
export { binomialDemonstration, lowerPodBound, trialsNeeded, type BinomialDemonstration } from './binomial';
export { falseCalls, type FalseCallEstimate } from './false-calls';
export { inverseLink, linkQuantile } from './glm';
export { normalCdf, normalQuantile, chiSquareQuantile } from './distributions';
export { POD_ENGINE_VERSION, type PodOutcome, type PodRefusal, type PodCurvePoint, type Warning } from './types';

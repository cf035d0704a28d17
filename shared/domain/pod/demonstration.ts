// The analysis of a recorded demonstration: every inspector's call on every flaw is one
// observation (the inspections are pooled), with the flaw's size in the demonstration's dimension.
import type { PodDemonstrationData, PodModel } from '../../schemas/pod';
import { analyseHitMiss, type HitMissAnalysis } from './hit-miss';
import { analyseSignalResponse, type SignalResponseAnalysis } from './signal-response';
import type { PodOutcome } from './types';

export type DemonstrationAnalysis = PodOutcome<HitMissAnalysis> | PodOutcome<SignalResponseAnalysis>;

export function analyseDemonstration(model: PodModel, data: PodDemonstrationData): DemonstrationAnalysis {
  const sizeOf = new Map(data.specimens.map((s) => [s.flawId, s.sizeMm]));
  const results = data.inspections.flatMap((inspection) => inspection.results).filter((r) => sizeOf.has(r.flawId));
  if (model === 'hit-miss') {
    return analyseHitMiss(
      results.map((r) => ({ sizeMm: sizeOf.get(r.flawId)!, hit: r.hit === true })),
      { link: data.link },
    );
  }
  return analyseSignalResponse(
    results.map((r) => ({ sizeMm: sizeOf.get(r.flawId)!, signal: r.signal ?? 0 })),
    {
      decisionThreshold: data.decisionThreshold ?? NaN,
      recordingThreshold: data.recordingThreshold,
      saturation: data.saturation,
      noise: data.noise,
    },
  );
}

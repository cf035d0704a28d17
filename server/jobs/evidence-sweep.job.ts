// The evidence orphan sweep, every ten minutes: finishes interrupted moves to storage and
// removes temporary upload files nobody claims.
import { sweepEvidenceTemp } from '../services/evidence.service';
import type { ScheduledJob } from './scheduler';

export const evidenceSweepJob: ScheduledJob = {
  name: 'evidence-sweep',
  everySeconds: 10 * 60,
  async run(deps) {
    const result = await sweepEvidenceTemp(deps);
    if (result.finished || result.removed) deps.logger.info(`Evidence sweep: ${result.finished} move(s) finished, ${result.removed} leftover(s) removed`);
  },
};

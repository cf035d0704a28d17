// Anchors the trail's head outside the database at least once a day, whatever
// else happens (signatures anchor it too). The scheduler's row lock runs it on
// one app server at a time.
import { writeTrailAnchor } from '../services/trail-anchors';
import type { ScheduledJob } from './scheduler';

export const trailAnchorJob: ScheduledJob = {
  name: 'trail-anchor',
  everySeconds: 6 * 60 * 60,
  async run(deps) {
    await writeTrailAnchor(deps.sequelize, 'scheduled');
  },
};

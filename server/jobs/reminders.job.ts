// The reminders job: every source's reminders for today into the outbox, in
// the job's claimed transaction. Duplicates (same record, kind, day and
// person) are dropped by the outbox's unique key.
import { queueNotices } from '../mail/notice';
import { isoDay, reminderSources } from './reminder-sources';
import type { ScheduledJob } from './scheduler';

export const remindersJob: ScheduledJob = {
  name: 'reminders',
  everySeconds: 15 * 60,
  async run(deps, transaction, now) {
    const today = isoDay(now);
    for (const source of reminderSources()) {
      const reminders = await source.collect({ deps, transaction, now, today });
      if (!reminders.length) continue;
      await queueNotices(deps.sequelize, transaction, reminders, { publicUrl: deps.config.publicUrl, now });
    }
  },
};

// The jobs every app server schedules, and the reminder sources built in.
import { registerReminderSource } from './reminder-sources';
import { actionReminderSource, auditReminderSource, signoffReminderSource } from './workflow-reminders';
import { certificationReminderSource } from './certification-reminders.source';
import { remindersJob } from './reminders.job';
import { digestJob } from './digest.job';
import { evidenceSweepJob } from './evidence-sweep.job';
import { trailAnchorJob } from './trail-anchor.job';
import type { ScheduledJob } from './scheduler';

registerReminderSource(actionReminderSource);
registerReminderSource(signoffReminderSource);
registerReminderSource(auditReminderSource);
registerReminderSource(certificationReminderSource);

export const SCHEDULED_JOBS: ScheduledJob[] = [remindersJob, digestJob, evidenceSweepJob, trailAnchorJob];

export { createScheduler, type Scheduler, type ScheduledJob } from './scheduler';
export { registerReminderSource, type Reminder, type ReminderSource } from './reminder-sources';

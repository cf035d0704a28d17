// Reminder sources: each looks at its records for "today" and says who should
// be reminded of what. The reminders job turns every reminder into outbox
// rows inside its claimed transaction; the dedupe key (record, kind, day)
// makes each reminder go out once however often the job runs.
// Another feature adds a source with registerReminderSource(...) at start-up.
import type { Transaction } from 'sequelize';
import type { AppDeps } from '../app-deps';

export interface Reminder {
  kind: string;
  recordType: string;
  recordId: number;
  to: number[];
  subject: string;
  paragraphs: string[];
  /** Client path of the record. */
  path: string;
  linkLabel: string;
  /** Unique per record, kind and day, e.g. "action:12:overdue:2026-12-05". */
  dedupeKey: string;
}

export interface ReminderSourceContext {
  deps: AppDeps;
  transaction: Transaction;
  now: Date;
  /** The UTC calendar day of `now`, YYYY-MM-DD. */
  today: string;
}

export interface ReminderSource {
  name: string;
  collect(context: ReminderSourceContext): Promise<Reminder[]>;
}

const sources = new Map<string, ReminderSource>();

/** Adds (or replaces, by name) a source of reminders. */
export function registerReminderSource(source: ReminderSource): void {
  sources.set(source.name, source);
}

export function reminderSources(): ReminderSource[] {
  return [...sources.values()];
}

export function isoDay(date: Date): string {
  return date.toISOString().slice(0, 10);
}

/** Whole days from `from` to `to` (both YYYY-MM-DD); negative when `to` is earlier. */
export function daysBetween(from: string, to: string): number {
  return Math.round((Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / 86_400_000);
}

export function addDays(day: string, days: number): string {
  return isoDay(new Date(Date.parse(`${day}T00:00:00Z`) + days * 86_400_000));
}

// Periodic work shared by every app server. Each job is a row in
// scheduled_jobs; a tick claims the due rows with SELECT … FOR UPDATE SKIP
// LOCKED (raw SQL: Sequelize's skipLocked is dropped by the mariadb dialect),
// runs each job inside that same transaction and moves next_run_at on, so
// two servers ticking at once never run the same job twice. What a job writes
// (outbox rows) commits with the claim.
import { QueryTypes, type Transaction } from 'sequelize';
import type { AppDeps } from '../app-deps';

export interface ScheduledJob {
  name: string;
  /** Seconds between runs. */
  everySeconds: number;
  run(deps: AppDeps, transaction: Transaction, now: Date): Promise<void>;
}

export interface Scheduler {
  /** Runs every job that is due now; resolves with the names of the jobs this call ran. */
  tick(): Promise<string[]>;
  start(intervalSeconds: number): void;
  stop(): Promise<void>;
}

export function createScheduler(deps: AppDeps, jobs: ScheduledJob[], { onRan }: { onRan?: (names: string[]) => void } = {}): Scheduler {
  const { sequelize, clock, logger } = deps;
  let timer: NodeJS.Timeout | undefined;
  let current: Promise<string[]> | null = null;
  let registered = false;

  async function register(now: Date) {
    if (registered) return;
    for (const job of jobs) {
      await sequelize.query('INSERT IGNORE INTO scheduled_jobs (name, next_run_at, run_count) VALUES (?, ?, 0)', {
        replacements: [job.name, now],
      });
    }
    registered = true;
  }

  async function runJob(job: ScheduledJob): Promise<boolean> {
    return sequelize.transaction(async (transaction) => {
      const now = clock.now();
      const claimed = await sequelize.query<{ name: string }>(
        'SELECT name FROM scheduled_jobs WHERE name = ? AND next_run_at <= ? FOR UPDATE SKIP LOCKED',
        { replacements: [job.name, now], type: QueryTypes.SELECT, transaction },
      );
      if (!claimed.length) return false;
      await job.run(deps, transaction, now);
      await sequelize.query(
        'UPDATE scheduled_jobs SET next_run_at = ?, last_run_at = ?, last_error = NULL, run_count = run_count + 1 WHERE name = ?',
        { replacements: [new Date(now.getTime() + job.everySeconds * 1000), now, job.name], transaction },
      );
      return true;
    });
  }

  async function tickOnce(): Promise<string[]> {
    await register(clock.now());
    const ran: string[] = [];
    for (const job of jobs) {
      try {
        if (await runJob(job)) ran.push(job.name);
      } catch (error) {
        logger.error(`Scheduled job ${job.name} failed; it runs again at the next tick`, error);
        await sequelize
          .query('UPDATE scheduled_jobs SET last_error = ? WHERE name = ?', { replacements: [String((error as Error)?.message ?? error).slice(0, 2000), job.name] })
          .catch(() => undefined);
      }
    }
    if (ran.length) onRan?.(ran);
    return ran;
  }

  return {
    tick() {
      // One tick at a time per process; another process ticks on its own and the row locks keep them apart.
      current ??= tickOnce().finally(() => (current = null));
      return current;
    },
    start(intervalSeconds) {
      if (timer) return;
      timer = setInterval(() => void this.tick().catch((error) => logger.error('Scheduler tick failed', error)), intervalSeconds * 1000);
      timer.unref();
      void this.tick().catch((error) => logger.error('Scheduler tick failed', error));
    },
    async stop() {
      if (timer) clearInterval(timer);
      timer = undefined;
      await current?.catch(() => undefined);
    },
  };
}

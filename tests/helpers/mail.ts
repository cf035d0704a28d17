// Mail in API tests: the same local SMTP fake and outbox worker the server
// runs, started per test file, and small waits on what the fake caught.
import { QueryTypes } from 'sequelize';
import { Op } from 'sequelize';
import { CaughtMail, OutboxMessage } from '../../server/models';
import { startMail, type MailRuntime } from '../../server/mail';
import type { TestContext } from './test-app';

export async function startTestMail(context: TestContext): Promise<MailRuntime> {
  return startMail(context.deps, { scheduler: false, pollMs: 100 });
}

export async function waitFor<T>(probe: () => Promise<T | null | undefined | false>, { timeoutMs = 10_000, what = 'condition' } = {}): Promise<T> {
  const started = Date.now();
  for (;;) {
    const value = await probe();
    if (value) return value;
    if (Date.now() - started > timeoutMs) throw new Error(`Timed out waiting for ${what}`);
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}

/** Messages the fake caught for one address, oldest first. */
export async function caughtFor(address: string): Promise<CaughtMail[]> {
  const all = await CaughtMail.findAll({ order: [['id', 'ASC']] });
  return all.filter((mail) => mail.envelopeTo.includes(address));
}

/** Outbox rows about one record, optionally of one kind. */
export async function outboxFor(recordType: string, recordId: number, kind?: string): Promise<OutboxMessage[]> {
  return OutboxMessage.findAll({
    where: { recordType, recordId: String(recordId), ...(kind ? { kind } : {}) },
    order: [['id', 'ASC']],
  });
}

/** Every outbox row has been sent or is waiting for a retry: nothing is due now. */
export async function outboxSettled(now: Date): Promise<boolean> {
  return (await OutboxMessage.count({ where: { status: 'pending', nextAttemptAt: { [Op.lte]: now } } })) === 0;
}

/** Makes every scheduled job due again (tests move the clock back and forth). */
export async function makeJobsDue(context: TestContext): Promise<void> {
  await context.deps.sequelize.query(`UPDATE scheduled_jobs SET next_run_at = '2000-01-01'`, { type: QueryTypes.UPDATE });
}

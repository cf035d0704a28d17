// Sends what the outbox holds. A worker claims a batch of due rows with
// SELECT … FOR UPDATE SKIP LOCKED and a short lease (so two app servers never
// send the same row), sends each outside any transaction, then marks it sent
// or schedules a retry with exponential backoff. The Message-ID derives from
// the outbox id, so a receiver can recognise a resend after a crash.
import { QueryTypes } from 'sequelize';
import type { Transporter } from 'nodemailer';
import type { AppDeps } from '../app-deps';
import { OutboxMessage } from '../models';

const BATCH = 20;
const LEASE_MS = 2 * 60_000;
const BACKOFF_BASE_MS = 30_000;
const BACKOFF_MAX_MS = 60 * 60_000;

/** 30 s, 1 min, 2 min, … capped at an hour. */
export function backoffMs(attempts: number): number {
  return Math.min(BACKOFF_MAX_MS, BACKOFF_BASE_MS * 2 ** Math.max(0, attempts - 1));
}

export function messageIdFor(outboxId: number): string {
  return `<outbox-${outboxId}@whorl.local>`;
}

export interface OutboxWorker {
  /** Sends every due message once; resolves with how many were sent. */
  runOnce(): Promise<{ sent: number; failed: number }>;
  /** Asks for a run soon (after a commit that queued mail); never throws. */
  kick(): void;
  start(intervalMs: number): void;
  stop(): Promise<void>;
}

export function createOutboxWorker(deps: AppDeps, transport: Transporter): OutboxWorker {
  const { sequelize, config, logger, clock } = deps;
  let running: Promise<{ sent: number; failed: number }> | null = null;
  let again = false;
  let timer: NodeJS.Timeout | undefined;
  let stopped = false;

  async function claim(): Promise<number[]> {
    return sequelize.transaction(async (transaction) => {
      const now = clock.now();
      const rows = await sequelize.query<{ id: number }>(
        `SELECT id FROM outbox_messages
          WHERE status = 'pending' AND next_attempt_at <= ? AND (locked_until IS NULL OR locked_until < ?)
          ORDER BY id LIMIT ${BATCH} FOR UPDATE SKIP LOCKED`,
        { replacements: [now, now], type: QueryTypes.SELECT, transaction },
      );
      const ids = rows.map((row) => Number(row.id));
      if (ids.length) {
        await OutboxMessage.update({ lockedUntil: new Date(now.getTime() + LEASE_MS) }, { where: { id: ids }, transaction });
      }
      return ids;
    });
  }

  async function sendOne(id: number): Promise<boolean> {
    const message = await OutboxMessage.findByPk(id);
    if (!message || message.status !== 'pending') return false;
    try {
      await transport.sendMail({
        from: config.mail.from,
        to: message.toAddress,
        subject: message.subject,
        text: message.textBody,
        html: message.htmlBody,
        messageId: messageIdFor(message.id),
        headers: { 'X-Whorl-Kind': message.kind },
      });
      await OutboxMessage.update({ status: 'sent', sentAt: clock.now(), lockedUntil: null, lastError: null }, { where: { id } });
      return true;
    } catch (error) {
      const attempts = message.attempts + 1;
      const reason = error instanceof Error ? error.message : String(error);
      await OutboxMessage.update(
        { attempts, nextAttemptAt: new Date(clock.now().getTime() + backoffMs(attempts)), lockedUntil: null, lastError: reason.slice(0, 2000) },
        { where: { id } },
      );
      logger.info(`Outbox ${id}: sending failed (attempt ${attempts}), retrying later: ${reason}`);
      return false;
    }
  }

  async function drain(): Promise<{ sent: number; failed: number }> {
    let sent = 0;
    let failed = 0;
    for (;;) {
      const ids = await claim();
      if (!ids.length) break;
      for (const id of ids) {
        if (await sendOne(id)) sent += 1;
        else failed += 1;
      }
      // A failed row waits for its backoff; stop when a whole batch failed (the server is down).
      if (failed && !sent) break;
    }
    return { sent, failed };
  }

  function runOnce(): Promise<{ sent: number; failed: number }> {
    if (running) {
      again = true;
      return running;
    }
    running = drain().finally(() => {
      running = null;
      if (again && !stopped) {
        again = false;
        void runOnce().catch((error) => logger.error('Outbox run failed', error));
      }
    });
    return running;
  }

  return {
    runOnce,
    kick() {
      if (stopped) return;
      void runOnce().catch((error) => logger.error('Outbox run failed', error));
    },
    start(intervalMs) {
      if (timer) return;
      timer = setInterval(() => void runOnce().catch((error) => logger.error('Outbox run failed', error)), intervalMs);
      timer.unref();
    },
    async stop() {
      stopped = true;
      if (timer) clearInterval(timer);
      timer = undefined;
      await running?.catch(() => undefined);
    },
  };
}

// The e-mail side of the workflows' effects seam (server/services/effects.ts):
// in the transaction, the notices for the effects go into the outbox; after
// commit, the outbox worker of this process is woken to send them.
import type { Sequelize } from 'sequelize';
import type { EffectSink } from '../services/effects';
import { noticesForEffects } from './effect-notices';
import { queueNotices } from './notice';
import type { OutboxWorker } from './outbox-worker';

const workers = new WeakMap<Sequelize, OutboxWorker>();

/** The worker that sends for this database pool in this process (set by startMail). */
export function registerOutboxWorker(sequelize: Sequelize, worker: OutboxWorker | null): void {
  if (worker) workers.set(sequelize, worker);
  else workers.delete(sequelize);
}

/** Wakes this process's sender, if it has one; otherwise another app server's worker picks the mail up. */
export function kickOutbox(sequelize: Sequelize): void {
  workers.get(sequelize)?.kick();
}

export const mailEffectSink: EffectSink = {
  async inTransaction(transaction, effects, context) {
    const { sequelize, config, clock } = context.deps;
    const notices = await noticesForEffects(sequelize, transaction, effects, context);
    if (notices.length) await queueNotices(sequelize, transaction, notices, { publicUrl: config.publicUrl, now: clock.now(), exceptUserId: context.actorId });
  },
  async afterCommit(_effects, context) {
    kickOutbox(context.deps.sequelize);
  },
};

// The seam between record transitions and their side effects (e-mail, later
// perhaps webhooks). A transition returns the names of the effects its machine
// executed (see machines/*.machine.ts for what each one means); the event
// service hands them here twice:
//
//   inTransaction(t, effects, ctx)  inside the transaction, before commit: write
//                                   outbox rows here so a message exists exactly
//                                   when the change does (nothing lost if the mail
//                                   server is down, nothing sent for a rollback).
//   afterCommit(effects, ctx)       after commit: wake a sender, never throws into
//                                   the request (errors are logged and swallowed).
//
// Both are no-ops by default. The e-mail contributor registers a sink with
// `setEffectSink(...)` at start-up (or a test does); nothing else is needed.
import type { Transaction } from 'sequelize';
import type { AppDeps } from '../app-deps';

export type EffectRecordType = 'audit' | 'finding' | 'action';

export interface EffectContext {
  deps: AppDeps;
  /** Who caused the transition (null for server-sent events). */
  actorId: number | null;
  recordType: EffectRecordType;
  recordId: number;
  /** The event that caused the effects (e.g. 'SUBMIT', 'ACTION_VERIFIED'). */
  event: string;
  /** The record's state after the event. */
  state: string;
  /** The machine context after the event (reasons, due dates, class). */
  context: Record<string, unknown>;
}

export interface EffectBatch {
  /** Effect names, in the order the machine executed them. */
  effects: string[];
  context: EffectContext;
}

export interface EffectSink {
  inTransaction(transaction: Transaction, effects: string[], context: EffectContext): Promise<void>;
  afterCommit(effects: string[], context: EffectContext): Promise<void>;
}

export const noEffects: EffectSink = {
  async inTransaction() {},
  async afterCommit() {},
};

let sink: EffectSink = noEffects;

/** Installs the sink every later transition uses; returns the previous one (tests restore it). */
export function setEffectSink(next: EffectSink): EffectSink {
  const previous = sink;
  sink = next;
  return previous;
}

export function effectSink(): EffectSink {
  return sink;
}

/** Hands every batch to the sink inside the transaction. */
export async function runEffectsInTransaction(transaction: Transaction, batches: EffectBatch[]): Promise<void> {
  for (const batch of batches) {
    if (batch.effects.length) await sink.inTransaction(transaction, batch.effects, batch.context);
  }
}

/** Hands every batch to the sink after commit; a failure is logged, never turned into a failed request. */
export async function runEffectsAfterCommit(batches: EffectBatch[]): Promise<void> {
  for (const batch of batches) {
    if (!batch.effects.length) continue;
    try {
      await sink.afterCommit(batch.effects, batch.context);
    } catch (error) {
      batch.context.deps.logger.error(`After-commit effects of ${batch.context.recordType} ${batch.context.recordId} failed`, error);
    }
  }
}

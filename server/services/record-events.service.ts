// The one place a workflow record changes state. In one transaction:
//   load the row FOR UPDATE → role rule on the loaded record (403) → restore the
//   machine and apply the event with the server's facts (422 with the reason)
//   → version check (409) → signing password for signed events (401) → save
//   fields, snapshot, version + 1 and a trail entry → the cross-record event
//   (VERIFY → ACTION_VERIFIED to the finding; NOT_EFFECTIVE → REOPEN to the
//   action) → effects.inTransaction. After commit: effects.afterCommit.
// A transaction chosen as a deadlock victim is run again from the start.
// A wrong signing password rolls everything back; the failure is then counted
// toward the sign-in lockout and written to the trail in a transaction of its own.
import type { Model, Transaction } from 'sequelize';
import {
  applyEvent,
  persistSnapshot,
  recordMachines,
  restoreRecordSnapshot,
  SnapshotRestoreError,
  type RecordKind,
} from '../../machines';
import type { AnyMachineSnapshot, AnyStateMachine } from 'xstate';
import type { AppDeps } from '../app-deps';
import type { AppAbility } from '../../shared/abilities';
import type { Role } from '../../shared/roles';
import { AppError, forbidden, notAllowedNow, notFound, staleVersion } from '../lib/app-error';
import { CorrectiveAction, User } from '../models';
import { verifyPassword } from '../auth/passwords';
import { accountLockPolicy, registerFailure } from '../auth/sign-in.service';
import { appendTrail, recordTrail } from './trail.service';
import { snapshotIssuedFindings } from './audit-issue-snapshot';
import { recordSignature } from './signatures.service';
import { writeTrailAnchor } from './trail-anchors';
import { runEffectsAfterCommit, runEffectsInTransaction, type EffectBatch } from './effects';
import { loadFindingDuePolicy } from './workflow-policy';
import {
  LABELS,
  SETTLED_FINDING_STATES,
  factsForMany,
  loadForUpdate,
  relatedIdsFor,
  signedMeaning,
  subjectFor,
  type WorkflowRow,
} from './workflow/record-kinds';
import { assignFields, fieldsAfter } from './workflow/record-fields';
import { refusalReason } from './workflow/refusal-reasons';
import { stateLabel, trailEventLabel } from '../../shared/labels';
import { retryOnDeadlock } from './workflow/retry';

export interface EventActor {
  id: number;
  displayName: string;
  roles: readonly Role[];
}

export interface RecordEventInput {
  type: string;
  version: number;
  password?: string;
  [key: string]: unknown;
}

/** The role a signature is given under: the first the signer holds of those that may sign this event. */
const SIGNING_ROLES: Record<string, Role[]> = {
  'audit:ISSUE': ['quality_manager'],
  'finding:CLOSE': ['accountable_manager'],
  'action:VERIFY': ['quality_manager', 'auditor'],
};

const TRAIL_TYPES: Record<RecordKind, string> = { audit: 'audit', finding: 'finding', action: 'action' };

class SigningPasswordRefused extends Error {}

/** Fields that say nothing about what was signed (they change on every save). */
const VOLATILE_FIELDS = new Set(['snapshot', 'version', 'updatedAt', 'machineVersion']);

function signedContent(kind: RecordKind, row: WorkflowRow, event: string, meaning: string) {
  const fields = Object.fromEntries(
    Object.entries(row.get({ plain: true }) as Record<string, unknown>)
      .filter(([key]) => !VOLATILE_FIELDS.has(key))
      .map(([key, value]) => [key, value instanceof Date ? value.toISOString() : value]),
  );
  return { recordType: kind, event, meaning, record: fields };
}

function restore(kind: RecordKind, row: WorkflowRow): AnyMachineSnapshot {
  try {
    return restoreRecordSnapshot(kind, row.snapshot, row.machineVersion) as unknown as AnyMachineSnapshot;
  } catch (error) {
    if (error instanceof SnapshotRestoreError) {
      throw new AppError(`This ${LABELS[kind]} needs a data migration before it can change: ${error.message}`, {
        status: 409,
        code: 'snapshot_incompatible',
      });
    }
    throw error;
  }
}

interface TransitionResult {
  batch: EffectBatch;
  changes: Record<string, unknown>;
}

/** Applies an already-checked event: saves fields, snapshot, version + 1 and the trail entry. */
async function persistTransition(
  deps: AppDeps,
  transaction: Transaction,
  args: {
    kind: RecordKind;
    row: WorkflowRow;
    snapshot: AnyMachineSnapshot;
    event: { type: string; [key: string]: unknown };
    actorId: number | null;
    now: Date;
    extraTrail?: Record<string, unknown>;
  },
): Promise<TransitionResult | null> {
  const { kind, row, event, now } = args;
  const machine = recordMachines[kind].machine as AnyStateMachine;
  const applied = applyEvent(machine, args.snapshot as never, event as never);
  if (!applied.changed) return null;
  const policy = await loadFindingDuePolicy(deps.sequelize, transaction);
  const nextContext = (applied.snapshot as AnyMachineSnapshot).context as Record<string, unknown>;
  const fieldChanges = assignFields(row, {
    state: applied.state,
    ...fieldsAfter(kind, row, { state: applied.state, context: nextContext, eventType: event.type, now, policy }),
  });
  const model = row as unknown as Model;
  model.set('snapshot', persistSnapshot(machine, applied.snapshot as never));
  model.set('machineVersion', recordMachines[kind].version);
  model.changed('snapshot' as keyof Model, true);
  await model.save({ transaction });
  if (kind === 'audit' && event.type === 'ISSUE') await snapshotIssuedFindings(deps.sequelize, transaction, row.id, now);
  const changes = { ...fieldChanges, ...(args.extraTrail ?? {}) };
  await appendTrail(deps.sequelize, transaction, {
    userId: args.actorId,
    recordType: TRAIL_TYPES[kind],
    recordId: row.id,
    event: event.type,
    changes,
    at: now,
  });
  return {
    changes,
    batch: {
      effects: applied.effects,
      context: {
        deps,
        actorId: args.actorId,
        recordType: kind,
        recordId: row.id,
        event: event.type,
        state: applied.state,
        context: nextContext,
      },
    },
  };
}

/** Sends a server-only event (never from a request) to a related record in the same transaction. */
async function sendServerEvent(
  deps: AppDeps,
  transaction: Transaction,
  kind: RecordKind,
  id: number,
  event: { type: string; [key: string]: unknown },
  causedBy: { actorId: number; kind: RecordKind; id: number; event: string },
  now: Date,
): Promise<EffectBatch> {
  const row = await loadForUpdate(kind, id, transaction);
  if (!row) throw notFound(LABELS[kind]);
  const snapshot = restore(kind, row);
  const result = await persistTransition(deps, transaction, {
    kind,
    row,
    snapshot,
    event,
    actorId: causedBy.actorId,
    now,
    extraTrail: { causedBy: `${causedBy.event} on ${TRAIL_TYPES[causedBy.kind]} ${causedBy.id}` },
  });
  if (!result) {
    throw notAllowedNow(`The linked ${LABELS[kind]} cannot take “${trailEventLabel(kind, event.type)}” while it is ${stateLabel(String(snapshot.value)).toLowerCase()}`);
  }
  return result.batch;
}

/** The machine event: the request's payload without version and password, plus the server's facts. */
function machineEvent(input: RecordEventInput, facts: Record<string, unknown>): { type: string; [key: string]: unknown } {
  const { version: _version, password: _password, ...payload } = input;
  return Object.keys(facts).length ? { ...payload, facts } : payload;
}

export async function applyRecordEvent(
  deps: AppDeps,
  { actor, ability, kind, id, input }: { actor: EventActor; ability: AppAbility; kind: RecordKind; id: number; input: RecordEventInput },
): Promise<void> {
  const { sequelize } = deps;
  const now = deps.clock.now();
  const meaning = signedMeaning(kind, input.type);
  const batches: EffectBatch[] = [];
  try {
    // A deadlock victim was rolled back whole (outbox inserts of concurrent transitions can meet on the
    // dedupe index's gap locks): run it again from the start, with nothing kept from the failed attempt.
    await retryOnDeadlock(() => sequelize.transaction(async (transaction) => {
      batches.length = 0;
      const row = await loadForUpdate(kind, id, transaction);
      if (!row) throw notFound(LABELS[kind]);
      const related = await relatedIdsFor(kind, row, transaction);
      if (!ability.can(input.type, subjectFor(kind, row, related))) {
        throw forbidden(`You may not ${input.type} this ${LABELS[kind]}`);
      }

      const snapshot = restore(kind, row);
      const needsFacts =
        (kind === 'audit' && input.type === 'CLOSE') ||
        (kind === 'action' && input.type === 'SUBMIT') ||
        (kind === 'finding' && input.type === 'RECORD_CONTAINMENT');
      const facts = needsFacts ? ((await factsForMany(kind, [row.id], transaction, now)).get(row.id) ?? {}) : {};
      const event = machineEvent(input, needsFacts ? facts : {});
      const machine = recordMachines[kind].machine as AnyStateMachine;
      if (!applyEvent(machine, snapshot as never, event as never).changed) {
        throw notAllowedNow(refusalReason(kind, snapshot, event), { state: row.state, event: input.type });
      }
      if (row.version !== input.version) throw staleVersion();

      let extraTrail: Record<string, unknown> | undefined;
      let signatureContent: unknown;
      if (meaning) {
        const signer = await User.findByPk(actor.id, { attributes: ['id', 'passwordHash', 'failedSignIns'], transaction });
        if (!(await verifyPassword(signer?.passwordHash ?? null, input.password ?? ''))) throw new SigningPasswordRefused();
        // A right password ends a run of failures, as at sign-in.
        if (signer!.failedSignIns > 0) await User.update({ failedSignIns: 0 }, { where: { id: actor.id }, transaction });
        signatureContent = signedContent(kind, row, input.type, meaning);
      }
      if (meaning) {
        const roleKey = `${kind}:${input.type}`;
        const role = (SIGNING_ROLES[roleKey] ?? []).find((candidate) => actor.roles.includes(candidate)) ?? actor.roles[0];
        const signature = await recordSignature(transaction, {
          recordType: kind,
          recordId: row.id,
          event: input.type,
          signer: actor,
          role,
          meaning,
          signedAt: now,
          content: signatureContent,
        });
        extraTrail = { signature: { id: signature.id, meaning, role, contentHash: signature.contentHash } };
      }

      const result = await persistTransition(deps, transaction, { kind, row, snapshot, event, actorId: actor.id, now, extraTrail });
      if (!result) throw notAllowedNow(refusalReason(kind, snapshot, event));
      batches.push(result.batch);

      const causedBy = { actorId: actor.id, kind, id: row.id, event: input.type };
      if (result.batch.effects.includes('markFindingActionVerified')) {
        const action = row as CorrectiveAction;
        batches.push(await sendServerEvent(deps, transaction, 'finding', action.findingId, { type: 'ACTION_VERIFIED' }, causedBy, now));
      }
      if (result.batch.effects.includes('requestReopenOfAction')) {
        const action = await CorrectiveAction.findOne({ where: { findingId: row.id }, attributes: ['id'], transaction });
        if (!action) throw notAllowedNow('This finding has no corrective action to reopen');
        const reason = String(result.batch.context.context.notEffectiveReason ?? input.reason ?? '');
        batches.push(await sendServerEvent(deps, transaction, 'action', action.id, { type: 'REOPEN', reason }, causedBy, now));
      }
      await runEffectsInTransaction(transaction, batches);
    }));
  } catch (error) {
    if (error instanceof SigningPasswordRefused) {
      await registerFailure(sequelize, actor.id, accountLockPolicy(deps.config), 'signature', deps.clock.now());
      await recordTrail(sequelize, {
        userId: actor.id,
        recordType: TRAIL_TYPES[kind],
        recordId: id,
        event: 'SIGNATURE_REFUSED',
        changes: { attempted: input.type, reason: 'wrong password; nothing was changed' },
      });
      throw new AppError('The password is not right; nothing was signed or changed', { status: 401, code: 'signature_password_invalid' });
    }
    throw error;
  }
  await runEffectsAfterCommit(batches);
  // Every signature anchors the trail outside the database; a failed anchor never undoes the signature.
  if (meaning) await writeTrailAnchor(sequelize, 'signature').catch((error) => deps.logger.error('Could not write the trail anchor after a signature', error));
}

export { SETTLED_FINDING_STATES };

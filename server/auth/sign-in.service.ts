// Credential checks with a temporary, growing lockout, counted in the database
// so every app server sees the same counts. Used by passport's local strategy
// and by electronic signatures (a wrong signing password counts too).
//
// Only a failed credential counts (a malformed request never reaches here).
// Per account: ACCOUNT_LOCK_THRESHOLD failures in a row lock it for 1 minute,
// the next lock 2, then 4 … up to ACCOUNT_LOCK_MAX_MINUTES; a right password
// after the lock ends starts afresh. Nobody, the last administrator included,
// is locked for good, and `npm run unlock -- EMAIL` lifts a lock at once.
// Per address: SIGNIN_RATE_LIMIT failures inside SIGNIN_RATE_WINDOW_MINUTES
// pause sign-in from that address the same growing way (answered with 429).
import { QueryTypes, type Sequelize } from 'sequelize';
import { User } from '../models';
import { verifyPassword } from './passwords';
import { appendTrail } from '../services/trail.service';
import { userIncludes } from '../services/user-loader';
import type { AppConfig } from '../config/env';

export interface LockPolicy {
  threshold: number;
  maxLockMinutes: number;
}

export interface SignInDeps {
  sequelize: Sequelize;
  config: AppConfig;
  clock: { now(): Date };
}

/** A run of locks is forgotten a day after the last one ended. */
const LOCKOUT_MEMORY_MS = 24 * 3_600_000;

export type CredentialResult = { ok: true; user: User } | { ok: false };

export function accountLockPolicy(config: AppConfig): LockPolicy {
  return { threshold: config.signIn.lockThreshold, maxLockMinutes: config.signIn.maxLockMinutes };
}

/** The e-mail as stored: trimmed and case-folded. */
export function normaliseEmail(email: string): string {
  return email.trim().toLowerCase();
}

/** Minutes the n-th lock in a row lasts: 1, 2, 4 … capped. */
export function lockMinutes(lockouts: number, maxLockMinutes: number): number {
  return Math.min(2 ** Math.max(0, lockouts - 1), maxLockMinutes);
}

export function isLocked(lockedUntil: Date | null | undefined, now: Date): boolean {
  return Boolean(lockedUntil && lockedUntil.getTime() > now.getTime());
}

/**
 * Checks an e-mail and password. Whatever is wrong (unknown e-mail, wrong
 * password, deactivated or temporarily locked account) the answer is the same
 * `{ ok: false }`, after the same password hashing work.
 */
export async function checkCredentials(
  { sequelize, config, clock }: SignInDeps,
  { email, password, address }: { email: string; password: string; address: string },
): Promise<CredentialResult> {
  const user = await User.findOne({ where: { email: normaliseEmail(email) }, include: userIncludes });
  const valid = await verifyPassword(user?.passwordHash ?? null, password);
  const now = clock.now();
  const locked = isLocked(user?.lockedUntil, now);
  if (user && valid && user.active && !locked) {
    if (user.failedSignIns > 0 || user.lockouts > 0 || user.lockedUntil) {
      await User.update({ failedSignIns: 0, lockouts: 0, lockedUntil: null }, { where: { id: user.id } });
    }
    return { ok: true, user };
  }
  // The right password of a locked or deactivated account is no failure to count.
  if (!valid) {
    await registerAddressFailure(sequelize, config, address, now);
    if (user && !locked) await registerFailure(sequelize, user.id, accountLockPolicy(config), 'sign-in', now);
  }
  return { ok: false };
}

/** Counts a failed password of an account atomically; the failure that reaches the threshold locks it for a while. */
export async function registerFailure(sequelize: Sequelize, userId: number, policy: LockPolicy, purpose: 'sign-in' | 'signature', now = new Date()) {
  await sequelize.transaction(async (transaction) => {
    const user = await User.findByPk(userId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!user) return;
    const failures = user.failedSignIns + 1;
    const forgotten = user.lockedUntil && now.getTime() - user.lockedUntil.getTime() > LOCKOUT_MEMORY_MS;
    const previousLockouts = forgotten ? 0 : user.lockouts;
    const lock = failures >= policy.threshold;
    const lockouts = lock ? previousLockouts + 1 : previousLockouts;
    const minutes = lockMinutes(lockouts, policy.maxLockMinutes);
    const lockedUntil = lock ? new Date(now.getTime() + minutes * 60_000) : user.lockedUntil;
    await User.update({ failedSignIns: lock ? 0 : failures, lockouts, lockedUntil }, { where: { id: userId }, transaction });
    await appendTrail(sequelize, transaction, {
      userId,
      recordType: 'user',
      recordId: userId,
      event: purpose === 'signature' ? 'SIGNATURE_PASSWORD_FAILED' : 'SIGN_IN_FAILED',
      changes: { failedSignIns: { before: user.failedSignIns, after: failures } },
    });
    if (lock) {
      await appendTrail(sequelize, transaction, {
        userId,
        recordType: 'user',
        recordId: userId,
        event: 'ACCOUNT_LOCKED',
        changes: {
          lockedUntil: { before: user.lockedUntil?.toISOString() ?? null, after: lockedUntil!.toISOString() },
          reason: `${failures} failed passwords in a row; locked for ${minutes} minute${minutes === 1 ? '' : 's'}`,
        },
      });
    }
  });
}

interface AddressRow {
  failures: number;
  lockouts: number;
  locked_until: Date | null;
  last_failed_at: Date;
}

/** When sign-in from this address is paused, the time it resumes; otherwise null. */
export async function addressLockedUntil(sequelize: Sequelize, address: string, now: Date): Promise<Date | null> {
  const [row] = await sequelize.query<{ locked_until: Date | null }>('SELECT locked_until FROM sign_in_address_failures WHERE address = ?', {
    replacements: [address],
    type: QueryTypes.SELECT,
  });
  return row && isLocked(row.locked_until, now) ? row.locked_until : null;
}

async function registerAddressFailure(sequelize: Sequelize, config: AppConfig, address: string, now: Date) {
  const windowMs = config.signIn.rateWindowMinutes * 60_000;
  await sequelize.transaction(async (transaction) => {
    await sequelize.query('INSERT IGNORE INTO sign_in_address_failures (address, failures, lockouts, locked_until, last_failed_at) VALUES (?, 0, 0, NULL, ?)', {
      replacements: [address, now],
      transaction,
    });
    const [row] = await sequelize.query<AddressRow>('SELECT failures, lockouts, locked_until, last_failed_at FROM sign_in_address_failures WHERE address = ? FOR UPDATE', {
      replacements: [address],
      type: QueryTypes.SELECT,
      transaction,
    });
    const stale = now.getTime() - new Date(row.last_failed_at).getTime() > windowMs;
    const forgotten = row.locked_until && now.getTime() - new Date(row.locked_until).getTime() > LOCKOUT_MEMORY_MS;
    const failures = (stale ? 0 : row.failures) + 1;
    const lock = failures >= config.signIn.rateLimit;
    const lockouts = (forgotten ? 0 : row.lockouts) + (lock ? 1 : 0);
    const lockedUntil = lock ? new Date(now.getTime() + lockMinutes(lockouts, config.signIn.maxLockMinutes) * 60_000) : row.locked_until;
    await sequelize.query('UPDATE sign_in_address_failures SET failures = ?, lockouts = ?, locked_until = ?, last_failed_at = ? WHERE address = ?', {
      replacements: [lock ? 0 : failures, lockouts, lockedUntil, now, address],
      transaction,
    });
    // Addresses quiet for a day are forgotten, a few rows at a time.
    await sequelize.query('DELETE FROM sign_in_address_failures WHERE last_failed_at < ? AND address <> ? LIMIT 20', {
      replacements: [new Date(now.getTime() - LOCKOUT_MEMORY_MS), address],
      transaction,
    });
  });
}

/** Lifts an account's lock and forgets its failures (an administrator's unlock, or `npm run unlock`). */
export async function clearAccountLock(sequelize: Sequelize, userId: number, actorId: number | null): Promise<boolean> {
  return sequelize.transaction(async (transaction) => {
    const user = await User.findByPk(userId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!user) return false;
    if (!user.lockedUntil && !user.lockedAt && user.failedSignIns === 0 && user.lockouts === 0) return false;
    const before = { lockedUntil: user.lockedUntil?.toISOString() ?? null, failedSignIns: user.failedSignIns };
    await User.update({ lockedAt: null, lockedUntil: null, failedSignIns: 0, lockouts: 0 }, { where: { id: userId }, transaction });
    await appendTrail(sequelize, transaction, {
      userId: actorId,
      recordType: 'user',
      recordId: userId,
      event: 'ACCOUNT_UNLOCKED',
      changes: {
        lockedUntil: { before: before.lockedUntil, after: null },
        failedSignIns: { before: before.failedSignIns, after: 0 },
        ...(actorId === null ? { by: 'the unlock command on the server' } : {}),
      },
    });
    return true;
  });
}

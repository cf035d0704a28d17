// Credential checks with per-account lockout. Used by passport's local strategy
// and again by electronic signatures (a wrong signing password counts too).
import type { Sequelize } from 'sequelize';
import { User } from '../models';
import { verifyPassword } from './passwords';
import { appendTrail } from '../services/trail.service';
import { userIncludes } from '../services/user-loader';

export type CredentialResult =
  | { ok: true; user: User }
  | { ok: false; reason: 'invalid' | 'locked' | 'inactive' };

export async function checkCredentials(
  sequelize: Sequelize,
  { email, password, lockThreshold, purpose }: { email: string; password: string; lockThreshold: number; purpose: 'sign-in' | 'signature' },
): Promise<CredentialResult> {
  const user = await User.findOne({ where: { email: email.toLowerCase() }, include: userIncludes });
  const valid = await verifyPassword(user?.passwordHash ?? null, password);
  if (!user) return { ok: false, reason: 'invalid' };
  if (user.lockedAt) return { ok: false, reason: 'locked' };
  if (!user.active) return { ok: false, reason: 'inactive' };
  if (valid) {
    if (user.failedSignIns > 0) await User.update({ failedSignIns: 0 }, { where: { id: user.id } });
    return { ok: true, user };
  }
  await registerFailure(sequelize, user.id, lockThreshold, purpose);
  return { ok: false, reason: 'invalid' };
}

/** Counts a failed password atomically; the failure that reaches the threshold locks the account. */
export async function registerFailure(sequelize: Sequelize, userId: number, lockThreshold: number, purpose: string) {
  await sequelize.transaction(async (transaction) => {
    const user = await User.findByPk(userId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!user) return;
    const failures = user.failedSignIns + 1;
    const lock = failures >= lockThreshold && !user.lockedAt;
    await User.update(
      { failedSignIns: failures, ...(lock ? { lockedAt: new Date() } : {}) },
      { where: { id: userId }, transaction },
    );
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
        changes: { lockedAt: { before: null, after: new Date().toISOString() }, reason: `${failures} consecutive failed passwords` },
      });
    }
  });
}

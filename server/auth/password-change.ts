// A person choosing their own password (always allowed, and required after an
// administrator set one). The current password is checked like a sign-in (a
// wrong one counts toward the lock); every other session of theirs ends.
import type { AppDeps } from '../app-deps';
import { User } from '../models';
import { AppError } from '../lib/app-error';
import { hashPassword, verifyPassword } from './passwords';
import { passwordProblem } from './password-policy';
import { accountLockPolicy, registerFailure } from './sign-in.service';
import { endSessionsOf } from './session-revocation';
import { appendTrail } from '../services/trail.service';
import type { PasswordChangeInput } from '../../shared/schemas/user';

const fieldError = (path: string, message: string, status = 400) =>
  new AppError('Some body fields are not valid', { status, code: 'invalid_input', details: [{ path, message }] });

export async function changeOwnPassword(
  { sequelize, config, clock }: AppDeps,
  { userId, sid }: { userId: number; sid: string },
  input: PasswordChangeInput,
): Promise<void> {
  const user = await User.findByPk(userId);
  if (!user) throw new AppError('Sign in first', { status: 401, code: 'unauthenticated' });
  if (!(await verifyPassword(user.passwordHash, input.currentPassword))) {
    await registerFailure(sequelize, userId, accountLockPolicy(config), 'sign-in', clock.now());
    throw fieldError('currentPassword', 'this is not your current password', 422);
  }
  const problem = passwordProblem(input.newPassword, { email: user.email });
  if (problem) throw fieldError('newPassword', problem);
  if (await verifyPassword(user.passwordHash, input.newPassword)) throw fieldError('newPassword', 'choose a password different from the current one');
  const passwordHash = await hashPassword(input.newPassword);
  await sequelize.transaction(async (transaction) => {
    const locked = await User.findByPk(userId, { transaction, lock: transaction.LOCK.UPDATE });
    locked!.passwordHash = passwordHash;
    locked!.passwordChangeRequired = false;
    await locked!.save({ transaction });
    await appendTrail(sequelize, transaction, {
      userId,
      recordType: 'user',
      recordId: userId,
      event: 'PASSWORD_CHANGED',
      changes: { password: { before: '(set)', after: '(changed by its holder)' } },
    });
    await endSessionsOf(sequelize, userId, { exceptSid: sid, transaction });
  });
}

import { Area, RoleAssignment, User } from '../models';
import type { SessionUser } from '../../shared/types/session';

export const userIncludes = [
  { model: RoleAssignment, as: 'roleAssignments', attributes: ['role'] },
  { model: Area, as: 'area', attributes: ['id', 'name'] },
];

export function toSessionUser(user: User): SessionUser {
  return {
    id: user.id,
    email: user.email,
    displayName: user.displayName,
    roles: user.roles,
    areaId: user.areaId,
    areaName: user.area?.name ?? null,
    passwordChangeRequired: user.passwordChangeRequired,
  };
}

/**
 * The signed-in person, or null when the account is gone or deactivated. A
 * temporary sign-in lock (failed passwords, perhaps someone else's) leaves
 * sessions already open alone: it only refuses new sign-ins.
 */
export async function loadActiveSessionUser(id: number): Promise<SessionUser | null> {
  const user = await User.findByPk(id, { include: userIncludes });
  if (!user || !user.active) return null;
  return toSessionUser(user);
}

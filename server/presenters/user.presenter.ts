import type { User } from '../models';
import type { UserView } from '../../shared/schemas/user';

export function presentUser(user: User): UserView {
  return {
    id: user.id,
    email: user.email,
    displayName: user.displayName,
    roles: user.roles,
    areaId: user.areaId,
    areaName: user.area?.name ?? null,
    active: user.active,
    locked: Boolean(user.lockedAt),
    mailDigest: user.mailDigest,
    version: user.version,
  };
}

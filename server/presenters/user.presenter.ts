import type { User } from '../models';
import type { UserView } from '../../shared/schemas/user';

/** Who reads: lock state and a pending password change are for administrators only. */
export interface UserAudience {
  administrator: boolean;
  now: Date;
}

export function presentUser(user: User, audience: UserAudience = { administrator: false, now: new Date() }): UserView {
  const view: UserView = {
    id: user.id,
    email: user.email,
    displayName: user.displayName,
    roles: user.roles,
    areaId: user.areaId,
    areaName: user.area?.name ?? null,
    active: user.active,
    mailDigest: user.mailDigest,
    version: user.version,
  };
  if (!audience.administrator) return view;
  const locked = Boolean(user.lockedUntil && user.lockedUntil.getTime() > audience.now.getTime());
  return { ...view, locked, lockedUntil: locked ? user.lockedUntil!.toISOString() : null, passwordChangeRequired: user.passwordChangeRequired };
}

import type { User } from '../models';
import type { PersonRef } from '../../shared/schemas/workflow';

export const personRef = (user: User | null | undefined): PersonRef | null =>
  user ? { id: user.id, displayName: user.displayName } : null;

export const iso = (date: Date | null | undefined): string | null => (date ? date.toISOString() : null);

/** Today's ISO date in UTC, for overdue flags. */
export const todayIso = (now: Date): string => now.toISOString().slice(0, 10);

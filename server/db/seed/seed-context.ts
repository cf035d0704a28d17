import type { Sequelize } from 'sequelize';
import type { Role } from '../../../shared/roles';

export const DEMO_PASSWORD = 'whorl-demo-2026';

/** What each seed step leaves for the next: ids by a stable key. */
export interface SeedContext {
  sequelize: Sequelize;
  now: Date;
  users: Record<string, { id: number; displayName: string; roles: Role[] }>;
  areas: Record<string, { id: number; name: string }>;
  /** Free-form ids later steps may need (techniques by code, audits by key, …). */
  refs: Record<string, number>;
}

export type SeedStep = (context: SeedContext) => Promise<void>;

import type { Sequelize } from 'sequelize';
import type { Role } from '../../../shared/roles';
import type { AppConfig } from '../../config/env';

export const DEMO_PASSWORD = 'whorl-demo-2026';

/** What each seed step leaves for the next: ids by a stable key. */
export interface SeedContext {
  sequelize: Sequelize;
  now: Date;
  users: Record<string, { id: number; displayName: string; roles: Role[] }>;
  areas: Record<string, { id: number; name: string }>;
  /** Free-form ids later steps may need (techniques by code, audits by key, …). */
  refs: Record<string, number>;
  /** The app's configuration, when seeding for a real run: evidence bytes then go to its storage. */
  config?: AppConfig;
}

export type SeedStep = (context: SeedContext) => Promise<void>;

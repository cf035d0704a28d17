// Seeds the demo scenario into an empty database. Each step is a file of its
// own; a feature that brings demo records adds its step to the list.
import { configureTrail } from '../../services/trail-anchors';
import type { Sequelize } from 'sequelize';
import { initModels, User } from '../../models';
import { seedPeople } from './people.seed';
import { seedTechniques } from './techniques.seed';
import { seedRegisters } from './registers.seed';
import { seedInspections } from './inspections.seed';
import { seedWorkflows } from './workflows.seed';
import { seedPodDemonstrations } from './pod.seed';
import { seedOrganisation } from './organisation.seed';
import type { SeedContext, SeedStep } from './seed-context';
import type { AppConfig } from '../../config/env';

export const seedSteps: SeedStep[] = [seedOrganisation, seedPeople, seedTechniques, seedRegisters, seedInspections, seedWorkflows, seedPodDemonstrations];

export async function isDatabaseEmpty(sequelize: Sequelize): Promise<boolean> {
  initModels(sequelize);
  return (await User.count()) === 0;
}

export async function seedDemo(
  sequelize: Sequelize,
  { now = new Date(), config }: { now?: Date; config?: AppConfig } = {},
): Promise<SeedContext> {
  initModels(sequelize);
  // The demo's trail entries are keyed and its signatures anchored like any others.
  if (config) configureTrail(config);
  const context: SeedContext = { sequelize, now, users: {}, areas: {}, refs: {}, config };
  for (const step of seedSteps) await step(context);
  return context;
}

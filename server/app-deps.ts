import type { Sequelize } from 'sequelize';
import type { AppConfig } from './config/env';
import type { Logger } from './lib/logger';

/** What route factories and services are given; built once in createApp's caller. */
export interface AppDeps {
  config: AppConfig;
  sequelize: Sequelize;
  logger: Logger;
  /** The clock every due-date and reminder computation reads, so tests can move time. */
  clock: { now(): Date };
}

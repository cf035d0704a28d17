import { Sequelize } from 'sequelize';
import type { AppConfig } from '../config/env';

export interface DatabaseOptions {
  url: string;
  poolMax?: number;
  logging?: boolean;
  /** Longest wait for a pooled connection (including opening one) before the request fails with 503. */
  acquireTimeoutMs?: number;
  /** Longest silence on a connection with a query in flight before the driver gives up on it. */
  queryTimeoutMs?: number;
}

/** One Sequelize instance per process; UTC everywhere (Sequelize sets the connection time zone). */
export function createSequelize({ url, poolMax = 20, logging = false, acquireTimeoutMs = 2_000, queryTimeoutMs = 10_000 }: DatabaseOptions): Sequelize {
  return new Sequelize(url, {
    dialect: 'mariadb',
    logging: logging ? (sql) => console.log(sql) : false,
    timezone: '+00:00',
    // A stopped (not dead) server accepts TCP connections and never answers: every
    // wait is bounded so that requests end in 503 instead of hanging.
    // The driver's socketTimeout also ends a connection that merely sits idle that
    // long, so idle connections leave the pool well before (eviction runs every second).
    pool: { max: poolMax, min: 0, acquire: acquireTimeoutMs, idle: Math.min(10_000, Math.floor(queryTimeoutMs / 2)) },
    dialectOptions: {
      connectTimeout: Math.min(acquireTimeoutMs, 5_000),
      // The mariadb driver destroys a connection whose socket stays silent this long,
      // query in flight or not (its queryTimeout is a server-side limit, useless when
      // the server is stopped).
      socketTimeout: queryTimeoutMs,
    },
    define: { underscored: true },
  });
}

/** The application's pool, with the configured size and bounded waits. */
export function createAppSequelize(config: AppConfig): Sequelize {
  return createSequelize({
    url: config.databaseUrl,
    poolMax: config.databasePoolMax,
    acquireTimeoutMs: config.database.acquireTimeoutMs,
    queryTimeoutMs: config.database.queryTimeoutMs,
  });
}

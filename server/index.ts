// Listens. Everything the server needs is built here from the configuration.
import http from 'node:http';
import { fileURLToPath } from 'node:url';
import path from 'node:path';
import type { Sequelize } from 'sequelize';
import { createApp } from './app';
import { createLogger } from './lib/logger';
import type { AppConfig } from './config/env';
import type { AppDeps } from './app-deps';
import { createAppSequelize } from './db/sequelize';
import { startMail, type MailRuntime } from './mail';

export const CLIENT_DIR = path.resolve(fileURLToPath(new URL('.', import.meta.url)), '../dist');

export interface RunningServer {
  server: http.Server;
  deps: AppDeps;
  url: string;
  /** Outbox worker, scheduler and (without SMTP_URL) the local SMTP fake. */
  mail: MailRuntime;
  close(): Promise<void>;
}

export async function startServer(
  config: AppConfig,
  { sequelize = createAppSequelize(config), clientDir = CLIENT_DIR }: { sequelize?: Sequelize; clientDir?: string } = {},
): Promise<RunningServer> {
  const logger = createLogger(config.logLevel);
  const deps: AppDeps = { config, sequelize, logger, clock: { now: () => new Date() } };
  const app = createApp(deps, { clientDir });
  const mail = await startMail(deps);
  const server = http.createServer(app);
  // Bounded waits: a slow client or a stuck request cannot hold a socket forever.
  server.requestTimeout = 60_000;
  server.headersTimeout = 20_000;
  server.keepAliveTimeout = 5_000;
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(config.port, config.host, () => resolve());
  });
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : config.port;
  const url = `http://${config.host}:${port}`;
  // PORT=0 picks a free port: without PUBLIC_URL the public address is known only now.
  if (new URL(config.publicUrl).port === '0') config.publicUrl = url;
  return {
    server,
    deps,
    url,
    mail,
    async close() {
      await new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      });
      await mail.stop();
      app.close();
      await sequelize.close();
    },
  };
}

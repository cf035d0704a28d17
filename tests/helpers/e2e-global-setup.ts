// Browser tests run against the real server serving a fresh production build of
// the client, on its own database seeded with the demo scenario.
import { mkdirSync, rmSync } from 'node:fs';
import path from 'node:path';
import type { TestProject } from 'vitest/node';
import { build } from 'vite';
import { startTestDatabase } from './test-database';
import { loadConfig } from '../../server/config/env';
import { createSequelize } from '../../server/db/sequelize';
import { seedDemo } from '../../server/db/seed';
import { startServer } from '../../server/index';

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
    e2eDatabaseSocket: string;
    outputDir: string;
  }
}

const ROOT = path.resolve(import.meta.dirname, '../..');

export default async function setup(project: TestProject) {
  // A build of its own per run, so a concurrent `npm start` or another run never sees a half-written dist/.
  const clientDir = path.join(ROOT, '.data', `e2e-client-${process.pid}-${Date.now()}`);
  const evidenceDir = path.join(ROOT, '.data', `e2e-evidence-${process.pid}-${Date.now()}`);
  await build({ root: ROOT, logLevel: 'error', build: { outDir: clientDir, emptyOutDir: true } });

  const database = await startTestDatabase('e2e');
  const sequelize = createSequelize({ url: database.instance.url, poolMax: 20 });
  let running: Awaited<ReturnType<typeof startServer>> | undefined;
  try {
    const config = loadConfig({
      NODE_ENV: 'test',
      HOST: '127.0.0.1',
      PORT: '0',
      DATABASE_URL: database.instance.url,
      SESSION_SECRET: 'e2e-session-secret-that-is-long-enough',
      LOG_LEVEL: 'error',
      SIGNIN_RATE_LIMIT: '1000',
      SCHEDULER: 'false',
      STORAGE_DIR: evidenceDir,
    });
    await seedDemo(sequelize, { config });
    running = await startServer(config, { sequelize, clientDir });
  } catch (error) {
    await sequelize.close().catch(() => undefined);
    await database.stop();
    rmSync(clientDir, { recursive: true, force: true });
    rmSync(evidenceDir, { recursive: true, force: true });
    throw error;
  }

  const outputDir = path.join(ROOT, 'tests', 'output');
  mkdirSync(outputDir, { recursive: true });
  project.provide('baseUrl', running.url);
  project.provide('e2eDatabaseSocket', database.instance.socket);
  project.provide('outputDir', outputDir);

  return async () => {
    await running?.close();
    await database.stop();
    rmSync(clientDir, { recursive: true, force: true });
    rmSync(evidenceDir, { recursive: true, force: true });
  };
}

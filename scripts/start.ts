// npm start: a private MariaDB on loopback (unless DATABASE_URL is set),
// migrations, demo data on an empty database, a fresh client build, then the
// server. Ctrl-C stops the server and the database it started.
import path from 'node:path';
import { loadConfig } from '../server/config/env';
import { startLocalMariadb, type LocalInstance } from '../server/db/local-mariadb';
import { createAppSequelize } from '../server/db/sequelize';
import { excessPrivileges, migrateWithAccounts } from '../server/db/privileges';
import { configureTrail, writeTrailAnchor } from '../server/services/trail-anchors';
import { isDatabaseEmpty, seedDemo } from '../server/db/seed';
import { startServer } from '../server/index';
import { ensureClientBuilt } from './lib/client-build';
import { DATA_DIR, localSessionSecret } from './lib/local-config';

async function main() {
  let database: LocalInstance | undefined;
  const env: Record<string, string | undefined> = { ...process.env };
  if (!env.DATABASE_URL) {
    const port = Number(env.DB_PORT ?? 3307);
    console.log(`Starting MariaDB on 127.0.0.1:${port} (data in .data/mariadb)…`);
    database = await startLocalMariadb({ dir: path.join(DATA_DIR, 'mariadb'), port, database: 'whorl' });
    env.DATABASE_URL = database.url;
    env.DATABASE_OWNER_URL = database.ownerUrl;
  }
  env.SESSION_SECRET ??= localSessionSecret();
  env.NODE_ENV ??= 'production';
  const config = loadConfig(env);

  // Migrations as the owner account; then the application account gets its table privileges.
  const applied = await migrateWithAccounts({ ownerUrl: config.databaseOwnerUrl, appUrl: config.databaseUrl });
  if (applied.length) console.log(`Applied ${applied.length} migration(s).`);
  const sequelize = createAppSequelize(config);
  const excess = await excessPrivileges(sequelize);
  if (excess.length) {
    console.warn(
      `Warning: the application's database account holds more than it needs (see docs/security.md):\n  ${excess.join('\n  ')}`,
    );
  }
  // The trail key and anchors: the demo data is signed and anchored like any other.
  configureTrail(config);
  if (await isDatabaseEmpty(sequelize)) {
    console.log('Empty database: loading the Tarnbrook Aero Components demo scenario…');
    await seedDemo(sequelize, { config });
  }
  await ensureClientBuilt();

  const running = await startServer(config, { sequelize });
  await writeTrailAnchor(sequelize, 'start').catch((error) => console.error('Could not anchor the trail at start:', error));
  console.log(`Whorl is ready at ${running.url} (demo password: whorl-demo-2026). Press Ctrl-C to stop.`);

  let stopping = false;
  const stop = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`\n${signal}: stopping…`);
    await running.close().catch((error) => console.error('Error while stopping the server:', error));
    if (database?.startedHere) await database.stop();
    process.exit(0);
  };
  process.on('SIGINT', () => void stop('SIGINT'));
  process.on('SIGTERM', () => void stop('SIGTERM'));
}

main().catch((error) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});

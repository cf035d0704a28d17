// A private MariaDB per fault test (fresh folder, free port, migrated), with the
// means to kill it and bring it back on the same folder and port, and a
// Sequelize connection of the test's own for setting up users and checking rows.
import { readFileSync, existsSync } from 'node:fs';
import path from 'node:path';
import { QueryTypes, type Sequelize } from 'sequelize';
import { startLocalMariadb } from '../../../server/db/local-mariadb';
import { createSequelize } from '../../../server/db/sequelize';
import { initModels } from '../../../server/models';
import { hashPassword } from '../../../server/auth/passwords';
import type { Role } from '../../../shared/roles';
import { startTestDatabase } from '../../helpers/test-database';
import { loadConfig } from '../../../server/config/env';
import { configureTrail } from '../../../server/services/trail-anchors';

const ROOT = path.resolve(import.meta.dirname, '../../..');

export const FAULT_PASSWORD = 'fault test password 2026';

export interface FaultUser {
  id: number;
  email: string;
  displayName: string;
}

export interface FaultDatabase {
  url: string;
  /** The owner account (migrations, DDL). */
  ownerUrl: string;
  dir: string;
  port: number;
  socket: string;
  sequelize: Sequelize;
  rootSql(sql: string): string;
  /** SIGKILL of mariadbd: no clean shutdown, like a crash or a pulled plug. */
  kill(): void;
  /** SIGSTOP / SIGCONT of mariadbd: a server that hangs (connections open, nothing answers), then resumes. */
  pause(): void;
  resume(): void;
  /** Starts the server again on the same data folder and port. */
  restart(): Promise<void>;
  createUser(roles: Role[], tag?: string): Promise<FaultUser>;
  stop(): Promise<void>;
}

let passwordHash: Promise<string> | undefined;

export async function startFaultDatabase(label: string): Promise<FaultDatabase> {
  const database = await startTestDatabase(label.replace(/[^a-z0-9]/gi, ''));
  const { instance, dir } = database;
  const databaseName = new URL(instance.url).pathname.slice(1);
  const sequelize = createSequelize({ url: instance.url, poolMax: 5 });
  initModels(sequelize);
  // The app processes read the default key file under the project's .data/ (their working folder): the same key here.
  configureTrail(loadConfig({ DATABASE_URL: instance.url, SESSION_SECRET: 'x'.repeat(32), TRAIL_KEY_FILE: path.join(ROOT, '.data', 'trail-key'), TRAIL_ANCHOR_FILE: path.join(ROOT, '.data', 'trail-anchors.log') }));
  let counter = 0;
  const serverPid = () => Number(readFileSync(path.join(dir, 'mysqld.pid'), 'utf8').trim());
  return {
    url: instance.url,
    ownerUrl: instance.ownerUrl,
    dir,
    port: instance.port,
    socket: instance.socket,
    sequelize,
    rootSql: instance.rootSql,
    kill() {
      const pidFile = path.join(dir, 'mysqld.pid');
      if (!existsSync(pidFile)) return;
      process.kill(Number(readFileSync(pidFile, 'utf8').trim()), 'SIGKILL');
    },
    pause() {
      process.kill(serverPid(), 'SIGSTOP');
    },
    resume() {
      process.kill(serverPid(), 'SIGCONT');
    },
    async restart() {
      // Let the killed process release its port and files before the new one binds them.
      await new Promise((resolve) => setTimeout(resolve, 500));
      await startLocalMariadb({ dir, port: instance.port, database: databaseName });
    },
    async createUser(roles, tag = `u${(counter += 1)}`) {
      // Raw SQL on this instance's own connection: the models are bound to one
      // Sequelize per process, and a test may run two databases at once.
      const now = new Date();
      const email = `${tag}-${Date.now()}@faults.example`;
      const displayName = `Fault ${tag}`;
      const [id] = await sequelize.query(
        `INSERT INTO users (email, display_name, password_hash, area_id, active, failed_sign_ins, mail_digest, version, created_at, updated_at)
         VALUES (?, ?, ?, NULL, 1, 0, 0, 0, ?, ?)`,
        { replacements: [email, displayName, await (passwordHash ??= hashPassword(FAULT_PASSWORD)), now, now], type: QueryTypes.INSERT },
      );
      for (const role of roles) {
        await sequelize.query('INSERT INTO role_assignments (user_id, role, created_at, updated_at) VALUES (?, ?, ?, ?)', {
          replacements: [id, role, now, now],
          type: QueryTypes.INSERT,
        });
      }
      return { id: Number(id), email, displayName };
    },
    async stop() {
      await sequelize.close().catch(() => undefined);
      await database.stop();
    },
  };
}

// A private MariaDB per fault test (fresh folder, free port, migrated), with the
// means to kill it and bring it back on the same folder and port, and a
// Sequelize connection of the test's own for setting up users and checking rows.
import { readFileSync, existsSync } from 'node:fs';
import path from 'node:path';
import type { Sequelize } from 'sequelize';
import { startLocalMariadb } from '../../../server/db/local-mariadb';
import { createSequelize } from '../../../server/db/sequelize';
import { initModels, RoleAssignment, User } from '../../../server/models';
import { hashPassword } from '../../../server/auth/passwords';
import type { Role } from '../../../shared/roles';
import { startTestDatabase } from '../../helpers/test-database';

export const FAULT_PASSWORD = 'fault test password 2026';

export interface FaultDatabase {
  url: string;
  dir: string;
  port: number;
  socket: string;
  sequelize: Sequelize;
  rootSql(sql: string): string;
  /** SIGKILL of mariadbd: no clean shutdown, like a crash or a pulled plug. */
  kill(): void;
  /** Starts the server again on the same data folder and port. */
  restart(): Promise<void>;
  createUser(roles: Role[], tag?: string): Promise<User>;
  stop(): Promise<void>;
}

let passwordHash: Promise<string> | undefined;

export async function startFaultDatabase(label: string): Promise<FaultDatabase> {
  const database = await startTestDatabase(label.replace(/[^a-z0-9]/gi, ''));
  const { instance, dir } = database;
  const databaseName = new URL(instance.url).pathname.slice(1);
  const sequelize = createSequelize({ url: instance.url, poolMax: 5 });
  initModels(sequelize);
  let counter = 0;
  return {
    url: instance.url,
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
    async restart() {
      // Let the killed process release its port and files before the new one binds them.
      await new Promise((resolve) => setTimeout(resolve, 500));
      await startLocalMariadb({ dir, port: instance.port, database: databaseName });
    },
    async createUser(roles, tag = `u${(counter += 1)}`) {
      const user = await User.create({
        email: `${tag}-${Date.now()}@faults.example`,
        displayName: `Fault ${tag}`,
        passwordHash: await (passwordHash ??= hashPassword(FAULT_PASSWORD)),
        areaId: null,
        lockedAt: null,
      });
      await RoleAssignment.bulkCreate(roles.map((role) => ({ userId: user.id, role })));
      return user;
    },
    async stop() {
      await sequelize.close().catch(() => undefined);
      await database.stop();
    },
  };
}
